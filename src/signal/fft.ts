/**
 * In-place iterative radix-2 Cooley–Tukey FFT (J. W. Cooley and J. W. Tukey,
 * "An algorithm for the machine calculation of complex Fourier series",
 * Math. Comp. 19, 1965). Length must be a power of two.
 */
export function isPowerOfTwo(n: number): boolean {
  return Number.isInteger(n) && n >= 2 && (n & (n - 1)) === 0;
}

export function fftInPlace(re: Float64Array, im: Float64Array): void {
  const n = re.length;
  for (let i = 1, j = 0; i < n; i++) {
    let bit = n >> 1;
    for (; j & bit; bit >>= 1) j ^= bit;
    j ^= bit;
    if (i < j) {
      [re[i], re[j]] = [re[j]!, re[i]!];
      [im[i], im[j]] = [im[j]!, im[i]!];
    }
  }
  for (let size = 2; size <= n; size <<= 1) {
    const half = size >> 1;
    const step = (-2 * Math.PI) / size;
    for (let start = 0; start < n; start += size) {
      for (let k = 0; k < half; k++) {
        const wr = Math.cos(step * k);
        const wi = Math.sin(step * k);
        const a = start + k;
        const b = a + half;
        const tr = wr * re[b]! - wi * im[b]!;
        const ti = wr * im[b]! + wi * re[b]!;
        re[b] = re[a]! - tr;
        im[b] = im[a]! - ti;
        re[a] = re[a]! + tr;
        im[a] = im[a]! + ti;
      }
    }
  }
}

/**
 * Amplitudes of the first `count` harmonics of a real signal sampled over
 * exactly one period (coherent sampling: harmonic k falls in bin k, no window
 * needed). Index 0 is DC, 1 the fundamental, k the k-th harmonic, in the
 * signal's units as peak amplitude.
 */
export function harmonicAmplitudes(samples: Float64Array, count: number): number[] {
  const n = samples.length;
  const re = Float64Array.from(samples);
  const im = new Float64Array(n);
  fftInPlace(re, im);
  const out: number[] = [];
  for (let k = 0; k <= Math.min(count, n / 2 - 1); k++) {
    const mag = Math.hypot(re[k]!, im[k]!);
    out.push(k === 0 ? mag / n : (2 * mag) / n);
  }
  return out;
}
