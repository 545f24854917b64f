import { describe, expect, it } from 'vitest';
import {
  capacitorsForCorner, decouplingFilter, droppingResistor, elevationDivider, findTube, heaterElevation, heaterTotals, productionSpread,
  solvedStage, stagePartsList, solveStage,
} from '../../src/index';
import { expectClose } from '../helpers/expectClose';

const au7 = findTube('12AU7')!;
const design = { tube: au7, bplus: 275, ra: 27e3, rk: 1200, rl: 220e3, rg: 1e6, rsource: 1e3, cin: 470e-9, ck: 100e-6, cout: 1e-6 };
const solved = () => {
  const s = solvedStage(design);
  if (!s.ok) throw new Error(s.message);
  return s;
};

describe('parts list', () => {
  it('gives each resistor its preferred value, Joule-law dissipation and a rating of twice the worst case (common practice)', () => {
    const { checked, solution } = solved();
    const { resistors } = stagePartsList(checked, solution, 'E24');
    const ra = resistors.find((r) => r.ref === 'Ra')!;
    expect(ra.preferred).toBe(27e3);
    // Joule's law, P = I²R, at the operating point.
    expectClose(ra.watts, solution.op.ia ** 2 * 27e3, { rel: 1e-12 });
    // Worst case: current +20 % (tube spread), resistor −5 % (E24 tolerance).
    expectClose(ra.wattsWorst, (solution.op.ia * 1.2) ** 2 * 27e3 * 0.95, { rel: 1e-12 });
    expect(ra.ratingWatts).toBeGreaterThanOrEqual(2 * ra.wattsWorst);
    expect(resistors.find((r) => r.ref === 'Rg')!.watts).toBe(0);
  });

  it('rates the output coupling capacitor for the full B+ it sees at switch-on (a cold tube draws no current)', () => {
    const { checked, solution } = solved();
    const cout = stagePartsList(checked, solution, 'E24').capacitors.find((c) => c.ref === 'Cout')!;
    expect(cout.volts).toBeCloseTo(solution.op.va, 9);
    expect(cout.voltsAtSwitchOn).toBe(275);
    expect(cout.ratingVolts).toBe(630); // the next standard rating at or above 2 × 275 V
    expect(cout.polarity).toBe('+ to the plate');
    const ck = stagePartsList(checked, solution, 'E24').capacitors.find((c) => c.ref === 'Ck')!;
    expect(ck.polarity).toBe('+ to the cathode');
    expect(ck.ratingVolts).toBe(16); // 2 × 5.4 V
    const cin = stagePartsList(checked, solution, 'E24').capacitors.find((c) => c.ref === 'Cin')!;
    expect(cin.volts).toBe(0);
    expect(cin.ratingVolts).toBe(63); // a film coupling capacitor, floor 63 V (common practice)
  });

  it('chooses coupling and bypass capacitors for a wanted corner by C = 1/(2πfR) (Horowitz & Hill, §1.7)', () => {
    const { checked, solution } = solved();
    const r = capacitorsForCorner(checked, solution, 5);
    if (!r.ok) throw new Error(r.message);
    expectClose(r.cout!.exact, 1 / (2 * Math.PI * 5 * (solution.zout + 220e3)), { rel: 1e-12 });
    expectClose(r.cin!.exact, 1 / (2 * Math.PI * 5 * (1e3 + 1e6)), { rel: 1e-12 });
    expect(r.cout!.preferred).toBeGreaterThanOrEqual(r.cout!.exact);
    expect(r.cout!.cornerHz).toBeLessThanOrEqual(5);
  });

  it('refuses a corner frequency of 0 with a specific message', () => {
    const { checked, solution } = solved();
    expect(capacitorsForCorner(checked, solution, 0)).toEqual({ ok: false, reason: 'invalid-input', message: 'The corner frequency must be from 0.01 Hz to 1 MHz (got 0 Hz)', field: 'cornerHz' });
  });
});

