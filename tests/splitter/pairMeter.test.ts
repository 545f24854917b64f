import { describe, expect, it } from 'vitest';
import { findTube, readPairMeter, solveLongTailedPair, TAIL_AGREEMENT } from '../../src/index';
import { expectClose } from '../helpers/expectClose';

const au7 = findTube('12AU7')!;

describe('readPairMeter: a long-tailed pair read from its plates, its tail a check on their sum', () => {
  // Tung-Sol 12AU7 (1962), class A1: Va 250 V, Vg −8.5 V, Ia 10.5 mA. A pair built so both sections sit
  // there: grids at 60 V, cathodes at 68.5 V; 21 mA through Rk + tail = 68.5 V / 21 mA (Ohm's law); each
  // 10.5 mA through 10 kΩ drops 105 V from a 423.5 V supply to plates at 318.5 V (Vpk 250 V).
  const stage = { tube: au7, ra: 10e3, ra2: 10e3, rk: 262, rtail: 68.5 / 21e-3 - 262, grid: 60 };
  const typical = { supply: 423.5, plate: 318.5, plate2: 318.5, cathode: 68.5 };

  it('both sections at the data sheet\u2019s typical point read as typical tubes, and the tail agrees', () => {
    const r = readPairMeter(stage, typical);
    if (!r.ok) throw new Error(r.message);
    for (const t of r.tubes) {
      expectClose(t.ia, 10.5e-3, { rel: 1e-12 });
      expect(t.vpk).toBe(250);
      expect(t.vgk).toBe(-8.5);
      expect(t.verdict).toBe('within-spread');
      expectClose(t.ratio, 1, { rel: 0.1 });
    }
    expectClose(r.plateSum, 21e-3, { rel: 1e-12 });
    expectClose(r.tailCurrent, 21e-3, { rel: 1e-12 });
    expect(r.tailAgrees).toBe(true);
    // Each triode's dissipation check, named by its triode as the pair's design findings are: 10.5 mA at 250 V is 2.63 W,
    // 95 % of the Tung-Sol 12AU7's 2.75 W a section, near the rating on both.
    expect(r.findings.map((f) => [f.severity, f.message.slice(0, 33)])).toEqual([
      ['warning', 'First triode: plate dissipation 2'],
      ['warning', 'Second triode: plate dissipation '],
    ]);
  });

  // A first plate resistor drifted from 10 kΩ to 15 kΩ (carbon composition drifts up with age, common
  // practice): the same 10.5 mA drops 157.5 V, which the nominal 10 kΩ reads as 15.75 mA. The plates'
  // sum, 26.25 mA, then disagrees with the tail's 21 mA by 25 %, past TAIL_AGREEMENT.
  it('a drifted plate resistor shows as the plates\u2019 sum disagreeing with the tail', () => {
    const r = readPairMeter(stage, { ...typical, plate: 423.5 - 157.5 });
    if (!r.ok) throw new Error(r.message);
    expectClose(r.tubes[0].ia, 15.75e-3, { rel: 1e-12 });
    expect(r.tubes[0].verdict).toBe('high');
    expect(Math.abs(r.plateSum / r.tailCurrent - 1)).toBeGreaterThan(TAIL_AGREEMENT);
    expect(r.tailAgrees).toBe(false);
  });

  it('reads the model\u2019s own solved pair back as typical tubes', () => {
    const design = { tube: au7, bplus: 330, ra1: 47e3, ra2: 47e3, rk: 470, tail: { kind: 'resistor' as const, rt: 22e3 }, grid: { kind: 'fixed' as const, volts: 80 } };
    const s = solveLongTailedPair(design);
    if (!s.ok) throw new Error(s.message);
    const r = readPairMeter({ tube: au7, ra: 47e3, ra2: 47e3, rk: 470, rtail: 22e3, grid: 80 }, { supply: 330, plate: s.ops[0].va, plate2: s.ops[1].va, cathode: s.cathodeVolts });
    if (!r.ok) throw new Error(r.message);
    for (const t of r.tubes) expectClose(t.ratio, 1, { rel: 1e-6 });
    expectClose(r.plateSum, r.tailCurrent, { rel: 1e-6 });
  });

  it('a reading that cannot be is a typed failure naming the box to check', () => {
    expect(readPairMeter(stage, { ...typical, cathode: 0 })).toMatchObject({ ok: false, reason: 'invalid-input', field: 'cathode' });
    expect(readPairMeter(stage, { ...typical, supply: 300 })).toMatchObject({ ok: false, reason: 'invalid-input', field: 'supply' });
    expect(readPairMeter(stage, { ...typical, plate2: 60 })).toMatchObject({ ok: false, reason: 'invalid-input', field: 'plate2' });
    expect(readPairMeter(stage, { ...typical, plate2: 430 })).toMatchObject({ ok: false, reason: 'invalid-input', field: 'plate2' });
    expect(readPairMeter({ ...stage, rtail: 0 }, typical)).toMatchObject({ ok: false, reason: 'invalid-input', field: 'rtail' });
    expect(readPairMeter({ ...stage, grid: 0 }, typical)).toMatchObject({ ok: false, reason: 'cutoff', field: 'plate' });
  });
});
