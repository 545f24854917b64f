import { describe, expect, it } from 'vitest';
import { amplifierAtLevel, findOutputTube, findTube, solveChain, type ChainInput } from '../../src/index';
import { expectClose } from '../helpers/expectClose';
import { chainNetlist } from '../../src/netlist/chainNetlist';
import { fourierTable, ngspiceGate, runNgspiceFull } from './ngspice';

// Outside reference: ngspice on the whole amplifier with every grid drawing current by the model's law
// (behavioural sources, see chainNetlist), driven past the chain's clean limit so the stage that clips first
// is in grid current, fed by the stage before it. Agreement asked (#18): fundamental within 1 %, H2 and H3
// within 1 dB. Each case fails without the grid's loop (measured: the fundamental 2 to 6 % high, H2 up to 7 dB off).
// The runs are 5 ms long, so the output stage's magnetising current and every coupling capacitor keep their operating
// point's. A run long enough to settle the first (as tests/spice/chain.spice.test.ts does inside the clean limit) also
// charges the driven grid's capacitor through its grid current, a shift of bias the model does not follow (measured:
// the EL84's H2 then 2.7 dB off); the model's settled figures for that EL84 differ from its idle-held ones by 0.4 % in
// the input and 0.1 dB in H2, 0.3 dB in H3, well inside what is asked.
const run = ngspiceGate();
/**
 * An output transformer's transient takes ngspice 3 to 9 s here, past the
 * default 5 s on a loaded machine: a timeout would also make the known miss
 * below pass as an expected failure without ever comparing anything.
 */
const SIMULATION_TIMEOUT = 60_000;

const ax7 = findTube('12AX7')!;
const au7 = findTube('12AU7')!;
const el84 = findOutputTube('EL84')!;

// Our own designs, values from E12.
const chains: { label: string; chain: ChainInput; over: number }[] = [
  {
    label: '12AX7 plate (about 40k) driving a 12AU7 stage into grid current through 470k',
    chain: {
      source: { rsource: 1e3 },
      stages: [
        { kind: 'common-cathode', tube: ax7, bplus: 300, ra: 100e3, rk: 1500, bypassed: true, coupling: { kind: 'capacitor', cc: 1e-6, rg: 1e6 } },
        { kind: 'common-cathode', tube: au7, bplus: 300, ra: 47e3, rk: 1000, bypassed: true, coupling: { kind: 'capacitor', cc: 1e-6, rg: 470e3 } },
      ],
      load: { rl: 470e3 },
    },
    over: 1.25,
  },
  {
    label: 'a direct-coupled follower driven into grid current from a 12AX7\u2019s plate (about 40k)',
    chain: {
      source: { rsource: 1e3 },
      stages: [
        { kind: 'common-cathode', tube: ax7, bplus: 300, ra: 100e3, rk: 2700, bypassed: true, coupling: { kind: 'capacitor', cc: 1e-6, rg: 1e6 } },
        { kind: 'follower', tube: au7, bplus: 300, rk: 47e3, coupling: { kind: 'direct' } },
      ],
      load: { rl: 100e3 },
    },
    over: 1.3,
  },
  {
    label: '12AU7 driver into a triode-connected EL84 past 0 V on its grid (through the driver\u2019s plate, about 9k, and 470k)',
    chain: {
      source: { rsource: 600 },
      stages: [
        { kind: 'common-cathode', tube: au7, bplus: 350, ra: 47e3, rk: 1500, bypassed: true, coupling: { kind: 'capacitor', cc: 1e-6, rg: 1e6 } },
        {
          kind: 'single-ended-output', tube: el84, connection: 'triode', bplus: 250, screenVolts: 250, ulTap: 0.4, zPrimary: 5200, rPrimary: 0,
          bias: 'fixed', rk: 0, vg: -8, speakerOhms: 8, thdLimit: 0.1, coupling: { kind: 'capacitor', cc: 1e-6, rg: 470e3 },
        },
      ],
    },
    over: 1.15,
  },
  {
    label: '12AX7 plate driving a 12AU7 into grid current through a 470k volume control at 0.7 of its track (the wiper about 100k)',
    chain: {
      source: { rsource: 1e3 },
      stages: [
        { kind: 'common-cathode', tube: ax7, bplus: 300, ra: 100e3, rk: 1500, bypassed: true, coupling: { kind: 'capacitor', cc: 1e-6, rg: 1e6 } },
        { kind: 'common-cathode', tube: au7, bplus: 300, ra: 47e3, rk: 1000, bypassed: true, volume: 0.7, coupling: { kind: 'capacitor', cc: 1e-6, rg: 470e3 } },
      ],
      load: { rl: 470e3 },
    },
    over: 1.25,
  },
];

