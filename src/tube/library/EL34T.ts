import { defineTube } from '../defineTube';

/** EL34-T: EL34 (6CA7) power pentode wired as a triode; single-ended outputs. Values SI (V, A, Ω, S, F, W). */
export const tubeEL34T = defineTube({
  id: 'EL34-T',
  description: 'EL34 (6CA7) power pentode wired as a triode; single-ended outputs.',
  params: { mu: 11.1401, ex: 1.27557, kg1: 319.405, kp: 88.0006, kvb: 6916.1 },
  gridResistance: 1000,
  fit: {
    method: 'this project\'s fit to the typical points below (scripts/fit-library.ts)',
    rmsPercent: 0.8,
    worst: 'mu at 250 V/-17 V: -1.3 %',
  },
  directlyHeated: false,
  heaters: [
    { wiring: 'single', volts: 6.3, amps: 1.5, source: 'from memory' },
  ],
  ratings: {
    maxPlateVoltage: 425,
    maxPlateDissipation: 25,
    maxHeaterCathodeVoltage: 100,
    maxGridResistanceCathodeBias: 700000,
    maxGridResistanceFixedBias: 500000,
    source: 'pentode ratings; 425 V is the screen rating, which binds when the screen is tied to the plate; from memory',
  },
  capacitances: { cgk: 15.2e-12, cgp: 1.1e-12, cpk: 8.4e-12, source: 'triode connection, from memory, low confidence' },
  typical: [
    { va: 250, vg: -17, ia: 70e-3, mu: 11, rp: 950, gm: 11500e-6, source: 'triode-connected figures: from memory, low confidence' },
  ],
});
