import { defineOutputTube, type OutputTube } from '../outputTube';

export const outputEL84: OutputTube = defineOutputTube({
  id: 'EL84',
  description: 'Power pentode, noval; small single-ended and push-pull outputs.',
  construction: 'pentode',
  // No published Koren set; fitted by scripts/fit-pentodes.ts to the static
  // figures only (Ia 48 mA, Ig2 5.5 mA, gm 11.3 mA/V, ri 38 kΩ, mu g1-g2 19).
  law: { kind: 'pentode', params: { mu: 19, ex: 1.3789, kg1: 656.766, kp: 833.209, kvb: 49.0021, kg2: 2081 } },
  lawSource: 'this project\'s fit (scripts/fit-pentodes.ts) to the Philips EL84 static figures at 250 V (from memory)',
  heater: { wiring: 'single', volts: 6.3, amps: 0.76, source: 'from memory' },
  ratings: {
    maxPlateVoltage: 300,
    maxPlateDissipation: 12,
    maxScreenVoltage: 300,
    maxScreenDissipation: 2,
    maxCathodeCurrent: 0.065,
    maxHeaterCathodeVoltage: 100,
    maxGridResistanceCathodeBias: 1e6,
    maxGridResistanceFixedBias: 300e3,
    source: 'Philips EL84 data sheet, design-centre limits (from memory)',
  },
  capacitances: { cgk: 10.8e-12, cgp: 0.5e-12, cpk: 6.5e-12, source: 'from memory, low confidence' },
  singleEnded: [
    { connection: 'pentode', va: 250, vg2: 250, vg1: -7.3, ia: 48e-3, ig2: 5.5e-3, load: 5200, power: 5.7, thd: 0.1, source: 'Philips EL84 data sheet, single tube class A (from memory)' },
  ],
});
