import { describe, expect, it } from 'vitest';
import { findTube, ratingsFindings, solveStage } from '../../src/index';

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
    expect(cold?.message).toBe('At switch-on, before the heater warms, the plate sees the full B+ of 350 V, above the 300 V rating.');
  });

  it('checks heater-to-cathode voltage against 180 V (Tung-Sol 12AX7, design-centre)', () => {
    const f = ratingsFindings({ ...base, vk: 200 }).find((x) => x.kind === 'heater-cathode');
    expect(f?.message).toBe('Heater-to-cathode voltage 200 V exceeds the 180 V rating: elevate the heater supply.');
    expect(ratingsFindings({ ...base, vk: 200, heaterVolts: 60 }).some((x) => x.kind === 'heater-cathode')).toBe(false);
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
