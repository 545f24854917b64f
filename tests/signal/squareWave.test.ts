import { describe, expect, it } from 'vitest';
import { squareWave } from '../../src/index';
import { expectClose } from '../helpers/expectClose';

// Outside reference: the textbook steady state of a first-order network driven by a square wave of ±1 (any circuits
// text's RC low- and high-pass; e.g. Millman & Taub, Pulse and Digital Circuits, ch. 2): with τ the time constant and
// T the period, over the first half period after the rising edge,
//   low pass:  v(t) = 1 − 2·e^(−t/τ) / (1 + e^(−T/2τ))     high pass: v(t) = 2·e^(−t/τ) / (1 + e^(−T/2τ))
// and the second half the same, negated. Checked away from the edges (three samples, 2 % of the period, either side), where cutting the
// series at the 199th harmonic (and damping its ripple) does not reach.
const lowPass = (fc: number) => (f: number) => {
  const x = f / fc;
  return [1 / (1 + x * x), -x / (1 + x * x)] as const;
};
const highPass = (fc: number) => (f: number) => {
  const x = f / fc;
  return [(x * x) / (1 + x * x), x / (1 + x * x)] as const;
};

function compare(wave: ReturnType<typeof squareWave>, expected: (t: number) => number, period: number) {
  if (!wave.ok) throw new Error(wave.message);
  const n = wave.t.length;
  wave.t.forEach((t, j) => {
    const nearEdge = Math.min(j, Math.abs(j - n / 2), n - j) < 3;
    if (nearEdge) return;
    const first = t < period / 2;
    const want = first ? expected(t) : -expected(t - period / 2);
    expectClose(wave.v[j]!, want, { abs: 0.02 }, `v at ${(t * 1e6).toFixed(1)} µs`);
  });
}

describe('a square wave through a response', () => {
  it('a 10 kHz square wave through a 50 kHz low pass rises as the textbook\'s exponential', () => {
    const hz = 10e3;
    const tau = 1 / (2 * Math.PI * 50e3);
    const a = Math.exp(-1 / (2 * hz * tau));
    compare(squareWave(lowPass(50e3), hz, [1, 0]), (t) => 1 - (2 * Math.exp(-t / tau)) / (1 + a), 1 / hz);
  });

  it('a 100 Hz square wave through a 20 Hz high pass tilts as the textbook\'s exponential', () => {
    const hz = 100;
    const tau = 1 / (2 * Math.PI * 20);
    const a = Math.exp(-1 / (2 * hz * tau));
    // Referred to its midband (the high pass at 1 kHz, a shade under 1), as the amplifier's are.
    const ref = highPass(20)(1000);
    const wave = squareWave(highPass(20), hz, ref);
    const g = Math.hypot(ref[0], ref[1]);
    if (!wave.ok) throw new Error(wave.message);
    compare({ ...wave, v: wave.v.map((v) => v * g) }, (t) => (2 * Math.exp(-t / tau)) / (1 + a), 1 / hz);
  });

  // A second-order low pass's step response overshoots by e^(−πζ/√(1−ζ²)) of the step (Ogata, Modern Control
  // Engineering, ch. 5); the square wave's step is 2 (−1 to +1). Its ringing is the response's own: nothing of cutting
  // the series short may add to it or damp it.
  for (const zeta of [0.2, 0.5]) {
    it(`a 10 kHz square wave through a second-order low pass at 383 kHz, ζ = ${zeta}, overshoots as the textbook's step`, () => {
      const fn = 383e3;
      const h = (f: number) => {
        const x = f / fn;
        const [dr, di] = [1 - x * x, 2 * zeta * x];
        const m = dr * dr + di * di;
        return [dr / m, -di / m] as const;
      };
      const wave = squareWave(h, 10e3, [1, 0]);
      if (!wave.ok) throw new Error(wave.message);
      const overshoot = (Math.max(...wave.v.slice(0, wave.v.length / 2)) - 1) / 2;
      expectClose(overshoot, Math.exp((-Math.PI * zeta) / Math.sqrt(1 - zeta * zeta)), { rel: 0.03 }, 'overshoot');
    });
  }

  it('refuses what it cannot draw', () => {
    expect(squareWave(lowPass(1e3), 0, [1, 0])).toMatchObject({ ok: false, field: 'hz' });
    expect(squareWave(lowPass(1e3), 100, [0, 0])).toMatchObject({ ok: false, field: 'reference' });
    // A midband gain so small its square underflows (found by the robustness run: every sample came out NaN).
    expect(squareWave(lowPass(1e3), 100, [0, 1e-307])).toMatchObject({ ok: false, field: 'reference' });
    expect(squareWave(() => null, 100, [1, 0])).toMatchObject({ ok: false, field: 'hz' });
  });
});
