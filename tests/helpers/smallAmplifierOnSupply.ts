import { findOutputTube, findTube, type ChainInput, type SupplyDesign } from '../../src/index';

// Our own small amplifier on its own supply: the output stage on the reservoir, the follower after a 1k section,
// the input stage after a further 10k.
export const amplifier: ChainInput = {
  source: { rsource: 1e3 },
  stages: [
    { kind: 'common-cathode', tube: findTube('12AU7')!, bplus: 300, ra: 27e3, rk: 1200, bypassed: true, coupling: { kind: 'capacitor', cc: 470e-9, rg: 1e6 } },
    { kind: 'follower', tube: findTube('12AU7')!, bplus: 300, rk: 22e3, coupling: { kind: 'direct' } },
    {
      kind: 'single-ended-output', tube: findOutputTube('EL34')!, connection: 'ultralinear', bplus: 330, screenVolts: 300, ulTap: 0.43, zPrimary: 3500, rPrimary: 130,
      bias: 'cathode', rk: 330, vg: -22, speakerOhms: 8, thdLimit: 0.05, coupling: { kind: 'capacitor', cc: 1e-6, rg: 220e3 },
    },
  ],
};
export const supply: SupplyDesign = {
  mainsHz: 50, secondaryRms: 260, windingOhms: 35, rectifier: { kind: 'silicon-full-wave' },
  input: { kind: 'capacitor', c: 100e-6 }, sections: [{ kind: 'rc', r: 1000, c: 47e-6 }, { kind: 'rc', r: 10e3, c: 47e-6 }], loads: [0, 0, 0],
};