const dB = (x: number) => 20 * Math.log10(x);

describe.runIf(run)('an amplifier driven past its clean limit agrees with ngspice, grid current drawn through the stage before', () => {
  it.each(chains.map((c) => [c.label, c] as const))('%s', (_label, c) => {
    const ours = solveChain(c.chain);
    if (!ours.ok) throw new Error(ours.message);
    expect(ours.clipsFirst.by).toBe('grid-current');
    const level = amplifierAtLevel(c.chain, { outputRms: c.over * ours.output.rms });
    if (!level.ok) throw new Error(level.message);
    expect(level.pastClean).toEqual({ stage: ours.clipsFirst.stage, by: 'grid-current' });
    const f = fourierTable(runNgspiceFull(chainNetlist(c.chain, { kind: 'tran', peak: level.inputPeak })).output);
    expectClose(level.output.peak, f.get(1)!.magnitude, { rel: 0.01 }, 'fundamental');
    for (const h of [2, 3]) {
      expect(Math.abs(dB(level.harmonics[h]!) - dB(f.get(h)!.normalized)), `H${h}: ${dB(level.harmonics[h]!).toFixed(2)} dB vs ${dB(f.get(h)!.normalized).toFixed(2)} dB`).toBeLessThan(1);
    }
  }, SIMULATION_TIMEOUT);
});

// Known miss: a 300B driven past 0 V from a 6SN7's plate (about 7k). Its grid draws milliamps, and the driver
// loaded that hard is no longer the linear source of its small-signal output impedance the loop assumes:
// measured H2 1.6 dB off ngspice at 1.15 times the clean level (fundamental and H3 within the limits). This
// fails when the driver's own curvature under grid current is followed.
const sn7 = findTube('6SN7')!;
const heavyGrid: ChainInput = {
  source: { rsource: 600 },
  stages: [
    { kind: 'common-cathode', tube: sn7, bplus: 350, ra: 47e3, rk: 1500, bypassed: true, coupling: { kind: 'capacitor', cc: 1e-6, rg: 1e6 } },
    {
      kind: 'single-ended-output', tube: findOutputTube('300B')!, connection: 'triode', bplus: 350, screenVolts: 350, ulTap: 0.4, zPrimary: 3500, rPrimary: 0,
      bias: 'fixed', rk: 0, vg: -70, speakerOhms: 8, thdLimit: 0.1, coupling: { kind: 'capacitor', cc: 1e-6, rg: 220e3 },
    },
  ],
};
describe.runIf(run)('known miss past the clean limit', () => {
  it.fails('a 300B driven past 0 V from a 6SN7\u2019s plate: H2 within 1 dB of ngspice', () => {
    const ours = solveChain(heavyGrid);
    if (!ours.ok) throw new Error(ours.message);
    const level = amplifierAtLevel(heavyGrid, { outputRms: 1.15 * ours.output.rms });
    if (!level.ok) throw new Error(level.message);
    const f = fourierTable(runNgspiceFull(chainNetlist(heavyGrid, { kind: 'tran', peak: level.inputPeak })).output);
    expect(Math.abs(dB(level.harmonics[2]!) - dB(f.get(2)!.normalized))).toBeLessThan(1);
  }, SIMULATION_TIMEOUT);
});
