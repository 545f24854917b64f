/** A complex number as [real, imaginary]. */
export type Complex = readonly [number, number];

/**
 * Solves the n×n complex system A·x = b by Gaussian elimination with partial
 * pivoting (the small networks of a phase splitter); null when singular.
 */
export function solveComplex(a: readonly (readonly Complex[])[], b: readonly Complex[]): Complex[] | null {
  const n = b.length;
  const m = a.map((row, i) => [...row.map((c) => [c[0], c[1]] as [number, number]), [b[i]![0], b[i]![1]] as [number, number]]);
  const abs2 = (c: readonly [number, number]) => c[0] * c[0] + c[1] * c[1];
  for (let col = 0; col < n; col++) {
    let pivot = col;
    for (let r = col + 1; r < n; r++) if (abs2(m[r]![col]!) > abs2(m[pivot]![col]!)) pivot = r;
    const p = m[pivot]![col]!;
    const d = abs2(p);
    if (!(d > 1e-300)) return null;
    [m[col], m[pivot]] = [m[pivot]!, m[col]!];
    const inv: [number, number] = [p[0] / d, -p[1] / d];
    for (let r = col + 1; r < n; r++) {
      const e = m[r]![col]!;
      const f: [number, number] = [e[0] * inv[0] - e[1] * inv[1], e[0] * inv[1] + e[1] * inv[0]];
      for (let c = col; c <= n; c++) {
        const x = m[col]![c]!;
        m[r]![c] = [m[r]![c]![0] - (f[0] * x[0] - f[1] * x[1]), m[r]![c]![1] - (f[0] * x[1] + f[1] * x[0])];
      }
    }
  }
  const x: [number, number][] = new Array(n);
  for (let r = n - 1; r >= 0; r--) {
    let s: [number, number] = [m[r]![n]![0], m[r]![n]![1]];
    for (let c = r + 1; c < n; c++) {
      const y = m[r]![c]!;
      s = [s[0] - (y[0] * x[c]![0] - y[1] * x[c]![1]), s[1] - (y[0] * x[c]![1] + y[1] * x[c]![0])];
    }
    const p = m[r]![r]!;
    const d = abs2(p);
    x[r] = [(s[0] * p[0] + s[1] * p[1]) / d, (s[1] * p[0] - s[0] * p[1]) / d];
  }
  return x.every((c) => Number.isFinite(c[0]) && Number.isFinite(c[1])) ? x : null;
}
