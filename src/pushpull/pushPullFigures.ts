import { fail, type Result } from '../result';
import { SWEEP_SAMPLES } from '../output/outputSignal';
import { checkPushPullSolution, pushPullDriveOf, type PushPullDrive } from './pushPullDrive';
import { plateOf, type PushPullSolution } from './solvePushPull';
import { emptyCurrents } from '../output/electrodes';

/** Drive levels in the sweep for the worst dissipation (it peaks below full power in class AB). */
const SWEEP_LEVELS = 16;

export interface PushPullFigures {
  /** Driven until the grids reach 0 V (the onset of grid current): the most a grid-current-free driver gets. */
  readonly atZeroGrid: PushPullDrive;
  /**
   * The most drive with THD within the design's limit: null when THD stays
   * within it all the way to 0 V on the grids. (THD need not rise steadily:
   * a pair biased far into class AB distorts most at low levels.)
   */
  readonly atThdLimit: PushPullDrive | null;
  /** True when THD is over the limit at every level swept (crossover distortion at the smallest ones included). */
  readonly overThdEverywhere: boolean;
  /** The smallest drive at which a tube cuts off (class AB from there); null for class A to 0 V on the grids. */
  readonly classABFrom: number | null;
  /** The most either tube's plate dissipates at any level up to 0 V on the grids, W, and at which drive. */
  readonly worstPlate: { readonly watts: number; readonly drive: number };
  /** The same for the screens, W (0 for triodes and triode connection). */
  readonly worstScreen: { readonly watts: number; readonly drive: number };
  /** The stage's source impedance plate to plate at idle (both tubes and the primary's resistance), Ω; null where the tubes do not respond to their plates (none here do). */
  readonly zPlateToPlate: number | null;
  /** The same at the speaker, Ω, and the damping factor (speaker over it). */
  readonly zSpeaker: number | null;
  readonly dampingFactor: number | null;
}

/**
 * The pair's figures a builder checks, from a sweep of drive levels up to
 * 0 V on the grids: power there; the most power within the distortion limit
 * (the highest swept level within it, then bisection up to the next); where
 * class AB begins (bisection on the cutoff test); and the worst plate and
 * screen dissipation over the sweep, since in class AB the plate dissipation
 * peaks below full power (in class B at about 2/π of the full swing:
 * Langford-Smith, ch. 13) while in class A it is worst at idle.
 */
export function pushPullFigures(s: PushPullSolution): Result<PushPullFigures> {
  const problem = checkPushPullSolution(s);
  if (problem) return problem;
  // Driven until the first grid reaches 0 V (the two differ by a trimmed side's offset).
  const full = Math.min(-s.vgk, -s.vgk2);
  if (!(full > 0)) return fail('invalid-input', 'The grids have no negative bias: there is no drive before grid current', 'vg');
  const at = (drive: number) => pushPullDriveOf(s, drive, SWEEP_SAMPLES);
  const sweep = Array.from({ length: SWEEP_LEVELS + 1 }, (_, k) => at((full * k) / SWEEP_LEVELS));
  const atZeroGrid = pushPullDriveOf(s, full);
  const limit = s.design.thdLimit;
  const bisect = (lo: number, hi: number, stillLow: (r: PushPullDrive) => boolean): number => {
    for (let k = 0; k < 40 && hi - lo > 1e-4 * full; k++) {
      const mid = 0.5 * (lo + hi);
      if (stillLow(at(mid))) lo = mid;
      else hi = mid;
    }
    return lo;
  };
  // Level 0 has no signal and so no distortion: the highest level within the limit from level 1 up.
  let within = -1;
  for (let k = 1; k <= SWEEP_LEVELS; k++) if (sweep[k]!.thd <= limit) within = k;
  const overThdEverywhere = within < 0;
  const atThdLimit = within === SWEEP_LEVELS || overThdEverywhere ? null : pushPullDriveOf(s, bisect(sweep[within]!.drive, sweep[within + 1]!.drive, (r) => r.thd <= limit));
  const firstAB = sweep.findIndex((r) => r.classAB);
  const classABFrom = firstAB < 0 ? null : firstAB === 0 ? 0 : bisect(sweep[firstAB - 1]!.drive, sweep[firstAB]!.drive, (r) => !r.classAB);
  let worstPlate = { watts: 0, drive: 0 };
  let worstScreen = { watts: 0, drive: 0 };
  for (const r of sweep) {
    const pa = Math.max(...r.plateDissipation);
    const pg2 = Math.max(...r.screenDissipation);
    if (pa > worstPlate.watts) worstPlate = { watts: pa, drive: r.drive };
    if (pg2 > worstScreen.watts) worstScreen = { watts: pg2, drive: r.drive };
  }
  const zPlateToPlate = plateToPlateImpedance(s);
  const zSpeaker = zPlateToPlate === null ? null : (zPlateToPlate * s.design.speakerOhms) / s.design.raa;
  return { ok: true, atZeroGrid, atThdLimit, overThdEverywhere, classABFrom, worstPlate, worstScreen, zPlateToPlate, zSpeaker, dampingFactor: zSpeaker === null ? null : s.design.speakerOhms / zSpeaker };
}

/**
 * The pair as a source, grids held at idle: a small winding voltage δw on
 * each half (opposite senses) changes the net coupled current by δM; each
 * half then sees δw/δM, and the whole primary (twice the turns) four times
 * that. In class A with triodes and no primary resistance this is 2·rp, the
 * textbook's two plate resistances in series (Langford-Smith, ch. 13).
 */
export function plateToPlateImpedance(s: PushPullSolution): number | null {
  const rHalf = s.design.rPrimary / 2;
  const c = emptyCurrents();
  const net = (w: number) => {
    plateOf(s.tube, s.feed, s.supply, w, rHalf, s.vgk, c);
    const m1 = c.mmf;
    plateOf(s.tube2, s.feed, s.supply, -w, rHalf, s.vgk2, c);
    return m1 - c.mmf;
  };
  const h = 1e-3;
  const slope = (net(h) - net(-h)) / (2 * h);
  return slope < 0 && Number.isFinite(slope) ? 4 / -slope : null;
}
