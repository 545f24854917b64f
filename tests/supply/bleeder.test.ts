import { describe, expect, it } from 'vitest';
import { bleederFor } from '../../src/index';

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
});
