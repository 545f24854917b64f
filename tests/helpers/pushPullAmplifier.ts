import { findOutputTube, findTube, type ChainInput } from '../../src/index';

/** Our own small push-pull amplifier: a 12AX7 input stage, a 12AU7 split-load splitter and a cathode-biased ultralinear EL84 pair, from 600 Ω. */
export const SPLIT_LOAD_EL84_PAIR: ChainInput = {
  source: { rsource: 600 },
  stages: [
    { kind: 'common-cathode', tube: findTube('12AX7')!, bplus: 300, ra: 100e3, rk: 1500, bypassed: true, coupling: { kind: 'capacitor', cc: 100e-9, rg: 1e6 } },
    { kind: 'split-load', tube: findTube('12AU7')!, bplus: 300, ra: 22e3, rk: 22e3, vbias: 90, coupling: { kind: 'capacitor', cc: 100e-9, rg: 1e6 } },
    {
      kind: 'push-pull-output', tube: findOutputTube('EL84')!, connection: 'ultralinear', bplus: 300, screenVolts: 300, ulTap: 0.4, raa: 8000, rPrimary: 240,
      bias: 'cathode', rk: 130, vg: 0, speakerOhms: 8, thdLimit: 0.05, coupling: { kind: 'capacitor', cc: 220e-9, rg: 470e3 },
    },
  ],
};
