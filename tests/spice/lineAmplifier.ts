import { findTube, type ChainInput } from '../../src/index';

/**
 * Our own line amplifier, values from E12/E24: a 12AX7 from a 1k source,
 * bypassed, into a 12AU7 unbypassed, then a cathode follower direct-coupled
 * to its plate, into 100k. Checked whole (chain.spice.test.ts) and for its
 * noise (chainNoise.spice.test.ts).
 */
export const LINE_AMPLIFIER: ChainInput = {
  source: { rsource: 1e3 },
  stages: [
    { kind: 'common-cathode', tube: findTube('12AX7')!, bplus: 280, ra: 120e3, rk: 1800, bypassed: true, ck: 47e-6, coupling: { kind: 'capacitor', cc: 220e-9, rg: 1e6 } },
    { kind: 'common-cathode', tube: findTube('12AU7')!, bplus: 280, ra: 33e3, rk: 3300, bypassed: false, coupling: { kind: 'capacitor', cc: 68e-9, rg: 470e3 } },
    { kind: 'follower', tube: findTube('12AU7')!, bplus: 280, rk: 39e3, coupling: { kind: 'direct' } },
  ],
  load: { rl: 100e3 },
};
