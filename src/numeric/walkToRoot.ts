import { bracketedRoot } from './bracketedRoot';

/** Steps the walk takes before it gives up. */
const MAX_STEPS = 60;

/**
 * The root of f nearest `start` on the side f points to: walk from `start`
 * in steps of `step` (upward where f(start) > 0, downward where it is
 * negative), held within [lo, hi], until f changes sign, then close in by
 * Brent's method to `tol`. Null when the walk meets a bound or takes
 * MAX_STEPS steps without a change of sign. For a bias that settles where
 * a resistor drops an average current (f = R·Ī(V) − V), whose search starts
 * at the idle bias and should find the settled one nearest it.
 */
export function walkToRoot(f: (x: number) => number, start: number, step: number, lo: number, hi: number, tol: number): number | null {
  const f0 = f(start);
  if (f0 === 0) return start;
  const dir = f0 > 0 ? 1 : -1;
  let prev = start;
  for (let k = 1; k <= MAX_STEPS; k++) {
    const next = Math.min(Math.max(start + dir * step * k, lo), hi);
    if (Math.sign(f(next)) !== Math.sign(f0)) return bracketedRoot(f, Math.min(prev, next), Math.max(prev, next), tol).x;
    if (next === lo || next === hi) return null;
    prev = next;
  }
  return null;
}
