import type { StateCreator } from 'zustand/vanilla';
import { biasForPoint, findOutputTube, nearestPreferred, pairBiasForPoint, pushPullRaaSweep, raaThrough, type RaaRow, switchPairBias, zPrimaryThrough, type Connection, type Failure, type Result, switchBias } from '../../src/index';
import { LONG_TAILED_START, pushPullDesignOf, SPLIT_LOAD_START, type OutputPair, type OutputPlan, type SplitterKind } from './outputPlan';
import type { StageKind } from './analysis';
import { analyzeOutputBench, type OutputBench, type OutputRival } from './outputAnalysis';
import type { WorkbenchState } from './workbenchStore';
import { DEMO_DESIGN } from './demoDesign';
import { DESIGN_LIMITS, within } from './designLimits';
import { currentOutputRegion } from './outputTargets';
import { nearestInside } from './regionSlice';
import { withSplitterFed } from './supplyPlan';
import { ROLE_NAME } from './amplifierChain';

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
  /** The pair's Raa sweep, run when asked (each point is a whole level sweep), for the output design it was run on. */
  pairRaaSweep: { readonly output: OutputPlan; readonly result: Result<{ readonly rows: readonly RaaRow[]; readonly best: number }> } | null;
  sweepPairRaa: () => void;
  /** One tube or a push-pull pair: the shared cathode resistor halves (or doubles) so each tube keeps its idle current. */
  setOutputPair: (pair: OutputPair) => void;
  /** The phase splitter's kind (each kind starts from its own typical values) or its tube; returns the failure, if any. */
  setSplitter: (patch: { kind?: SplitterKind; tubeId?: string; coupling?: 'capacitor' | 'direct' }) => Failure | null;
  /** Applies a change to the output design through commit; returns the failure, if any, for the caller to place. */
  changeOutput: (patch: Partial<OutputPlan>, opts?: { light?: boolean }) => Failure | null;
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
export function initialOutputBench(d: OutputPlan): OutputBench {
  const b = analyzeOutputBench(d, null, { light: true });
  if (!b.ok) throw new Error(`the demo output stage must solve: ${b.message}`);
  return b;
}

/** Points of the pair's Raa sweep: a third to three times the design's, about a sixth of a decade apart. */
const RAA_SWEEP_POINTS = 7;

/** Primary impedances are read to three figures: finer than any transformer is wound. */
const threeFigures = (x: number) => Number(x.toPrecision(3));

/** The bias and B+ for a wanted point of the stage as it is wired: one tube, or each tube of the pair. */
function biasFor(b: OutputBench, d: OutputPlan, vpk: number, ip: number) {
  const tube = b.analysis.solution.tube;
  return d.pair === 'push-pull' ? pairBiasForPoint(tube, pushPullDesignOf(d), vpk, ip) : biasForPoint(tube, d, vpk, ip);
}

