import { describe, expect, it } from 'vitest';
import { findTube, solveCathodyne, type CathodyneDesign } from '../../src/index';
import { expectClose } from '../helpers/expectClose';
import { ngspiceGate, runNgspiceFull } from './ngspice';
import { cathodyneNetlist } from './cathodyneNetlist';

// Outside reference: ngspice on the same split-load stage (cathodyneNetlist). Asked: the operating point to 0.1 %,
// both outputs' gain to 0.5 % at 1 kHz and with the loads' capacitance at 50 kHz, each output's impedance to 0.5 %.
const run = ngspiceGate();

// Our own splitters.
const cases: { label: string; d: CathodyneDesign }[] = [
  { label: '12AU7, self-biased from the tap, into 470 kΩ and 50 pF', d: { tube: findTube('12AU7')!, bplus: 350, ra: 22e3, rk: 21e3, rb: 1e3, grid: { kind: 'tap' }, rl: 470e3, cl: 50e-12 } },
  { label: '6SN7, grid direct-coupled at 110 V, unequal loads (Ra 47k, Rk 47k with 1k5 bias)', d: { tube: findTube('6SN7')!, bplus: 400, ra: 47e3, rk: 47e3, rb: 1.5e3, grid: { kind: 'fixed', volts: 110 }, rl: 220e3, cl: 100e-12 } },
];

const at = (values: Record<string, number>, node: string) => [values[`vr(${node})`]!, values[`vi(${node})`]!] as const;
const mag = (c: readonly [number, number]) => Math.hypot(c[0], c[1]);

describe.runIf(run)('split-load splitters agree with ngspice', () => {
  it.each(cases.map((c) => [c.label, c.d] as const))('%s', (_label, d) => {
    const ours = solveCathodyne(d);
    if (!ours.ok) throw new Error(ours.message);
    const gain = runNgspiceFull(cathodyneNetlist(d, 'gain', 1e3)).values;
    expectClose(ours.op.va, gain['v(plate)']!, { rel: 1e-3 }, 'plate');
    expectClose(ours.op.vk, gain['v(cathode)']!, { rel: 1e-3 }, 'cathode');
    const vg = mag(at(gain, 'grid'));
    expectClose(ours.gainPlate, at(gain, 'plate')[0] / vg, { rel: 5e-3 }, 'plate gain');
    expectClose(ours.gainCathode, at(gain, 'cathode')[0] / vg, { rel: 5e-3 }, 'cathode gain');
    const hf = runNgspiceFull(cathodyneNetlist(d, 'gain', 50e3)).values;
    const b = ours.balanceAt.find((x) => x.hz === 50e3)!;
    expectClose(b.ratio, mag(at(hf, 'cathode')) / mag(at(hf, 'plate')), { rel: 5e-3 }, 'balance at 50 kHz');
    // The probe sees the output's impedance in parallel with its own load.
    const withLoad = (z: number) => 1 / (1 / z + 1 / (d.rl ?? Infinity));
    expectClose(withLoad(ours.zPlate), mag(at(runNgspiceFull(cathodyneNetlist(d, 'plate', 1e3)).values, 'plate')), { rel: 5e-3 }, 'plate impedance');
    expectClose(withLoad(ours.zCathode), mag(at(runNgspiceFull(cathodyneNetlist(d, 'cathode', 1e3)).values, 'cathode')), { rel: 5e-3 }, 'cathode impedance');
    expect(ours.zPlate / ours.zCathode).toBeGreaterThan(5);
  }, 60_000);
});
