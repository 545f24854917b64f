import { recordOf, type TubeLike } from '../tube/types';
import { dissipationLimit, familyGrids, plateCurve, plateFamily, type PlanePoint, type PlateCurve } from './planeSeries';
import { plateExtent, type PlateExtent } from './plateExtent';

/**
 * The static layer of a plate chart: what depends only on the tube and the
 * supply, so it is built once per tube/B+ change and not on every drag move.
 */
export interface CurveSheet {
  readonly extent: PlateExtent;
  readonly family: readonly PlateCurve[];
  /** The rated plate-dissipation hyperbola; empty for a bare model with no ratings. */
  readonly dissipation: readonly PlanePoint[];
  /** Rated maximum plate voltage, V, or null when unknown. */
  readonly maxPlateVoltage: number | null;
  readonly maxPlateDissipation: number | null;
  /**
   * A voltage stage whose grid returns through a leak: the plate curve at the
   * highest grid its cathode bias can reach, where the grid's own current
   * through the leak alone biases it (leakLimit); above it the grid draws
   * current. Absent or null for a grid held at 0 V and for other charts.
   */
  readonly gridLimit?: PlateCurve | null;
}

/** Samples per plate curve: smooth at chart sizes up to ~1600 px wide. */
export const CURVE_SAMPLES = 160;

export function curveSheet(tube: TubeLike, bplus: number, extent: PlateExtent = plateExtent(tube, bplus), maxCurves?: number): CurveSheet {
  const rec = recordOf(tube);
  const grids = familyGrids(tube, extent.vmax, maxCurves);
  return {
    extent,
    family: plateFamily(tube, grids, extent.vmax, CURVE_SAMPLES),
    dissipation: rec ? dissipationLimit(rec.ratings.maxPlateDissipation, extent.vmax, extent.iaMax) : [],
    maxPlateVoltage: rec ? rec.ratings.maxPlateVoltage : null,
    maxPlateDissipation: rec ? rec.ratings.maxPlateDissipation : null,
  };
}

/** The sheet with the plate curve at a grid-leak limit `vg` (V, below 0), or with none for a grid that can reach 0 V. */
export function withGridLimit(sheet: CurveSheet, tube: TubeLike, vg: number): CurveSheet {
  return { ...sheet, gridLimit: vg < 0 ? plateCurve(tube, vg, sheet.extent.vmax, CURVE_SAMPLES) : null };
}
