import type { StateCreator } from 'zustand/vanilla';
import { shownTube } from './shownStage';
import { gridVoltageAt } from '../../src/index';
import type { WorkbenchState } from './workbenchStore';
import { DEFAULT_BUILD, type BuildInputs } from './buildSheet';

/** What the cursor is over on the plate chart: the plane point and the grid voltage the model gives there. */
export interface HoverReadout {
  readonly vpk: number;
  readonly ia: number;
  /** null above the 0 V curve (where the grid would draw current). */
  readonly vgk: number | null;
}

export interface ViewSlice {
  /** The builder's inputs to the build sheet (corner, heater supply, B+ filter). */
  buildInputs: BuildInputs;
  setBuildInputs: (patch: Partial<BuildInputs>) => void;
  /** The last message about keeping designs (opened, saved, refused and why). */
  keepNote: { readonly kind: 'ok' | 'error'; readonly text: string } | null;
  setKeepNote: (note: ViewSlice['keepNote']) => void;
  /** The voltage stage's chart window: the whole sheet (by the tube's ratings) or framed on the load line. */
  chartWindow: 'sheet' | 'load-line';
  setChartWindow: (w: 'sheet' | 'load-line') => void;
  hover: HoverReadout | null;
  setHover: (vpk: number, ia: number) => void;
  clearHover: () => void;
  /** The cursor over the output stage's chart (plate to cathode, V; the charted current, A), or null. */
  outputHover: { readonly vpk: number; readonly ip: number } | null;
  setOutputHover: (at: { readonly vpk: number; readonly ip: number } | null) => void;
}

export const createViewSlice: StateCreator<WorkbenchState, [], [], ViewSlice> = (set, get) => ({
  buildInputs: DEFAULT_BUILD,
  setBuildInputs: (patch) => set({ buildInputs: { ...get().buildInputs, ...patch } }),
  keepNote: null,
  setKeepNote: (keepNote) => set({ keepNote }),
  chartWindow: 'sheet',
  setChartWindow: (chartWindow) => {
    set({ chartWindow });
    get().commit(get().design, { force: true });
  },
  hover: null,
  setHover: (vpk, ia) => set({ hover: { vpk, ia, vgk: gridVoltageAt(shownTube(get()), vpk, ia) } }),
  clearHover: () => set({ hover: null }),
  outputHover: null,
  setOutputHover: (outputHover) => set({ outputHover }),
});
