import { describe, expect, it } from 'vitest';
import { findOutputTube, findTube, globalFeedback, type ChainInput } from '../../src/index';

// The loop's square waves are its closed-loop response (feedbackBand, whose response and margins are checked against
// ngspice in tests/spice/feedbackBand.spice.test.ts) summed over the square wave's harmonics (src/signal/squareWave.ts,
// checked against the textbook's exponentials). Here, that the overshoot on a 10 kHz square wave follows the phase
// margin as a second-order loop's does (Ogata, Modern Control Engineering, ch. 7: damping ratio ζ ≈ PM/100 for margins
// under about 70°, overshoot e^(−πζ/√(1−ζ²))): 22° of margin about 49 %, 65° about 7 %. A loop of this order is
// near enough second-order at its crossover for the overshoot to land within a few tenths of that estimate.
const el34Amp: ChainInput = {
  source: { rsource: 1e3 },
  stages: [
    { kind: 'common-cathode', tube: findTube('12AX7')!, bplus: 275, ra: 100e3, rk: 1500, bypassed: false, coupling: { kind: 'capacitor', cc: 47e-9, rg: 1e6 } },
    { kind: 'common-cathode', tube: findTube('12AU7')!, bplus: 275, ra: 27e3, rk: 1200, bypassed: true, coupling: { kind: 'capacitor', cc: 100e-9, rg: 1e6 } },
    {
      kind: 'single-ended-output', tube: findOutputTube('EL34')!, connection: 'ultralinear', bplus: 330, screenVolts: 300, ulTap: 0.43, zPrimary: 3500, rPrimary: 130,
      bias: 'cathode', rk: 330, vg: -20, speakerOhms: 8, thdLimit: 0.05, coupling: { kind: 'capacitor', cc: 220e-9, rg: 220e3 }, primaryInductance: 15, leakageInductance: 8e-3,
    },
  ],
};

const secondOrderOvershoot = (pmDeg: number) => {
  const z = pmDeg / 100;
  return Math.exp((-Math.PI * z) / Math.sqrt(1 - z * z));
};

function tenKilohertz(cf: number | null) {
  const fb = globalFeedback(el34Amp, 22e3, undefined, cf);
  if (!fb.ok) throw new Error(fb.message);
  const w = fb.band.squareWaves.find((s) => s.hz === 10e3);
  if (!w) throw new Error('no 10 kHz square wave');
  const half = w.closed.slice(0, w.closed.length / 2);
  // The square wave steps from −1 to +1: the overshoot is the excess over 1 as a share of that step of 2.
  return { pm: fb.band.high!.phaseMarginDeg, overshoot: (Math.max(...half) - 1) / 2, settled: half[Math.floor(half.length * 0.9)]! };
}

describe('a square wave through the closed loop', () => {
  it('rings on a thin high-end margin as a second-order loop would, and settles at the midband gain', () => {
    const thin = tenKilohertz(null);
    expect(thin.pm).toBeLessThan(30);
    const est = secondOrderOvershoot(thin.pm);
    expect(thin.overshoot).toBeGreaterThan(0.7 * est);
    expect(thin.overshoot).toBeLessThan(1.3 * est);
    expect(Math.abs(thin.settled - 1)).toBeLessThan(0.02);
  });

  it('barely overshoots once a lead capacitor sized for the crossover gives it margin', () => {
    const lead = tenKilohertz(22e-12);
    expect(lead.pm).toBeGreaterThan(60);
    expect(lead.overshoot).toBeLessThan(Math.max(0.15, 2 * secondOrderOvershoot(lead.pm)));
    expect(Math.abs(lead.settled - 1)).toBeLessThan(0.02);
  });

  it('draws nothing for a loop that oscillates', () => {
    const fb = globalFeedback(el34Amp, 4.7e3);
    if (!fb.ok) throw new Error(fb.message);
    expect(fb.band.verdict).toBe('oscillates');
    expect(fb.band.squareWaves).toEqual([]);
  });
});
