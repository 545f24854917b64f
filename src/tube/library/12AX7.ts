import { defineTube } from '../defineTube';

/** 12AX7: Twin high-mu triode (ECC83), noval; the usual first stage of guitar and phono preamps. Values SI (V, A, Ω, S, F, W). */
export const tube12AX7 = defineTube({
  id: '12AX7',
  description: 'Twin high-mu triode (ECC83), noval; the usual first stage of guitar and phono preamps.',
  params: { mu: 129.511, ex: 1.2, kg1: 591.183, kp: 437.13, kvb: 10000 },
  gridResistance: 2000,
  fit: {
    method: 'this project\'s fit to the typical points (scripts/fit-library.ts), kept over Koren\'s set: lower RMS error over the typical points',
    rmsPercent: 6.1,
    worst: 'rp at 250 V/-2 V: -9.5 %',
    rejected: 'Koren\'s published set (errata Table 1), RMS 44.7 %',
  },
  directlyHeated: false,
  sections: 2,
  heaters: [
    { wiring: 'parallel', volts: 6.3, amps: 0.3, source: 'Tung-Sol 12AX7 (1947) p.1; Brimar VAD/513.5 p.2 (P)' },
    { wiring: 'series', volts: 12.6, amps: 0.15, source: 'Tung-Sol 12AX7 (1947) p.1; Brimar VAD/513.5 p.2 (P)' },
  ],
  ratings: {
    maxPlateVoltage: 300,
    maxPlateDissipation: 1,
    maxHeaterCathodeVoltage: 180,
    maxCathodeCurrent: 0.008,
    source: 'Tung-Sol 12AX7 (1947), design-centre (P); cathode current 8 mA from Brimar VAD/513.5 p.2 (P). Brimar gives 250 V heater-cathode; the lower Tung-Sol 180 V is kept.',
  },
  capacitances: { cgk: 1.6e-12, cgp: 1.7e-12, cpk: 0.46e-12, source: 'Tung-Sol 12AX7 (1947), unit 1, no shield (P)' },
  typical: [
    { va: 100, vg: -1, ia: 0.5e-3, mu: 100, rp: 80000, gm: 1250e-6, source: 'Tung-Sol 12AX7 data sheet (1947) p.1; Brimar VAD/513.5 p.3 (P)' },
    { va: 250, vg: -2, ia: 1.2e-3, mu: 100, rp: 62500, gm: 1600e-6, source: 'Tung-Sol 12AX7 data sheet (1947) p.1; Brimar VAD/513.5 p.3 (P)' },
  ],
});
