import { cutoffGridVoltage } from '../tube/koren';
import type { CurveSheet } from '../stage/curveSheet';
import { CURVE_SAMPLES } from '../stage/curveSheet';
import { acLoadLine, dissipationLimit, gridsDownTo, MAX_FAMILY_CURVES, type PlanePoint, type PlateCurve } from '../stage/planeSeries';
import { niceCeil, type PlateExtent } from '../stage/plateExtent';
import { primaryCurrent, screenVoltage, type ScreenFeed } from './electrodes';
import type { OutputTube } from './outputTube';
import type { OutputSolution } from './solveOutput';

const EXTENT_MIN_VOLTS = 1;
const EXTENT_MAX_VOLTS = 1e5;
const EXTENT_MAX_WATTS = 1e5;

/**
 * The plate-plane window for an output stage. A transformer lets the plate
 * swing to about twice B+, so the voltage axis runs to 2.2 × B+; the current
 * axis to 2.2 × the current the rated dissipation allows at B+. Both depend
 * on the tube and B+ only, so the window stays still while the point moves.
 */
export function outputExtent(tube: OutputTube, bplus: number): PlateExtent {
  // Held to a window a chart can draw: a B+ of 6.8e307 V (found by the robustness test) made an infinite axis.
  const b = Number.isFinite(bplus) && bplus > 0 ? Math.min(Math.max(bplus, EXTENT_MIN_VOLTS), EXTENT_MAX_VOLTS) : 250;
  const pd = tube?.ratings?.maxPlateDissipation;
  const watts = typeof pd === 'number' && pd > 0 && Number.isFinite(pd) ? Math.min(pd, EXTENT_MAX_WATTS) : 10;
  return { vmax: niceCeil(2.2 * b), iaMax: niceCeil((2.2 * watts) / b) };
}

/** The grid voltage that cuts the tube off at the right edge of the chart. */
function cutoffAt(tube: OutputTube, feed: ScreenFeed, vmax: number): number {
  if (tube.law.kind === 'triode') return Math.abs(cutoffGridVoltage(tube.law.tube.model.params, vmax));
  return Math.max(1, screenVoltage(feed, vmax) / tube.law.params.mu);
}

/**
 * Plate curves for the connection as wired: at the set screen voltage for a
 * pentode, with the screen following the plate for triode and ultralinear
 * connections (so the family is the one the stage really moves on). The
 * y value is the primary current (plate plus screen when tied).
 */
export function outputSheet(tube: OutputTube, feed: ScreenFeed, extent: PlateExtent, maxCurves = MAX_FAMILY_CURVES): CurveSheet {
  const grids = gridsDownTo(cutoffAt(tube, feed, extent.vmax), maxCurves);
  const family: PlateCurve[] = grids.map((vg) => {
    const points: PlanePoint[] = [];
    for (let k = 0; k <= CURVE_SAMPLES; k++) {
      const v = (extent.vmax * k) / CURVE_SAMPLES;
      points.push({ v, i: primaryCurrent(tube, feed, v, vg) });
    }
    return { vg, points };
  });
  return {
    extent,
    family,
    dissipation: dissipationLimit(tube.ratings.maxPlateDissipation, extent.vmax, extent.iaMax),
    maxPlateVoltage: tube.ratings.maxPlateVoltage,
    maxPlateDissipation: tube.ratings.maxPlateDissipation,
  };
}

export interface OutputOverlay {
  /** Nearly vertical: through (supply, 0) with slope −1/Rpri. */
  readonly dcLoad: readonly PlanePoint[];
  /** Through the point with slope −1/(Zpri + Rpri). */
  readonly acLoad: readonly PlanePoint[];
  readonly point: PlanePoint;
  /** Where the AC load line's slope handle sits. */
  readonly loadHandle: PlanePoint;
  /**
   * The stretch of the AC load line the clean swing covers: its ends are the
   * plate-voltage extremes, each at the current the line gives there. Under
   * a sustained drive the magnetising current settles Δ from idle and the
   * instants run on the line moved up by Z·Δ/(Z + Rpri), so the band is
   * drawn on that line (parallel to the one through the idle point). The
   * line is the primary's current referred to the plate; in ultralinear the
   * plate current proper departs from it by the screen's share of the
   * winding (a few mA), so plotting the plate current's extremes would put
   * the band beside the line it belongs to.
   */
  readonly swing: readonly PlanePoint[];
}

export function outputOverlay(s: OutputSolution, extent: PlateExtent, swing: { vpkMin: number; vpkMax: number; magnetising: number } | null): OutputOverlay {
  const { supply, vpk, ip } = s.op;
  const rp = s.design.rPrimary;
  const top = extent.iaMax * 1.02;
  const dcLoad = rp > 0 ? [{ v: supply, i: 0 }, { v: Math.max(0, supply - top * rp), i: Math.min(top, supply / rp) }] : [{ v: supply, i: 0 }, { v: supply, i: top }];
  const zt = s.design.zPrimary + rp;
  const acLoad = acLoadLine(vpk, ip, zt, extent.vmax).map((p) => (p.i > top ? { v: vpk - (top - ip) * zt, i: top } : p));
  // The handle sits 60 % of the way from the point to where the line leaves the chart on the right.
  const right = acLoad[acLoad.length - 1] ?? { v: vpk, i: ip };
  const loadHandle = { v: vpk + 0.6 * (right.v - vpk), i: ip + 0.6 * (right.i - ip) };
  const shift = swing ? (s.design.zPrimary * (swing.magnetising - s.op.mmf)) / zt : 0;
  const onLine = (v: number) => ({ v, i: ip - (v - vpk) / zt + shift });
  const sw = swing ? [onLine(swing.vpkMin), onLine(swing.vpkMax)] : [];
  return { dcLoad, acLoad, point: { v: vpk, i: ip }, loadHandle, swing: sw };
}

/** The primary impedance whose AC load line passes through (v, i), or null when the point is not on a falling line. */
export function zPrimaryThrough(s: OutputSolution, v: number, i: number): number | null {
  const dv = v - s.op.vpk;
  const di = s.op.ip - i;
  if (!(dv > 0) || !(di > 0)) return null;
  const z = dv / di - s.design.rPrimary;
  return z > 0 && Number.isFinite(z) ? z : null;
}
