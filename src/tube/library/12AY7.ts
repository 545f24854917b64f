import { defineTube } from '../defineTube';

/** 12AY7: Twin medium-high-mu low-noise triode, noval; microphone and instrument preamps. Values SI (V, A, Ω, S, F, W). */
export const tube12AY7 = defineTube({
  id: '12AY7',
  description: 'Twin medium-high-mu low-noise triode, noval; microphone and instrument preamps.',
  params: { mu: 44.3344, ex: 1.24048, kg1: 1461.46, kp: 352.004, kvb: 5989.86 },
  gridResistance: 2000,
  fit: {
    method: 'this project\'s fit to the typical points below (scripts/fit-library.ts)',
    rmsPercent: 0.9,
    worst: 'mu at 250 V/-4 V: -1.4 %',
  },
  directlyHeated: false,
  sections: 2,
  heaters: [
    { wiring: 'parallel', volts: 6.3, amps: 0.3, source: 'from memory' },
    { wiring: 'series', volts: 12.6, amps: 0.15, source: 'from memory' },
  ],
  ratings: {
    maxPlateVoltage: 300,
    maxPlateDissipation: 1.5,
    maxHeaterCathodeVoltage: 90,
    source: 'from memory',
  },
  capacitances: { cgk: 1.3e-12, cgp: 1.3e-12, cpk: 0.6e-12, source: 'from memory, low confidence' },
  typical: [
    { va: 250, vg: -4, ia: 3e-3, mu: 44, rp: 25000, gm: 1750e-6, source: 'RCA-style typical point: from memory' },
  ],
});
