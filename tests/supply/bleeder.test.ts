import { describe, expect, it } from 'vitest';
import { bleederFor, bleederForSupply, type SupplyDesign } from '../../src/index';

describe('the bleeder that makes the filter capacitors safe to touch', () => {
  // RC discharge, V(t) = V0·e^(−t/RC): 200 µF from 400 V to 60 V in 30 s needs R ≤ 30 / (200e-6 · ln(400/60)) = 79.1 kΩ.
  it('is the largest E12 value that discharges in time, with its power at the peak', () => {
    const r = bleederFor(200e-6, 400, 350);
    if (!r.ok || !r.needed) throw new Error('a bleeder is needed');
    expect(r.ohms).toBeCloseTo(68e3, 6);
    expect(r.seconds).toBeLessThan(30);
    expect(r.seconds).toBeCloseTo(68e3 * 200e-6 * Math.log(400 / 60), 9);
    expect(r.watts).toBeCloseTo((400 * 400) / 68e3, 9);
    expect(r.partWatts).toBe(5); // 2.35 W at the peak: twice that is 4.7 W (common practice), so a 5 W part
    expect(r.amps).toBeCloseTo(350 / 68e3, 12);
  });

  it('a supply that never exceeds the safe voltage needs none; nonsense is refused with a reason', () => {
    expect(bleederFor(100e-6, 50, 40)).toEqual({ ok: true, needed: false });
    expect(bleederFor(0, 400, 350)).toMatchObject({ ok: false, reason: 'invalid-input' });
    expect(bleederFor(100e-6, 400, 500)).toMatchObject({ ok: false });
  });

  it('for a supply, from its design alone: every filter capacitor charged to the winding\'s open-circuit peak', () => {
    // The demo's supply: 246 V at its rated 200 mA with 35 Ω, so 246 + 0.2·35 = 253 V open circuit, 357.8 V peak; 100 + 100 + 47 + 220 µF.
    // R ≤ 30 / (467e-6 · ln(357.8/60)) = 36.0 kΩ, so 33 kΩ (E12, IEC 60063), whose 3.88 W at the peak asks a 10 W part (twice, common practice).
    const d: SupplyDesign = {
      mainsHz: 50, secondaryRms: 246, windingOhms: 35, ratedAmps: 0.2, rectifier: { kind: 'silicon-full-wave' }, input: { kind: 'capacitor', c: 100e-6 },
      sections: [{ kind: 'lc', l: 5, rdc: 100, c: 100e-6 }, { kind: 'rc', r: 1e3, c: 47e-6 }, { kind: 'rc', r: 9.1e3, c: 220e-6 }], loads: [0, 0, 0, 0],
    };
    const r = bleederForSupply(d, 338);
    if (!r.ok || !r.needed) throw new Error('a bleeder is needed');
    expect(r.ohms).toBeCloseTo(33e3, 6);
    expect(r.watts).toBeCloseTo(357.8 ** 2 / 33e3, 1);
    expect(r.partWatts).toBe(10);
    expect(r.amps).toBeCloseTo(338 / 33e3, 9);
    // Before the supply is solved the current is taken at the peak; a choke input's capacitor counts the same.
    const early = bleederForSupply({ ...d, input: { kind: 'choke', l: 10, rdc: 150, c: 100e-6 } });
    expect(early).toMatchObject({ ok: true, ohms: 33e3 });
    if (early.ok && early.needed) expect(early.amps).toBeCloseTo((Math.SQRT2 * 253) / 33e3, 9);
    expect(bleederForSupply({ ...d, sections: [{ kind: 'rc', r: 1e3, c: Number.NaN }] })).toMatchObject({ ok: false, reason: 'invalid-input' });
  });
});
