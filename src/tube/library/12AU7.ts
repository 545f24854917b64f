import { defineTube } from '../defineTube';

/** 12AU7: Twin medium-mu triode (ECC82), noval; line stages, drivers, cathode followers. Values SI (V, A, Ω, S, F, W). */
export const tube12AU7 = defineTube({
  id: '12AU7',
  description: 'Twin medium-mu triode (ECC82), noval; line stages, drivers, cathode followers.',
  params: { mu: 22.1074, ex: 1.31349, kg1: 1269.19, kp: 67.6025, kvb: 574.998 },
  gridResistance: 2000,
  fit: {
    method: 'this project\'s fit to the typical points (scripts/fit-library.ts), kept over Koren\'s set: lower RMS error over the typical points',
    rmsPercent: 0.7,
    worst: 'mu at 100 V/0 V: +1.1 %',
    rejected: 'Koren\'s published set (errata Table 1), RMS 7.1 %',
  },
  directlyHeated: false,
  sections: 2,
  heaters: [
    { wiring: 'parallel', volts: 6.3, amps: 0.3, source: 'Tung-Sol 12AU7 (1962) p.1 (P)' },
    { wiring: 'series', volts: 12.6, amps: 0.15, source: 'Tung-Sol 12AU7 (1962) p.1 (P)' },
  ],
  ratings: {
    maxPlateVoltage: 300,
    maxPlateDissipation: 2.75,
    maxHeaterCathodeVoltage: 200,
    maxHeaterCathodeVoltageCathodeNegative: 100,
    maxGridResistanceCathodeBias: 1000000,
    maxGridResistanceFixedBias: 250000,
    maxCathodeCurrent: 0.02,
    source: 'Tung-Sol 12AU7 (1962), design-centre, class A1 (P). Heater-cathode: 200 V with the heater negative to the cathode (the usual case with the heater at ground), 100 V DC the other way.',
  },
  capacitances: { cgk: 1.6e-12, cgp: 1.5e-12, cpk: 0.4e-12, source: 'Tung-Sol 12AU7 (1962), unit 1, no shield (P)' },
  typical: [
    { va: 100, vg: 0, ia: 11.8e-3, mu: 20, rp: 6500, gm: 3100e-6, source: 'Tung-Sol 12AU7 data sheet (1962) p.2 (P)' },
    { va: 250, vg: -8.5, ia: 10.5e-3, mu: 17, rp: 7700, gm: 2200e-6, source: 'Tung-Sol 12AU7 data sheet (1962) p.2; Brimar VAD/513.4 p.3 (P)' },
  ],
});
