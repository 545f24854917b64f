import { bracketedRoot } from '../numeric/bracketedRoot';
import { gridCurrent } from '../tube/gridCurrent';
import { korenPlateCurrent } from '../tube/koren';
import type { TriodeModel } from '../tube/types';

/**
 * The DC operating point of the series loop every triode stage here is made
 * of: B+ → Ra → plate … cathode → Rk → ground, with the grid held at vgrid to
 * ground. A common-cathode stage has vgrid = its fixed bias (0 for cathode
 * bias); a follower has Ra = 0 and vgrid = the driving plate's voltage.
 *
 * With Ia the unknown, Kirchhoff's voltage law gives
 *   Vk = Ia·Rk,  Va = B+ − Ia·Ra,  Vpk = Va − Vk,  Vgk = vgrid − Vk,
 * and the tube closes the loop: Ia = Ip(Vpk, Vgk). Both arguments fall as Ia
 * rises and Ip rises with each of them, so f(Ia) = Ip − Ia is strictly
 * decreasing from f(0) ≥ 0 to f(B+/(Ra+Rk)) < 0: exactly one root, which a
 * bracketed solver finds without any chance of diverging.
 *
 * Held through a grid leak `rg` (a capacitor-coupled grid), the grid's own
 * current flows out through it: the grid sits Ig·Rg below vgrid (grid-leak
 * bias), which matters for a high-mu stage biased near a volt, where the
 * retarding-field current is a fraction of a microamp. Vgk then solves
 * Vgk + Rg·Ig(Vgk) = vgrid − Vk, rising with its right side, so f above still
 * falls with Ia.
 */
export interface LoopPoint {
  /** Plate voltage to ground, V. */
  readonly va: number;
  /** Cathode voltage to ground, V. */
  readonly vk: number;
  /** Plate current, A. */
  readonly ia: number;
  /** Grid–cathode voltage, V. */
  readonly vgk: number;
  /** Plate–cathode voltage, V. */
  readonly vpk: number;
  /** Plate dissipation Vpk·Ia, W. */
  readonly pa: number;
  readonly converged: boolean;
}

/** Relative tolerance on Ia; the consistency tests hold the point to 1e-6. */
export const LOOP_REL_TOL = 1e-12;

export function solveLoop(model: TriodeModel, bplus: number, ra: number, rk: number, vgrid: number, rg: number | null = null): LoopPoint {
  const p = model.params;
  const rSeries = ra + rk;
  const gridToCathode = (vk: number) => (rg !== null && rg > 0 ? leakBiased(model, vgrid - vk, rg) : vgrid - vk);
  const at = (ia: number, converged: boolean): LoopPoint => {
    const vk = ia * rk;
    const va = bplus - ia * ra;
    const vpk = va - vk;
    return { va, vk, ia, vgk: gridToCathode(vk), vpk, pa: vpk * ia, converged };
  };
  if (!(rSeries > 0)) return at(korenPlateCurrent(p, bplus, gridToCathode(0)), true);
  const iaMax = bplus / rSeries;
  const f = (ia: number) => korenPlateCurrent(p, bplus - ia * rSeries, gridToCathode(ia * rk)) - ia;
  if (!(f(0) > 0)) return at(0, true);
  const root = bracketedRoot(f, 0, iaMax, iaMax * LOOP_REL_TOL);
  return at(root.x, root.converged);
}

/** A grid-leak drop below this, V, is left out: it moves the plate current by parts per million at most. */
const LEAK_DROP_FLOOR = 1e-7;

/**
 * Vgk with the grid's own current through its leak: the root of
 * Vgk + Rg·Ig(Vgk) = open (open: Vgk with no grid current), bracketed by
 * [open − Rg·Ig(open), open] as Ig only rises with Vgk.
 */
function leakBiased(model: TriodeModel, open: number, rg: number): number {
  const drop = rg * gridCurrent(model, open);
  if (!(drop > LEAK_DROP_FLOOR)) return open;
  const root = bracketedRoot((vgk) => vgk + rg * gridCurrent(model, vgk) - open, open - drop, open, 1e-9);
  return root.x;
}
