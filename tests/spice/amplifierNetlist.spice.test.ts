import { describe, expect, it } from 'vitest';
import { amplifierNetlist, findOutputTube, findTube, globalFeedback, solveChain, type ChainInput } from '../../src/index';
import { expectClose } from '../helpers/expectClose';
import { fourierTable, ngspiceGate, runNgspiceFull } from './ngspice';
import { pushPullAmplifiers } from './pushPullAmplifiers';

// The netlist a builder exports, run as written by ngspice (the outside reference): its operating point against the
// model's within 0.5 % at every plate and cathode, and the transient's fundamental at the output against the model's
// midband gain within 1 % at a small level; with global feedback, the closed loop's gain against the model's within 1 %,
// which also holds the secondary's winding sense to the one that makes the feedback negative. The only change made to
// the file is a `quit 0` at the end of its control block, so a batch run exits cleanly.
const run = ngspiceGate();

const singleEnded: ChainInput = {
  source: { rsource: 600 },
  stages: [
    { kind: 'common-cathode', tube: findTube('12AT7')!, bplus: 300, ra: 56e3, rk: 820, bypassed: false, coupling: { kind: 'capacitor', cc: 470e-9, rg: 680e3 } },
    { kind: 'follower', tube: findTube('12AU7')!, bplus: 300, rk: 27e3, coupling: { kind: 'direct' } },
    {
      kind: 'single-ended-output', tube: findOutputTube('EL34')!, connection: 'ultralinear', bplus: 330, screenVolts: 300, ulTap: 0.43, zPrimary: 3300, rPrimary: 120,
      bias: 'cathode', rk: 330, ck: 220e-6, vg: -20, speakerOhms: 8, thdLimit: 0.05, coupling: { kind: 'capacitor', cc: 330e-9, rg: 270e3 },
    },
  ],
};

function simulate(text: string) {
  const r = runNgspiceFull(text.replace(/^\.endc$/m, 'quit 0\n.endc'));
  return { values: r.values, fundamental: fourierTable(r.output).get(1)!.magnitude };
}

describe.runIf(run)('the exported netlist, run by ngspice as written', () => {
  const cases = [{ label: 'common cathode → follower → single-ended EL34 (ultralinear)', chain: singleEnded }, ...pushPullAmplifiers];
  it.each(cases.map((c) => [c.label, c.chain] as const))('%s: its operating point and midband gain are the model\u2019s', (_label, chain) => {
    const model = solveChain(chain);
    if (!model.ok) throw new Error(model.message);
    const peak = 0.01;
    const net = amplifierNetlist(chain, { title: 'A check\nof two lines', inputPeak: peak });
    if (!net.ok) throw new Error(net.message);
    // The model's figures head the file, as comments; the title on one line.
    expect(net.text.split('\n')[0]).toBe('* A check of two lines: a netlist for ngspice');
    expect(net.text).toMatch(/^\* stage 1 \(common-cathode\): plate [\d.]+ V/m);
    const sim = simulate(net.text);
    model.stages.forEach((st, i) => {
      expectClose(st.pins.plate, sim.values[`p${i}`]!, { rel: 0.005 }, `stage ${i + 1} plate`);
      expectClose(st.pins.cathode, sim.values[`k${i}`]!, { rel: 0.005 }, `stage ${i + 1} cathode`);
    });
    expectClose(Math.abs(model.gain), sim.fundamental / peak, { rel: 0.01 }, 'midband gain');
  }, 120_000);

  it('with global feedback, the secondary is wound for negative feedback and the closed loop\u2019s gain is the model\u2019s', () => {
    const rf = 22e3;
    const ours = globalFeedback(singleEnded, rf);
    if (!ours.ok) throw new Error(ours.message);
    const peak = 0.05;
    const net = amplifierNetlist(singleEnded, { title: 'fed back', inputPeak: peak, feedback: { rf, cf: null } });
    if (!net.ok) throw new Error(net.message);
    expect(net.text).toMatch(/^RF sec k0 /m);
    const sim = simulate(net.text);
    expectClose(ours.closedGain, sim.fundamental / peak, { rel: 0.01 }, 'closed-loop gain');
    // Rf's DC path joins the first cathode's resistor: the operating point is the model's open loop's, as the file's head says.
    ours.open.stages.forEach((st, i) => expectClose(st.pins.plate, sim.values[`p${i}`]!, { rel: 0.005 }, `stage ${i + 1} plate`));
  }, 120_000);
});
