import { describe, expect, it } from 'vitest';
import { findOutputTube, findTube, solveChain, supplyHum, type ChainInput } from '../../src/index';
import type { PushPullLink } from '../../src/chain/chainTypes';
import { expectClose } from '../helpers/expectClose';
import { chainNetlist, nodes } from './chainNetlist';
import { ngspiceGate, runNgspice } from './ngspice';

// Outside reference: ngspice on whole push-pull amplifiers (chainNetlist: the splitter's grid returned to a held DC
// source, as the divider's decoupling holds it), the input at rest and a 100 Hz ripple of 1 V on the phase
// splitter's B+ alone: the speaker's voltage is the splitter's hum per volt, carried by a matched pair. Asked within
// 3 % in magnitude. The designs are our own (those of the push-pull amplifier checks).
const run = ngspiceGate();

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
    label: 'split-load (12AU7) into an EL84 pair',
    chain: { source: { rsource: 600 }, stages: [input, { kind: 'split-load', tube: findTube('12AU7')!, bplus: 300, ra: 22e3, rk: 22e3, vbias: 90, coupling: { kind: 'capacitor', cc: 100e-9, rg: 1e6 } }, el84] },
  },
  {
    label: 'long-tailed pair (12AU7, trimmed plates) into an EL34 pair',
    chain: { source: { rsource: 600 }, stages: [input, { kind: 'long-tailed-pair', tube: findTube('12AU7')!, bplus: 400, ra: 47e3, ra2: 51e3, rk: 470, rtail: 15e3, vbias: 80, coupling: { kind: 'capacitor', cc: 100e-9, rg: 1e6 } }, el34] },
  },
];

// A long-tailed pair with equal plates is symmetric for its own ripple but for one thing the model leaves out: the
// plate's ripple reaching the first grid through the plate-to-grid capacitance (the second grid is held by its
// capacitor, the first only through the stage before it).
const symmetric: ChainInput = {
  source: { rsource: 600 },
  stages: [input, { kind: 'long-tailed-pair', tube: findTube('12AT7')!, bplus: 300, ra: 39e3, rk: 1000, rtail: 22e3, vbias: 70, coupling: { kind: 'capacitor', cc: 100e-9, rg: 1e6 } }, el84],
};

/** The speaker's voltage per volt of 100 Hz ripple on the splitter's B+ (stage 2), the input at rest, from ngspice. */
function simulated(chain: ChainInput): number {
  const supply = nodes.supply(1).toUpperCase();
  const netlist = chainNetlist(chain, { kind: 'op-ac' })
    .replace('VS src 0 DC 0 AC 1', 'VS src 0 DC 0 AC 0')
    .split('\n')
    .map((line) => (line.startsWith(`${supply} `) ? `${line} AC 1` : line))
    .join('\n')
    .replace('ac lin 1 1000 1000', 'ac lin 1 100 100');
  const sim = runNgspice(netlist);
  return Math.hypot(sim['vr(out)']!, sim['vi(out)']!);
}

describe.runIf(run)('a phase splitter\'s own hum, against ngspice', () => {
  it.each(chains.map((c) => [c.label, c.chain] as const))('%s', (_, chain) => {
    const solved = solveChain(chain);
    if (!solved.ok) throw new Error(solved.message);
    const hum = supplyHum(chain, solved, 50);
    if (!hum.ok) throw new Error(hum.message);
    expect(hum.perVolt[1]).not.toBeNull();
    expectClose(Math.abs(hum.perVolt[1]!), simulated(chain), { rel: 0.03 }, 'the splitter\'s hum per volt at the speaker');
  });

  it('long-tailed pair with equal plates: nothing by the model, about 1 mV per volt by ngspice (through the plate-to-grid capacitance)', () => {
    const solved = solveChain(symmetric);
    if (!solved.ok) throw new Error(solved.message);
    const hum = supplyHum(symmetric, solved, 50);
    if (!hum.ok) throw new Error(hum.message);
    expect(Math.abs(hum.perVolt[1]!)).toBeLessThan(1e-9);
    // What the model leaves out, bounded: under 2 mV at the speaker per volt of ripple on the splitter.
    expect(simulated(symmetric)).toBeLessThan(2e-3);
  });

  // Known miss: the plate-to-grid capacitance's share is left out (the grids are held). Fails when it starts to pass.
  it.fails('known miss: long-tailed pair with equal plates, within 3 % of ngspice', () => {
    const solved = solveChain(symmetric);
    if (!solved.ok) throw new Error(solved.message);
    const hum = supplyHum(symmetric, solved, 50);
    if (!hum.ok) throw new Error(hum.message);
    expectClose(Math.abs(hum.perVolt[1]!), simulated(symmetric), { rel: 0.03 }, 'the splitter\'s hum per volt at the speaker');
  });
});
