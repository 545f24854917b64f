import { bracketedRoot } from '../numeric/bracketedRoot';
import { fail, type Result } from '../result';
import { emptyCurrents, screenFeedOf, stageCurrentsInto, type ScreenFeed, type StageCurrents } from '../output/electrodes';
import { effectiveConnection, type OutputDesign } from '../output/outputDesign';
import type { OutputTube } from '../output/outputTube';
import { OUTPUT_CUTOFF_A } from '../output/solveOutput';
import { checkPushPull, mismatchParts, type PushPullDesign } from './pushPullDesign';

/** One tube of the pair at idle. */
export interface PushPullTubePoint {
  /** Plate to cathode, V. */
  readonly vpk: number;
  readonly ia: number;
  readonly ig2: number;
  readonly ik: number;
  /** The current its half of the primary carries (plate, plus the screen when tied), A. */
  readonly ip: number;
  /** The current its half couples to the core (ip, plus the tap's share of an ultralinear screen's), A. */
  readonly mmf: number;
  /** Plate and screen dissipation, W. */
  readonly pa: number;
  readonly pg2: number;
}

export interface PushPullSolution {
  readonly tube: OutputTube;
  /** The second tube as it is (its current scaled by the mismatch). */
  readonly tube2: OutputTube;
  readonly design: PushPullDesign;
  /** Grid to cathode at idle, V (the first tube's; the second's is vgk2). */
  readonly vgk: number;
  /** The second tube's grid to cathode at idle, V: vgk, plus the offset that sets its idle current apart (a trimmed or untrimmed side). */
  readonly vgk2: number;
  /** Cathode to ground, V (cathode bias); 0 for fixed bias. */
  readonly vk: number;
  /** The centre tap to the cathode, V. */
  readonly supply: number;
  readonly idle: readonly [PushPullTubePoint, PushPullTubePoint];
  /** The idle current the supply delivers to the stage (both cathodes), A. */
  readonly supplyCurrent: number;
  /** The DC the two halves leave uncancelled in the core (tube 1's coupled current less tube 2's), A. */
  readonly dcImbalance: number;
  /** Each tube's screen feed at idle (its tap on its own half for ultralinear). */
  readonly feed: ScreenFeed;
}

/** A tube whose current, and so its gm, is (1 + m) times the library tube's at every voltage (Koren's law scales as 1/kg). */
export function scaledTube(tube: OutputTube, m: number): OutputTube {
  if (m === 0) return tube;
  const k = 1 + m;
  if (tube.law.kind === 'pentode') {
    const p = tube.law.params;
    return { ...tube, law: { ...tube.law, params: { ...p, kg1: p.kg1 / k, kg2: p.kg2 / k } } };
  }
  const t = tube.law.tube;
  return { ...tube, law: { ...tube.law, tube: { ...t, model: { ...t.model, params: { ...t.model.params, kg1: t.model.params.kg1 / k } } } } };
}

const VOLT_TOL = 1e-9;

/**
 * Plate voltage of one tube when its half of the primary carries a winding
 * signal `winding` and its DC resistance `rHalf`: vpk = supply − winding −
 * ip(vpk)·rHalf, found by fixed-point iteration (it contracts: the slope is
 * rHalf/rp, under 1 for any real primary) and by bisection if it does not.
 */
export function plateOf(tube: OutputTube, feed: ScreenFeed, supply: number, winding: number, rHalf: number, vgk: number, c: StageCurrents): number {
  const top = supply - winding;
  if (rHalf === 0) {
    stageCurrentsInto(tube, feed, Math.max(top, 0), vgk, c, winding);
    return Math.max(top, 0);
  }
  let v = Math.max(top, 0);
  for (let k = 0; k < 60; k++) {
    stageCurrentsInto(tube, feed, v, vgk, c, winding);
    const next = Math.max(top - c.ip * rHalf, 0);
    if (Math.abs(next - v) <= VOLT_TOL * (Math.abs(supply) + 1)) {
      stageCurrentsInto(tube, feed, next, vgk, c, winding);
      return next;
    }
    v = next;
  }
  const r = bracketedRoot((x) => {
    stageCurrentsInto(tube, feed, x, vgk, c, winding);
    return x + c.ip * rHalf - top;
  }, 0, Math.max(top, 1e-9), VOLT_TOL * (Math.abs(supply) + 1));
  stageCurrentsInto(tube, feed, r.x, vgk, c, winding);
  return r.x;
}

function pointOf(tube: OutputTube, feed: ScreenFeed, supply: number, rHalf: number, vgk: number): PushPullTubePoint {
  const c = emptyCurrents();
  const vpk = plateOf(tube, feed, supply, 0, rHalf, vgk, c);
  const tied = feed.kind === 'tied';
  const vg2k = feed.kind === 'fixed' ? feed.vg2k : feed.kind === 'tap' ? feed.supply : vpk;
  return { vpk, ia: c.ia, ig2: c.ig2, ik: c.ik, ip: c.ip, mmf: c.mmf, pa: vpk * (tied ? c.ip : c.ia), pg2: tied ? 0 : vg2k * c.ig2 };
}

