import type { StateCreator } from 'zustand/vanilla';
import { designAtPlanePoint, nearestPreferred, nearestReachable, plateExtent, type PlateExtent, type Result } from '../../src/index';
import type { TubeRegistry } from './tubeRegistry';
import { analyze, type Analysis, type BenchDesign } from './analysis';
import { analyzeAmplifier, type AmplifierView } from './amplifierChain';
import type { WorkbenchState } from './workbenchStore';

/**
 * A second tube weighed against the first on shared axes. "Same parts" puts
 * the rival in the first design's socket (same B+, Ra, Rk): what a tube swap
 * does. "Own values" gives it its own Ra and Rk, dragged on its own point.
 */
export interface Rival {
  readonly on: boolean;
  readonly tubeId: string;
  readonly mode: 'same-parts' | 'own-values';
  readonly ra: number;
  readonly rk: number;
}

export interface CompareSlice {
  rival: Rival;
  rivalAnalysis: Result<Analysis> | null;
  /** The whole amplifier with the second tube in the bench's socket (its own Ra and Rk when fitted so); null when not compared or no chain. */
  rivalAmplifier: AmplifierView | null;
  setRival: (patch: Partial<Rival>) => void;
  /** Swaps which tube is first; everything else stays. */
  swapTubes: () => void;
  dragRivalTo: (vpk: number, ia: number) => void;
  endRivalDrag: () => void;
}

export function rivalDesign(d: BenchDesign, r: Rival): BenchDesign {
  return {
    ...d,
    tubeId: r.tubeId,
    ra: r.mode === 'own-values' ? r.ra : d.ra,
    rk: r.mode === 'own-values' ? r.rk : d.rk,
    stage2: { ...d.stage2, kind: 'none' },
  };
}

/** The amplifier with the rival in the bench's socket: only the bench stage's tube (and, own values, its Ra and Rk) changes. */
export function analyzeRivalAmplifier(d: BenchDesign, registry: TubeRegistry, r: Rival): AmplifierView | null {
  if (!r.on || d.stageKind !== 'voltage') return null;
  const own = r.mode === 'own-values';
  const view = analyzeAmplifier({ ...d, tubeId: r.tubeId, ra: own ? r.ra : d.ra, rk: own ? r.rk : d.rk }, registry);
  return view && view.input.stages.length > 1 ? view : null;
}

/** The chart window covering both tubes at this B+, so both families share one pair of axes. */
export function sharedWindow(d: BenchDesign, registry: TubeRegistry, r: Rival): PlateExtent | undefined {
  const a = registry.lookup(d.tubeId);
  const b = registry.lookup(r.tubeId);
  if (!r.on || !a || !b) return undefined;
  const ea = plateExtent(a, d.bplus);
  const eb = plateExtent(b, d.bplus);
  return { vmax: Math.max(ea.vmax, eb.vmax), iaMax: Math.max(ea.iaMax, eb.iaMax) };
}

export function analyzeRival(d: BenchDesign, registry: TubeRegistry, r: Rival, prev: Result<Analysis> | null, extent: PlateExtent | undefined, light: boolean, maxCurves?: number): Result<Analysis> | null {
  if (!r.on) return null;
  return analyze(rivalDesign(d, r), registry, prev?.ok ? prev : null, extent, light, maxCurves);
}

export const createCompareSlice: StateCreator<WorkbenchState, [], [], CompareSlice> = (set, get) => ({
  rival: { on: false, tubeId: '12AX7', mode: 'same-parts', ra: 100e3, rk: 1500 },
  rivalAnalysis: null,
  rivalAmplifier: null,

  setRival: (patch) => {
    const s = get();
    const rival = { ...s.rival, ...patch };
    if (patch.mode === 'own-values' && s.rival.mode !== 'own-values') Object.assign(rival, { ra: s.design.ra, rk: s.design.rk });
    set({ rival });
    s.commit(s.design, { force: true }); // re-window both tubes and analyse the rival
  },

  swapTubes: () => {
    const s = get();
    if (!s.rival.on) return;
    const own = s.rival.mode === 'own-values';
    const design = { ...s.design, tubeId: s.rival.tubeId, ...(own ? { ra: s.rival.ra, rk: s.rival.rk } : {}) };
    const rival = { ...s.rival, tubeId: s.design.tubeId, ...(own ? { ra: s.design.ra, rk: s.design.rk } : {}) };
    const before = s.rival;
    set({ rival });
    if (s.commit(design, { force: true }) !== null) set({ rival: before });
  },

  dragRivalTo: (vpk, ia) => {
    const s = get();
    if (!s.rival.on || s.rival.mode !== 'own-values' || !s.rivalAnalysis?.ok) return;
    const tube = s.rivalAnalysis.tube;
    const reach = nearestReachable(tube, s.design.bplus, vpk, ia, s.design.rg);
    if (!reach.ok) return;
    const d = designAtPlanePoint({ tube, bplus: s.design.bplus, vpk: reach.vpk, ia: reach.ia, rg: s.design.rg });
    if (!d.ok) return;
    const rival = { ...s.rival, ra: d.ra, rk: d.rk };
    const a = analyzeRival(s.design, s.registry, rival, s.rivalAnalysis, s.analysis.sheet.extent, true);
    // The whole amplifier waits for the release; until then it is marked as behind.
    const amp = s.rivalAmplifier && !s.rivalAmplifier.stale ? { ...s.rivalAmplifier, stale: true } : s.rivalAmplifier;
    if (a?.ok) set({ rival, rivalAnalysis: a, rivalAmplifier: amp, dragNote: reach.reason });
  },

  endRivalDrag: () => {
    const s = get();
    const rival = s.design.snap ? { ...s.rival, ra: nearestPreferred(s.rival.ra, s.design.series), rk: nearestPreferred(s.rival.rk, s.design.series) } : s.rival;
    const a = analyzeRival(s.design, s.registry, rival, s.rivalAnalysis, s.analysis.sheet.extent, false);
    if (a?.ok) set({ rival, rivalAnalysis: a, rivalAmplifier: analyzeRivalAmplifier(s.design, s.registry, rival) });
  },
});
