import { defineTube } from '../defineTube';

/** 6V6-T: 6V6GT beam tetrode wired as a triode; small single-ended outputs. Values SI (V, A, Ω, S, F, W). */
export const tube6V6T = defineTube({
  id: '6V6-T',
  description: '6V6GT beam tetrode wired as a triode; small single-ended outputs.',
  params: { mu: 8.91323, ex: 1.2, kg1: 668.074, kp: 71.9398, kvb: 10000 },
  gridResistance: 1000,
  fit: {
    method: 'this project\'s fit to the typical points below (scripts/fit-library.ts)',
    rmsPercent: 7.7,
    worst: 'mu at 250 V/-20 V: -10.1 %',
  },
  directlyHeated: false,
  heaters: [
    { wiring: 'single', volts: 6.3, amps: 0.45, source: 'from memory' },
  ],
  ratings: {
    maxPlateVoltage: 285,
    maxPlateDissipation: 12,
    maxHeaterCathodeVoltage: 200,
    maxGridResistanceCathodeBias: 500000,
    maxGridResistanceFixedBias: 100000,
    source: '6V6GT ratings; 285 V is the screen rating, which binds when the screen is tied to the plate; from memory',
  },
  capacitances: { cgk: 9.5e-12, cgp: 0.7e-12, cpk: 7.5e-12, source: 'triode connection, from memory, low confidence' },
  typical: [
    { va: 250, vg: -20, ia: 49.5e-3, mu: 9.8, rp: 1960, gm: 5000e-6, source: 'RCA triode-connection figures: from memory' },
  ],
});
