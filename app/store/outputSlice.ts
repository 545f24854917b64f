import type { StateCreator } from 'zustand/vanilla';
import { biasForPoint, findOutputTube, nearestPreferred, zPrimaryThrough, type Connection, type Failure, type OutputDesign, type Result, switchBias } from '../../src/index';
import type { StageKind } from './analysis';
import { analyzeOutputBench, type OutputBench, type OutputRival } from './outputAnalysis';
import type { WorkbenchState } from './workbenchStore';
import { DEMO_DESIGN } from './demoDesign';
import { DESIGN_LIMITS, within } from './designLimits';

/**
 * The transformer-coupled output stage. Its design lives in the bench design
 * (`design.output`), so undo, autosave, files and links carry it; this slice
 * holds what the model makes of it and the actions that change it. Dragging
 * the operating point sets the bias (Rk or the grid supply) and B+; dragging
 * the handle on the AC load line sets the primary impedance.
 */
export interface OutputSlice {
  outputBench: OutputBench;
  outputRival: OutputRival;
  outputRivalBench: Result<OutputBench> | null;
  setStageKind: (kind: StageKind) => void;
  /** Applies a change to the output design through commit; returns the failure, if any, for the caller to place. */
  changeOutput: (patch: Partial<OutputDesign>, opts?: { light?: boolean }) => Failure | null;
  chooseOutputTube: (id: string) => void;
  /** Switches between cathode and fixed bias keeping the idle current; returns the failure, if any. */
  setOutputBias: (to: 'cathode' | 'fixed') => Failure | null;
  setOutputRival: (patch: Partial<OutputRival>) => void;
  dragOutputPointTo: (vpk: number, ip: number) => void;
  /** Inverse design: the bias (Rk, snapped to the series, or the grid supply) and B+ for a wanted point; the failure when there is none. */
  placeOutputPoint: (vpk: number, ip: number) => Failure | null;
  dragOutputLoadTo: (vpk: number, ip: number) => void;
}

/** The light analysis: the bench opens on the voltage stage; the full one runs when the output stage is shown. */
export function initialOutputBench(d: OutputDesign): OutputBench {
  const b = analyzeOutputBench(d, null, { light: true });
  if (!b.ok) throw new Error(`the demo output stage must solve: ${b.message}`);
  return b;
}

/** Primary impedances are read to three figures: finer than any transformer is wound. */
const threeFigures = (x: number) => Number(x.toPrecision(3));

export const createOutputSlice: StateCreator<WorkbenchState, [], [], OutputSlice> = (set, get) => ({
  outputBench: initialOutputBench(DEMO_DESIGN.output),
  outputRival: { on: false, tubeId: '6L6GC', connection: 'pentode' },
  outputRivalBench: null,

  setStageKind: (kind) => {
    const s = get();
    if (s.design.stageKind !== kind) s.commit({ ...s.design, stageKind: kind });
  },

  changeOutput: (patch, opts = {}) => {
    const s = get();
    const pinned = s.dragging ? s.outputBench.analysis.sheet.extent : undefined;
    return s.commit({ ...s.design, output: { ...s.design.output, ...patch } }, { light: opts.light ?? false, ...(pinned ? { outputExtent: pinned } : {}) });
  },

  setOutputBias: (to) => {
    const s = get();
    const parts = switchBias(s.outputBench.analysis.solution, to);
    if (!parts.ok) return parts;
    // The answer's parts become a patch of the output design: its ok flag is not a design field.
    const { ok: _ok, ...patch } = parts;
    return s.changeOutput(patch);
  },

  chooseOutputTube: (id) => {
    const s = get();
    const tube = findOutputTube(id);
    if (!tube) return;
    const connection: Connection = tube.law.kind === 'triode' ? 'triode' : s.design.output.connection === 'triode' && findOutputTube(s.design.output.tubeId)?.law.kind === 'triode' ? 'pentode' : s.design.output.connection;
    const failure = s.changeOutput({ tubeId: id, connection });
    set({ errors: failure ? { ...get().errors, outputTube: `The ${id} cannot run with these parts: ${failure.message}` } : { ...get().errors, outputTube: undefined } });
  },

  setOutputRival: (patch) => {
    const s = get();
    const outputRival = { ...s.outputRival, ...patch };
    const tube = findOutputTube(outputRival.tubeId);
    if (tube?.law.kind === 'triode') outputRival.connection = 'triode';
    set({ outputRival });
    s.commit(s.design, { force: true });
  },

  dragOutputPointTo: (vpk, ip) => {
    const s = get();
    const d = s.design.output;
    const tube = s.outputBench.analysis.solution.tube;
    const { vmax, iaMax } = s.outputBench.analysis.sheet.extent;
    const v = Math.min(Math.max(vpk, 10), vmax);
    const i = Math.min(Math.max(ip, iaMax * 0.005), iaMax);
    const b = biasForPoint(tube, d, v, i);
    if (!b.ok) {
      set({ dragNote: b.message });
      return;
    }
    const bplus = within(b.bplus, DESIGN_LIMITS.output.bplus);
    const patch: Partial<OutputDesign> = d.bias === 'cathode' ? { bplus, rk: Math.max(1, b.rk) } : { bplus, vg: b.vgk };
    const failure = s.changeOutput(patch, { light: true });
    set({ dragNote: failure ? failure.message : null });
  },

  placeOutputPoint: (vpk, ip) => {
    const s = get();
    const d = s.design.output;
    const b = biasForPoint(s.outputBench.analysis.solution.tube, d, vpk, ip);
    if (!b.ok) return b;
    const patch: Partial<OutputDesign> =
      d.bias === 'cathode' ? { bplus: Math.round(b.bplus), rk: s.design.snap ? nearestPreferred(Math.max(1, b.rk), s.design.series) : Math.max(1, Math.round(b.rk)) } : { bplus: Math.round(b.bplus), vg: Math.round(b.vgk * 10) / 10 };
    return s.changeOutput(patch);
  },

  dragOutputLoadTo: (vpk, ip) => {
    const s = get();
    const z = zPrimaryThrough(s.outputBench.analysis.solution, vpk, ip);
    if (z === null) {
      set({ dragNote: 'The AC load line falls from the operating point: drag its handle down and to the right' });
      return;
    }
    const zPrimary = threeFigures(within(z, DESIGN_LIMITS.output.zPrimary));
    if (zPrimary === s.design.output.zPrimary) return;
    const failure = s.changeOutput({ zPrimary }, { light: true });
    set({ dragNote: failure ? failure.message : null });
  },
});

