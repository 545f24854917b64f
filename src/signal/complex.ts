/** Complex numbers as [re, im] pairs, and a dense complex linear solve, for the small-signal AC network. */
export type Complex = readonly [number, number];

export const cadd = (a: Complex, b: Complex): Complex => [a[0] + b[0], a[1] + b[1]];
export const csub = (a: Complex, b: Complex): Complex => [a[0] - b[0], a[1] - b[1]];
export const cmul = (a: Complex, b: Complex): Complex => [a[0] * b[0] - a[1] * b[1], a[0] * b[1] + a[1] * b[0]];
export const cdiv = (a: Complex, b: Complex): Complex => {
  const d = b[0] * b[0] + b[1] * b[1];
  return [(a[0] * b[0] + a[1] * b[1]) / d, (a[1] * b[0] - a[0] * b[1]) / d];
};
export const cabs = (a: Complex): number => Math.hypot(a[0], a[1]);

/** Solves A·x = b for complex A (n×n) by Gaussian elimination with partial pivoting; null when singular. */
export function csolve(a: Complex[][], b: Complex[]): Complex[] | null {
  const n = b.length;
  const m = a.map((row, i) => [...row, b[i]!]);
  for (let col = 0; col < n; col++) {
    let pivot = col;
    for (let r = col + 1; r < n; r++) if (cabs(m[r]![col]!) > cabs(m[pivot]![col]!)) pivot = r;
    if (!(cabs(m[pivot]![col]!) > 0)) return null;
    [m[col], m[pivot]] = [m[pivot]!, m[col]!];
    for (let r = col + 1; r < n; r++) {
      const f = cdiv(m[r]![col]!, m[col]![col]!);
      if (f[0] === 0 && f[1] === 0) continue;
      for (let c = col; c <= n; c++) m[r]![c] = csub(m[r]![c]!, cmul(f, m[col]![c]!));
    }
  }
  const x: Complex[] = new Array(n).fill([0, 0]);
  for (let r = n - 1; r >= 0; r--) {
    let s = m[r]![n]!;
    for (let c = r + 1; c < n; c++) s = csub(s, cmul(m[r]![c]!, x[c]!));
    x[r] = cdiv(s, m[r]![r]!);
  }
  return x.every((v) => Number.isFinite(v[0]) && Number.isFinite(v[1])) ? x : null;
}
