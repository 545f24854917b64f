import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { findOutputTube, solveOutput, type OutputDesign } from '../../src/index';
import { atDrive, waveform } from '../../src/output/outputSignal';
import { settleMagnetising } from '../../src/output/steadyState';

/**
 * The magnetising current a sustained drive settles at: where the cycle's
 * average coupled current equals it, so the winding's voltage averages to
 * zero (Faraday's law: an inductance holds no net volt-seconds over a cycle
 * in the steady state). The circuit itself is held to ngspice's 300 ms runs
 * in tests/spice/outputSteadyState.spice.test.ts and output.spice.test.ts.
 */
describe('the magnetising current a drive settles at', () => {
  it('solves a linear cycle mean to its root in a few cycles (hand algebra: 0.1 + 0.5·m = m at m = 0.2)', () => {
    let calls = 0;
    const m = settleMagnetising((x) => (calls++, 0.1 + 0.5 * x), 0.1, 1e-12);
    expect(m).toBeCloseTo(0.2, 12);
    expect(calls).toBeLessThanOrEqual(4);
  });

  it('stops where part of the cycle is cut off (the mean then rises more slowly) and from any start', () => {
    // A mean that saturates: half the cycle's current held at zero, the other half sharing the shift.
    const mean = (x: number) => 0.5 * Math.max(0, 0.3 + 0.4 * x) + 0.5 * Math.max(0, -0.05 + 0.8 * x);
    for (const start of [0, 0.05, 1, 10]) {
      const m = settleMagnetising(mean, start, 1e-12);
      expect(Math.abs(mean(m) - m)).toBeLessThanOrEqual(1e-12);
    }
  });

  it('property: for any mean rising with slope under one, the answer is its fixed point, finite and not negative', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 0, max: 0.95, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 0, max: 5, noNaN: true }), (a, b, share, start) => {
        // Its slope b + c·sech² stays under one: c takes a share of what b leaves.
        const c = share * (0.99 - b);
        const mean = (x: number) => a + b * x + c * Math.tanh(x);
        const m = settleMagnetising(mean, start, 1e-10);
        expect(Number.isFinite(m)).toBe(true);
        expect(m).toBeGreaterThanOrEqual(0);
        // Within the tolerance, unless the iteration cap ended it (a slope near one converges slowest).
        expect(Math.abs(mean(m) - m)).toBeLessThanOrEqual(b + c < 0.9 ? 1e-10 : 1e-6);
      }),
      { numRuns: 300 },
    );
  });

  it('an EL34 pentode: the settled cycle\'s winding voltage averages to zero, and its magnetising current is the average coupled current', () => {
    const d: OutputDesign = { tubeId: 'EL34', connection: 'pentode', bplus: 330, screenVolts: 300, ulTap: 0.43, zPrimary: 3500, rPrimary: 130, bias: 'cathode', rk: 330, vg: -22, rg: 220e3, speakerOhms: 8, thdLimit: 0.05 };
    const s = solveOutput(findOutputTube('EL34')!, d);
    if (!s.ok) throw new Error(s.message);
    const w = waveform(s, -s.op.vgk);
    const mean = w.winding.reduce((x, y) => x + y, 0) / w.winding.length;
    const swing = Math.max(...w.winding) - Math.min(...w.winding);
    expect(Math.abs(mean)).toBeLessThan(1e-5 * swing);
    // The pentode's coupled current is its plate current: the magnetising current is its average.
    const ipMean = w.ip.reduce((x, y) => x + y, 0) / w.ip.length;
    expect(w.magnetising).toBeCloseTo(ipMean, 6);
    // No drive, no shift: idle.
    expect(atDrive(s, 0).magnetising).toBe(s.op.mmf);
  });

  it('settles on 32 points of the cycle what every point of it gives (the EL34 in all three connections at full drive, within 1e-4)', () => {
    for (const connection of ['pentode', 'ultralinear', 'triode'] as const) {
      const d: OutputDesign = { tubeId: 'EL34', connection, bplus: 330, screenVolts: 300, ulTap: 0.43, zPrimary: 3500, rPrimary: 130, bias: 'cathode', rk: 330, vg: -22, rg: 220e3, speakerOhms: 8, thdLimit: 0.05 };
      const s = solveOutput(findOutputTube('EL34')!, d);
      if (!s.ok) throw new Error(s.message);
      // 128 points settle on every fourth; 1000 (not a multiple of 32) on all of them.
      const coarse = waveform(s, -s.op.vgk, d.zPrimary, 128).magnetising;
      const every = waveform(s, -s.op.vgk, d.zPrimary, 1000).magnetising;
      expect(Math.abs(coarse / every - 1), connection).toBeLessThan(1e-4);
    }
  });
});