describe('production spread', () => {
  it('repeats exactly under a fixed seed, and spreads on both sides of the nominal point', () => {
    const { checked, solution } = solved();
    const a = productionSpread(checked, solution, 'E12', { seed: 7 });
    const b = productionSpread(checked, solution, 'E12', { seed: 7 });
    if (!a.ok || !b.ok) throw new Error('spread failed');
    expect(a.samples).toEqual(b.samples);
    const ias = a.samples.map((s) => s.ia);
    expect(Math.min(...ias)).toBeLessThan(solution.op.ia);
    expect(Math.max(...ias)).toBeGreaterThan(solution.op.ia);
    // ±20 % tube current and ±10 % resistors move Ia by several percent each way, not by half.
    expect(Math.max(...ias) / solution.op.ia).toBeGreaterThan(1.03);
    expect(Math.max(...ias) / solution.op.ia).toBeLessThan(1.5);
    const c = productionSpread(checked, solution, 'E12', { seed: 8 });
    expect(c.ok && c.samples).not.toEqual(a.samples);
  });

  it('refuses a negative tolerance with a specific message', () => {
    const { checked, solution } = solved();
    expect(productionSpread(checked, solution, 'E12', { tubeSpread: -0.1 })).toEqual({ ok: false, reason: 'invalid-input', message: "The tube's current spread must be from 0 % to under 100 % (got -10 %)", field: 'tubeSpread' });
  });
});

describe('heater supply', () => {
  it('sizes a dropping resistor by Ohm\'s law and its dissipation by Joule\'s law: two 6.3 V 0.3 A heaters from 12 V DC', () => {
    // Worked example: R = (12 − 6.3)/0.6 = 9.5 Ω → E24 9.1 Ω; the heaters as 6.3/0.6 = 10.5 Ω:
    // I = 12/(10.5 + 9.1) = 0.6122 A, Vh = 6.43 V, P = I²R = 3.41 W → rating 7 W (2× margin, common practice).
    const plan = heaterTotals([{ wiring: 'parallel', volts: 6.3, amps: 0.3 }, { wiring: 'parallel', volts: 6.3, amps: 0.3 }]);
    if (!plan.ok) throw new Error(plan.message);
    expectClose(plan.totalWatts, 3.78, { rel: 1e-12 });
    const r = droppingResistor(plan, 12);
    if (!r.ok) throw new Error(r.message);
    expectClose(r.exact, 9.5, { rel: 1e-12 });
    expect(r.preferred).toBe(9.1);
    expectClose(r.heaterVolts, 6.4286, { rel: 1e-4 });
    expectClose(r.watts, 3.4106, { rel: 1e-3 });
    expect(r.ratingWatts).toBe(7);
    expect(r.warning).toBeNull();
  });

  it('refuses a supply below the heater voltage with a specific message', () => {
    const plan = heaterTotals([{ wiring: 'series', volts: 12.6, amps: 0.15 }]);
    if (!plan.ok) throw new Error(plan.message);
    expect(droppingResistor(plan, 6.3)).toEqual({ ok: false, reason: 'supply-too-low', message: 'A 6.3 V supply is below the 12.6 V the heaters need: no resistor can raise it', field: 'supply' });
  });

  it('with the nearest preferred value the heaters stay within ±10 % (common practice), so no warning', () => {
    const plan = heaterTotals([{ wiring: 'single', volts: 6.3, amps: 0.3 }]);
    if (!plan.ok) throw new Error(plan.message);
    const r = droppingResistor(plan, 7, 'E12');
    expect(r.ok && r.warning).toBeNull();
  });

  it('finds the heater elevation that keeps a follower at 155 V and a gain stage at 5 V inside 180 V and 200 V', () => {
    const r = heaterElevation([{ name: 'stage 1', vk: 5, maxVhk: 200 }, { name: 'follower', vk: 200, maxVhk: 180 }]);
    if (!r.ok) throw new Error(r.message);
    expect(r.groundedOk).toBe(false);
    expect(r.lo).toBe(20);
    expect(r.hi).toBe(205);
    expect(r.suggested).toBeGreaterThanOrEqual(20);
    for (const [vk, max] of [[5, 200], [200, 180]] as const) expect(Math.abs(vk - r.suggested)).toBeLessThanOrEqual(max);
  });

  it('heeds a polarity rated apart: a 12AU7 gain stage at 5 V allows the heater only 100 V above its cathode (Tung-Sol 12AU7, 1962)', () => {
    const r = heaterElevation([{ name: 'stage 1', vk: 5, maxVhk: 200, maxVhkCathodeNegative: 100 }, { name: 'follower', vk: 200, maxVhk: 180 }]);
    if (!r.ok) throw new Error(r.message);
    expect(r.lo).toBe(20);
    expect(r.hi).toBe(105);
  });
});

