import { describe, expect, it } from 'vitest';
import { corners, findTube, frequencyResponse, solveStage } from '../../src/index';
import { expectClose } from '../helpers/expectClose';

const au7 = findTube('12AU7')!;
const base = { tube: au7, bplus: 275, ra: 27e3, rk: 1200, bypassed: true };

describe('frequency response', () => {
  it('an output coupling capacitor into RL is an RC high-pass at 1/(2π·C·(Zout + RL))', () => {
    // First-order high-pass corner f = 1/(2πRC): any circuits textbook, e.g. P. Horowitz and W. Hill,
    // The Art of Electronics, 3rd ed., §1.7. Here R is the load plus the stage's output impedance in series.
    const s = solveStage({ ...base, rl: 100e3 });
    if (!s.ok) throw new Error(s.message);
    const c = corners({ ...base, rl: 100e3, cout: 100e-9 });
    if (!c.ok) throw new Error(c.message);
    expectClose(c.lowHz!, 1 / (2 * Math.PI * 100e-9 * (s.zout + 100e3)), { rel: 0.005 });
  });

  // The same first-order RC corner (Horowitz and Hill, 3rd ed., §1.7), R the source and grid leak in series.
  it('an input coupling capacitor into the grid leak is an RC high-pass at 1/(2π·Cin·(Rs + Rg))', () => {
    const c = corners({ ...base, rsource: 10e3, cin: 47e-9, rg: 470e3 });
    if (!c.ok) throw new Error(c.message);
    expectClose(c.lowHz!, 1 / (2 * Math.PI * 47e-9 * (10e3 + 470e3)), { rel: 0.005 });
  });

  // Voltage divider (Ohm's law) times the stage gain; the plate output inverts (common practice).
  it('midband gain is the stage gain times the input divider Rg/(Rs + Rg), with a plate output inverting (phase near ±180°)', () => {
    const s = solveStage({ ...base, rl: 220e3 });
    if (!s.ok) throw new Error(s.message);
    const r = frequencyResponse({ ...base, rl: 220e3, rsource: 1e3, cin: 1e-6, rg: 1e6, cout: 1e-6 }, [1000]);
    if (!r.ok) throw new Error(r.message);
    expectClose(Math.pow(10, r.magnitudeDb[0]! / 20), Math.abs(s.gain) * (1e6 / 1.001e6), { rel: 0.005 });
    expect(Math.abs(Math.abs(r.phaseDeg[0]!) - 180)).toBeLessThan(2);
  });

  // Langford-Smith, Radiotron Designer's Handbook, 4th ed., ch. 12 (cathode bias and its bypass): the gain
  // runs from the degenerated figure at DC to the bypassed one above the shelf.
  it('a cathode bypass capacitor makes a shelf from the unbypassed gain (low frequencies) to the bypassed gain (midband)', () => {
    const s = solveStage(base);
    if (!s.ok) throw new Error(s.message);
    const r = frequencyResponse({ ...base, ck: 10e-6 }, [0.01, 1e4]);
    if (!r.ok) throw new Error(r.message);
    expectClose(Math.pow(10, r.magnitudeDb[0]! / 20), Math.abs(s.gainUnbypassed), { rel: 0.005 });
    expectClose(Math.pow(10, r.magnitudeDb[1]! / 20), Math.abs(s.gainBypassed), { rel: 0.01 });
  });

  it('a high source impedance with the Miller input capacitance sets the upper corner near 1/(2π·Rs·Cin(Miller))', () => {
    // The Miller approximation (Miller, 1920) ignores the plate-side pole, so expect agreement to ~10 %.
    const s = solveStage({ ...base, rl: 220e3 });
    if (!s.ok) throw new Error(s.message);
    const c = corners({ ...base, rl: 220e3, rsource: 200e3, rg: 1e6, cin: 1e-6 });
    if (!c.ok) throw new Error(c.message);
    const rsParRg = (200e3 * 1e6) / 1.2e6;
    expectClose(c.highHz!, 1 / (2 * Math.PI * rsParRg * s.cin), { rel: 0.1 });
  });

  it('refuses frequencies that are not positive numbers', () => {
    expect(frequencyResponse(base, [1000, -5])).toEqual({ ok: false, reason: 'invalid-input', message: 'Frequencies must be a list of at most 10000 positive numbers in Hz', field: 'frequencies' });
  });
});
