/**
 * One cycle of f driven by a sine of the given peak, at n points (n a
 * multiple of 4): wave[k] = f(peak·sin(2πk/n)). A sine takes each value
 * twice a cycle (sin θ = sin(π − θ)), so f is evaluated at the n/2 + 1
 * distinct points only and the rest mirrored: half the work for a transfer
 * that costs a root solve per point, the same wave to the last bit of the
 * sine's rounding.
 */
export function sineCycle(n: number, peak: number, f: (v: number) => number, into = new Float64Array(n)): Float64Array {
  const half = n / 2;
  const quarter = n / 4;
  for (let k = 0; k <= quarter; k++) {
    const y = f(peak * Math.sin((2 * Math.PI * k) / n));
    into[k] = y;
    if (k > 0) into[half - k] = y;
  }
  for (let k = half; k <= half + quarter; k++) {
    const y = k === half ? into[0]! : f(peak * Math.sin((2 * Math.PI * k) / n));
    into[k] = y;
    if (k > half) into[n + half - k] = y;
  }
  return into;
}
