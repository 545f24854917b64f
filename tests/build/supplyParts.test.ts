import { describe, expect, it } from 'vitest';
import { bleederFor, solveSupply, supplyPartsList, type SupplyDesign } from '../../src/index';
import { expectClose } from '../helpers/expectClose';

// Our own supply: 250 V a side, full wave, 47 µF reservoir, an R–C section and an L–C section.
const base: SupplyDesign = {
  mainsHz: 50, secondaryRms: 250, windingOhms: 40, rectifier: { kind: 'silicon-full-wave' },
  input: { kind: 'capacitor', c: 47e-6 },
  sections: [{ kind: 'rc', r: 1000, c: 47e-6 }, { kind: 'lc', l: 5, rdc: 120, c: 22e-6 }],
  loads: [0.06, 0.01, 0.004],
};
const solvedOf = (d: SupplyDesign) => {
  const supply = solveSupply(d);
  if (!supply.ok) throw new Error(supply.message);
  return { supply, loads: d.loads, atFullPower: null };
};
const listed = (d: SupplyDesign, full: readonly number[] | null = null) => {
  const solved = solvedOf(d);
  const r = supplyPartsList(d, { ...solved, atFullPower: full ? { loads: full } : null });
  if (!r.ok) throw new Error(r.message);
  return { parts: r, solved };
};

describe("the supply's parts to order", () => {
  it('a filter resistor carries every node after it (Kirchhoff\'s current law) and dissipates I²R (Joule\'s law)', () => {
    const { parts } = listed(base);
    const rf2 = parts.resistors.find((r) => r.ref === 'Rf2')!;
    expectClose(rf2.watts, (0.01 + 0.004) ** 2 * 1000, { rel: 1e-12 }, 'Rf2 dissipation');
    // Rated as every resistor on the build sheet: twice the worst case (current +20 %, resistor 5 % low: 0.268 W), rounded up to a stocked rating (common practice).
    expectClose(rf2.wattsWorst, 0.014 ** 2 * 1.44 * 1000 * 0.95, { rel: 1e-12 }, 'Rf2 worst case');
    expect(rf2.ratingWatts).toBe(1);
    const lf3 = parts.chokes.find((c) => c.ref === 'Lf3')!;
    expectClose(lf3.amps, 0.004, { rel: 1e-12 }, 'Lf3 current');
    expect(lf3.henries).toBe(5);
  });

  it('at full power a resistor is rated for the larger current', () => {
    const { parts } = listed(base, [0.06, 0.03, 0.004]);
    expectClose(parts.resistors.find((r) => r.ref === 'Rf2')!.watts, 0.034 ** 2 * 1000, { rel: 1e-12 }, 'Rf2 at full power');
  });

  // The capacitors charge to the secondary's peak when nothing draws current (the tubes cold): 250·√2 = 353.6 V;
  // the mains 10 % high (IEC 60038: 230 V ±10 %) makes 389 V, so the next standard rating is 400 V (IEC 60384's kind of series).
  it('every filter capacitor is rated for the cold voltage with the mains 10 % high (IEC 60038)', () => {
    const { parts, solved } = listed(base);
    expect(parts.capacitors.map((c) => c.ref)).toEqual(['Cf1', 'Cf2', 'Cf3']);
    for (const c of parts.capacitors) {
      expect(c.ratingVolts).toBe(400);
      expectClose(c.voltsAtSwitchOn, 250 * Math.SQRT2, { rel: 1e-9 }, 'switch-on');
      expect(c.note).toBeNull();
    }
    expectClose(parts.capacitors[0]!.rippleAmps, solved.supply.nodes[0]!.capacitorRippleRms, { rel: 1e-12 });
    expect(parts.capacitors[0]!.role).toMatch(/reservoir/);
  });

  it('past 500 V the capacitors are named for two in series (common practice)', () => {
    const { parts } = listed({ ...base, secondaryRms: 350 });
    // 350·√2·1.1 = 544 V: above every usual electrolytic.
    expect(parts.capacitors[0]!.ratingVolts).toBe(630);
    expect(parts.capacitors[0]!.note).toMatch(/two in series/);
  });

  // Peak inverse voltage: a centre-tapped full-wave rectifier's idle diode stands both halves' peaks, 2·Vpk;
  // a bridge's diodes stand one peak (the textbook relations of the two circuits).
  it('the diodes stand twice the peak in a centre-tapped full wave and once in a bridge; 1N400x ratings from their data sheet', () => {
    const ct = listed(base).parts.rectifier;
    expectClose(ct.piv, 2 * 250 * Math.SQRT2, { rel: 1e-9 }, 'full-wave PIV');
    // 707 V, 778 V with the mains high: the 800 V part (1N4006).
    expect(ct.diodeVolts).toBe(800);
    const bridge = listed({ ...base, rectifier: { kind: 'silicon-bridge' } }).parts.rectifier;
    expectClose(bridge.piv, bridge.pivHighMains / 1.1, { rel: 1e-12 });
    expectClose(bridge.piv, 250 * Math.SQRT2, { rel: 1e-9 }, 'bridge PIV');
    expect(bridge.diodeVolts).toBe(400);
    expect(listed({ ...base, secondaryRms: 400 }).parts.rectifier.diodeVolts).toBeNull();
    // Half wave: with the reservoir charged to the peak, the diode stands it plus the winding's opposite peak, 2·Vpk.
    const half = listed({ ...base, rectifier: { kind: 'silicon-half-wave' } }).parts.rectifier;
    expectClose(half.piv, 2 * 250 * Math.SQRT2, { rel: 1e-9 }, 'half-wave PIV');
  });

  it('an input choke carries the whole supply\'s current', () => {
    const d: SupplyDesign = { ...base, input: { kind: 'choke', l: 10, rdc: 150, c: 47e-6 } };
    const { parts } = listed(d);
    expect(parts.chokes[0]!.ref).toBe('Lf1');
    expectClose(parts.chokes[0]!.amps, 0.074, { rel: 1e-12 }, 'input choke current');
  });

  it('the bleeder is listed with the power it needs cold', () => {
    const solved = solvedOf(base);
    const b = bleederFor(116e-6, solved.supply.noLoadVolts, solved.supply.nodes[0]!.dc);
    if (!b.ok || !b.needed) throw new Error('a bleeder is needed');
    const r = supplyPartsList(base, solved, b);
    if (!r.ok) throw new Error(r.message);
    const line = r.resistors.find((x) => x.ref === 'Rbleed')!;
    expect(line.preferred).toBe(b.ohms);
    expect(line.ratingWatts).toBe(b.partWatts);
    expectClose(line.watts, solved.supply.nodes[0]!.dc ** 2 / b.ohms, { rel: 1e-12 }, 'running');
    // A bleeder of next to nothing is a slip, not a part: refused (found by the robustness run: its power came out infinite).
    expect(supplyPartsList(base, solved, { ...b, ohms: 1e-300 })).toMatchObject({ ok: false, message: expect.stringMatching(/bleeder/) });
  });

  it('a solution that does not match the design is a typed failure, not a throw', () => {
    const solved = solvedOf(base);
    const r = supplyPartsList({ ...base, sections: base.sections.slice(0, 1) }, solved);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toMatch(/one voltage and one load per node \(2\)/);
  });
});
