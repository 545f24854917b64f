import { bracketedRoot } from '../numeric/bracketedRoot';
import { formatValue } from '../parts/formatValue';
import { gridCurrent } from '../tube/gridCurrent';
import { gridVoltageForCurrent, korenPlateCurrent } from '../tube/koren';
import { modelOf, type TubeLike } from '../tube/types';
import { fail, type Result } from '../result';
import { checkNumber, checkTube, LIMITS } from './checkInput';

/**
 * The design behind a point of the plate plane: where the pointer is on the
 * chart, (Vpk, Ia), which Ra and Rk put a cathode-biased stage there with the
 * given B+. At fixed Vpk the grid voltage that passes Ia is unique (Ip rises
 * with Vgk), so Vgk, Rk = −Vgk/Ia, Va = Vpk − Vgk and Ra = (B+ − Va)/Ia follow.
 *
 * With the grid returned through a leak `rg`, its own current there biases it
 * lower by Ig·Rg (as solveStage solves it), so Rk sets the rest:
 * Vk = −Vgk − Rg·Ig(Vgk). The highest grid a cathode-biased stage can then
 * sit at is where the leak alone biases it (Rk = 0): leakLimit.
 */
export interface PlanePointTarget {
  readonly tube: TubeLike;
  readonly bplus: number;
  /** Plate–cathode voltage, V. */
  readonly vpk: number;
  /** Plate current, A. */
  readonly ia: number;
  /** The grid leak, Ω, whose drop from the grid's own current biases it; none: the grid held at 0 V. */
  readonly rg?: number | null;
}

export interface PlanePointDesign {
  readonly ra: number;
  readonly rk: number;
  readonly vgk: number;
  /** Plate to ground, V. */
  readonly va: number;
}

/** The smallest plate resistor a drag may produce, Ω: below it the "stage" is a short to B+. */
export const MIN_DRAG_RA = 100;
/** The smallest plate current a drag may ask for, A. */
export const MIN_DRAG_IA = 2e-6;
/** Relative slack between "reachable" (nearestReachable) and "designable" (designAtPlanePoint), so a point clamped onto a boundary is never refused by rounding. */
const BOUNDARY_SLACK = 1e-6;

export function designAtPlanePoint(t: PlanePointTarget): Result<PlanePointDesign> {
  if (typeof t !== 'object' || t === null) return fail('invalid-input', 'No point given');
  const problem =
    checkTube(t.tube) ??
    checkNumber('bplus', 'B+', t.bplus, 'V', 0, LIMITS.maxVolts, { minExclusive: true }) ??
    checkNumber('vpk', 'Plate voltage', t.vpk, 'V', 0, LIMITS.maxVolts, { minExclusive: true }) ??
    checkNumber('ia', 'Plate current', t.ia, 'A', MIN_DRAG_IA, 100);
  if (problem) return problem;
  const model = modelOf(t.tube);
  const p = model.params;
  const rg = t.rg ?? null;
  const top = leakLimit(t.tube, rg);
  const iaAtTop = korenPlateCurrent(p, t.vpk, top);
  if (t.ia > iaAtTop * (1 + BOUNDARY_SLACK)) {
    const most = `At ${t.vpk.toFixed(0)} V the tube passes at most ${(iaAtTop * 1e3).toFixed(2)} mA`;
    return fail(
      'grid-current',
      top < 0 ? `${most} with cathode bias: its grid's own current through its ${formatValue(rg!, 'Ω')} leak holds it ${(-top).toFixed(2)} V or more below its cathode.` : `${most} before its grid goes positive.`,
      'ia',
    );
  }
  const vgk = Math.min(gridVoltageForCurrent(p, t.vpk, t.ia), top);
  const vk = Math.max(0, -vgk - (rg !== null && rg > 0 ? rg * gridCurrent(model, vgk) : 0));
  const va = t.vpk + vk;
  const ra = (t.bplus - va) / t.ia;
  if (!(ra >= MIN_DRAG_RA * (1 - BOUNDARY_SLACK))) {
    return fail('supply-too-low', `With B+ at ${t.bplus.toFixed(0)} V the plate cannot sit at ${va.toFixed(0)} V with ${(t.ia * 1e3).toFixed(2)} mA: the load line ends at B+.`, 'vpk');
  }
  return { ok: true, ra, rk: vk / t.ia, vgk, va };
}

/**
 * The highest Vgk a cathode-biased grid returned through `rg` can sit at, V:
 * where its own current through the leak alone biases it (Vgk + Rg·Ig = 0,
 * Rk = 0); 0 V with no leak. Ig rises with Vgk, so one root below 0.
 */
export function leakLimit(tube: TubeLike, rg: number | null): number {
  if (rg === null || !(rg > 0) || !Number.isFinite(rg)) return 0;
  const model = modelOf(tube);
  // A drag asks for the same tube and leak on every move (the reachable point, its design, the chart's sheet), and a
  // compared tube for its own: one root per tube serves until its leak changes.
  const kept = lastLimits.get(model);
  if (kept && kept.rg === rg) return kept.vgk;
  const f = (vgk: number) => vgk + rg * gridCurrent(model, vgk);
  const vgk = f(0) > 0 ? bracketedRoot(f, -10, 0, 1e-9).x : 0;
  lastLimits.set(model, { rg, vgk });
  return vgk;
}

