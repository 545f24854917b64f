import { defineTube } from '../defineTube';

/** 45: Directly heated power triode (type 45), UX4; low-power single-ended outputs. Values SI (V, A, Ω, S, F, W). */
export const tube45 = defineTube({
  id: '45',
  description: 'Directly heated power triode (type 45), UX4; low-power single-ended outputs.',
  params: { mu: 3.51342, ex: 1.38753, kg1: 4108.48, kp: 47.1082, kvb: 319.414 },
  gridResistance: 1000,
  fit: {
    method: 'this project\'s fit to the typical points below (scripts/fit-library.ts)',
    rmsPercent: 0.3,
    worst: 'Ia at 180 V/-31.5 V: -0.4 %',
  },
  directlyHeated: true,
  heaters: [
    { wiring: 'single', volts: 2.5, amps: 1.5, source: 'from memory' },
  ],
  ratings: {
    maxPlateVoltage: 275,
    maxPlateDissipation: 10,
    maxHeaterCathodeVoltage: null,
    source: 'from memory (dissipation low confidence)',
  },
  capacitances: { cgk: 4e-12, cgp: 7e-12, cpk: 3e-12, source: 'from memory, low confidence' },
  typical: [
    { va: 180, vg: -31.5, ia: 31e-3, mu: 3.5, rp: 1650, gm: 2125e-6, source: 'typical point: from memory' },
    { va: 250, vg: -50, ia: 34e-3, mu: 3.5, rp: 1610, gm: 2175e-6, source: 'typical point: from memory' },
  ],
});
