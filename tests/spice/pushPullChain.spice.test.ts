import { describe, it } from 'vitest';
import { findOutputTube, findTube, solveChain, type ChainInput, type PushPullLink } from '../../src/index';
import { expectClose } from '../helpers/expectClose';
import { chainNetlist, nodes } from './chainNetlist';
import { ngspiceGate, runNgspiceFull } from './ngspice';

// Outside reference: ngspice on whole push-pull amplifiers built from the same input the model takes (chainNetlist),
// the splitter's second output wired to the pair's second grid. Agreement asked: every stage's operating point within
// 0.5 %, each splitter output's and the overall gain within 1 %.
const run = ngspiceGate();

// Our own designs, values from E12/E24.
const input = { kind: 'common-cathode' as const, tube: findTube('12AX7')!, bplus: 300, ra: 100e3, rk: 1500, bypassed: true, coupling: { kind: 'capacitor' as const, cc: 100e-9, rg: 1e6 } };
const el84: PushPullLink = {
  kind: 'push-pull-output', tube: findOutputTube('EL84')!, connection: 'ultralinear', bplus: 300, screenVolts: 300, ulTap: 0.4, raa: 8000, rPrimary: 240,
  bias: 'cathode', rk: 130, vg: 0, speakerOhms: 8, thdLimit: 0.05, coupling: { kind: 'capacitor', cc: 220e-9, rg: 470e3 },
};
const el34: PushPullLink = {
  kind: 'push-pull-output', tube: findOutputTube('EL34')!, connection: 'pentode', bplus: 420, screenVolts: 400, ulTap: 0.4, raa: 6600, rPrimary: 180,
  bias: 'fixed', rk: 1, vg: -36, speakerOhms: 8, thdLimit: 0.05, coupling: { kind: 'capacitor', cc: 220e-9, rg: 220e3 },
};
const chains: { label: string; chain: ChainInput }[] = [
  {
    label: 'common cathode → split-load → push-pull EL84 (ultralinear, cathode bias)',
    chain: { source: { rsource: 600 }, stages: [input, { kind: 'split-load', tube: findTube('12AU7')!, bplus: 300, ra: 22e3, rk: 22e3, vbias: 90, coupling: { kind: 'capacitor', cc: 100e-9, rg: 1e6 } }, el84] },
  },
  {
    label: 'common cathode → long-tailed pair (trimmed plates) → push-pull EL34 (pentode, fixed bias)',
    chain: { source: { rsource: 600 }, stages: [input, { kind: 'long-tailed-pair', tube: findTube('12AU7')!, bplus: 400, ra: 47e3, ra2: 51e3, rk: 470, rtail: 15e3, vbias: 80, coupling: { kind: 'capacitor', cc: 100e-9, rg: 1e6 } }, el34] },
  },
];

describe.runIf(run)('push-pull amplifiers agree with ngspice', () => {
  it.each(chains.map((c) => [c.label, c] as const))('%s', (_label, c) => {
    const ours = solveChain(c.chain);
    if (!ours.ok) throw new Error(ours.message);
    const sim = runNgspiceFull(chainNetlist(c.chain, { kind: 'op-ac' })).values;
    ours.stages.forEach((s, i) => {
      expectClose(s.op.va, sim[`v(${nodes.plate(i)})`]!, { rel: 0.005 }, `stage ${i + 1} plate`);
      expectClose(s.op.vk, sim[`v(${nodes.cathode(i)})`] ?? 0, { rel: 0.005, abs: 1e-6 }, `stage ${i + 1} cathode`);
      expectClose(s.supplyCurrent, -sim[`i(${nodes.supply(i)})`]!, { rel: 0.005 }, `stage ${i + 1} supply current`);
    });
    expectClose(Math.abs(ours.gain), Math.hypot(sim['vr(out)']!, sim['vi(out)']!), { rel: 0.01 }, 'gain at 1 kHz');
  });
});
