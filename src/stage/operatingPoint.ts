import { bracketedRoot } from '../numeric/bracketedRoot';
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

export function solveLoop(model: TriodeModel, bplus: number, ra: number, rk: number, vgrid: number): LoopPoint {
  const p = model.params;
  const rSeries = ra + rk;
  const at = (ia: number, converged: boolean): LoopPoint => {
    const vk = ia * rk;
    const va = bplus - ia * ra;
    const vpk = va - vk;
    return { va, vk, ia, vgk: vgrid - vk, vpk, pa: vpk * ia, converged };
  };
  if (!(rSeries > 0)) return at(korenPlateCurrent(p, bplus, vgrid), true);
  const iaMax = bplus / rSeries;
  const f = (ia: number) => korenPlateCurrent(p, bplus - ia * rSeries, vgrid - ia * rk) - ia;
  if (!(f(0) > 0)) return at(0, true);
  const root = bracketedRoot(f, 0, iaMax, iaMax * LOOP_REL_TOL);
  return at(root.x, root.converged);
}
