import { describe, expect, it } from 'vitest';
import { harmonicAmplitudes } from '../../src/signal/fft';


const N = 1024;
const dB = (x: number) => 20 * Math.log10(x);

describe('FFT harmonics (coherent sampling, one period)', () => {
  it('a pure sine shows no harmonic above -120 dB', () => {
    const x = Float64Array.from({ length: N }, (_, k) => 3 * Math.sin((2 * Math.PI * k) / N));
    const a = harmonicAmplitudes(x, 20);
    expect(a[1]).toBeCloseTo(3, 12);
    for (let k = 2; k <= 20; k++) expect(dB(a[k]! / a[1]!)).toBeLessThan(-120);
  });

  it('a square wave has only odd harmonics, at 1/k of the fundamental (its Fourier series: 4/π · Σ sin(kωt)/k, k odd)', () => {
    // Source: the Fourier series of a square wave, e.g. A. V. Oppenheim and A. S. Willsky, Signals and Systems, 2nd ed., ch. 3.
    // Sampled so that no sample falls on a jump (half-sample offset); the sampled series converges to the same ratios.
    const x = Float64Array.from({ length: N }, (_, k) => (Math.sin((2 * Math.PI * (k + 0.5)) / N) >= 0 ? 1 : -1));
    const a = harmonicAmplitudes(x, 9);
    expect(a[1]).toBeCloseTo(4 / Math.PI, 4);
    for (const k of [3, 5, 7, 9]) expect(a[k]! / a[1]!).toBeCloseTo(1 / k, 4);
    for (const k of [2, 4, 6, 8]) expect(dB(a[k]! / a[1]!)).toBeLessThan(-120);
  });

  it('a known two-component signal comes back exactly: 1 V fundamental plus 0.01 V second harmonic is H2 = -40 dB', () => {
    const x = Float64Array.from({ length: N }, (_, k) => Math.sin((2 * Math.PI * k) / N) + 0.01 * Math.cos((4 * Math.PI * k) / N) + 0.5);
    const a = harmonicAmplitudes(x, 4);
    expect(a[0]).toBeCloseTo(0.5, 12);
    expect(dB(a[2]! / a[1]!)).toBeCloseTo(-40, 9);
  });
});