/** What stays the same wherever the shared cathode sits: the two tubes, half the primary's resistance, the screen's connection. */
interface PairParts {
  readonly tube: OutputTube;
  readonly tube2: OutputTube;
  readonly design: PushPullDesign;
  readonly rHalf: number;
  readonly mismatch: ReturnType<typeof mismatchParts>;
  readonly feedAt: (vk: number) => ScreenFeed;
}

function partsOf(tube: OutputTube, d: PushPullDesign): PairParts {
  const mismatch = mismatchParts(d.mismatch);
  const connection = effectiveConnection(d as unknown as OutputDesign, tube);
  return { tube, tube2: scaledTube(tube, mismatch.gm), design: d, rHalf: d.rPrimary / 2, mismatch, feedAt: (vk) => screenFeedOf(connection, d.screenVolts - vk, d.ulTap, d.bplus - vk) };
}

/**
 * With the idle mismatch given apart from the gm's, the second grid sits off the first by what brings its idle
 * current to (1 + idle) × the first's (the balance adjustment of a fixed-bias side, or a cathode-biased pair's spread).
 */
function offsetAt(p: PairParts, feed: ScreenFeed, supply: number, g: number): number {
  const { mismatch, tube, tube2, rHalf } = p;
  if (mismatch.idle === null || (mismatch.idle === 0 && mismatch.gm === 0)) return 0;
  const want = (1 + mismatch.idle) * pointOf(tube, feed, supply, rHalf, g).ik;
  const r = bracketedRoot((x) => pointOf(tube2, feed, supply, rHalf, g + x).ik - want, -Math.max(supply, 10), Math.max(-g, 0) + 1e-9, 1e-9);
  return r.x;
}

/** The shared resistor's voltage less what the pair's idle current would drop across it with the cathode at x, V. */
function cathodeExcess(p: PairParts, x: number): number {
  const feed = p.feedAt(x);
  const supply = p.design.bplus - x;
  return p.design.rk * (pointOf(p.tube, feed, supply, p.rHalf, -x).ik + pointOf(p.tube2, feed, supply, p.rHalf, -x + offsetAt(p, feed, supply, -x)).ik) - x;
}

/** The pair with its cathode held at vk (0 for fixed bias) and the first grid at vgk, every electrode at rest; a failure where it cannot run. */
function pairAt(p: PairParts, vk: number, vgk: number): Result<PushPullSolution> {
  const { tube, tube2, design: d, rHalf } = p;
  const feed = p.feedAt(vk);
  const supply = d.bplus - vk;
  const vgk2 = vgk + offsetAt(p, feed, supply, vgk);
  const one = pointOf(tube, feed, supply, rHalf, vgk);
  const two = pointOf(tube2, feed, supply, rHalf, vgk2);
  if (!(one.ik > OUTPUT_CUTOFF_A) || !(two.ik > OUTPUT_CUTOFF_A)) {
    return fail('cutoff', d.bias === 'fixed' ? `The ${tube.id}s are cut off at ${d.vg} V grid bias: make the bias less negative` : `The ${tube.id}s are cut off with this Rk`, d.bias === 'fixed' ? 'vg' : 'rk');
  }
  if (!(one.vpk > 0.5) || !(two.vpk > 0.5)) return fail('supply-too-low', 'The primary\'s DC drop leaves no voltage on the plates: lower its DC resistance or raise B+', 'rPrimary');
  return {
    ok: true,
    tube,
    tube2,
    design: d,
    vgk,
    vgk2,
    vk,
    supply,
    idle: [one, two],
    supplyCurrent: one.ik + two.ik,
    dcImbalance: one.mmf - two.mmf,
    feed,
  };
}

/**
 * The pair at idle. Fixed bias: both grids at the bias supply. Cathode bias:
 * the shared resistor carries both cathodes' current, Vk = Rk·(Ik1 + Ik2),
 * found by a bracketed root on Vk (the current falls as Vk rises, so there is
 * one). Each tube's half of the primary drops its own current through half
 * the primary's DC resistance.
 */
export function solvePushPull(tube: OutputTube, design: PushPullDesign): Result<PushPullSolution> {
  const problem = checkPushPull(tube, design);
  if (problem) return problem;
  const d = design;
  const p = partsOf(tube, d);
  let vk = 0;
  if (d.bias === 'cathode') {
    const r = bracketedRoot((x) => cathodeExcess(p, x), 0, d.bplus, VOLT_TOL * d.bplus);
    if (!r.converged && Math.abs(cathodeExcess(p, r.x)) > 1e-6 * d.bplus) return fail('no-convergence', 'The shared cathode resistor\'s bias did not settle; try another Rk', 'rk');
    vk = r.x;
  }
  return pairAt(p, vk, d.bias === 'cathode' ? -vk : d.vg);
}

/**
 * A cathode-biased pair with its shared cathode moved to vk (the grids, at
 * ground through their resistors, vk below it), every electrode's idle
 * current at that bias: the pair as it stands once a drive has shifted its
 * bias. The design is the solution's; a failure where the tubes cut off.
 */
export function pairWithCathodeAt(s: PushPullSolution, vk: number): Result<PushPullSolution> {
  return pairAt(partsOf(s.tube, s.design), vk, -vk);
}
