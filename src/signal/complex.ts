/** Complex numbers as [re, im] pairs, and a dense complex linear solve, for the small-signal AC network. */
export type Complex = readonly [number, number];

export const cabs = (a: Complex): number => Math.hypot(a[0], a[1]);

/**
 * Gaussian elimination with partial pivoting on the first n rows and columns
 * of a complex matrix stored row by row with stride w (columns past n, an
 * augmented right-hand side, are carried along), leaving it upper
 * triangular in place. `pivot` hears each pivot as it is taken, and whether
 * rows were swapped for it. False when a column has no nonzero pivot.
 */
function eliminate(re: Float64Array, im: Float64Array, n: number, w: number, pivot?: (magnitude: number, pr: number, pi: number, swapped: boolean) => void): boolean {
  for (let col = 0; col < n; col++) {
    let row = col;
    let best = Math.hypot(re[col * w + col]!, im[col * w + col]!);
    for (let r = col + 1; r < n; r++) {
      const m = Math.hypot(re[r * w + col]!, im[r * w + col]!);
      if (m > best) {
        best = m;
        row = r;
      }
    }
    if (!(best > 0)) return false;
    if (row !== col) {
      for (let c = col; c < w; c++) {
        const i1 = col * w + c;
        const i2 = row * w + c;
        const tr = re[i1]!;
        const ti = im[i1]!;
        re[i1] = re[i2]!;
        im[i1] = im[i2]!;
        re[i2] = tr;
        im[i2] = ti;
      }
    }
    const pr = re[col * w + col]!;
    const pi = im[col * w + col]!;
    pivot?.(best, pr, pi, row !== col);
    const pd = pr * pr + pi * pi;
    for (let r = col + 1; r < n; r++) {
      const ar = re[r * w + col]!;
      const ai = im[r * w + col]!;
      if (ar === 0 && ai === 0) continue;
      const fr = (ar * pr + ai * pi) / pd;
      const fi = (ai * pr - ar * pi) / pd;
      for (let c = col + 1; c < w; c++) {
        const vr = re[col * w + c]!;
        const vi = im[col * w + c]!;
        re[r * w + c] = re[r * w + c]! - (fr * vr - fi * vi);
        im[r * w + c] = im[r * w + c]! - (fr * vi + fi * vr);
      }
    }
  }
  return true;
}

/**
 * Solves the augmented complex system [A | b] (n rows of n + 1 entries, real
 * and imaginary parts in two flat arrays, overwritten) by Gaussian
 * elimination with partial pivoting, writing x into xr, xi. Returns false
 * when the matrix is singular or the answer is not finite. No allocation.
 */
export function csolveFlat(re: Float64Array, im: Float64Array, n: number, xr: Float64Array, xi: Float64Array): boolean {
  const w = n + 1;
  if (!eliminate(re, im, n, w)) return false;
  for (let r = n - 1; r >= 0; r--) {
    let sr = re[r * w + n]!;
    let si = im[r * w + n]!;
    for (let c = r + 1; c < n; c++) {
      const mr = re[r * w + c]!;
      const mi = im[r * w + c]!;
      sr -= mr * xr[c]! - mi * xi[c]!;
      si -= mr * xi[c]! + mi * xr[c]!;
    }
    const dr = re[r * w + r]!;
    const di = im[r * w + r]!;
    const dd = dr * dr + di * di;
    xr[r] = (sr * dr + si * di) / dd;
    xi[r] = (si * dr - sr * di) / dd;
    if (!Number.isFinite(xr[r]!) || !Number.isFinite(xi[r]!)) return false;
  }
  return true;
}

/**
 * The determinant of the square submatrix of rows and columns `idx` of a
 * matrix stored row by row with stride `w`, in polar form: its log magnitude
 * and its argument (the sum of the pivots' arguments, π for each row swap;
 * not wrapped). Null for a singular one. Eliminated on a copy; the matrix is
 * left as it was.
 */
export function cdetPolar(re: Float64Array, im: Float64Array, w: number, idx: readonly number[]): { logAbs: number; arg: number } | null {
  const n = idx.length;
  const ar = new Float64Array(n * n);
  const ai = new Float64Array(n * n);
  for (let r = 0; r < n; r++) {
    for (let c = 0; c < n; c++) {
      ar[r * n + c] = re[idx[r]! * w + idx[c]!]!;
      ai[r * n + c] = im[idx[r]! * w + idx[c]!]!;
    }
  }
  let logAbs = 0;
  let arg = 0;
  const solved = eliminate(ar, ai, n, n, (magnitude, pr, pi, swapped) => {
    logAbs += Math.log(magnitude);
    arg += Math.atan2(pi, pr) + (swapped ? Math.PI : 0);
  });
  return solved && Number.isFinite(logAbs) && Number.isFinite(arg) ? { logAbs, arg } : null;
}
