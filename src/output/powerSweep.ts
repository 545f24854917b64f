import { illinois } from '../numeric/illinois';
import { atDrive, SWEEP_SAMPLES, type DriveResult } from './outputSignal';
import type { OutputSolution } from './solveOutput';

/** Drive levels in a power sweep, spread evenly up to the onset of grid current. */
export const SWEEP_LEVELS = 24;

/**
 * Power, THD, H2 and H3 as the drive rises from a whisper to the onset of
 * grid current (grid at 0 V), for the THD-against-power chart.
 */
export function powerSweep(s: OutputSolution, levels = SWEEP_LEVELS, zPrimary = s.design.zPrimary): DriveResult[] {
  const top = Math.max(0, -s.op.vgk);
  if (!(top > 0)) return [];
  const out: DriveResult[] = [];
  for (let k = 1; k <= levels; k++) out.push(atDrive(s, (top * k) / levels, zPrimary, SWEEP_SAMPLES));
  return out;
}

export type PowerLimit = 'distortion' | 'grid current';

export interface LimitedPower {
  readonly zPrimary: number;
  /** Most power with THD at or under the limit and the grid at or under 0 V, W. */
  readonly power: number;
  readonly thd: number;
  readonly drive: number;
  readonly limitedBy: PowerLimit;
}

/** Coarse steps the drive is scanned in before the crossing is refined. */
const SCAN_STEPS = 4;

/**
 * The most power the stage gives with THD at most `limit`, never driving the
 * grid positive. THD is scanned upward in drive and the first crossing of the
 * limit refined by the Illinois method, so a distortion that dips and rises
 * again (H2 cancelling in a partly-triode connection) is still read at its
 * first crossing, the one a listener hits first.
 */
export function powerAtDistortion(s: OutputSolution, limit: number, zPrimary = s.design.zPrimary): LimitedPower {
  const top = Math.max(0, -s.op.vgk);
  let prev: DriveResult | null = null;
  for (let k = 1; k <= SCAN_STEPS; k++) {
    const r = atDrive(s, (top * k) / SCAN_STEPS, zPrimary, SWEEP_SAMPLES);
    if (r.thd > limit) {
      let last = r;
      const g = (a: number) => {
        last = atDrive(s, a, zPrimary, SWEEP_SAMPLES);
        return last.thd - limit;
      };
      illinois(g, prev?.drive ?? 0, r.drive, limit * 1e-3, { fa: (prev?.thd ?? 0) - limit, fb: r.thd - limit });
      return { zPrimary, power: last.power, thd: last.thd, drive: last.drive, limitedBy: 'distortion' };
    }
    prev = r;
  }
  const at = prev ?? atDrive(s, top, zPrimary, SWEEP_SAMPLES);
  return { zPrimary, power: at.power, thd: at.thd, drive: at.drive, limitedBy: 'grid current' };
}

/** Primary impedances tried in a sweep, as multiples of the stage's own Vq/Iq. */
export const Z_SWEEP_POINTS = 17;
export const Z_SWEEP_SPAN = [0.25, 4] as const;

export interface ZSweep {
  readonly rows: readonly LimitedPower[];
  /** The row with the most power. */
  readonly best: LimitedPower;
  readonly limit: number;
}

/**
 * Inverse design of the load: at the stage's operating point, the most power
 * under the distortion limit for each primary impedance on a log scale
 * around Vq/Iq (the load whose line runs from the point to twice the plate
 * voltage at zero current, a common starting point).
 */
export function zPrimarySweep(s: OutputSolution, limit = s.design.thdLimit, points = Z_SWEEP_POINTS): ZSweep {
  const centre = s.op.vpk / Math.max(s.op.ip, 1e-9);
  const [lo, hi] = Z_SWEEP_SPAN;
  const rows: LimitedPower[] = [];
  for (let k = 0; k < points; k++) {
    const z = centre * lo * Math.pow(hi / lo, k / (points - 1));
    rows.push(powerAtDistortion(s, limit, Number(z.toPrecision(3))));
  }
  const best = rows.reduce((a, b) => (b.power > a.power ? b : a), rows[0]!);
  return { rows, best, limit };
}
