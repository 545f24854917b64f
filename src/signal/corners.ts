import type { Result } from '../result';
import type { StageDesign } from '../stage/stageDesign';
import { solvedStage, type SolvedStage } from './analysisInput';
import { cabs } from './complex';
import { logFrequencies, responseAt } from './frequencyResponse';
import { illinois } from '../numeric/illinois';
import { decibelsOf } from './levels';

export interface Corners {
  /** Lower −3 dB frequency, Hz; null when the response stays flat down to SCAN_LO_HZ (direct coupling). */
  readonly lowHz: number | null;
  /** Upper −3 dB frequency, Hz; null when flat up to SCAN_HI_HZ. */
  readonly highHz: number | null;
  /** The largest gain in the band (linear, source to output) and its dB. */
  readonly midbandGain: number;
  readonly midbandDb: number;
}

export const SCAN_LO_HZ = 0.01;
export const SCAN_HI_HZ = 1e9;

/** Relative accuracy of a corner frequency: far below the 2 % the simulator checks ask. */
const CORNER_REL_TOL = 1e-9;

/**
 * Frequency between loHz and hiHz where |H| crosses level: Illinois regula
 * falsi on ln|H| against ln f, which is nearly straight near a corner, so a
 * handful of evaluations reach CORNER_REL_TOL.
 */
function crossing(s: SolvedStage, loHz: number, hiHz: number, level: number): number {
  const g = (lnF: number) => Math.log(cabs(responseAt(s, Math.exp(lnF))) / level);
  return Math.exp(illinois(g, Math.log(loHz), Math.log(hiHz), CORNER_REL_TOL));
}

/** The −3 dB points: where the gain falls to 1/√2 of its largest value, each side of it. */
export function cornersOf(s: SolvedStage): Corners {
  // Five points a decade find the peak and bracket each crossing; the crossing itself is refined above.
  const freqs = logFrequencies(SCAN_LO_HZ, SCAN_HI_HZ, 5);
  const mags = freqs.map((f) => cabs(responseAt(s, f)));
  let peak = 0;
  for (let k = 1; k < mags.length; k++) if (mags[k]! > mags[peak]!) peak = k;
  const mid = mags[peak]!;
  const level = mid / Math.SQRT2;
  let lowHz: number | null = null;
  for (let k = peak; k > 0; k--) {
    if (mags[k - 1]! < level) {
      lowHz = crossing(s, freqs[k - 1]!, freqs[k]!, level);
      break;
    }
  }
  let highHz: number | null = null;
  for (let k = peak; k < mags.length - 1; k++) {
    if (mags[k + 1]! < level) {
      highHz = crossing(s, freqs[k]!, freqs[k + 1]!, level);
      break;
    }
  }
  return { lowHz, highHz, midbandGain: mid, midbandDb: decibelsOf(mid) };
}

/** The stage's −3 dB points from source to output. */
export function corners(design: StageDesign): Result<Corners> {
  const s = solvedStage(design);
  if (!s.ok) return s;
  return { ok: true, ...cornersOf(s) };
}
