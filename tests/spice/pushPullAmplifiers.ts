import { findOutputTube, findTube, type ChainInput, type PushPullLink } from '../../src/index';

// Our own push-pull amplifiers, values from E12/E24: an input stage, a phase splitter and a pair.
export const pushPullInput = { kind: 'common-cathode' as const, tube: findTube('12AX7')!, bplus: 300, ra: 100e3, rk: 1500, bypassed: true, coupling: { kind: 'capacitor' as const, cc: 100e-9, rg: 1e6 } };
export const el84Pair: PushPullLink = {
  kind: 'push-pull-output', tube: findOutputTube('EL84')!, connection: 'ultralinear', bplus: 300, screenVolts: 300, ulTap: 0.4, raa: 8000, rPrimary: 240,
  bias: 'cathode', rk: 130, vg: 0, speakerOhms: 8, thdLimit: 0.05, coupling: { kind: 'capacitor', cc: 220e-9, rg: 470e3 },
};
export const el34Pair: PushPullLink = {
  kind: 'push-pull-output', tube: findOutputTube('EL34')!, connection: 'pentode', bplus: 420, screenVolts: 400, ulTap: 0.4, raa: 6600, rPrimary: 180,
  bias: 'fixed', rk: 1, vg: -36, speakerOhms: 8, thdLimit: 0.05, coupling: { kind: 'capacitor', cc: 220e-9, rg: 220e3 },
};
export const pushPullAmplifiers: { label: string; chain: ChainInput }[] = [
  {
    label: 'common cathode → split-load → push-pull EL84 (ultralinear, cathode bias)',
    chain: { source: { rsource: 600 }, stages: [pushPullInput, { kind: 'split-load', tube: findTube('12AU7')!, bplus: 300, ra: 22e3, rk: 22e3, vbias: 90, coupling: { kind: 'capacitor', cc: 100e-9, rg: 1e6 } }, el84Pair] },
  },
  {
    label: 'common cathode → long-tailed pair (trimmed plates) → push-pull EL34 (pentode, fixed bias)',
    chain: { source: { rsource: 600 }, stages: [pushPullInput, { kind: 'long-tailed-pair', tube: findTube('12AU7')!, bplus: 400, ra: 47e3, ra2: 51e3, rk: 470, rtail: 15e3, vbias: 80, coupling: { kind: 'capacitor', cc: 100e-9, rg: 1e6 } }, el34Pair] },
  },
];
