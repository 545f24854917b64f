import { describe, expect, it } from 'vitest';
import { findTube, solveLongTailedPair, type LongTailedPairDesign } from '../../src/index';
import { expectClose } from '../helpers/expectClose';
import { ngspiceGate, runNgspiceFull } from './ngspice';
import { longTailedPairNetlist } from './longTailedPairNetlist';

// Outside reference: ngspice on the same pair (longTailedPairNetlist). Asked: the operating point to 0.1 %, both
// plates' gain to 0.5 % at 1 kHz, the balance with the loads' capacitance at 50 kHz and each plate's impedance to 0.5 %.
const run = ngspiceGate();

// Our own pairs.
const cases: { label: string; d: LongTailedPairDesign }[] = [
  { label: '12AU7, 22k tail to ground, grids to the tail, into 220k and 50 pF', d: { tube: findTube('12AU7')!, bplus: 400, ra1: 47e3, ra2: 47e3, rk: 820, tail: { kind: 'resistor', rt: 22e3 }, grid: { kind: 'tap' }, rl: 220e3, cl: 50e-12 } },
  { label: '12AT7, 47k tail to −150 V, grids at 0 V, plate resistors trimmed (82k and 91k)', d: { tube: findTube('12AT7')!, bplus: 350, ra1: 82e3, ra2: 91e3, rk: 0, tail: { kind: 'resistor', rt: 47e3, vee: -150 }, grid: { kind: 'fixed', volts: 0 }, rl: 470e3, cl: 30e-12 } },
  { label: '6SN7, 8 mA constant-current tail, grids at 100 V', d: { tube: findTube('6SN7')!, bplus: 400, ra1: 47e3, ra2: 47e3, rk: 0, tail: { kind: 'current', amps: 0.008 }, grid: { kind: 'fixed', volts: 100 }, rl: 220e3, cl: 100e-12 } },
];

const at = (values: Record<string, number>, node: string) => [values[`vr(${node})`]!, values[`vi(${node})`]!] as const;
const mag = (c: readonly [number, number]) => Math.hypot(c[0], c[1]);

describe.runIf(run)('long-tailed pairs agree with ngspice', () => {
  it.each(cases.map((c) => [c.label, c.d] as const))('%s', (_label, d) => {
    const ours = solveLongTailedPair(d);
    if (!ours.ok) throw new Error(ours.message);
    const sim = runNgspiceFull(longTailedPairNetlist(d, 'gain', 1e3)).values;
    expectClose(ours.ops[0].va, sim['v(p1)']!, { rel: 1e-3 }, 'plate 1');
    expectClose(ours.ops[1].va, sim['v(p2)']!, { rel: 1e-3 }, 'plate 2');
    expectClose(ours.cathodeVolts, sim['v(k)']!, { rel: 1e-3, abs: 1e-3 }, 'cathodes');
    const vg = mag(at(sim, 'g1'));
    expectClose(ours.gain1, at(sim, 'p1')[0] / vg, { rel: 5e-3 }, 'gain to plate 1');
    expectClose(ours.gain2, at(sim, 'p2')[0] / vg, { rel: 5e-3 }, 'gain to plate 2');
    const hf = runNgspiceFull(longTailedPairNetlist(d, 'gain', 50e3)).values;
    expectClose(ours.balanceAt.find((x) => x.hz === 50e3)!.ratio, mag(at(hf, 'p2')) / mag(at(hf, 'p1')), { rel: 5e-3 }, 'balance at 50 kHz');
    const withLoad = (z: number) => 1 / (1 / z + 1 / (d.rl ?? Infinity));
    expectClose(withLoad(ours.zout[0]), mag(at(runNgspiceFull(longTailedPairNetlist(d, 'p1', 1e3)).values, 'p1')), { rel: 5e-3 }, 'plate 1 impedance');
    expectClose(withLoad(ours.zout[1]), mag(at(runNgspiceFull(longTailedPairNetlist(d, 'p2', 1e3)).values, 'p2')), { rel: 5e-3 }, 'plate 2 impedance');
    expect(ours.balance).toBeGreaterThan(0.5);
  }, 60_000);
});
