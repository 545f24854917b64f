/** Timing statistics: these machines are shared and noisy, so every figure is a median with its spread. */

/** Measured blocks per figure: each figure is the median over these runs, with their spread. */
export const RUNS = 3;

export interface Stats {
  readonly n: number;
  readonly median: number;
  readonly p95: number;
  readonly min: number;
  readonly max: number;
  /** For a figure taken over repeated runs: each run's p95, whose median is `p95`. */
  readonly p95Runs?: readonly number[];
}

const middle = (xs: readonly number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length % 2 ? s[(s.length - 1) / 2]! : (s[s.length / 2 - 1]! + s[s.length / 2]!) / 2;
};

/**
 * A figure over repeated runs (each run its own block of samples): the median
 * of the runs' medians and of their p95s, with every run's p95 kept as the
 * spread. One unlucky block on a shared machine moves the figure no more
 * than it should.
 */
export function repeatedStats(runs: readonly number[][]): Stats {
  const each = runs.map(stats);
  return {
    n: each.reduce((a, r) => a + r.n, 0),
    median: middle(each.map((r) => r.median)),
    p95: middle(each.map((r) => r.p95)),
    min: Math.min(...each.map((r) => r.min)),
    max: Math.max(...each.map((r) => r.max)),
    p95Runs: each.map((r) => r.p95),
  };
}

export function stats(samples: number[]): Stats {
  const s = [...samples].sort((a, b) => a - b);
  const at = (q: number) => s[Math.min(s.length - 1, Math.floor(q * (s.length - 1)))]!;
  return { n: s.length, median: at(0.5), p95: at(0.95), min: s[0]!, max: s[s.length - 1]! };
}

/** Runs fn repeatedly (after a warm-up) and returns per-call times in ms. */
export function timeIt(fn: () => unknown, runs: number, warmup = Math.min(20, runs)): number[] {
  for (let k = 0; k < warmup; k++) fn();
  const out: number[] = [];
  for (let k = 0; k < runs; k++) {
    const t0 = performance.now();
    fn();
    out.push(performance.now() - t0);
  }
  return out;
}

export const ms = (x: number) => `${x < 1 ? x.toFixed(3) : x.toFixed(2)} ms`;
