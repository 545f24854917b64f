import { fail, type Result } from '../result';
import { plateCurrent } from '../tube/triode';
import { modelOf } from '../tube/types';
import { bracketedRoot } from '../numeric/bracketedRoot';
import { checkNumber, checkTube, LIMITS } from './checkInput';
import { parallel } from './parallel';
import { acLoadLine, dcLoadLine, type PlanePoint } from './planeSeries';
import type { PlateExtent } from './plateExtent';
import { solveFollower, type FollowerDesign, type FollowerSolution } from './solveFollower';
import { BIAS_SAMPLES, type StageOverlay } from './stageOverlay';

/**
 * A cathode follower on its own plate curves. Its plate sits at B+ and its
 * cathode carries the load, so in the plate plane (Vpk, Ia) the DC load line
 * is Vpk = B+ − Ia·Rk, and the bias line is Vgk = Vgrid − Ia·Rk: the same
 * two lines a cathode-biased gain stage has, with the plate resistor gone and
 * the grid held at the plate before it instead of at ground. The operating
 * point is where they cross.
 */
export interface FollowerPlane {
  readonly solution: FollowerSolution;
  readonly overlay: StageOverlay;
  /** Where the point goes as Rk changes with the grid held where it is: the only places a drag can put it. */
  readonly locus: readonly PlanePoint[];
}

/** Points on the locus: smooth at the chart's size, cheap enough for every drag frame. */
const LOCUS_SAMPLES = 48;
/** Below this current the follower is cut off (the locus ends there). */
const LOCUS_FLOOR_A = 1e-6;

/** The cathode voltage range a follower with its grid at `vgrid` can sit in: from grid-to-cathode 0 V (or ground) up to B+. */
function cathodeSpan(bplus: number, vgrid: number): { lo: number; hi: number } {
  return { lo: Math.min(Math.max(vgrid, 0), bplus), hi: bplus };
}

export function followerPlane(design: FollowerDesign, extent: PlateExtent): Result<FollowerPlane> {
  const solved = solveFollower(design);
  if (!solved.ok) return solved;
  if (typeof extent !== 'object' || extent === null || !(extent.vmax > 0) || !(extent.iaMax > 0) || !Number.isFinite(extent.vmax) || !Number.isFinite(extent.iaMax)) {
    return fail('invalid-input', 'Give the chart extent as { vmax, iaMax }, both above 0', 'extent');
  }
  const { op } = solved;
  const rk = design.rk;
  const rl = design.rl ?? Infinity;
  const rAc = parallel(rk, rl);
  const overlay: StageOverlay = {
    dcLoad: dcLoadLine(design.bplus, rk),
    // Through a capacitor the load shares the cathode's swing: the AC line is steeper than the DC one.
    acLoad: Number.isFinite(rl) ? acLoadLine(op.vpk, op.ia, rAc, extent.vmax) : [],
    bias: followerBiasLine(design, extent),
    point: { v: op.vpk, i: op.ia },
  };
  return { ok: true, solution: solved, overlay, locus: followerLocus(design, extent) };
}

/**
 * The bias line Vgk = Vgrid − Ia·Rk on the plate plane. A follower's Rk is
 * large, so the line spans a few volts of grid over a sliver of current:
 * sampled in grid voltage (from 0 V down to where the current would leave
 * the chart's plate voltage), not in current as a gain stage's is, or every
 * sample would miss it.
 */
function followerBiasLine(design: FollowerDesign, extent: PlateExtent): PlanePoint[] {
  const { tube, vgrid, rk } = design;
  const reach = extent.vmax / Math.max(modelMu(design), 1);
  const out: PlanePoint[] = [];
  for (let k = 0; k <= BIAS_SAMPLES; k++) {
    const vgk = -(reach * k) / BIAS_SAMPLES;
    const ia = (vgrid - vgk) / rk;
    if (!(ia > 0) || ia > extent.iaMax || plateCurrent(tube, extent.vmax, vgk) < ia) continue;
    const r = bracketedRoot((v) => plateCurrent(tube, v, vgk) - ia, 0, extent.vmax, extent.vmax * 1e-9);
    if (r.converged) out.push({ v: r.x, i: ia });
  }
  return out;
}

