import { curveSheet, type CurveSheet } from './curveSheet';
import { solveFollower } from './solveFollower';
import type { StageDesign } from './stageDesign';
import type { Failure } from '../result';
import type { SolvedStage } from '../signal/analysisInput';
import { cornersOf, type Corners } from '../signal/corners';
import { distortionOf, type DistortionResult } from '../signal/distortion';
import { distortionSweep, type LevelThd } from '../signal/distortionSweep';
import { logFrequencies, responseOf, type ResponsePoint } from '../signal/frequencyResponse';
import { levelAtThdOf, type LevelAtThd } from '../signal/levelAtThd';
import { solveLinks, type ChainLink, type LinkChainResult } from '../signal/solveLinks';
import { stageTransfer, type TransferSample } from '../signal/stageTransfer';
import { swingOf, type SwingResult } from '../signal/swing';
import { swingPath, transferCurve } from '../signal/transferCurve';
import type { PlanePoint } from './planeSeries';
import type { Result } from '../result';

/** What a voltage stage's signal views show: swing, distortion at a level, the level at a THD, transfer, response, and its second stage. */
export interface StageSignal {
  readonly swing: SwingResult;
  /** Distortion at the chosen output level, or why there is none. */
  readonly distortion: ({ ok: true } & DistortionResult) | Failure;
  readonly transfer: readonly TransferSample[];
  /** Where the operating point travels on the plate curves at the chosen level. */
  readonly swingPath: readonly PlanePoint[];
  /** Heavier views, recomputed when a drag ends (kept from before while dragging). */
  readonly response: readonly ResponsePoint[];
  readonly corners: Corners;
  readonly thdByLevel: readonly LevelThd[];
  /** The output level at which THD reaches the stage's limit (past the clean swing when that is where it lands). */
  readonly atThd: Result<LevelAtThd>;
  readonly chain: ({ ok: true } & LinkChainResult) | Failure | null;
  /** The second stage's own plate curves and operating point, when it has one. */
  readonly stage2: { readonly sheet: CurveSheet; readonly point: PlanePoint; readonly tubeId: string } | null;
  /** True while a drag is in progress: these figures are from before it and are redone on release. */
  readonly stale: boolean;
}

/** The level the distortion figures are read at and the THD whose level is sought. */
export interface SignalLevels {
  /** Output level, V rms. */
  readonly levelRms: number;
  /** THD limit, a fraction. */
  readonly thdLimit: number;
}

export const RESPONSE_FREQUENCIES = logFrequencies(1, 1e6, 15);

/**
 * A follower after a plate at `va` (its grid there, or at its own bias when
 * capacitor-coupled), at DC: the full pass refuses
 * a follower whose grid would draw current, so a drag's light pass checks it
 * too and never leaves the design there.
 */
export function followerProblem(va: number, second: ChainLink | null): Failure | null {
  if (!second || second.kind !== 'follower') return null;
  const f = solveFollower({ tube: second.tube, bplus: second.bplus, vgrid: second.coupling ? second.coupling.vbias : va, rk: second.rk, rl: second.rl ?? Infinity });
  return f.ok ? null : { ...f, message: `Follower: ${f.message}`, field: 'stage2' };
}

/**
 * The signal analysis of a solved stage and the second stage after it (a
 * follower or a gain stage, as `second`, solved with it as a two-link chain).
 * While dragging (`light`) only the signal's span on the load line follows
 * each frame, from the small-signal estimate of the input it needs capped by
 * the last clean swing; the rest is `prev`, marked stale, and is redone on
 * release. (Measured: the full analysis with its chart redraws took the
 * drag's p95 from under 10 ms to about 30 ms per move.)
 */
export function stageSignal(s: SolvedStage, stage1: StageDesign, second: ChainLink | null, levels: SignalLevels, prev: StageSignal | null, light: boolean): StageSignal {
  if (light && prev) {
    const estimate = Math.min((levels.levelRms * Math.SQRT2) / Math.abs(s.solution.gain), prev.swing.inputPeak);
    return { ...prev, swingPath: swingPath(s, estimate, 24), stale: true };
  }
  const transfer = stageTransfer(s.checked, s.solution.op);
  const swing = swingOf(s, transfer);
  const distortion = distortionOf(s, { outputRms: levels.levelRms }, {}, { transfer, swing });
  const peak = distortion.ok ? distortion.inputPeak : swing.inputPeak;
  // The chain solver applies the second stage's loading to stage 1 itself.
  const chain = second ? solveLinks([{ kind: 'common-cathode', ...stage1, rl: Infinity }, second]) : null;
  let stage2: StageSignal['stage2'] = null;
  if (chain?.ok && chain.links[1] && second) {
    const op = chain.links[1].op;
    const id = 'id' in second.tube ? second.tube.id : '';
    const bplus = second.bplus;
    const sheet = prev?.stage2 && prev.stage2.tubeId === id && prev.stage2.sheet.extent.vmax >= bplus ? prev.stage2.sheet : curveSheet(second.tube, bplus);
    stage2 = { sheet, point: { v: op.vpk, i: op.ia }, tubeId: id };
  }
  return {
    swing,
    distortion,
    transfer: transferCurve(s, swing.inputPeak * 1.25, 64, transfer),
    swingPath: swingPath(s, peak, 24, transfer),
    response: responseOf(s, RESPONSE_FREQUENCIES),
    corners: cornersOf(s),
    thdByLevel: distortionSweep(s, 18, 256),
    atThd: levelAtThdOf(s, levels.thdLimit, { transfer, swing }),
    chain,
    stage2,
    stale: false,
  };
}
