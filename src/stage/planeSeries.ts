import { bracketedRoot } from '../numeric/bracketedRoot';
import { cutoffGridVoltage, korenPlateCurrent } from '../tube/koren';
import { modelOf, type TubeLike } from '../tube/types';

/**
 * Series in the plate plane for drawing: x is the plate–cathode voltage Vpk
 * in volts (the voltage the characteristic curves are measured against), y is
 * the plate current in amperes. A NaN i marks a gap (drawn with line.defined).
 */
export interface PlanePoint {
  readonly v: number;
  readonly i: number;
}

export interface PlateCurve {
  /** Grid–cathode voltage of this curve, V. */
  readonly vg: number;
  readonly points: readonly PlanePoint[];
}

/** One curve of the plate family: Ia against Vpk at fixed Vgk, n+1 samples over [0, vmax]. */
export function plateCurve(tube: TubeLike, vg: number, vmax: number, n = 120): PlateCurve {
  const p = modelOf(tube).params;
  const points: PlanePoint[] = [];
  const steps = Math.max(1, Math.floor(n));
  for (let k = 0; k <= steps; k++) {
    // The share first, then the span: vmax · k overflows for a span near the largest double.
    const v = vmax * (k / steps);
    points.push({ v, i: korenPlateCurrent(p, v, vg) });
  }
  return { vg, points };
}

export function plateFamily(tube: TubeLike, grids: readonly number[], vmax: number, n = 120): PlateCurve[] {
  return grids.map((vg) => plateCurve(tube, vg, vmax, n));
}

const NICE_STEPS = [0.05, 0.1, 0.2, 0.25, 0.5, 1, 2, 2.5, 5, 10, 20, 25, 50, 100];
/** Most curves a family is drawn with; enough to read, few enough to label. */
export const MAX_FAMILY_CURVES = 12;
/** The most curves a sheet may be asked for: the densest the workbench offers, to interpolate between. */
export const DENSEST_FAMILY_CURVES = 24;

/**
 * Grid voltages for a plate family: 0 V down to the model's cutoff at vmax in
 * a "nice" step, fine for high-mu types (0.5 V for a 12AX7) and coarse for
 * power triodes (20 V for a 300B), as printed curve sheets do.
 */
export function familyGrids(tube: TubeLike, vmax: number, maxCurves = MAX_FAMILY_CURVES): number[] {
  return gridsDownTo(Math.abs(cutoffGridVoltage(modelOf(tube).params, Math.max(vmax, 1))), maxCurves);
}

/** 0 V down to −cutoff in a nice step, at most maxCurves values. */
export function gridsDownTo(cutoff: number, maxCurves = MAX_FAMILY_CURVES): number[] {
  const wanted = cutoff / Math.max(2, maxCurves - 1);
  const step = NICE_STEPS.find((s) => s >= wanted) ?? NICE_STEPS[NICE_STEPS.length - 1]!;
  const grids: number[] = [];
  for (let vg = 0; vg >= -cutoff && grids.length < maxCurves; vg -= step) grids.push(Number(vg.toFixed(6)));
  return grids;
}

/** DC load line: Vpk = B+ − Ia·(Ra + Rk), from the current axis to the voltage axis. */
export function dcLoadLine(bplus: number, rSeries: number): PlanePoint[] {
  if (typeof bplus !== 'number' || !Number.isFinite(bplus) || typeof rSeries !== 'number' || Number.isNaN(rSeries)) return [];
  // A series resistance too small to draw (a denormal) is a vertical line, as 0 Ω is.
  if (!(rSeries > 0) || !Number.isFinite(bplus / rSeries)) return [{ v: bplus, i: 0 }];
  return [
    { v: 0, i: bplus / rSeries },
    { v: bplus, i: 0 },
  ];
}

/**
 * AC load line through the operating point with slope −1/rAc (rAc = Ra ∥ RL,
 * plus Rk when it is not bypassed, since the plane's x is Vpk), clipped to
 * Vpk ∈ [0, vmax] and Ia ≥ 0.
 */
export function acLoadLine(vpk: number, ia: number, rAc: number, vmax: number): PlanePoint[] {
  if (!(rAc > 0) || !Number.isFinite(rAc)) return [];
  const vAtZeroI = vpk + ia * rAc;
  const left = { v: 0, i: ia + vpk / rAc };
  const right = vAtZeroI <= vmax ? { v: vAtZeroI, i: 0 } : { v: vmax, i: ia - (vmax - vpk) / rAc };
  return [left, right];
}

/**
 * Cathode bias line mapped onto the plate plane: for each current Ia the grid
 * sits at Vgk = vbias − Ia·Rk, and the point is where that grid's plate curve
 * carries Ia. Points the tube cannot reach within vmax are left out.
 */
export function biasLine(tube: TubeLike, rk: number, vbias: number, iaMax: number, vmax: number, n = 48): PlanePoint[] {
  const p = modelOf(tube).params;
  const out: PlanePoint[] = [];
  for (let k = 1; k <= n; k++) {
    const ia = (iaMax * k) / n;
    const vgk = vbias - ia * rk;
    if (vgk > 0) continue;
    if (korenPlateCurrent(p, vmax, vgk) < ia) continue;
    const r = bracketedRoot((v) => korenPlateCurrent(p, v, vgk) - ia, 0, vmax, vmax * 1e-9);
    if (r.converged) out.push({ v: r.x, i: ia });
  }
  return out;
}

/** The plate-dissipation limit Ia = Pmax/Vpk, within the chart's current and voltage ranges. */
export function dissipationLimit(pmax: number, vmax: number, iaMax: number, n = 64): PlanePoint[] {
  if (!(pmax > 0) || !(vmax > 0) || !(iaMax > 0)) return [];
  const vStart = Math.min(vmax, pmax / iaMax);
  const out: PlanePoint[] = [];
  for (let k = 0; k <= n; k++) {
    // Denser where the hyperbola bends: geometric spacing in V.
    const v = vStart * Math.pow(vmax / vStart, k / n);
    // A point the doubles cannot hold (an extent near their ends) is left out of the curve.
    if (Number.isFinite(v) && v > 0 && Number.isFinite(pmax / v)) out.push({ v, i: pmax / v });
  }
  return out;
}
