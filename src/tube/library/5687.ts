import { defineTube } from '../defineTube';

/** 5687: Twin medium-mu, high-current triode, noval; drivers and headphone stages. Values SI (V, A, Ω, S, F, W). */
export const tube5687 = defineTube({
  id: '5687',
  description: 'Twin medium-mu, high-current triode, noval; drivers and headphone stages.',
  params: { mu: 18.6431, ex: 1.28445, kg1: 382.039, kp: 136, kvb: 348.783 },
  gridResistance: 2000,
  fit: {
    method: 'this project\'s fit to the typical points below (scripts/fit-library.ts)',
    rmsPercent: 7.3,
    worst: 'rp at 120 V/-2 V: -8.7 %',
  },
  directlyHeated: false,
  sections: 2,
  heaters: [
    { wiring: 'parallel', volts: 6.3, amps: 0.9, source: 'from memory' },
    { wiring: 'series', volts: 12.6, amps: 0.45, source: 'from memory' },
  ],
  ratings: {
    maxPlateVoltage: 300,
    maxPlateDissipation: 4.2,
    maxHeaterCathodeVoltage: 90,
    source: 'from memory, low confidence (heater-cathode not recalled; 90 V assumed as a cautious figure)',
  },
  capacitances: { cgk: 4e-12, cgp: 4e-12, cpk: 0.6e-12, source: 'from memory, low confidence' },
  typical: [
    { va: 120, vg: -2, ia: 36e-3, mu: 17, rp: 2000, gm: 11000e-6, source: 'typical point: from memory, low confidence' },
  ],
});