const lastLimits = new WeakMap<object, { readonly rg: number; readonly vgk: number }>();

/** Where a drag may go: the asked point if reachable, else the nearest reachable one, with the reason. */
export interface ReachablePoint {
  readonly vpk: number;
  readonly ia: number;
  /** Why the asked point could not be reached; null when it was. */
  readonly reason: string | null;
}

/**
 * Moves an asked plate-plane point to the nearest one a cathode-biased stage
 * on this B+ can reach: not above the 0 V grid curve (grid current), not so
 * far right that the plate would need a plate resistor under MIN_DRAG_RA,
 * and not below MIN_DRAG_IA. Each limit is a monotonic boundary, found by
 * bisection, so the answer is always on the reachable side.
 */
export function nearestReachable(tube: TubeLike, bplus: number, vpk: number, ia: number, rg: number | null = null): Result<ReachablePoint> {
  const problem =
    checkTube(tube) ??
    checkNumber('bplus', 'B+', bplus, 'V', 0, LIMITS.maxVolts, { minExclusive: true }) ??
    checkNumber('vpk', 'Plate voltage', vpk, 'V', -LIMITS.maxVolts, LIMITS.maxVolts) ??
    checkNumber('ia', 'Plate current', ia, 'A', -100, 100);
  if (problem) return problem;
  const model = modelOf(tube);
  const p = model.params;
  const gridTop = leakLimit(tube, rg);
  // The cathode's voltage at a grid voltage: what Rk must drop once the leak has dropped its share.
  const cathodeAt = (vgk: number) => Math.max(0, -vgk - (rg !== null && rg > 0 ? rg * gridCurrent(model, vgk) : 0));
  let reason: string | null = null;
  let v = Math.min(Math.max(vpk, 0.5), bplus);
  let i = Math.max(ia, MIN_DRAG_IA);
  if (ia < MIN_DRAG_IA) reason = 'The plate current cannot go lower here.';
  // The two limits meet at a corner (on the 0 V curve, where the plate is as
  // close to B+ as Ra allows), and moving off one can cross the other; apply
  // them in turn until both hold. Each pass moves strictly inward.
  for (let pass = 0; pass < 8; pass++) {
    let moved = false;
    // Grid current: above the 0 V curve (or, through a leak, the curve where the leak alone biases the grid). Drop straight down onto it.
    const top = korenPlateCurrent(p, v, gridTop) * (1 - BOUNDARY_SLACK);
    if (i > top) {
      reason =
        gridTop < 0
          ? `Above the curve with the grid ${(-gridTop).toFixed(2)} V below its cathode the grid would draw current: its own current through Rg biases it that far with no Rk, so at ${v.toFixed(0)} V the tube passes at most ${(top * 1e3).toFixed(2)} mA.`
          : `Above the 0 V grid curve the grid would draw current: at ${v.toFixed(0)} V the tube passes at most ${(top * 1e3).toFixed(2)} mA.`;
      i = Math.max(top, MIN_DRAG_IA);
      moved = true;
    }
    // The plate must stay below B+ by at least Ia·MIN_DRAG_RA: Va = Vpk − Vgk(Vpk, Ia) rises with Vpk.
    const current = i;
    const vaAt = (vv: number) => vv + cathodeAt(gridVoltageForCurrent(p, vv, current));
    const vaMax = bplus - i * MIN_DRAG_RA * (1 + BOUNDARY_SLACK);
    if (vaAt(v) > vaMax) {
      let lo = 0;
      let hi = v;
      for (let k = 0; k < 60; k++) {
        const mid = 0.5 * (lo + hi);
        if (vaAt(mid) > vaMax) hi = mid;
        else lo = mid;
      }
      v = lo;
      reason = `With B+ at ${bplus.toFixed(0)} V the load line cannot reach further right at ${(i * 1e3).toFixed(2)} mA.`;
      moved = true;
    }
    if (!moved) break;
  }
  return { ok: true, vpk: v, ia: i, reason };
}

/** The grid voltage at which the tube passes ia at vpk: the Vgk read off the curves at the cursor, V. */
export function gridVoltageAt(tube: TubeLike, vpk: number, ia: number): number | null {
  if (!(vpk > 0) || !(ia > 0) || !Number.isFinite(vpk) || !Number.isFinite(ia) || checkTube(tube)) return null;
  const p = modelOf(tube).params;
  if (ia > korenPlateCurrent(p, vpk, 0)) return null; // would need a positive grid: off the family
  const vg = gridVoltageForCurrent(p, vpk, ia);
  // At plate voltages no tube sees (past 1e150 V) the bracket's floor is unbounded: off the family too.
  return Number.isFinite(vg) ? vg : null;
}
