import { acLoadLine, biasLine, dcLoadLine, type PlanePoint } from './planeSeries';
import { parallel } from './parallel';
import type { PlateExtent } from './plateExtent';
import type { CheckedStage } from './stageDesign';
import type { OperatingPoint } from './solveStage';

/** The moving layer of a plate chart: the lines through the operating point. */
export interface StageOverlay {
  readonly dcLoad: readonly PlanePoint[];
  /** Empty when there is no AC load different from the DC one (no RL, Rk bypassed). */
  readonly acLoad: readonly PlanePoint[];
  readonly bias: readonly PlanePoint[];
  /** The operating point in the plate plane (Vpk, Ia). */
  readonly point: PlanePoint;
}

/** Samples on the bias line: enough for a smooth curve, few enough for 60 frames a second while dragging. */
export const BIAS_SAMPLES = 40;

export function stageOverlay(d: CheckedStage, op: OperatingPoint, extent: PlateExtent): StageOverlay {
  const rAc = parallel(d.ra, d.rl) + (d.bypassed ? 0 : d.rk);
  const rDc = d.ra + d.rk;
  const showAc = Math.abs(rAc - rDc) > 1e-9 * rDc;
  return {
    dcLoad: dcLoadLine(d.bplus, rDc),
    acLoad: showAc ? acLoadLine(op.vpk, op.ia, rAc, extent.vmax) : [],
    bias: d.rk > 0 ? biasLine(d.tube, d.rk, d.vbias, extent.iaMax, extent.vmax, BIAS_SAMPLES) : [],
    point: { v: op.vpk, i: op.ia },
  };
}
