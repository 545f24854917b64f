import type { StateCreator } from 'zustand/vanilla';
import { curveSheet, findTube, type CurveSheet, type TubeRecord } from '../../src/index';

/**
 * The tube on the bench and the supply it runs from, with the static curve
 * sheet the model derives from them. The sheet is rebuilt only when one of
 * the two changes, so dragging the operating point never recomputes it.
 */
export interface SheetSlice {
  tubeId: string;
  bplus: number;
  sheet: CurveSheet;
  tube: () => TubeRecord;
}

export const DEMO_TUBE_ID = '12AU7';
export const DEMO_BPLUS = 275;

export const createSheetSlice: StateCreator<SheetSlice, [], [], SheetSlice> = (_set, get) => ({
  tubeId: DEMO_TUBE_ID,
  bplus: DEMO_BPLUS,
  sheet: curveSheet(findTube(DEMO_TUBE_ID)!, DEMO_BPLUS),
  tube: () => findTube(get().tubeId) ?? findTube(DEMO_TUBE_ID)!,
});
