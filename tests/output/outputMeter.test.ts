import { describe, expect, it } from 'vitest';
import { findOutputTube, readOutputMeter, SENSE_OHMS, singleEndedPins, solveOutput, type OutputDesign } from '../../src/index';
import { korenPentode } from '../../src/tube/pentode';
import { expectClose } from '../helpers/expectClose';

const a3 = findOutputTube('2A3')!;
const el34 = findOutputTube('EL34')!;

describe('readOutputMeter: an output tube read from the meter', () => {
  // Virtual Valve Museum's 2A3 summary (RT-2A3, ../shared/reference/tube-data.md §12), single tube class A1:
  // Va 250 V, Vg −45 V, Ia 60 mA, self bias Rk 750 Ω (45 V / 60 mA, Ohm's law).
  it('a 2A3 read at its data sheet\u2019s point, cathode-biased through its 750 Ω: 60 mA, a typical tube', () => {
    const r = readOutputMeter(a3, { plate: 295, screen: null, grid: 0, cathode: 45, rk: 750 });
    if (!r.ok) throw new Error(r.message);
    expectClose(r.ik, 0.06, { rel: 1e-12 });
    expect(r.vpk).toBe(250);
    expect(r.vgk).toBe(-45);
    expect(r.verdict).toBe('within-spread');
    expectClose(r.ratio, 1, { rel: 0.1 });
    // 250 V × 60 mA = 15 W: the point sits on the 2A3's 15 W rating (tube-data.md §12).
    expectClose(r.pa, 15, { rel: 1e-9 });
    expectClose(r.paFraction, 1, { rel: 1e-9 });
    // At the rating, not past it: a warning, as the design's own check gives a sheet's rated point; no screen to check.
    expect(r.findings).toEqual([expect.objectContaining({ kind: 'plate-dissipation', severity: 'warning' })]);
    expect(r.vg2k).toBeNull();
  });

  it('the same 2A3 fixed-bias, read across the 1 Ω sense resistor: millivolts as milliamps', () => {
    expect(SENSE_OHMS).toBe(1);
    const r = readOutputMeter(a3, { plate: 250.06, screen: null, grid: -45, cathode: 0.06, rk: SENSE_OHMS });
    if (!r.ok) throw new Error(r.message);
    expectClose(r.ik, 0.06, { rel: 1e-9 });
    expect(r.verdict).toBe('within-spread');
  });

  it('reads back the model\u2019s own ultralinear EL34 as the typical tube: its cathode current, plate and screen dissipation', () => {
    const design: OutputDesign = { tubeId: 'EL34', connection: 'ultralinear', bplus: 330, screenVolts: 300, ulTap: 0.43, zPrimary: 3500, rPrimary: 130, bias: 'cathode', rk: 330, vg: -22, rg: 220e3, speakerOhms: 8, thdLimit: 0.05 };
    const s = solveOutput(el34, design);
    if (!s.ok) throw new Error(s.message);
    const pins = singleEndedPins(s.op);
    const r = readOutputMeter(el34, { plate: pins.plate, screen: pins.screen, grid: pins.grid, cathode: pins.cathode, rk: 330 });
    if (!r.ok) throw new Error(r.message);
    expectClose(r.ratio, 1, { rel: 1e-6 });
    expectClose(r.ik, s.op.ik, { rel: 1e-9 });
    expectClose(r.pa, s.op.pa, { rel: 1e-6 });
    expectClose(r.pg2!, s.op.pg2, { rel: 1e-6 });
    // The plate's and the screen's dissipation checked as the design's are (EL34: 25 W plate, 8 W screen).
    expect(r.findings.map((f) => [f.kind, f.limit])).toEqual([['plate-dissipation', 25], ['screen-dissipation', 8]]);
    expect(Math.abs(r.gridShift!)).toBeLessThan(1e-3);
  });

  it('a tired EL34 on the same cathode resistor: less drop, under the spread, a shift the typical tube\u2019s grid would need', () => {
    const r = readOutputMeter(el34, { plate: 330, screen: 335, grid: 0, cathode: 17, rk: 330 });
    if (!r.ok) throw new Error(r.message);
    expect(r.verdict).toBe('low');
    expect(r.gridShift!).toBeGreaterThan(0);
    expect(r.ia + r.ig2!).toBeCloseTo(r.ik, 12);
  });

  it('a reading that cannot be is a typed failure naming what to check', () => {
    const ok = { plate: 330, screen: 335, grid: 0, cathode: 20, rk: 330 };
    expect(readOutputMeter(el34, { ...ok, cathode: 0 })).toMatchObject({ ok: false, reason: 'invalid-input', field: 'cathode' });
    expect(readOutputMeter(el34, { ...ok, plate: 10 })).toMatchObject({ ok: false, reason: 'invalid-input', field: 'plate' });
    expect(readOutputMeter(el34, { ...ok, screen: 10 })).toMatchObject({ ok: false, reason: 'invalid-input', field: 'screen' });
    expect(readOutputMeter(el34, { ...ok, rk: 0 })).toMatchObject({ ok: false, reason: 'invalid-input', field: 'rk' });
    expect(readOutputMeter(el34, { ...ok, grid: -200 })).toMatchObject({ ok: false, reason: 'cutoff', field: 'grid' });
    expect(readOutputMeter({ kind: 'tube' } as never, ok)).toMatchObject({ ok: false, reason: 'invalid-tube' });
  });

  it('splits a strong tube\u2019s cathode current as the typical tube splits the same current, at its shifted grid', () => {
    // Fixed bias, 75 mA across the sense resistor where the typical EL34 passes about 41 mA (and Koren's screen law gives it no screen current).
    const r = readOutputMeter(el34, { plate: 320.075, screen: 330.075, grid: -30, cathode: 0.075, rk: SENSE_OHMS });
    if (!r.ok) throw new Error(r.message);
    expect(r.verdict).toBe('high');
    const law = el34.law as Extract<typeof el34.law, { kind: 'pentode' }>;
    const same = korenPentode(law.params, r.vpk, r.vgk - r.gridShift!, r.vg2k!);
    expectClose(same.ia + same.ig2, r.ik, { rel: 1e-4 });
    expectClose(r.ig2! / r.ik, same.ig2 / (same.ia + same.ig2), { rel: 1e-6 });
    expect(r.ig2!).toBeGreaterThan(0);
  });
});

