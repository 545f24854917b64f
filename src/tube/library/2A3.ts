import { defineTube } from '../defineTube';

/** 2A3: Directly heated power triode, UX4; small single-ended and push-pull outputs. Values SI (V, A, Ω, S, F, W). */
export const tube2A3 = defineTube({
  id: '2A3',
  description: 'Directly heated power triode, UX4; small single-ended and push-pull outputs.',
  params: { mu: 4.47811, ex: 1.34007, kg1: 985.363, kp: 33.6001, kvb: 340.451 },
  gridResistance: 1000,
  fit: {
    method: 'this project\'s fit to the typical points (scripts/fit-library.ts), kept over Koren\'s set: lower RMS error over the typical points',
    rmsPercent: 0.6,
    worst: 'mu at 250 V/-45 V: -1.0 %',
    rejected: 'Koren\'s published set (errata Table 1), RMS 2.4 %',
  },
  directlyHeated: true,
  heaters: [
    { wiring: 'single', volts: 2.5, amps: 2.5, source: 'Virtual Valve Museum 2A3 page, summary of a data sheet (S)' },
  ],
  ratings: {
    maxPlateVoltage: 300,
    maxPlateDissipation: 15,
    maxHeaterCathodeVoltage: null,
    maxGridResistanceCathodeBias: 500000,
    maxGridResistanceFixedBias: 50000,
    source: 'from memory (grid resistors low confidence)',
  },
  capacitances: { cgk: 7.5e-12, cgp: 16.5e-12, cpk: 5.5e-12, source: 'from memory, low confidence' },
  typical: [
    { va: 250, vg: -45, ia: 60e-3, mu: 4.2, rp: 800, gm: 5200e-6, source: 'data-sheet summary, Virtual Valve Museum 2A3 page (S); mu from memory (= gm x rp)' },
  ],
});
