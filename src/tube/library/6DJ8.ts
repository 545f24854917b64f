import { defineTube, type TubeSpec } from '../defineTube';

/** 6DJ8: Frame-grid twin triode (ECC88), noval; high gm, low noise, low voltage. Values SI (V, A, Ω, S, F, W). */
export const spec6DJ8: TubeSpec = {
  id: '6DJ8',
  description: 'Frame-grid twin triode (ECC88), noval; high gm, low noise, low voltage.',
  params: { mu: 33.1079, ex: 1.3006, kg1: 221.059, kp: 264, kvb: 608.721 },
  gridResistance: 2000,
  fit: {
    method: 'this project\'s fit to the typical points (scripts/fit-library.ts), kept over Koren\'s set: lower RMS error over the typical points',
    rmsPercent: 0.6,
    worst: 'mu at 90 V/-1.3 V: -0.9 %',
    rejected: 'Koren\'s published set (errata Table 1), RMS 16.2 %',
  },
  directlyHeated: false,
  sections: 2,
  heaters: [
    { wiring: 'single', volts: 6.3, amps: 0.365, source: 'from memory' },
  ],
  ratings: {
    maxPlateVoltage: 130,
    maxPlateDissipation: 1.5,
    maxHeaterCathodeVoltage: 150,
    maxGridResistanceCathodeBias: 1000000,
    source: 'ECC88/6DJ8, from memory',
  },
  capacitances: { cgk: 3.3e-12, cgp: 1.4e-12, cpk: 1.8e-12, source: 'from memory, low confidence' },
  typical: [
    { va: 90, vg: -1.3, ia: 15e-3, mu: 33, rp: 2600, gm: 12500e-6, source: 'Philips ECC88 typical: from memory (mu quoted in a secondary source)' },
  ],
};

export const tube6DJ8 = defineTube(spec6DJ8);
