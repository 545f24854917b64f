import { describe, expect, it } from 'vitest';
import { findTube, solveCathodyne, type CathodyneDesign } from '../../src/index';
import { expectClose } from '../helpers/expectClose';

// Our own splitter.
const base: CathodyneDesign = { tube: findTube('12AU7')!, bplus: 350, ra: 22e3, rk: 21e3, rb: 1e3, grid: { kind: 'tap' } };
const solved = (d: CathodyneDesign) => {
  const r = solveCathodyne(d);
  if (!r.ok) throw new Error(r.message);
  return r;
};

describe('the split-load phase splitter', () => {
  // Langford-Smith, Radiotron Designer's Handbook (4th ed.), the split-load inverter: with no load, each output's gain is
  // μR/(rp + Ra + (μ+1)Rc), the plate's inverted; equal when Ra = Rc.
  it('unloaded, each output\'s gain is μR/(rp + Ra + (μ+1)Rc), equal and opposite when Ra = Rk + Rb', () => {
    const r = solved(base);
    const den = r.rp + 22e3 + (r.mu + 1) * 22e3;
    expectClose(r.gainPlate, (-r.mu * 22e3) / den, { rel: 1e-9 }, 'plate');
    expectClose(r.gainCathode, (r.mu * 22e3) / den, { rel: 1e-9 }, 'cathode');
    expect(r.balance).toBeCloseTo(1, 12);
    expect(r.gainCathode).toBeLessThan(1);
  });

  it('the outputs\' impedances differ greatly, yet equal loads (capacitive too) keep them balanced; unequal loads do not', () => {
    const r = solved({ ...base, rl: 470e3, cl: 100e-12 });
    expect(r.zPlate / r.zCathode).toBeGreaterThan(10);
    for (const b of r.balanceAt) {
      expect(b.ratio).toBeCloseTo(1, 9);
      expect(Math.abs(b.phaseErrorDeg)).toBeLessThan(1e-6);
    }
    // Ra 10 % above Rk + Rb: the plate's output is 10 % larger (Ohm's law on the one current).
    expectClose(solved({ ...base, ra: 24.2e3 }).balance, 22e3 / 24.2e3, { rel: 1e-9 }, 'unequal');
  });

  it('its cathode sits high: the heater–cathode voltage is checked; its clean swing ends at grid current or cutoff', () => {
    const r = solved(base);
    expectClose(r.vhk, r.op.vk, { rel: 1e-12 });
    expect(r.findings.some((f) => f.kind === 'heater-cathode')).toBe(true);
    expect(r.swing.inputPeak).toBeGreaterThan(10);
    expect(['grid-current', 'cutoff']).toContain(r.swing.limitedBy);
    expectClose(r.swing.platePeak, r.swing.cathodePeak, { rel: 1e-9 }, 'equal swings with equal loads');
    const hotter = solved({ ...base, bplus: 400 });
    expect(hotter.swing.platePeak).toBeGreaterThan(r.swing.platePeak);
    expect(solved({ ...base, heaterVolts: 80 }).vhk).toBeCloseTo(r.op.vk - 80, 9);
  });

  it('names the field of a bad value', () => {
    expect(solveCathodyne({ ...base, ra: 0 })).toMatchObject({ ok: false, field: 'ra' });
    expect(solveCathodyne({ ...base, grid: { kind: 'fixed', volts: 300 } })).toMatchObject({ ok: false, reason: 'grid-current', field: 'grid.volts' });
    expect(solveCathodyne({ ...base, grid: {} as never })).toMatchObject({ ok: false, field: 'grid' });
  });
});
