import { describe, expect, it } from 'vitest';
import { findTube, solveFollower, solveStage, type StageSolution } from '../../src/index';
import { expectClose } from '../helpers/expectClose';
import { chainNetlist, stageNetlist, type SpiceStage } from './netlists';
import { ngspiceGate, runNgspice } from './ngspice';

// Outside reference: ngspice (Debian's package), a general-purpose circuit
// simulator, solving the same circuits with Koren's law as a behavioural
// source. Agreement asked: operating point within 0.5 %, gain within 1 %,
// output impedance within 2 %.
const run = ngspiceGate();

const designs: (Omit<SpiceStage, 'params'> & { id: string; label: string })[] = [
  { id: '12AX7', label: 'high-mu, bypassed, no load', bplus: 250, ra: 100e3, rk: 1500, bypassed: true, rl: Infinity, vbias: 0 },
  { id: '12AX7', label: 'high-mu, unbypassed, 470k load', bplus: 300, ra: 220e3, rk: 2700, bypassed: false, rl: 470e3, vbias: 0 },
  { id: '12AU7', label: 'medium-mu, bypassed, 100k load', bplus: 250, ra: 22e3, rk: 1000, bypassed: true, rl: 100e3, vbias: 0 },
  { id: '12AU7', label: 'medium-mu, unbypassed, no load', bplus: 300, ra: 47e3, rk: 2200, bypassed: false, rl: Infinity, vbias: 0 },
  { id: '6SN7', label: 'medium-mu octal, bypassed, 220k load', bplus: 350, ra: 33e3, rk: 1200, bypassed: true, rl: 220e3, vbias: 0 },
  { id: '6DJ8', label: 'frame grid, unbypassed, 47k load', bplus: 150, ra: 8.2e3, rk: 220, bypassed: false, rl: 47e3, vbias: 0 },
  { id: '300B', label: 'power triode, bypassed cathode bias', bplus: 400, ra: 2.5e3, rk: 820, bypassed: true, rl: Infinity, vbias: 0 },
  { id: '2A3', label: 'power triode, fixed bias', bplus: 300, ra: 1e3, rk: 0, bypassed: true, rl: 10e3, vbias: -40 },
];

const solved = (d: (typeof designs)[number]) => {
  const r = solveStage({ tube: findTube(d.id)!, ...d });
  if (!r.ok) throw new Error(`${d.id}: ${r.message}`);
  return r as StageSolution;
};

describe.runIf(run)('common-cathode stages agree with ngspice', () => {
  it.each(designs.map((d) => [`${d.id} ${d.label}`, d] as const))('%s', (_label, d) => {
    const params = findTube(d.id)!.model.params;
    const s = solved(d);
    const sim = runNgspice(stageNetlist({ ...d, params }, 'gain'));
    expectClose(s.op.va, sim['v(plate)']!, { rel: 0.005 }, 'Va');
    expectClose(s.op.vk, sim['v(cathode)']!, { rel: 0.005, abs: 1e-9 }, 'Vk');
    expectClose(s.op.ia, -sim['i(vb)']!, { rel: 0.005 }, 'Ia');
    // The simulator's 1 kHz gain is a complex number; at midband it is real and negative.
    expectClose(s.gain, sim['vr(out)']!, { rel: 0.01 }, 'gain');
    expect(Math.abs(sim['vi(out)']!)).toBeLessThan(Math.abs(sim['vr(out)']!) * 1e-3);
    const z = runNgspice(stageNetlist({ ...d, params }, 'zout'));
    expectClose(s.zout, z['vr(plate)']!, { rel: 0.02 }, 'zout');
  });
});

describe.runIf(run)('gain stage into a direct-coupled cathode follower agrees with ngspice', () => {
  const chains = [
    { stage: designs[0]!, follower: { id: '12AX7', bplus: 250, rk: 100e3 } },
    { stage: designs[2]!, follower: { id: '12AU7', bplus: 300, rk: 22e3 } },
  ];
  it.each(chains.map((c) => [`${c.stage.id} into ${c.follower.id} follower`, c] as const))('%s', (_label, c) => {
    // In the chain the follower's grid is stage 1's only load: no RL.
    const s = solved({ ...c.stage, rl: Infinity });
    const tube2 = findTube(c.follower.id)!;
    // Stage 1 sees the follower's grid as an open circuit at DC and at 1 kHz (grid current is zero below 0 V).
    const f = solveFollower({ tube: tube2, bplus: c.follower.bplus, vgrid: s.op.va, rk: c.follower.rk });
    if (!f.ok) throw new Error(f.message);
    const netParams = { stage: { ...c.stage, params: findTube(c.stage.id)!.model.params }, follower: { ...c.follower, params: tube2.model.params } };
    const sim = runNgspice(chainNetlist(netParams, 'gain'));
    expectClose(f.op.vk, sim['v(out)']!, { rel: 0.005 }, 'follower cathode');
    expectClose(f.op.ia, -sim['i(vb2)']!, { rel: 0.005 }, 'follower current');
    expectClose(s.gain * f.gain, sim['vr(out)']!, { rel: 0.01 }, 'chain gain');
    const z = runNgspice(chainNetlist(netParams, 'zout'));
    expectClose(f.zout, z['vr(out)']!, { rel: 0.02 }, 'follower zout');
  });
});
