import { describe, expect, it } from 'vitest';
import { heaterWindings } from '../../src/index';

describe('the heater windings a whole amplifier needs', () => {
  // Heaters are resistive: a winding's current is the sum of its heaters' (Kirchhoff), its VA is V × A.
  it('heaters of one voltage share a winding; a directly heated rectifier gets one of its own at B+ (common practice)', () => {
    const r = heaterWindings([
      { label: '12AU7 (6.3 V, 0.3 A)', volts: 6.3, amps: 0.3, count: 2 },
      { label: 'EL34 (6.3 V, 1.5 A)', volts: 6.3, amps: 1.5, count: 2 },
      { label: '5U4GB rectifier (5 V, 3 A)', volts: 5, amps: 3, count: 1, atBplus: true },
    ]);
    if (!r.ok) throw new Error(r.message);
    expect(r.windings).toHaveLength(2);
    const [six, five] = r.windings;
    expect(six!.amps).toBeCloseTo(2 * 0.3 + 2 * 1.5, 12);
    expect(six!.va).toBeCloseTo(6.3 * 3.6, 12);
    expect(six!.feeds).toEqual(['2 × 12AU7 (6.3 V, 0.3 A)', '2 × EL34 (6.3 V, 1.5 A)']);
    expect(five).toMatchObject({ volts: 5, amps: 3, atBplus: true });
  });

  it('refuses what is not a heater', () => {
    expect(heaterWindings([])).toMatchObject({ ok: false });
    expect(heaterWindings([{ label: 'x', volts: 6.3, amps: 0.3, count: 0 }])).toMatchObject({ ok: false, message: expect.stringMatching(/^Heater 1 /) });
  });
});
