/** Timing statistics: these machines are shared and noisy, so every figure is a median with its spread. */
export interface Stats {
  readonly n: number;
  readonly median: number;
  readonly p95: number;
  readonly min: number;
  readonly max: number;
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
