import { describe, expect, it } from 'vitest';
import { findTube, solveLongTailedPair, type LongTailedPairDesign } from '../../src/index';
import { bothTriodesFindings } from '../../src/splitter/longTailedPair';
import { expectClose } from '../helpers/expectClose';

// Our own pair.
const base: LongTailedPairDesign = { tube: findTube('12AU7')!, bplus: 400, ra1: 47e3, ra2: 47e3, rk: 820, tail: { kind: 'resistor', rt: 22e3 }, grid: { kind: 'tap' }, rl: 220e3 };
const solved = (d: LongTailedPairDesign) => {
  const r = solveLongTailedPair(d);
  if (!r.ok) throw new Error(r.message);
  return r;
};

describe('the long-tailed pair', () => {
  // Langford-Smith, the cathode-coupled inverter: with a finite tail the second plate's output falls short of the
  // first's; an infinite tail (a constant current) makes them equal, and a longer tail brings them closer.
  it('a resistor tail leaves plate 2 short of plate 1; a longer tail less so; a constant current balances them', () => {
    const short = solved(base);
    expect(short.gain1).toBeLessThan(0);
    expect(short.gain2).toBeGreaterThan(0);
    expect(short.balance).toBeLessThan(0.95);
    const longer = solved({ ...base, tail: { kind: 'resistor', rt: 100e3, vee: -300 } });
    expect(longer.balance).toBeGreaterThan(short.balance);
    const ccs = solved({ ...base, rk: 0, tail: { kind: 'current', amps: 0.008 }, grid: { kind: 'fixed', volts: 100 } });
    expect(ccs.balance).toBeCloseTo(1, 9);
  });

  // Common practice: trim with the second plate resistor, so that its load (Ra2 with the next grid's resistor) is the
  // first's over the balance.
  it('a larger second plate resistor trims the balance (its loaded value the first\'s over the balance, common practice)', () => {
    const r = solved(base);
    const target = 1 / (1 / base.ra1 + 1 / 220e3) / r.balance;
    const trimmed = solved({ ...base, ra2: 1 / (1 / target - 1 / 220e3) });
    expect(Math.abs(trimmed.balance - 1)).toBeLessThan(0.03);
    expect(Math.abs(trimmed.balance - 1)).toBeLessThan(Math.abs(r.balance - 1) / 3);
  });

  it('the tail carries both tubes (Kirchhoff), the cathodes sit above its top by Rk\'s drop (Ohm\'s law), and the swing ends on a named tube', () => {
    const r = solved(base);
    expectClose(r.tailCurrent, r.ops[0].ia + r.ops[1].ia, { rel: 1e-12 });
    expectClose(r.cathodeVolts - r.tailVolts, r.tailCurrent * 820, { rel: 1e-9 });
    expectClose(r.tailVolts, r.tailCurrent * 22e3, { rel: 1e-6 }, 'tail to ground');
    expect(r.swing.inputPeak).toBeGreaterThan(1);
    expect([1, 2]).toContain(r.swing.tube);
    expect(r.swing.peaks[0]).toBeGreaterThan(r.swing.peaks[1] * 0.9);
  });

  it('lists each triode\'s own findings named by it, and what both say alike once', () => {
    const r = solved({ ...base, ra2: 68e3 });
    const list = bothTriodesFindings(r.findings);
    const dissipation = list.filter((f) => f.kind === 'plate-dissipation').map((f) => f.message);
    expect(dissipation).toHaveLength(2);
    expect(dissipation[0]).toMatch(/^First triode: plate dissipation [\d.]+ W is \d+ % of the 2.75 W rating\.$/);
    expect(dissipation[1]).toMatch(/^Second triode: plate dissipation [\d.]+ W is \d+ % of the 2.75 W rating\.$/);
    // The two triodes share a cathode: its heater–cathode check reads the same for both, and is said once, unnamed.
    const heater = list.filter((f) => f.kind === 'heater-cathode');
    expect(heater).toHaveLength(1);
    expect(heater[0]!.message).toMatch(/^Heater-to-cathode voltage/);
    expect(list.length).toBe(r.findings[0].length + r.findings[1].filter((f) => !r.findings[0].some((g) => g.message === f.message)).length);
  });

  it('names the field of a bad value', () => {
    expect(solveLongTailedPair({ ...base, ra2: -1 })).toMatchObject({ ok: false, field: 'ra2' });
    expect(solveLongTailedPair({ ...base, tail: { kind: 'current', amps: 0.008 } })).toMatchObject({ ok: false, field: 'grid' });
    expect(solveLongTailedPair({ ...base, rk: 0, tail: { kind: 'current', amps: 0.5 }, grid: { kind: 'fixed', volts: 100 } })).toMatchObject({ ok: false, reason: 'grid-current', field: 'tail.amps' });
  });
});
