import { defineTube } from '../defineTube';

/** 300B: Directly heated power triode, UX4; single-ended output stages. Values SI (V, A, Ω, S, F, W). */
export const tube300B = defineTube({
  id: '300B',
  description: 'Directly heated power triode, UX4; single-ended output stages.',
  params: { mu: 4.42888, ex: 1.47615, kg1: 1105.35, kp: 30.8, kvb: 264.873 },
  gridResistance: 1000,
  fit: {
    method: 'this project\'s fit to the typical points (scripts/fit-library.ts), kept over Koren\'s set: lower RMS error over the typical points',
    rmsPercent: 0.8,
    worst: 'mu at 300 V/-61 V: +1.3 %',
    rejected: 'Koren\'s published set (errata Table 1), RMS 5.4 %',
  },
  directlyHeated: true,
  heaters: [
    { wiring: 'single', volts: 5, amps: 1.2, source: 'Western Electric 300B technical data (P)' },
  ],
  ratings: {
    maxPlateVoltage: 450,
    maxPlateDissipation: 35,
    maxHeaterCathodeVoltage: null,
    maxGridResistanceCathodeBias: 250000,
    maxGridResistanceFixedBias: 50000,
    maxCathodeCurrent: 0.07,
    source: 'Western Electric 300B: 450 V, 70 mA fixed bias (P); 35 W permissible design maximum as quoted from WE 1950 data in an owner\'s manual (S; lower than the 40 W also seen, kept for safety); grid resistors from memory',
  },
  capacitances: { cgk: 9e-12, cgp: 15e-12, cpk: 4.3e-12, source: 'Western Electric 300B, average direct (P)' },
  typical: [
    { va: 300, vg: -61, ia: 60e-3, mu: 3.85, rp: 700, gm: 5500e-6, source: 'Western Electric 300B technical data (P)' },
  ],
});
