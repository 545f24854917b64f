import { describe, expect, it } from 'vitest';
import { findTube, plateCurrent, readPlateMeter, solveStage } from '../../src/index';
import { expectClose } from '../helpers/expectClose';

const ax7 = findTube('12AX7')!;
const au7 = findTube('12AU7')!;

describe('readPlateMeter: a triode read from its plate resistor\u2019s drop', () => {
  // Tung-Sol 12AX7 (1947) p.1, class A1 each section: Va 250 V, Vg −2 V, Ia 1.2 mA. A fixed-bias stage
  // built to sit there: 1.2 mA through 100 kΩ drops 120 V (Ohm's law), so the supply reads 370 V.
  it('a fixed-bias 12AX7 at its data sheet\u2019s typical point reads as a typical tube', () => {
    const r = readPlateMeter({ tube: ax7, ra: 100e3, grid: -2 }, { supply: 370, plate: 250, cathode: 0 });
    if (!r.ok) throw new Error(r.message);
    expectClose(r.ia, 1.2e-3, { rel: 1e-12 });
    expect(r.vpk).toBe(250);
    expect(r.vgk).toBe(-2);
    expectClose(r.pa, 0.3, { rel: 1e-12 });
    expect(r.verdict).toBe('within-spread');
    expectClose(r.ratio, 1, { rel: 0.1 });
  });

  // Tung-Sol 12AU7 (1962), class A1: Va 250 V, Vg −8.5 V, Ia 10.5 mA; 10.5 mA through 10 kΩ drops 105 V.
  it('a 12AU7 at its typical point, and the same stage with a tube passing 30 % less', () => {
    const typical = readPlateMeter({ tube: au7, ra: 10e3, grid: -8.5 }, { supply: 355, plate: 250, cathode: 0 });
    if (!typical.ok) throw new Error(typical.message);
    expect(typical.verdict).toBe('within-spread');
    expectClose(typical.ratio, 1, { rel: 0.1 });
    const weak = readPlateMeter({ tube: au7, ra: 10e3, grid: -8.5 }, { supply: 355, plate: 355 - 105 * 0.7, cathode: 0 });
    if (!weak.ok) throw new Error(weak.message);
    expect(weak.verdict).toBe('low');
    expect(weak.gridShift!).toBeGreaterThan(0);
    expectClose(plateCurrent(au7, weak.vpk, weak.vgk - weak.gridShift!), weak.ia, { rel: 1e-4 });
  });

  it('reads the model\u2019s own solved stage back from its plate side as it reads it from the cathode', () => {
    const s = solveStage({ tube: au7, bplus: 275, ra: 27e3, rk: 1200, bypassed: true });
    if (!s.ok) throw new Error(s.message);
    const r = readPlateMeter({ tube: au7, ra: 27e3, grid: 0 }, { supply: 275, plate: s.op.va, cathode: s.op.vk });
    if (!r.ok) throw new Error(r.message);
    expectClose(r.ia, s.op.ia, { rel: 1e-6 });
    expectClose(r.ratio, 1, { rel: 1e-6 });
  });

  it('a reading that cannot be is a typed failure naming the box to check', () => {
    const stage = { tube: au7, ra: 10e3, grid: -8.5 };
    expect(readPlateMeter(stage, { supply: 250, plate: 250, cathode: 0 })).toMatchObject({ ok: false, reason: 'invalid-input', field: 'supply' });
    expect(readPlateMeter(stage, { supply: 300, plate: 5, cathode: 6 })).toMatchObject({ ok: false, reason: 'invalid-input', field: 'plate' });
    expect(readPlateMeter(stage, { supply: 300, plate: 250, cathode: -1 })).toMatchObject({ ok: false, reason: 'invalid-input', field: 'cathode' });
    expect(readPlateMeter({ ...stage, ra: 0 }, { supply: 300, plate: 250, cathode: 0 })).toMatchObject({ ok: false, reason: 'invalid-input', field: 'ra' });
    expect(readPlateMeter({ ...stage, tube: au7.model as never }, { supply: 300, plate: 250, cathode: 0 })).toMatchObject({ ok: false, reason: 'invalid-tube' });
    // A grid 60 V below the cathode at 150 V: far past a 12AU7's cut-off.
    expect(readPlateMeter({ ...stage, grid: -60 }, { supply: 300, plate: 150, cathode: 0 })).toMatchObject({ ok: false, reason: 'cutoff', field: 'plate' });
  });
});
