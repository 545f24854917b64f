import { defineTube, type TubeSpec } from '../defineTube';

/** 6SN7: Twin medium-mu triode (6SN7GTB), octal; drivers and line stages. Values SI (V, A, Ω, S, F, W). */
export const spec6SN7: TubeSpec = {
  id: '6SN7',
  description: 'Twin medium-mu triode (6SN7GTB), octal; drivers and line stages.',
  params: { mu: 22.2693, ex: 1.34934, kg1: 1328.42, kp: 112.893, kvb: 1622.5 },
  gridResistance: 2000,
  fit: {
    method: 'this project\'s fit to the typical points below (scripts/fit-library.ts)',
    rmsPercent: 0.5,
    worst: 'mu at 90 V/0 V: +0.9 %',
  },
  directlyHeated: false,
  sections: 2,
  heaters: [
    { wiring: 'single', volts: 6.3, amps: 0.6, source: 'RCA data quoted in a secondary source (S)' },
  ],
  ratings: {
    maxPlateVoltage: 450,
    maxPlateDissipation: 5,
    maxHeaterCathodeVoltage: 200,
    maxGridResistanceCathodeBias: 1000000,
    source: '6SN7GTB design-maximum, from memory',
  },
  capacitances: { cgk: 2.8e-12, cgp: 4e-12, cpk: 0.8e-12, source: 'from memory, low confidence' },
  typical: [
    { va: 250, vg: -8, ia: 9e-3, mu: 20, rp: 7700, gm: 2600e-6, source: 'RCA data quoted in a secondary source (S)' },
    { va: 90, vg: 0, ia: 10e-3, mu: 20, rp: 6700, gm: 3000e-6, source: 'typical point: from memory' },
  ],
};

export const tube6SN7 = defineTube(spec6SN7);
