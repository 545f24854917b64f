/**
 * Brent's method (R. P. Brent, "Algorithms for Minimization without
 * Derivatives", 1973, ch. 4): inverse quadratic interpolation guarded by
 * bisection. Given a sign change on [lo, hi] it cannot diverge; it is bounded
 * by MAX_ITERATIONS and always returns the best point found with a status.
 */
export interface RootResult {
  readonly x: number;
  readonly converged: boolean;
  readonly iterations: number;
}

export const ROOT_MAX_ITERATIONS = 100;

export function bracketedRoot(
  f: (x: number) => number,
  lo: number,
  hi: number,
  absTol: number,
): RootResult {
  let a = lo;
  let b = hi;
  let fa = f(a);
  let fb = f(b);
  if (fa === 0) return { x: a, converged: true, iterations: 0 };
  if (fb === 0) return { x: b, converged: true, iterations: 0 };
  if (!(fa * fb < 0)) {
    // No sign change: report the end nearer to zero, flagged as not converged.
    return { x: Math.abs(fa) < Math.abs(fb) ? a : b, converged: false, iterations: 0 };
  }
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let i = 1; i <= ROOT_MAX_ITERATIONS; i++) {
    if (fb * fc > 0) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tol = 2 * Number.EPSILON * Math.abs(b) + 0.5 * absTol;
    const m = 0.5 * (c - b);
    if (Math.abs(m) <= tol || fb === 0) return { x: b, converged: true, iterations: i };
    if (Math.abs(e) >= tol && Math.abs(fa) > Math.abs(fb)) {
      const s = fb / fa;
      let p: number;
      let q: number;
      if (a === c) {
        p = 2 * m * s;
        q = 1 - s;
      } else {
        const qq = fa / fc;
        const r = fb / fc;
        p = s * (2 * m * qq * (qq - r) - (b - a) * (r - 1));
        q = (qq - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      if (2 * p < Math.min(3 * m * q - Math.abs(tol * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = m;
        e = d;
      }
    } else {
      d = m;
      e = d;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol ? d : m > 0 ? tol : -tol;
    fb = f(b);
  }
  return { x: b, converged: false, iterations: ROOT_MAX_ITERATIONS };
}
