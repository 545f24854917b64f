import { describe, expect, it } from 'vitest';
import { findOutputTube, findTube, solveChain, type ChainInput } from '../../src/index';
import { expectClose } from '../helpers/expectClose';
import { chainNetlist } from '../../src/netlist/chainNetlist';
import { LINE_AMPLIFIER } from './lineAmplifier';
import { ngspiceGate, runNgspiceFull } from './ngspice';
import { withTubeNoise } from './tubeNoise';
import { aWeighting } from '../../src/chain/aWeighting';

// Outside reference: ngspice's noise analysis (Debian's package) of each
// whole amplifier, at 290 K, over 20 Hz to 20 kHz: the thermal noise of every
// resistor carried to the output through the real network (couplings,
// bypasses, Miller capacitances, the next stage's loading). ngspice's
// behavioural tubes make no noise of their own, so each tube gets its
// equivalent noise resistance as a real resistor in series with its grid pin
// (withTubeNoise).
const run = ngspiceGate();

const ax7 = findTube('12AX7')!;
const au7 = findTube('12AU7')!;
const at7 = findTube('12AT7')!;
const el34 = findOutputTube('EL34')!;

const chains: { label: string; chain: ChainInput }[] = [
  {
    label: '12AX7 from a 1k source, bypassed → 12AU7 unbypassed → direct-coupled follower, into 100k',
    chain: LINE_AMPLIFIER,
  },
  {
    label: '12AX7 from a 47k source through a 68k grid stopper → single-ended EL34 (ultralinear)',
    chain: {
      source: { rsource: 47e3 },
      stages: [
        { kind: 'common-cathode', tube: ax7, bplus: 300, ra: 100e3, rk: 1500, bypassed: true, ck: 47e-6, rstopper: 68e3, coupling: { kind: 'capacitor', cc: 47e-9, rg: 1e6 } },
        {
          kind: 'single-ended-output', tube: el34, connection: 'ultralinear', bplus: 330, screenVolts: 300, ulTap: 0.43, zPrimary: 3300, rPrimary: 120,
          bias: 'cathode', rk: 330, ck: 220e-6, vg: -20, speakerOhms: 8, thdLimit: 0.05, coupling: { kind: 'capacitor', cc: 330e-9, rg: 270e3 },
        },
      ],
    },
  },
  {
    label: '12AT7 from an ideal source, cathode unbypassed (its Rk\'s noise in the signal path) → 12AU7',
    chain: {
      source: { rsource: 0 },
      stages: [
        { kind: 'common-cathode', tube: at7, bplus: 250, ra: 47e3, rk: 1000, bypassed: false, coupling: { kind: 'capacitor', cc: 100e-9, rg: 1e6 } },
        { kind: 'common-cathode', tube: au7, bplus: 250, ra: 22e3, rk: 1200, bypassed: true, ck: 100e-6, coupling: { kind: 'capacitor', cc: 47e-9, rg: 470e3 } },
      ],
      load: { rl: 220e3 },
    },
  },
  {
    label: '12AX7 from 10k through a 250k volume control at half its track (its wiper\'s 62.5k of thermal noise at the grid) → 12AU7',
    chain: {
      source: { rsource: 10e3 },
      stages: [
        { kind: 'common-cathode', tube: ax7, bplus: 300, ra: 100e3, rk: 1500, bypassed: true, ck: 47e-6, volume: 0.5, coupling: { kind: 'capacitor', cc: 100e-9, rg: 250e3 } },
        { kind: 'common-cathode', tube: au7, bplus: 300, ra: 22e3, rk: 1000, bypassed: true, ck: 100e-6, coupling: { kind: 'capacitor', cc: 220e-9, rg: 470e3 } },
      ],
      load: { rl: 100e3 },
    },
  },
];

/** ngspice's noise spectrum (frequency, V/√Hz per line) weighted by the A curve, power summed by the trapezoid rule, V rms. */
function weightedTotal(data: string): number {
  const rows = data.trim().split('\n').map((l) => l.trim().split(/\s+/).map(Number) as [number, number]);
  let sum = 0;
  for (let k = 1; k < rows.length; k++) {
    const [f0, v0] = rows[k - 1]!;
    const [f1, v1] = rows[k]!;
    sum += 0.5 * ((v0 * aWeighting(f0)) ** 2 + (v1 * aWeighting(f1)) ** 2) * (f1 - f0);
  }
  return Math.sqrt(sum);
}

describe.runIf(run)('the amplifier\'s noise against ngspice\'s noise analysis', () => {
  it.each(chains)('$label: output noise within 3 % (0.26 dB), plain and A-weighted', ({ chain }) => {
    const ours = solveChain(chain);
    if (!ours.ok) throw new Error(ours.message);
    expect(ours.noise).not.toBeNull();
    const sim = runNgspiceFull(withTubeNoise(chainNetlist(chain, { kind: 'noise' }), chain));
    expectClose(ours.noise!.outputRms, sim.values['onoise_total']!, { rel: 0.03 }, 'output noise, 20 Hz to 20 kHz');
    // A-weighted: ngspice's output noise spectrum (V/√Hz, 50 points a decade) weighted by the IEC 61672-1 curve and summed.
    expectClose(ours.noise!.weightedRms, weightedTotal(sim.data), { rel: 0.03 }, 'output noise, A-weighted');
  });
});
