import {
  cornersOf,
  curveSheet,
  distortionOf,
  distortionSweep,
  levelAtThdOf,
  logFrequencies,
  responseOf,
  solveChain,
  solveFollower,
  stageTransfer,
  swingOf,
  swingPath,
  transferCurve,
  type ChainLink,
  type LinkChainResult,
  type Corners,
  type CurveSheet,
  type DistortionResult,
  type Failure,
  type LevelThd,
  type LevelAtThd,
  type Result,
  type PlanePoint,
  type ResponsePoint,
  type SolvedStage,
  type StageDesign,
  type SwingResult,
  type TransferSample,
} from '../../src/index';
import { lookupTube } from '../keep/customTubes';
import type { BenchDesign } from './analysis';
import { loadAfterBench } from './stagePlans';

/** What the signal views show; the store asks the model for all of it. */
export interface SignalAnalysis {
  readonly swing: SwingResult;
  /** Distortion at the chosen output level, or why there is none (clipping). */
  readonly distortion: ({ ok: true } & DistortionResult) | Failure;
  readonly transfer: readonly TransferSample[];
  /** Where the operating point travels on the plate curves at the chosen level. */
  readonly swingPath: readonly PlanePoint[];
  /** Heavier views, recomputed when a drag ends (kept from before while dragging). */
  readonly response: readonly ResponsePoint[];
  readonly corners: Corners;
  readonly thdByLevel: readonly LevelThd[];
  /** The output level at which THD reaches the design's limit (past the clean swing when that is where it lands). */
  readonly atThd: Result<LevelAtThd>;
  readonly chain: ({ ok: true } & LinkChainResult) | Failure | null;
  /** The second stage's own plate curves and operating point, when it has one. */
  readonly stage2: { readonly sheet: CurveSheet; readonly point: PlanePoint; readonly tubeId: string } | null;
  /** True while a drag is in progress: these figures are from before it and are redone on release. */
  readonly stale: boolean;
}

export const RESPONSE_FREQUENCIES = logFrequencies(1, 1e6, 15);

function chainLinks(stage1: StageDesign, d: BenchDesign): ChainLink[] | null {
  const s2 = d.stage2;
  const tube = lookupTube(s2.tubeId);
  if (s2.kind === 'none' || !tube) return null;
  // The chain solver applies the second stage's loading to stage 1 itself.
  const first: ChainLink = { kind: 'common-cathode', ...stage1, rl: Infinity };
  // The second stage drives the next gain stage's grid, or the amplifier's own load.
  const { rl } = loadAfterBench(d);
  if (s2.kind === 'follower') return [first, { kind: 'follower', tube, bplus: d.bplus, rk: s2.rk, rl }];
  return [first, { kind: 'common-cathode', tube, bplus: d.bplus, ra: s2.ra, rk: s2.rk, rg: s2.rg, bypassed: true, rl }];
}

/**
 * The signal analysis of a solved first stage. While dragging (`light`) only
 * the signal's span on the load line follows each frame, from the
 * small-signal estimate of the input it needs capped by the last clean swing;
 * the rest is the previous analysis, marked stale, and is redone on release.
 * (Measured: the full analysis with its chart redraws took the drag's p95
 * from under 10 ms to about 30 ms per move.)
 */
/**
 * The second stage at DC on the first's plate, for a drag's light pass: the
 * full pass refuses a follower whose grid would draw current, so a drag must
 * not leave the design there (it would be held, unanalysed, after release).
 */
export function secondStageProblem(va: number, d: BenchDesign): Failure | null {
  const s2 = d.stage2;
  if (s2.kind !== 'follower') return null;
  const tube = lookupTube(s2.tubeId);
  if (!tube) return null;
  const f = solveFollower({ tube, bplus: d.bplus, vgrid: va, rk: s2.rk, rl: loadAfterBench(d).rl });
  return f.ok ? null : { ...f, message: `Follower: ${f.message}`, field: 'stage2' };
}

export function analyzeSignal(s: SolvedStage, stage1: StageDesign, d: BenchDesign, prev: SignalAnalysis | null, light: boolean): SignalAnalysis {
  if (light && prev) {
    const estimate = Math.min((d.levelRms * Math.SQRT2) / Math.abs(s.solution.gain), prev.swing.inputPeak);
    return { ...prev, swingPath: swingPath(s, estimate, 24), stale: true };
  }
  const transfer = stageTransfer(s.checked, s.solution.op);
  const swing = swingOf(s, transfer);
  const distortion = distortionOf(s, { outputRms: d.levelRms }, {}, { transfer, swing });
  const peak = distortion.ok ? distortion.inputPeak : swing.inputPeak;
  const links = chainLinks(stage1, d);
  const chain = links ? solveChain(links) : null;
  let stage2: SignalAnalysis['stage2'] = null;
  if (chain?.ok && chain.links[1]) {
    const tube = lookupTube(d.stage2.tubeId)!;
    const op = chain.links[1].op;
    const sheet = prev?.stage2 && prev.stage2.tubeId === tube.id && prev.stage2.sheet.extent.vmax >= d.bplus ? prev.stage2.sheet : curveSheet(tube, d.bplus);
    stage2 = { sheet, point: { v: op.vpk, i: op.ia }, tubeId: tube.id };
  }
  return {
    swing,
    distortion,
    transfer: transferCurve(s, swing.inputPeak * 1.25, 64, transfer),
    swingPath: swingPath(s, peak, 24, transfer),
    response: responseOf(s, RESPONSE_FREQUENCIES),
    corners: cornersOf(s),
    thdByLevel: distortionSweep(s, 18, 256),
    atThd: levelAtThdOf(s, d.thdLimit, { transfer, swing }),
    chain,
    stage2,
    stale: false,
  };
}
