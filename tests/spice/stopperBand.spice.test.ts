import { describe, expect, it } from 'vitest';
import { findOutputTube, findTube, solveChain, type ChainInput } from '../../src/index';
import { expectClose } from '../helpers/expectClose';
import { chainNetlist, nodes } from '../../src/netlist/chainNetlist';
import { ngspiceGate, runNgspiceFull } from './ngspice';
import { simulatedCorners } from './simulatedCorners';

// Outside reference: ngspice (Debian's package) on whole amplifiers whose followers and splitters (a split-load, a
// long-tailed pair's driven grid) carry grid stoppers, built from the same input the model takes (chainNetlist: the stopper between what feeds the grid and the
// grid, the tube's capacitances at its pins). Asked, as of every chain: each operating point within 0.5 %, the gain at
// 1 kHz within 1 %, the −3 dB points within 3 %. The stoppers are large enough to move the top of each band by more
// than twice that (checked below against the same amplifier without them), so a model that left them out fails.
const run = ngspiceGate();

const ax7 = findTube('12AX7')!;
const au7 = findTube('12AU7')!;
const at7 = findTube('12AT7')!;

// Our own designs, values from E12/E24.
const cases: { label: string; chain: (stopper: number) => ChainInput }[] = [
  {
    label: '12AX7 → direct-coupled 12AU7 follower (100k stopper) → 12AT7 → capacitor-coupled 12AU7 follower (47k stopper), into 10k',
    chain: (r) => ({
      source: { rsource: 600 },
      stages: [
        { kind: 'common-cathode', tube: ax7, bplus: 300, ra: 220e3, rk: 1500, bypassed: true, ck: 47e-6, coupling: { kind: 'capacitor', cc: 47e-9, rg: 1e6 } },
        { kind: 'follower', tube: au7, bplus: 300, rk: 47e3, rstopper: r, coupling: { kind: 'direct' } },
        { kind: 'common-cathode', tube: at7, bplus: 300, ra: 47e3, rk: 1000, bypassed: true, ck: 47e-6, coupling: { kind: 'capacitor', cc: 100e-9, rg: 470e3 } },
        { kind: 'follower', tube: au7, bplus: 300, rk: 22e3, vbias: 120, rstopper: r * 0.47, coupling: { kind: 'capacitor', cc: 100e-9, rg: 1e6 } },
      ],
      load: { rl: 10e3, cc: 1e-6 },
    }),
  },
  {
    label: '12AX7 → 12AU7 split-load (100k stopper) → push-pull EL84, ultralinear',
    chain: (r) => ({
      source: { rsource: 600 },
      stages: [
        { kind: 'common-cathode', tube: ax7, bplus: 300, ra: 220e3, rk: 1500, bypassed: false, coupling: { kind: 'capacitor', cc: 47e-9, rg: 1e6 } },
        { kind: 'split-load', tube: au7, bplus: 300, ra: 22e3, rk: 22e3, vbias: 90, rstopper: r, coupling: { kind: 'capacitor', cc: 100e-9, rg: 1e6 } },
        {
          kind: 'push-pull-output', tube: findOutputTube('EL84')!, connection: 'ultralinear', bplus: 300, screenVolts: 300, ulTap: 0.4, raa: 8000, rPrimary: 240,
          bias: 'cathode', rk: 130, vg: 0, speakerOhms: 8, thdLimit: 0.05, coupling: { kind: 'capacitor', cc: 100e-9, rg: 470e3 },
        },
      ],
    }),
  },
  {
    label: '12AX7 → 12AU7 long-tailed pair (100k stopper at its first grid) → push-pull EL34, pentode, fixed bias',
    chain: (r) => ({
      source: { rsource: 600 },
      stages: [
        { kind: 'common-cathode', tube: ax7, bplus: 300, ra: 220e3, rk: 1500, bypassed: false, coupling: { kind: 'capacitor', cc: 47e-9, rg: 1e6 } },
        { kind: 'long-tailed-pair', tube: au7, bplus: 400, ra: 47e3, ra2: 51e3, rk: 470, rtail: 15e3, vbias: 80, rstopper: r, coupling: { kind: 'capacitor', cc: 100e-9, rg: 1e6 } },
        {
          kind: 'push-pull-output', tube: findOutputTube('EL34')!, connection: 'pentode', bplus: 420, screenVolts: 400, ulTap: 0.4, raa: 6600, rPrimary: 180,
          bias: 'fixed', rk: 1, vg: -36, speakerOhms: 8, thdLimit: 0.05, coupling: { kind: 'capacitor', cc: 220e-9, rg: 220e3 },
        },
      ],
    }),
  },
];

describe.runIf(run)('grid stoppers on followers and splitters agree with ngspice', () => {
  it.each(cases.map((c) => [c.label, c] as const))('%s', { timeout: 120_000 }, (_label, c) => {
    const chain = c.chain(100e3);
    const ours = solveChain(chain);
    const bare = solveChain(c.chain(0));
    if (!ours.ok || !bare.ok) throw new Error('the designs solve');
    const sim = runNgspiceFull(chainNetlist(chain, { kind: 'op-ac' })).values;
    ours.stages.forEach((s, i) => {
      expectClose(s.op.va, sim[`v(${nodes.plate(i)})`]!, { rel: 0.005 }, `stage ${i + 1} plate`);
      expectClose(s.op.vk, sim[`v(${nodes.cathode(i)})`] ?? 0, { rel: 0.005, abs: 1e-6 }, `stage ${i + 1} cathode`);
    });
    expectClose(Math.abs(ours.gain), Math.hypot(sim['vr(out)']!, sim['vi(out)']!), { rel: 0.01 }, 'gain at 1 kHz');
    const corners = simulatedCorners(runNgspiceFull(chainNetlist(chain, { kind: 'sweep' })).data, 1000);
    expectClose(ours.lowHz!, corners.low!, { rel: 0.03 }, 'low −3 dB');
    expectClose(ours.highHz!, corners.high!, { rel: 0.03 }, 'high −3 dB');
    // The check can tell: without its stoppers the same amplifier's top is more than 6 % higher.
    expect(bare.highHz! / corners.high!).toBeGreaterThan(1.06);
  });
});
