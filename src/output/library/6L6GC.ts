import { defineOutputTube, type OutputTube } from '../outputTube';

export const output6L6GC: OutputTube = defineOutputTube({
  id: '6L6GC',
  description: 'Beam power tetrode, octal; single-ended and push-pull outputs.',
  construction: 'beam tetrode',
  // Fitted by scripts/fit-pentodes.ts to the static figures (Ia 72 mA, Ig2
  // 5 mA, gm 6 mA/V, rp 22.5 kΩ at 250 V/250 V/-14 V) with Koren's mu 8.7.
  // Koren's own set was weighed on the same figures and rejected: Ia +12.5 %,
  // Ig2 +68 %, rp 98 kΩ against 22.5 kΩ.
  law: { kind: 'pentode', params: { mu: 8.7, ex: 1.35, kg1: 1472.55, kp: 44.783, kvb: 54.7891, kg2: 7556.62 } },
  lawSource: 'this project\'s fit (scripts/fit-pentodes.ts) to the RCA 6L6GC static figures at 250 V (from memory), mu from Koren\'s errata Table 1; kept over Koren\'s set, which misses Ig2 by +68 % and rp by +336 %',
  heater: { wiring: 'single', volts: 6.3, amps: 0.9, source: 'from memory' },
  ratings: {
    maxPlateVoltage: 500,
    maxPlateDissipation: 30,
    maxScreenVoltage: 450,
    maxScreenDissipation: 5,
    maxHeaterCathodeVoltage: 200,
    maxGridResistanceCathodeBias: 500e3,
    maxGridResistanceFixedBias: 100e3,
    source: 'RCA 6L6GC data sheet, design-maximum (from memory)',
  },
  capacitances: { cgk: 11e-12, cgp: 0.85e-12, cpk: 8e-12, source: 'Koren, errata Table 1' },
  singleEnded: [
    { connection: 'pentode', va: 250, vg2: 250, vg1: -14, ia: 72e-3, ig2: 5e-3, load: 2500, power: 6.5, thd: 0.1, source: 'RCA 6L6GC data sheet, single tube class A1 (from memory)' },
    { connection: 'pentode', va: 350, vg2: 250, vg1: -18, ia: 54e-3, ig2: 2.5e-3, load: 4200, power: 10.8, thd: 0.15, source: 'RCA 6L6GC data sheet, single tube class A1 (from memory)' },
  ],
});
