import { fail, type Result } from '../result';
import { shown } from '../shown';
import { preferredAround } from '../parts/nearestPreferred';
import { SERIES, type PreferredSeries } from '../parts/preferredValues';
import type { StageDesign } from '../stage/stageDesign';
import { judgeDesign, type DesignVerdict } from './judgeDesign';
import type { Targets } from './targets';

export interface PreferredBest {
  /** Resistors to order, from the series, Ω. */
  readonly ra: number;
  readonly rk: number;
  /** The design with them, against the targets. */
  readonly verdict: DesignVerdict;
}

/** The weakest target's margin (the region's measure of a point): the least of them all. */
const weakest = (v: DesignVerdict) => Math.min(...Object.values(v.margins).filter((m): m is number => typeof m === 'number'));

/**
 * The region's best point as parts to order: of the preferred values around
 * its exact Ra and Rk (the nearest of each and its neighbours in the
 * series), the pair whose weakest target holds best, the nearer pair on a
 * tie. A point at the region's best is where the weakest margin peaks, so
 * the nearest values alone may cross an edge the neighbours stay inside.
 */
export function preferredBest(design: StageDesign, targets: Targets, series: PreferredSeries): Result<PreferredBest> {
  if (typeof design !== 'object' || design === null) return fail('invalid-input', 'No design given');
  if (typeof series !== 'string' || !Object.hasOwn(SERIES, series)) return fail('invalid-input', `Preferred series must be E12, E24 or E96 (got ${shown(series)})`, 'series');
  const { ra, rk } = design;
  if (!(typeof ra === 'number' && ra > 0 && Number.isFinite(ra)) || !(typeof rk === 'number' && rk > 0 && Number.isFinite(rk))) return fail('invalid-input', 'Ra and Rk must be positive to find their preferred values', 'ra');
  const cost = (a: number, k: number) => Math.abs(Math.log(a / ra)) + Math.abs(Math.log(k / rk));
  let best: PreferredBest | null = null;
  let bestScore = -Infinity;
  let bestCost = Infinity;
  let why: string | null = null;
  for (const a of preferredAround(ra, series)) {
    for (const k of preferredAround(rk, series)) {
      const v = judgeDesign({ ...design, ra: a, rk: k }, targets);
      if (!v.ok) {
        why ??= v.message;
        continue;
      }
      const score = weakest(v);
      const c = cost(a, k);
      if (score > bestScore || (score === bestScore && c < bestCost)) {
        best = { ra: a, rk: k, verdict: v };
        bestScore = score;
        bestCost = c;
      }
    }
  }
  return best ? { ok: true, ...best } : fail('invalid-input', why ?? 'No preferred values around this point solve');
}