/** The tube's amplification factor, for how far down the grid the bias line need go. */
function modelMu(design: FollowerDesign): number {
  return modelOf(design.tube).params.mu;
}

/** The locus inside the chart's extent: from the cathode voltage where the current enters the chart (or the grid meets the cathode) to where it stops. */
function followerLocus(design: FollowerDesign, extent: PlateExtent): PlanePoint[] {
  const { bplus, vgrid } = design;
  const { lo, hi } = cathodeSpan(bplus, vgrid);
  const at = (vk: number) => plateCurrent(design.tube, bplus - vk, vgrid - vk);
  const cathodeFor = (ia: number) => {
    const root = bracketedRoot((vk) => at(vk) - ia, lo, hi, bplus * 1e-9);
    return root.converged ? root.x : null;
  };
  const top = at(lo) > extent.iaMax ? cathodeFor(extent.iaMax) : lo;
  const end = at(hi) < LOCUS_FLOOR_A ? cathodeFor(LOCUS_FLOOR_A) : hi;
  if (top === null || end === null || !(end > top)) return [];
  const locus: PlanePoint[] = [];
  for (let k = 0; k <= LOCUS_SAMPLES; k++) {
    const vk = top + ((end - top) * k) / LOCUS_SAMPLES;
    if (bplus - vk <= extent.vmax) locus.push({ v: bplus - vk, i: at(vk) });
  }
  return locus;
}

export interface FollowerRk {
  readonly rk: number;
  /** Why the follower is not at the current asked for (its grid would reach its cathode, or the Rk limits); null when it is. */
  readonly reason: string | null;
}

/**
 * The cathode resistor that makes a follower draw `ia` with its grid held at
 * `vgrid`: the cathode voltage where the tube's law gives that current (one
 * root: more cathode voltage means less plate voltage and a more negative
 * grid, so less current), over the current. Held within `rkRange`, and below
 * the most current the grid allows (grid at its cathode's voltage).
 */
export function followerRkFor(design: Omit<FollowerDesign, 'rk'>, ia: number, rkRange: readonly [number, number] = [LIMITS.minOhms, LIMITS.maxOhms]): Result<FollowerRk> {
  if (typeof design !== 'object' || design === null) return fail('invalid-input', 'No follower given');
  const problem =
    checkTube(design.tube) ??
    checkNumber('bplus', 'B+', design.bplus, 'V', 0, LIMITS.maxVolts, { minExclusive: true }) ??
    checkNumber('vgrid', 'Grid voltage', design.vgrid, 'V', -LIMITS.maxVolts, LIMITS.maxVolts) ??
    checkNumber('ia', 'Plate current', ia, 'A', 0, 100, { minExclusive: true });
  if (problem) return problem;
  if (!Array.isArray(rkRange) || !(rkRange[0] > 0) || !(rkRange[1] >= rkRange[0]) || !Number.isFinite(rkRange[1])) return fail('invalid-input', 'Give the Rk range as [least, most] ohms', 'rk');
  const { bplus, vgrid } = design;
  const { lo, hi } = cathodeSpan(bplus, vgrid);
  const at = (vk: number) => plateCurrent(design.tube, bplus - vk, vgrid - vk);
  const most = at(lo);
  if (!(most > LOCUS_FLOOR_A)) return fail('cutoff', `The follower is cut off with its grid at ${vgrid.toFixed(1)} V on B+ ${bplus.toFixed(0)} V, whatever its Rk`, 'vgrid');
  let reason: string | null = null;
  let want = ia;
  if (want >= most) {
    want = most;
    reason = vgrid > 0 ? 'The grid is at its cathode\'s voltage here: more current would draw grid current.' : 'The cathode is at ground here: Rk cannot go lower.';
  }
  const root = bracketedRoot((vk) => at(vk) - want, lo, hi, bplus * 1e-10);
  const vk = root.converged ? root.x : lo;
  const exact = vk / want;
  const rk = Math.min(Math.max(exact, rkRange[0]), rkRange[1]);
  if (rk !== exact) reason = rk > exact ? `Rk is held at its least, ${rkRange[0]} Ω.` : `Rk is held at its most, ${rkRange[1]} Ω.`;
  return { ok: true, rk, reason };
}
