import type { PlanePoint, PlateCurve } from '../stage/planeSeries';
import { compositeCurves } from './compositeCurves';
import type { PlateExtent } from '../stage/plateExtent';
import type { OutputOverlay } from '../output/outputSheet';
import { emptyCurrents } from '../output/electrodes';
import type { PushPullDrive } from './pushPullDrive';
import { plateOf, type PushPullSolution } from './solvePushPull';

/** Points kept of the solved path: enough for a smooth curve at chart scale. */
const PATH_POINTS = 64;

/**
 * One tube's plate chart in a push-pull pair. Every field means what it means
 * for the single-ended stage, so the same chart draws it:
 * - `acLoad`: the composite load line through the idle point while both tubes
 *   conduct, slope −1/(Raa/2 + Rpri/2) (for a matched pair each tube sees half
 *   the plate-to-plate load: Langford-Smith, Radiotron Designer's Handbook,
 *   4th ed., ch. 13);
 * - `alone`: where one tube works alone (its partner cut off, class AB), the
 *   line from the centre tap at zero current with slope −1/(Raa/4 + Rpri/2);
 * - `swing`: the path the tube really takes at the drive given, solved instant
 *   by instant with its partner (it bends from the first line toward the
 *   second as the partner cuts off);
 * - `dcLoad`: the primary's half, nearly vertical;
 * - `composite`: the pair's composite characteristics, whose load line is
 *   `alone` (Raa/4 through the centre tap).
 */
export interface PushPullOverlay extends OutputOverlay {
  readonly alone: readonly PlanePoint[];
  /** The composite characteristics (compositeCurves), their load line being `alone`. */
  readonly composite: readonly PlateCurve[];
}

/** A line through (v0, i0) with slope −1/r, from the top of the window to zero current. */
function lineThrough(v0: number, i0: number, r: number, top: number): PlanePoint[] {
  const vTop = v0 - (top - i0) * r;
  const start = vTop >= 0 ? { v: vTop, i: top } : { v: 0, i: i0 + v0 / r };
  return [start, { v: v0 + i0 * r, i: 0 }];
}

export function pushPullOverlay(s: PushPullSolution, extent: PlateExtent, drive: PushPullDrive): PushPullOverlay {
  const rHalf = s.design.rPrimary / 2;
  const { vpk, ip } = s.idle[0];
  const top = extent.iaMax * 1.02;
  const dcLoad = rHalf > 0 ? [{ v: s.supply, i: 0 }, { v: Math.max(0, s.supply - top * rHalf), i: Math.min(top, s.supply / rHalf) }] : [{ v: s.supply, i: 0 }, { v: s.supply, i: top }];
  const acLoad = lineThrough(vpk, ip, s.design.raa / 2 + rHalf, top);
  const alone = lineThrough(s.supply, 0, s.design.raa / 4 + rHalf, top);
  const right = acLoad[1]!;
  const loadHandle = { v: vpk + 0.6 * (right.v - vpk), i: ip + 0.6 * (right.i - ip) };
  return { dcLoad, acLoad, alone, composite: compositeCurves(s, extent), point: { v: vpk, i: ip }, loadHandle, swing: pathOf(s, drive) };
}

/** Tube 1's plate voltage and charted current over the cycle the drive's winding signal describes. */
function pathOf(s: PushPullSolution, drive: PushPullDrive): PlanePoint[] {
  const w = drive.winding;
  const n = w.length;
  if (n === 0 || !(drive.drive > 0)) return [];
  const c = emptyCurrents();
  const rHalf = s.design.rPrimary / 2;
  const step = Math.max(1, Math.floor(n / PATH_POINTS));
  const out: PlanePoint[] = [];
  for (let k = 0; k <= n; k += step) {
    const j = k % n;
    const v = plateOf(s.tube, s.feed, s.supply, w[j]!, rHalf, s.vgk + drive.drive * Math.sin((2 * Math.PI * j) / n), c);
    out.push({ v, i: c.ip });
  }
  return out;
}

/** The plate-to-plate load whose composite line (both tubes conducting) passes through (v, i); null off a falling line. */
export function raaThrough(s: PushPullSolution, v: number, i: number): number | null {
  const dv = v - s.idle[0].vpk;
  const di = s.idle[0].ip - i;
  if (!(dv > 0) || !(di > 0)) return null;
  const raa = 2 * (dv / di - s.design.rPrimary / 2);
  return raa > 0 && Number.isFinite(raa) ? raa : null;
}
