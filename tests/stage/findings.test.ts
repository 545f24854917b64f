import { describe, expect, it } from 'vitest';
import { findTube, GRID_CURRENT_ONSET, solveStage } from '../../src/index';
import { ratingsFindings } from '../../src/stage/findings';

const ax7 = findTube('12AX7')!;
const base = { tube: ax7, bplus: 250, va: 150, vk: 1.5, vpk: 148.5, ia: 1e-3, vgk: -1.5, pa: 0.1485, heaterVolts: 0, rg: null, fixedBias: false };

describe('ratingsFindings', () => {
  it('rates plate dissipation against the 1.0 W of the Tung-Sol 12AX7 sheet (1947)', () => {
    const f = ratingsFindings({ ...base, vpk: 250, ia: 5e-3, pa: 1.25 });
    expect(f[0]).toMatchObject({ kind: 'plate-dissipation', severity: 'danger', value: 1.25, limit: 1, percent: 125 });
    expect(f[0]!.message).toBe('Plate dissipation 1.25 W is 125 % of the 1 W rating: the plate will overheat.');
  });

  it('warns above 85 % of rated dissipation (common practice)', () => {
    expect(ratingsFindings({ ...base, pa: 0.9 })[0]).toMatchObject({ kind: 'plate-dissipation', severity: 'warning' });
    expect(ratingsFindings({ ...base, pa: 0.5 })[0]).toMatchObject({ kind: 'plate-dissipation', severity: 'note' });
  });

  it('flags plate voltage over the 300 V rating, and full B+ at switch-on', () => {
    expect(ratingsFindings({ ...base, vpk: 320 }).some((x) => x.kind === 'plate-voltage' && x.severity === 'danger')).toBe(true);
    const cold = ratingsFindings({ ...base, bplus: 350 }).find((x) => x.kind === 'cold-plate-voltage');
    expect(cold?.message).toBe('At switch-on, before the heater warms, the plate sees the full B+ of 350 V, above the 300 V rating for a working tube. Many data sheets rate a cold plate higher (Va0): check the sheet, or bring B+ up after the heaters (a rectifier tube or a slow start, common practice).');
  });

  it('checks heater-to-cathode voltage against 180 V either polarity (Tung-Sol 12AX7, design-centre; shared reference § 12AX7)', () => {
    const f = ratingsFindings({ ...base, vk: 200 }).find((x) => x.kind === 'heater-cathode');
    expect(f).toMatchObject({ severity: 'danger', value: 200, limit: 180 });
    expect(f?.message).toBe('Heater-to-cathode voltage 200 V (cathode positive to the heater) is 111 % of the 180 V rating (the record gives one figure for both polarities): the insulation may break down; elevate the heater supply.');
    expect(ratingsFindings({ ...base, vk: 200, heaterVolts: 60 }).find((x) => x.kind === 'heater-cathode')?.severity).toBe('note');
  });

  it('bands heater-to-cathode voltage like dissipation: a note, a warning from 80 % (common practice), danger only over the rating', () => {
    const sev = (vk: number) => ratingsFindings({ ...base, vk }).find((x) => x.kind === 'heater-cathode')?.severity;
    expect(sev(100)).toBe('note');
    expect(sev(150)).toBe('warning');
    expect(sev(179.6)).toBe('warning');
    expect(sev(180)).toBe('warning');
    expect(sev(182)).toBe('danger');
  });

  it('a 6SN7 follower at 199.6 V against its 200 V rating is a warning, not silence (from memory: 6SN7GTB 200 V)', () => {
    const f = ratingsFindings({ ...base, tube: findTube('6SN7')!, vk: 199.6 }).find((x) => x.kind === 'heater-cathode');
    expect(f).toMatchObject({ severity: 'warning' });
    expect(f?.message).toContain('at its maximum rating');
  });

  it('rates each polarity on its own where the sheet does: 12AU7 200 V cathode positive, 100 V cathode negative (Tung-Sol 12AU7, 1962)', () => {
    const au7 = findTube('12AU7')!;
    const positive = ratingsFindings({ ...base, tube: au7, vk: 150 }).find((x) => x.kind === 'heater-cathode');
    expect(positive).toMatchObject({ severity: 'note', limit: 200 });
    expect(positive?.message).toContain('(the rating for this polarity; the other is 100 V)');
    // An elevated heater 150 V above a 2 V cathode: the cathode is 148 V negative to the heater.
    const negative = ratingsFindings({ ...base, tube: au7, vk: 2, heaterVolts: 150 }).find((x) => x.kind === 'heater-cathode');
    expect(negative).toMatchObject({ severity: 'danger', value: 148, limit: 100 });
    expect(negative?.message).toContain('cathode negative to the heater');
    // Held too high, the remedy is to bring the heaters down, not to elevate them further.
    expect(negative?.message).toMatch(/: the insulation may break down; hold the heaters lower\.$/);
    expect(positive?.message).not.toContain('hold the heaters lower');
  });

  it('a figure at its rating is a warning, never a danger: 2A3 at 15 W against its 15 W rating (2A3 record: from memory)', () => {
    const f = ratingsFindings({ ...base, tube: findTube('2A3')!, vpk: 250, ia: 0.06, pa: 15.00001 }).find((x) => x.kind === 'plate-dissipation');
    expect(f).toMatchObject({ severity: 'warning' });
    expect(f?.message).toBe('Plate dissipation 15.00 W is 100 % of the 15 W rating: at its maximum rating, with no margin for mains swings and tube spread.');
    expect(ratingsFindings({ ...base, tube: findTube('2A3')!, vpk: 250, ia: 0.0612, pa: 15.3 }).find((x) => x.kind === 'plate-dissipation')?.severity).toBe('danger');
  });

  it('a grid with no bias (Rk 0, no fixed bias) is a typed finding, not silence', () => {
    const f = ratingsFindings({ ...base, vk: 0, vgk: 0 }).find((x) => x.kind === 'no-grid-bias');
    expect(f?.severity).toBe('warning');
    expect(f?.message).toContain('draws current on every positive half-cycle');
    const s = solveStage({ tube: ax7, bplus: 250, ra: 100e3, rk: 0 });
    if (!s.ok) throw new Error(s.message);
    expect(s.findings.some((x) => x.kind === 'no-grid-bias')).toBe(true);
    expect(ratingsFindings({ ...base, vk: 0, vgk: 0, fixedBias: true }).some((x) => x.kind === 'no-grid-bias')).toBe(false);
  });

  it('skips the heater check for a directly heated tube (the filament is the cathode)', () => {
    const f = ratingsFindings({ ...base, tube: findTube('300B')!, vk: 600 });
    expect(f.some((x) => x.kind === 'heater-cathode')).toBe(false);
  });

  it('flags a grid resistor above the 12AU7 datasheet maximum: 0.25 MΩ fixed bias, 1 MΩ cathode bias (Tung-Sol 1962)', () => {
    const au7 = findTube('12AU7')!;
    expect(ratingsFindings({ ...base, tube: au7, rg: 470e3, fixedBias: true }).some((x) => x.kind === 'grid-resistor')).toBe(true);
    expect(ratingsFindings({ ...base, tube: au7, rg: 470e3, fixedBias: false }).some((x) => x.kind === 'grid-resistor')).toBe(false);
  });

  it('orders findings most severe first', () => {
    const f = ratingsFindings({ ...base, vpk: 320, pa: 0.9, bplus: 400 });
    const order = { danger: 0, warning: 1, note: 2 };
    for (let k = 1; k < f.length; k++) expect(order[f[k]!.severity]).toBeGreaterThanOrEqual(order[f[k - 1]!.severity]);
  });

  it('a stage solution carries its findings', () => {
    const s = solveStage({ tube: ax7, bplus: 400, ra: 22e3, rk: 220 });
    if (!s.ok) throw new Error(s.message);
    expect(s.op.pa).toBeGreaterThan(1);
    expect(s.findings[0]).toMatchObject({ kind: 'plate-dissipation', severity: 'danger' });
  });
});

describe('a grid biased past the onset of grid current', () => {
  it('is warned of, with the onset as its limit; a grid well below it is not', () => {
    const at = (vgk: number) => ratingsFindings({ ...base, vk: -vgk, vpk: 150 + vgk, vgk });
    expect(at(-0.4).find((f) => f.kind === 'grid-current-onset')).toMatchObject({ severity: 'warning', limit: GRID_CURRENT_ONSET });
    expect(at(-1.5).some((f) => f.kind === 'grid-current-onset')).toBe(false);
  });
});
