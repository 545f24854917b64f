import { defineTube } from '../defineTube';

/** EL84-T: EL84 (6BQ5) power pentode wired as a triode (screen to plate); small outputs and drivers. Values SI (V, A, Ω, S, F, W). */
export const tubeEL84T = defineTube({
  id: 'EL84-T',
  description: 'EL84 (6BQ5) power pentode wired as a triode (screen to plate); small outputs and drivers.',
  params: { mu: 20.1977, ex: 1.28432, kg1: 304.942, kp: 156.001, kvb: 363.05 },
  gridResistance: 1000,
  fit: {
    method: 'this project\'s fit to the typical points below (scripts/fit-library.ts)',
    rmsPercent: 0.8,
    worst: 'mu at 250 V/-9 V: -1.2 %',
  },
  directlyHeated: false,
  heaters: [
    { wiring: 'single', volts: 6.3, amps: 0.76, source: 'from memory' },
  ],
  ratings: {
    maxPlateVoltage: 300,
    maxPlateDissipation: 12,
    maxHeaterCathodeVoltage: 100,
    maxGridResistanceCathodeBias: 1000000,
    maxGridResistanceFixedBias: 300000,
    maxCathodeCurrent: 0.065,
    source: 'pentode ratings applied as upper bounds, from memory',
  },
  capacitances: { cgk: 10.8e-12, cgp: 2.7e-12, cpk: 6.5e-12, source: 'triode connection, from memory, low confidence' },
  typical: [
    { va: 250, vg: -9, ia: 34e-3, mu: 19.5, rp: 1800, gm: 10800e-6, source: 'triode-connected figures: from memory, low confidence' },
  ],
});
