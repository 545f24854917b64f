import { createStore, type StoreApi } from 'zustand/vanilla';
import { createDesignSlice, type DesignSlice } from './designSlice';
import { createDragSlice, type DragSlice } from './dragSlice';
import { createCompareSlice, type CompareSlice } from './compareSlice';
import { createCustomSlice, type CustomSlice } from './customSlice';
import { createHistorySlice, recordHistory, type HistorySlice } from './historySlice';
import { createViewSlice, type ViewSlice } from './viewSlice';
import { createOutputSlice, type OutputSlice } from './outputSlice';
import { createChainSlice, type ChainSlice } from './chainSlice';
import { createSupplySlice, watchSupply, type LowEndSolver, type SupplySlice, type SupplySolver } from './supplySlice';
import { watchBias } from './biasSupply';
import { createRegionSlice, inPlaceRegionSolver, watchRegion, type RegionSlice, type RegionSolver } from './regionSlice';

/** The whole workbench state: the slices, combined once. */
export type WorkbenchState = DesignSlice & DragSlice & ViewSlice & HistorySlice & CompareSlice & CustomSlice & OutputSlice & SupplySlice & ChainSlice & RegionSlice;
export type WorkbenchStore = StoreApi<WorkbenchState>;

export interface StoreOptions {
  /** Clock for undo coalescing (tests pass their own). */
  readonly now?: () => number;
  /**
   * Where the amplifier is solved on its supply (the page passes
   * supplyBetweenFrames); without one it is not solved, as in the tests that
   * do not look at the supply.
   */
  readonly supplySolver?: SupplySolver | null;
  /** Where the amplifier's low end on its supply is worked out after each settled solve (the page passes the model worker's); default in place. */
  readonly lowEndSolver?: LowEndSolver;
  /** Where the target region and the tube ranking are worked out (the page passes a Web Worker's); default in place. */
  readonly regionSolver?: RegionSolver;
}

/** A fresh store; the app makes one, each test makes its own. */
export function createWorkbenchStore(options: StoreOptions = {}): WorkbenchStore {
  const regions = options.regionSolver ?? inPlaceRegionSolver;
  const store = createStore<WorkbenchState>()((...a) => ({
    ...createDesignSlice(...a),
    ...createDragSlice(...a),
    ...createViewSlice(...a),
    ...createHistorySlice(...a),
    ...createCompareSlice(...a),
    ...createCustomSlice(...a),
    ...createOutputSlice(...a),
    ...createSupplySlice(...a),
    ...createChainSlice(...a),
    ...createRegionSlice(regions)(...a),
  }));
  recordHistory(store, options.now);
  watchSupply(store, options.supplySolver ?? null, options.lowEndSolver);
  watchBias(store);
  watchRegion(store, regions);
  return store;
}
