import type { Result } from '../result';
import type { StageDesign } from '../stage/stageDesign';
import { solvedStage, type SolvedStage } from './analysisInput';
import { cabs } from './complex';
import { logFrequencies, responseAt } from './frequencyResponse';

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

/** Frequency (on a log scale) between lo and hi where |H| crosses level, by bisection. */
function crossing(s: SolvedStage, loHz: number, hiHz: number, level: number, risingAtHi: boolean): number {
  let lo = Math.log(loHz);
  let hi = Math.log(hiHz);
  for (let k = 0; k < 60; k++) {
    const mid = 0.5 * (lo + hi);
    const above = cabs(responseAt(s, Math.exp(mid))) >= level;
    if (above === risingAtHi) hi = mid;
    else lo = mid;
  }
  return Math.exp(0.5 * (lo + hi));
}

/** The −3 dB points: where the gain falls to 1/√2 of its largest value, each side of it. */
export function cornersOf(s: SolvedStage): Corners {
  const freqs = logFrequencies(SCAN_LO_HZ, SCAN_HI_HZ, 10);
  const mags = freqs.map((f) => cabs(responseAt(s, f)));
  let peak = 0;
  for (let k = 1; k < mags.length; k++) if (mags[k]! > mags[peak]!) peak = k;
  const mid = mags[peak]!;
  const level = mid / Math.SQRT2;
  let lowHz: number | null = null;
  for (let k = peak; k > 0; k--) {
    if (mags[k - 1]! < level) {
      lowHz = crossing(s, freqs[k - 1]!, freqs[k]!, level, true);
      break;
    }
  }
  let highHz: number | null = null;
  for (let k = peak; k < mags.length - 1; k++) {
    if (mags[k + 1]! < level) {
      highHz = crossing(s, freqs[k]!, freqs[k + 1]!, level, false);
      break;
    }
  }
  return { lowHz, highHz, midbandGain: mid, midbandDb: 20 * Math.log10(mid) };
}

/** The stage's −3 dB points from source to output. */
export function corners(design: StageDesign): Result<Corners> {
  const s = solvedStage(design);
  if ('ok' in s) return s;
  return { ok: true, ...cornersOf(s) };
}
