import { createStore, type StoreApi } from 'zustand/vanilla';
import { createDesignSlice, type DesignSlice } from './designSlice';
import { createDragSlice, type DragSlice } from './dragSlice';
import { createViewSlice, type ViewSlice } from './viewSlice';

/** The whole workbench state: the slices, combined once. */
export type WorkbenchState = DesignSlice & DragSlice & ViewSlice;
export type WorkbenchStore = StoreApi<WorkbenchState>;

/** A fresh store; the app makes one, each test makes its own. */
export function createWorkbenchStore(): WorkbenchStore {
  return createStore<WorkbenchState>()((...a) => ({
    ...createDesignSlice(...a),
    ...createDragSlice(...a),
    ...createViewSlice(...a),
  }));
}
