import { recordOf, type TubeLike } from '../tube/types';

export interface PlateExtent {
  /** Highest plate–cathode voltage shown, V. */
  readonly vmax: number;
  /** Highest plate current shown, A. */
  readonly iaMax: number;
}

/** Rounds up to 1, 1.5, 2, 2.5, 3, 4, 5, 6, 8 × 10ⁿ so axes end on a readable tick. */
export function niceCeil(x: number): number {
  if (!(x > 0) || !Number.isFinite(x)) return 1;
  const exp = Math.floor(Math.log10(x));
  const base = Math.pow(10, exp);
  const m = x / base;
  const steps = [1, 1.5, 2, 2.5, 3, 4, 5, 6, 8, 10];
  return (steps.find((s) => s >= m - 1e-9) ?? 10) * base;
}

/** The largest voltage and current a chart is framed to, V and A: past any tube, and their nice ceilings stay finite. */
const FRAME_MAX_VOLTS = 1e6;
const FRAME_MAX_AMPS = 1e3;
/** A B+ to frame: 100 V for one that is not a positive number, at most FRAME_MAX_VOLTS. */
const framedVolts = (bplus: number) => (Number.isFinite(bplus) && bplus > 0 ? Math.min(bplus, FRAME_MAX_VOLTS) : 100);

/**
 * The plate-plane window for a tube and a supply. It depends on B+ and the
 * tube's ratings only, not on Ra or Rk, so that it stays still while the
 * operating point is dragged. Voltage: past both B+ and the plate rating.
 * Current: 1.6 × the current the dissipation limit allows at half that
 * voltage, which frames the curves where a stage can live. A bare model with
 * no ratings falls back to B+ alone and the model's current at 0 V grid.
 */
export function plateExtent(tube: TubeLike, bplus: number, fallbackIa?: number): PlateExtent {
  const r = typeof tube === 'object' && tube !== null ? recordOf(tube) : null;
  // A record without usable ratings frames like a bare model.
  const rec = r && r.ratings?.maxPlateVoltage > 0 && r.ratings?.maxPlateDissipation > 0 ? r : null;
  const b = framedVolts(bplus);
  const vmax = niceCeil(Math.max(b * 1.1, rec ? Math.min(rec.ratings.maxPlateVoltage, FRAME_MAX_VOLTS) * 1.05 : 0));
  const iaMax = rec
    ? niceCeil((1.6 * 2 * rec.ratings.maxPlateDissipation) / vmax)
    : niceCeil(fallbackIa !== undefined && fallbackIa > 0 ? Math.min(fallbackIa, FRAME_MAX_AMPS) : 0.01);
  return { vmax, iaMax };
}

/**
 * A window framing one stage's load line rather than the whole sheet: to just
 * past B+ and to 1.25 × the line's current at 0 V, B+/(Ra + Rk), so a 12AX7 at
 * a fraction of a milliamp fills the chart instead of its bottom few percent.
 * Depends on Ra and Rk, so the bench pins it during a drag and re-ranges on
 * release.
 */
export function loadLineExtent(bplus: number, ra: number, rk: number): PlateExtent {
  const b = framedVolts(bplus);
  const r = Number.isFinite(ra + rk) && ra + rk > 0 ? ra + rk : 1;
  return { vmax: niceCeil(b * 1.1), iaMax: niceCeil(Math.min(FRAME_MAX_AMPS, Math.max(1e-5, (1.25 * b) / r))) };
}
