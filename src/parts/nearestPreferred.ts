import { SERIES, type PreferredSeries } from './preferredValues';

/**
 * The value of the chosen IEC 60063 series nearest to `value`, nearest by
 * ratio (on a log scale, as the series are spaced), e.g. 50 kΩ → 47 kΩ in E12
 * and 49.9 kΩ in E96. Non-positive or non-finite values come back unchanged:
 * there is no preferred value for them; so does any value for a series name
 * that is not one of the series ("toString" is a name, not a key).
 */
export function nearestPreferred(value: number, series: PreferredSeries): number {
  const table = typeof series === 'string' && Object.hasOwn(SERIES, series) ? SERIES[series] : null;
  if (!table || typeof value !== 'number' || !(value > 0) || !Number.isFinite(value)) return value;
  const decade = Math.floor(Math.log10(value));
  const base = Math.pow(10, decade);
  let best = value;
  let bestDist = Infinity;
  // Candidates from this decade and the first of the next (9.1 → 10).
  for (const m of [...table, 10]) {
    const candidate = Number((m * base).toPrecision(3));
    const dist = Math.abs(Math.log(candidate / value));
    if (dist < bestDist) {
      bestDist = dist;
      best = candidate;
    }
  }
  return best;
}

/**
 * The preferred values around `value`: the nearest, and the next below and
 * above it in the series (by ratio), nearest first. For choosing among close
 * standard parts when the nearest will not do (a drag held inside a target
 * region). A value with no preferred value comes back alone.
 */
export function preferredAround(value: number, series: PreferredSeries): number[] {
  const nearest = nearestPreferred(value, series);
  if (nearest === value && !(value > 0 && Number.isFinite(value))) return [value];
  const table = SERIES[series];
  const step = Math.pow(10, 1 / table.length);
  const below = nearestPreferred(nearest / step, series);
  const above = nearestPreferred(nearest * step, series);
  // Near the largest double the value above is Infinity: not a part.
  return [nearest, ...[below, above].filter((v) => v !== nearest && Number.isFinite(v))].sort((a, b) => Math.abs(Math.log(a / value)) - Math.abs(Math.log(b / value)));
}
