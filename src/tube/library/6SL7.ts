import { defineTube } from '../defineTube';

/** 6SL7: Twin high-mu triode (6SL7GT), octal; input stages and phase splitters. Values SI (V, A, Ω, S, F, W). */
export const tube6SL7 = defineTube({
  id: '6SL7',
  description: 'Twin high-mu triode (6SL7GT), octal; input stages and phase splitters.',
  params: { mu: 69.1781, ex: 1.2, kg1: 1609.68, kp: 559.113, kvb: 630.197 },
  gridResistance: 2000,
  fit: {
    method: 'this project\'s fit to the typical points below (scripts/fit-library.ts)',
    rmsPercent: 2.3,
    worst: 'rp at 250 V/-2 V: -2.8 %',
  },
  directlyHeated: false,
  sections: 2,
  heaters: [
    { wiring: 'single', volts: 6.3, amps: 0.3, source: 'from memory' },
  ],
  ratings: {
    maxPlateVoltage: 300,
    maxPlateDissipation: 1,
    maxHeaterCathodeVoltage: 90,
    source: 'design-centre, from memory',
  },
  capacitances: { cgk: 3e-12, cgp: 2.8e-12, cpk: 3.8e-12, source: 'from memory, low confidence' },
  typical: [
    { va: 250, vg: -2, ia: 2.3e-3, mu: 70, rp: 44000, gm: 1600e-6, source: 'typical point: from memory (mu quoted in a secondary source)' },
  ],
});
