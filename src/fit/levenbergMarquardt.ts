import { solveLinear } from '../numeric/solveLinear';

/**
 * Levenberg–Marquardt least squares with box bounds (K. Levenberg 1944,
 * D. Marquardt 1963; damping scaled by the diagonal of JᵀJ as in Marquardt).
 * Small and dense: the problems here have five unknowns. Bounded: at most
 * `maxIterations`, the best point is always kept, and the status says whether
 * it converged. A residual function that returns non-finite values is treated
 * as a rejected step, never propagated.
 */
export interface LmOptions {
  readonly lower: readonly number[];
  readonly upper: readonly number[];
  readonly maxIterations?: number;
  /** Stop when the relative drop in the sum of squares falls below this. */
  readonly relTol?: number;
}

export interface LmResult {
  readonly x: number[];
  readonly cost: number;
  readonly iterations: number;
  readonly converged: boolean;
}

export const LM_DEFAULT_MAX_ITERATIONS = 200;
export const LM_DEFAULT_REL_TOL = 1e-10;
const FD_STEP = 1e-6;

function sumSquares(r: readonly number[]): number {
  let s = 0;
  for (const v of r) s += v * v;
  return Number.isFinite(s) ? s : Infinity;
}

function clamp(x: number, lo: number, hi: number): number {
  return x < lo ? lo : x > hi ? hi : x;
}

export function levenbergMarquardt(
  residuals: (x: readonly number[]) => number[],
  start: readonly number[],
  options: LmOptions,
): LmResult {
  const maxIterations = options.maxIterations ?? LM_DEFAULT_MAX_ITERATIONS;
  const relTol = options.relTol ?? LM_DEFAULT_REL_TOL;
  const n = start.length;
  let x = start.map((v, i) => clamp(v, options.lower[i]!, options.upper[i]!));
  let r = residuals(x);
  let cost = sumSquares(r);
  let lambda = 1e-3;
  let iterations = 0;
  let converged = false;

  while (iterations < maxIterations && Number.isFinite(cost)) {
    iterations++;
    // Forward-difference Jacobian, stepping inward at an upper bound.
    const jac: number[][] = r.map(() => new Array<number>(n).fill(0));
    for (let j = 0; j < n; j++) {
      const h = FD_STEP * Math.max(1, Math.abs(x[j]!));
      const step = x[j]! + h > options.upper[j]! ? -h : h;
      const xj = [...x];
      xj[j] = x[j]! + step;
      const rj = residuals(xj);
      for (let i = 0; i < r.length; i++) jac[i]![j] = (rj[i]! - r[i]!) / step;
    }
    const jtj: number[][] = Array.from({ length: n }, () => new Array<number>(n).fill(0));
    const jtr = new Array<number>(n).fill(0);
    for (let i = 0; i < r.length; i++) {
      const row = jac[i]!;
      for (let a = 0; a < n; a++) {
        jtr[a]! -= row[a]! * r[i]!;
        for (let b = a; b < n; b++) jtj[a]![b]! += row[a]! * row[b]!;
      }
    }
    for (let a = 0; a < n; a++) for (let b = 0; b < a; b++) jtj[a]![b] = jtj[b]![a]!;
    if (!jtj.flat().every(Number.isFinite)) break;

    let improved = false;
    for (let attempt = 0; attempt < 12 && !improved; attempt++) {
      const damped = jtj.map((row, i) => row.map((v, j) => (i === j ? v + lambda * Math.max(v, 1e-12) : v)));
      const delta = solveLinear(damped, jtr);
      if (delta) {
        const trial = x.map((v, i) => clamp(v + delta[i]!, options.lower[i]!, options.upper[i]!));
        const rt = residuals(trial);
        const ct = sumSquares(rt);
        if (ct < cost) {
          const drop = (cost - ct) / Math.max(cost, 1e-300);
          x = trial;
          r = rt;
          cost = ct;
          lambda = Math.max(lambda / 3, 1e-12);
          improved = true;
          if (drop < relTol) converged = true;
        }
      }
      if (!improved) lambda = Math.min(lambda * 4, 1e12);
    }
    if (!improved) {
      // No step lowers the cost at any damping: a (local) minimum.
      converged = true;
    }
    if (converged) break;
  }
  return { x, cost, iterations, converged };
}
