import { defineOutputTube, type OutputTube } from '../outputTube';

export const output6V6: OutputTube = defineOutputTube({
  id: '6V6GT',
  description: 'Beam power tetrode, octal; small single-ended outputs and guitar amplifiers.',
  construction: 'beam tetrode',
  // No published Koren set; fitted by scripts/fit-pentodes.ts to the static
  // figures only (Ia 45 mA, Ig2 4.5 mA, gm 4.1 mA/V, rp 50 kΩ, triode mu 9.8).
  law: { kind: 'pentode', params: { mu: 9.8, ex: 1.35, kg1: 2109.68, kp: 45.0291, kvb: 40.2171, kg2: 7096.94 } },
  lawSource: 'this project\'s fit (scripts/fit-pentodes.ts) to the RCA 6V6GT static figures at 250 V (from memory)',
  heater: { wiring: 'single', volts: 6.3, amps: 0.45, source: 'from memory' },
  ratings: {
    maxPlateVoltage: 315,
    maxPlateDissipation: 12,
    maxScreenVoltage: 285,
    maxScreenDissipation: 2,
    maxHeaterCathodeVoltage: 90,
    maxGridResistanceCathodeBias: 500e3,
    maxGridResistanceFixedBias: 100e3,
    source: 'RCA 6V6GT data sheet, design-centre limits (from memory; the later design-maximum figures are higher)',
  },
  capacitances: { cgk: 9e-12, cgp: 0.7e-12, cpk: 7.5e-12, source: 'from memory, low confidence' },
  singleEnded: [
    { connection: 'pentode', va: 250, vg2: 250, vg1: -12.5, ia: 45e-3, ig2: 4.5e-3, load: 5000, power: 4.5, thd: 0.08, source: 'RCA 6V6GT data sheet, single tube class A1 (from memory)' },
    { connection: 'pentode', va: 315, vg2: 225, vg1: -13, ia: 34e-3, ig2: 2.2e-3, load: 8500, power: 5.5, thd: 0.12, source: 'RCA 6V6GT data sheet, single tube class A1 (from memory)' },
  ],
});
