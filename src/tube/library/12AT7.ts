import { defineTube } from '../defineTube';

/** 12AT7: Twin high-mu, high-gm triode (ECC81), noval; mixers, phase inverters, drivers. Values SI (V, A, Ω, S, F, W). */
export const tube12AT7 = defineTube({
  id: '12AT7',
  description: 'Twin high-mu, high-gm triode (ECC81), noval; mixers, phase inverters, drivers.',
  params: { mu: 62.357, ex: 1.2, kg1: 459.513, kp: 664.94, kvb: 6750.89 },
  gridResistance: 2000,
  fit: {
    method: 'this project\'s fit to the typical points (scripts/fit-library.ts), kept over Koren\'s set: lower RMS error over the typical points',
    rmsPercent: 4.2,
    worst: 'Ia at 250 V/-2 V: +6.7 %',
    rejected: 'Koren\'s published set (errata Table 1), RMS 21.9 %',
  },
  directlyHeated: false,
  sections: 2,
  heaters: [
    { wiring: 'parallel', volts: 6.3, amps: 0.3, source: 'from memory' },
    { wiring: 'series', volts: 12.6, amps: 0.15, source: 'from memory' },
  ],
  ratings: {
    maxPlateVoltage: 300,
    maxPlateDissipation: 2.5,
    maxHeaterCathodeVoltage: 90,
    maxGridResistanceCathodeBias: 1000000,
    maxGridResistanceFixedBias: 250000,
    source: 'design-centre, from memory (no primary sheet reached)',
  },
  capacitances: { cgk: 2.2e-12, cgp: 1.5e-12, cpk: 0.5e-12, source: 'from memory, low confidence' },
  typical: [
    { va: 100, vg: -1, ia: 3.7e-3, mu: 62, rp: 15000, gm: 4000e-6, source: 'RCA typical, Rk 270 ohm (about -1 V): from memory' },
    { va: 250, vg: -2, ia: 10e-3, mu: 60, rp: 10900, gm: 5500e-6, source: 'RCA typical, Rk 200 ohm: from memory (mu, rp: tube-manual data quoted in a secondary source)' },
  ],
});