describe('heater elevation divider', () => {
  // Hand calculation (Ohm's law): Rh2 220 kΩ (common practice: a few hundred kΩ); Rh1 = 220k · (275 − 60) / 60 = 788 kΩ,
  // nearest E24 (IEC 60063) 820 kΩ; the heaters sit at 275 · 220 / 1040 = 58.2 V and the divider draws 275 V / 1.04 MΩ = 0.264 mA;
  // Ch for a 2 Hz corner with Rh1 ∥ Rh2 = 173.5 kΩ is 1 / (2π · 173.5k · 2) = 0.459 µF, next E12 value up 0.47 µF.
  it('holds the heaters at 58.2 V from a 275 V node with 820 kΩ over 220 kΩ, decoupled by 0.47 µF', () => {
    const r = elevationDivider(275, 60, 'E24');
    if (!r.ok) throw new Error(r.message);
    expect(r.resistors.map((x) => [x.ref, x.preferred])).toEqual([['Rh1', 820e3], ['Rh2', 220e3]]);
    expectClose(r.volts, 58.17, { abs: 0.01 });
    expectClose(r.amps, 0.2644e-3, { rel: 1e-3 });
    expect(r.capacitor.ref).toBe('Ch');
    expectClose(r.capacitor.value!, 0.47e-6, { rel: 1e-9 });
    // Twice what it sees (common practice): 120 V, so the next standard rating, 160 V.
    expect(r.capacitor.ratingVolts).toBe(160);
    expect(r.resistors[0]!.role).toContain('the heaters near 60 V');
  });

  it('refuses an elevation the node cannot give, naming the field', () => {
    const r = elevationDivider(100, 95);
    expect(r.ok).toBe(false);
    expect(!r.ok && r.field).toBe('elevation');
    expect(!r.ok && r.message).toContain('higher node');
    expect(elevationDivider(Number.NaN, 60).ok).toBe(false);
    expect(elevationDivider(275, 0).ok).toBe(false);
  });
});

describe('B+ decoupling filter', () => {
  it('drops by I·R with the current the stage draws at its own B+, and attenuates ripple as 1/|1 + jωRC| (first order)', () => {
    const current = (b: number) => {
      const s = solveStage({ ...design, bplus: b });
      return s.ok ? s.op.ia : null;
    };
    const r = decouplingFilter(300, 4.7e3, 47e-6, current);
    if (!r.ok) throw new Error(r.message);
    expectClose(r.stageBplus, 300 - 4.7e3 * current(r.stageBplus)!, { rel: 1e-9 });
    // First-order RC low-pass (Horowitz & Hill, The Art of Electronics, 3rd ed., §1.7).
    expectClose(r.ripple100Db, 20 * Math.log10(1 / Math.hypot(1, 2 * Math.PI * 100 * 4.7e3 * 47e-6)), { rel: 1e-12 });
    expect(r.ripple120Db).toBeLessThan(r.ripple100Db);
  });
});
