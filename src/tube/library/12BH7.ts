import { defineTube } from '../defineTube';

/** 12BH7: Twin medium-mu triode for higher current, noval; drivers and phase inverters. Values SI (V, A, Ω, S, F, W). */
export const tube12BH7 = defineTube({
  id: '12BH7',
  description: 'Twin medium-mu triode for higher current, noval; drivers and phase inverters.',
  params: { mu: 17.0947, ex: 1.3136, kg1: 1206.36, kp: 132.001, kvb: 342.747 },
  gridResistance: 2000,
  fit: {
    method: 'this project\'s fit to the typical points below (scripts/fit-library.ts)',
    rmsPercent: 0.6,
    worst: 'mu at 250 V/-10.5 V: -0.9 %',
  },
  directlyHeated: false,
  sections: 2,
  heaters: [
    { wiring: 'parallel', volts: 6.3, amps: 0.6, source: 'from memory' },
    { wiring: 'series', volts: 12.6, amps: 0.3, source: 'from memory' },
  ],
  ratings: {
    maxPlateVoltage: 300,
    maxPlateDissipation: 3.5,
    maxHeaterCathodeVoltage: 200,
    source: 'from memory, low confidence',
  },
  capacitances: { cgk: 3.2e-12, cgp: 2.6e-12, cpk: 0.5e-12, source: 'from memory, low confidence' },
  typical: [
    { va: 250, vg: -10.5, ia: 11.5e-3, mu: 16.5, rp: 5300, gm: 3100e-6, source: 'typical point: from memory' },
  ],
});
