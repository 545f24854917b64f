import { describe, it } from 'vitest';
import { solveChain } from '../../src/index';
import { expectClose } from '../helpers/expectClose';
import { chainNetlist, nodes } from '../../src/netlist/chainNetlist';
import { ngspiceGate, runNgspiceFull } from './ngspice';
import { pushPullAmplifiers } from './pushPullAmplifiers';

// Outside reference: ngspice on whole push-pull amplifiers built from the same input the model takes (chainNetlist),
// the splitter's second output wired to the pair's second grid. Agreement asked: every stage's operating point within
// 0.5 %, each splitter output's and the overall gain within 1 %.
const run = ngspiceGate();

const chains = pushPullAmplifiers;

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
