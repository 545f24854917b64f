import { createStore, type StoreApi } from 'zustand/vanilla';
import { createSheetSlice, type SheetSlice } from './sheetSlice';

/** The whole workbench state: the slices, combined once. */
export type WorkbenchState = SheetSlice;
export type WorkbenchStore = StoreApi<WorkbenchState>;

/** A fresh store; the app makes one, each test makes its own. */
export function createWorkbenchStore(): WorkbenchStore {
  return createStore<WorkbenchState>()((...a) => ({
    ...createSheetSlice(...a),
  }));
}