export const createOutputSlice: StateCreator<WorkbenchState, [], [], OutputSlice> = (set, get) => ({
  outputBench: initialOutputBench(DEMO_DESIGN.output),
  outputRival: { on: false, tubeId: '6L6GC', connection: 'as-wired' },
  outputRivalBench: null,

  setStageKind: (kind) => {
    const s = get();
    if (s.design.stageKind !== kind) s.commit({ ...s.design, stageKind: kind });
  },

  pairRaaSweep: null,
  sweepPairRaa: () => {
    const s = get();
    const o = s.design.output;
    const tube = findOutputTube(o.tubeId);
    if (!tube || o.pair !== 'push-pull') return;
    set({ pairRaaSweep: { output: o, result: pushPullRaaSweep(tube, pushPullDesignOf(o), RAA_SWEEP_POINTS) } });
  },

  setSplitter: (patch) => {
    const s = get();
    const sp = s.design.output.splitter;
    const kindChange = patch.kind !== undefined && patch.kind !== sp.kind ? (patch.kind === 'long-tailed-pair' ? LONG_TAILED_START : SPLIT_LOAD_START) : {};
    const next = { ...sp, ...patch, ...kindChange };
    const failure = s.commit({ ...s.design, output: { ...s.design.output, splitter: next } });
    // A refusal from the splitter's own solve already names it.
    const message = failure && (failure.message.startsWith(ROLE_NAME.splitter) ? failure.message : `The splitter cannot run so: ${failure.message}`);
    set({ errors: { ...get().errors, splitter: message || undefined } });
    return failure;
  },

  setOutputPair: (pair) => {
    const s = get();
    const o = s.design.output;
    if (o.pair === pair) return;
    // Ohm's law: one resistor carrying both cathodes' current is half the one that carried one tube's.
    const rk = o.bias === 'cathode' ? (pair === 'push-pull' ? o.rk / 2 : o.rk * 2) : o.rk;
    const snapped = s.design.snap ? nearestPreferred(rk, s.design.series) : Math.round(rk);
    // The pair brings its splitter, and the splitter needs a node of the supply (one undo step with the pair).
    const supply = pair === 'push-pull' ? withSplitterFed(s.design.supply) : s.design.supply;
    const failure = s.commit({ ...s.design, supply, output: { ...o, pair, rk: within(snapped, DESIGN_LIMITS.output.rk) } }, { step: true });
    // Said beside the choice, which stays as it was (a pair whose kept splitter cannot run, say).
    set({ errors: { ...get().errors, outputPair: failure ? `Not switched to ${pair === 'push-pull' ? 'a push-pull pair' : 'one tube'}: ${failure.message}` : undefined } });
  },

  changeOutput: (patch, opts = {}) => {
    const s = get();
    const pinned = s.dragging ? s.outputBench.analysis.sheet.extent : undefined;
    return s.commit({ ...s.design, output: { ...s.design.output, ...patch } }, { light: opts.light ?? false, ...(pinned ? { outputExtent: pinned } : {}) });
  },

  setOutputBias: (to) => {
    const s = get();
    const b = s.outputBench;
    if (b.pair === 'push-pull') return s.changeOutput(switchPairBias(b.analysis.solution, to));
    const parts = switchBias(b.analysis.solution, to);
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
    set({ outputRival: { ...s.outputRival, ...patch } });
    s.commit(s.design, { force: true });
  },

  dragOutputPointTo: (vpk, ip) => {
    const s = get();
    const d = s.design.output;
    const { vmax, iaMax } = s.outputBench.analysis.sheet.extent;
    const v0 = Math.min(Math.max(vpk, 10), vmax);
    const i0 = Math.min(Math.max(ip, iaMax * 0.005), iaMax);
    // Held inside the target region when asked (and the region is worked out for this very stage).
    const region = s.keepInside ? currentOutputRegion(s) : null;
    const held = region ? nearestInside(region, v0, i0) : null;
    const v = held?.vpk ?? v0;
    const i = held?.ia ?? i0;
    const b = biasFor(s.outputBench, d, v, i);
    if (!b.ok) {
      set({ dragNote: b.message });
      return;
    }
    const bplus = within(b.bplus, DESIGN_LIMITS.output.bplus);
    const patch: Partial<OutputPlan> = d.bias === 'cathode' ? { bplus, rk: Math.max(1, b.rk) } : { bplus, vg: b.vgk };
    const failure = s.changeOutput(patch, { light: true });
    set({ dragNote: failure ? failure.message : held && (held.vpk !== v0 || held.ia !== i0) ? 'Held inside the target region.' : null });
  },

  placeOutputPoint: (vpk, ip) => {
    const s = get();
    const d = s.design.output;
    const b = biasFor(s.outputBench, d, vpk, ip);
    if (!b.ok) return b;
    const patch: Partial<OutputPlan> =
      d.bias === 'cathode' ? { bplus: Math.round(b.bplus), rk: s.design.snap ? nearestPreferred(Math.max(1, b.rk), s.design.series) : Math.max(1, Math.round(b.rk)) } : { bplus: Math.round(b.bplus), vg: Math.round(b.vgk * 10) / 10 };
    return s.changeOutput(patch);
  },

  dragOutputLoadTo: (vpk, ip) => {
    const s = get();
    const b = s.outputBench;
    if (b.pair === 'push-pull') {
      const r = raaThrough(b.analysis.solution, vpk, ip);
      if (r === null) {
        set({ dragNote: 'The composite load line falls from the operating point: drag its handle down and to the right' });
        return;
      }
      const raa = threeFigures(within(r, DESIGN_LIMITS.output.raa));
      if (raa === s.design.output.raa) return;
      const failure = s.changeOutput({ raa }, { light: true });
      set({ dragNote: failure ? failure.message : null });
      return;
    }
    const z = zPrimaryThrough(b.analysis.solution, vpk, ip);
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

