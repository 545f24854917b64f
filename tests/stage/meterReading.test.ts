import { describe, expect, it } from 'vitest';
import { findTube, plateCurrent, readMeter, solveStage } from '../../src/index';
import { expectClose } from '../helpers/expectClose';

const ax7 = findTube('12AX7')!;
const au7 = findTube('12AU7')!;

describe('readMeter: where a built stage\u2019s tube sits, from the meter', () => {
  it('takes the cathode current across Rk by Ohm\u2019s law, and vpk and vgk from the three voltages', () => {
    const r = readMeter({ tube: ax7, rk: 1500, grid: 0 }, { plate: 180, cathode: 1.5 });
    if (!r.ok) throw new Error(r.message);
    expectClose(r.ia, 1e-3, { rel: 1e-12 }); // Ohm's law: 1.5 V across 1.5 kΩ
    expect(r.vpk).toBe(178.5);
    expect(r.vgk).toBe(-1.5);
    expectClose(r.pa, 178.5e-3, { rel: 1e-12 });
    expectClose(r.paFraction, 178.5e-3 / 1.0, { rel: 1e-12 }); // 12AX7 plate dissipation 1.0 W (Tung-Sol 12AX7, 1947)
    expect(r.findings).toEqual([expect.objectContaining({ kind: 'plate-dissipation', severity: 'note' })]);
  });

  // Tung-Sol 12AU7 (1962): 2.75 W plate dissipation a section. 12 V across 1.2 kΩ is 10 mA (Ohm's law) at 288 V: 2.88 W.
  it('a reading past the plate rating is a danger, banded as the design\u2019s own checks are', () => {
    const r = readMeter({ tube: au7, rk: 1200, grid: 0 }, { plate: 300, cathode: 12 });
    if (!r.ok) throw new Error(r.message);
    expectClose(r.pa, 2.88, { rel: 1e-12 });
    expect(r.findings).toEqual([expect.objectContaining({ kind: 'plate-dissipation', severity: 'danger', value: r.pa, limit: 2.75 })]);
    expect(r.findings[0]!.message).toMatch(/as read: the plate will overheat\.$/);
  });

  // Tung-Sol 12AX7 (1947) p.1, class A1 each section: Va 250 V, Vg −2 V, Ia 1.2 mA. A stage built to sit
  // there (Rk = 2 V / 1.2 mA) reads as a typical tube: within the ±20 % spread, and within the model's fit.
  it('a 12AX7 read at its data sheet\u2019s typical point is within the spread of the model\u2019s typical tube', () => {
    const r = readMeter({ tube: ax7, rk: 2 / 1.2e-3, grid: 0 }, { plate: 252, cathode: 2 });
    if (!r.ok) throw new Error(r.message);
    expectClose(r.ia, 1.2e-3, { rel: 1e-9 });
    expect(r.verdict).toBe('within-spread');
    expectClose(r.ratio, 1, { rel: 0.1 });
  });

  // Tung-Sol 12AU7 (1962), class A1: Va 250 V, Vg −8.5 V, Ia 10.5 mA.
  it('a 12AU7 read at its data sheet\u2019s typical point, and the same stage with a tube passing 30 % less', () => {
    const rk = 8.5 / 10.5e-3;
    const typical = readMeter({ tube: au7, rk, grid: 0 }, { plate: 258.5, cathode: 8.5 });
    if (!typical.ok) throw new Error(typical.message);
    expect(typical.verdict).toBe('within-spread');
    expectClose(typical.ratio, 1, { rel: 0.1 });
    // A weak tube on the same Rk settles lower: less drop across Rk, a higher plate.
    const weak = readMeter({ tube: au7, rk, grid: 0 }, { plate: 280, cathode: 8.5 * 0.7 });
    if (!weak.ok) throw new Error(weak.message);
    expect(weak.verdict).toBe('low');
    expect(weak.gridShift!).toBeGreaterThan(0);
    // The shift is what the typical tube's grid would need to pass the measured current there.
    expectClose(plateCurrent(au7, weak.vpk, weak.vgk - weak.gridShift!), weak.ia, { rel: 1e-4 });
  });

  it('reads back the model\u2019s own solved stage as the typical tube: ratio 1, no shift', () => {
    const s = solveStage({ tube: au7, bplus: 275, ra: 27e3, rk: 1200, bypassed: true });
    if (!s.ok) throw new Error(s.message);
    const r = readMeter({ tube: au7, rk: 1200, grid: 0 }, { plate: s.op.va, cathode: s.op.vk });
    if (!r.ok) throw new Error(r.message);
    expectClose(r.ratio, 1, { rel: 1e-6 });
    expect(Math.abs(r.gridShift!)).toBeLessThan(1e-3);
  });

  it('a strong tube reads high; a follower\u2019s grid, held above chassis, sets its vgk', () => {
    const strong = readMeter({ tube: au7, rk: 1200, grid: 0 }, { plate: 140, cathode: 8 });
    if (!strong.ok) throw new Error(strong.message);
    expect(strong.verdict).toBe('high');
    expect(strong.gridShift!).toBeLessThan(0);
    const follower = readMeter({ tube: au7, rk: 22e3, grid: 150 }, { plate: 275, cathode: 155 });
    if (!follower.ok) throw new Error(follower.message);
    expect(follower.vgk).toBe(-5);
    expect(follower.vpk).toBe(120);
  });

  it('a reading that cannot be is a typed failure naming what to check', () => {
    expect(readMeter({ tube: au7, rk: 1200, grid: 0 }, { plate: 150, cathode: 0 })).toMatchObject({ ok: false, reason: 'invalid-input', field: 'cathode' });
    expect(readMeter({ tube: au7, rk: 1200, grid: 0 }, { plate: 5, cathode: 6 })).toMatchObject({ ok: false, reason: 'invalid-input', field: 'plate' });
    expect(readMeter({ tube: au7, rk: 0, grid: 0 }, { plate: 150, cathode: 5 })).toMatchObject({ ok: false, reason: 'invalid-input', field: 'rk' });
    expect(readMeter({ tube: au7.model as never, rk: 1200, grid: 0 }, { plate: 150, cathode: 5 })).toMatchObject({ ok: false, reason: 'invalid-tube' });
    // 40 V on a 12AU7's cathode with its grid at 0 V: the model's tube is far past cut-off at 110 V.
    expect(readMeter({ tube: au7, rk: 1200, grid: 0 }, { plate: 150, cathode: 40 })).toMatchObject({ ok: false, reason: 'cutoff', field: 'cathode' });
  });
});
