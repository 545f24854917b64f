import { defineTube } from '../defineTube';

/** 6N1P: Soviet twin medium-mu triode (6N1P-EV), noval; line stages. Values SI (V, A, Ω, S, F, W). */
export const tube6N1P = defineTube({
  id: '6N1P',
  description: 'Soviet twin medium-mu triode (6N1P-EV), noval; line stages.',
  params: { mu: 36.4407, ex: 1.50763, kg1: 1010.88, kp: 279.998, kvb: 266.499 },
  gridResistance: 2000,
  fit: {
    method: 'this project\'s fit to the typical points below (scripts/fit-library.ts)',
    rmsPercent: 0.7,
    worst: 'rp at 250 V/-4.5 V: +1.0 %',
  },
  directlyHeated: false,
  sections: 2,
  heaters: [
    { wiring: 'single', volts: 6.3, amps: 0.6, source: 'from memory' },
  ],
  ratings: {
    maxPlateVoltage: 250,
    maxPlateDissipation: 2.2,
    maxHeaterCathodeVoltage: 100,
    maxCathodeCurrent: 0.025,
    source: 'from memory (cathode current and heater-cathode low confidence)',
  },
  capacitances: { cgk: 3.1e-12, cgp: 1.9e-12, cpk: 1.75e-12, source: 'from memory, low confidence' },
  typical: [
    { va: 250, vg: -4.5, ia: 7.5e-3, mu: 35, rp: 8000, gm: 4350e-6, source: 'typical point, Rk 600 ohm: from memory (rp derived as mu/gm)' },
  ],
});
