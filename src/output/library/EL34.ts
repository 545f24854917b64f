import { defineOutputTube, type OutputTube } from '../outputTube';

export const outputEL34: OutputTube = defineOutputTube({
  id: 'EL34',
  description: 'Power pentode, octal; single-ended and push-pull outputs up to tens of watts.',
  construction: 'pentode',
  // Fitted by scripts/fit-pentodes.ts to the static figures (Ia 100 mA, Ig2
  // 14.9 mA, gm 11 mA/V, ri 15 kΩ at 250 V/250 V/-13.5 V) with Koren's mu 11.
  // Koren's own set was weighed on the same figures and rejected: Ig2 -68 %,
  // ri 40 kΩ against 15 kΩ.
  law: { kind: 'pentode', params: { mu: 11, ex: 1.35, kg1: 620.089, kp: 43.9793, kvb: 58.9064, kg2: 1347.92 } },
  lawSource: 'this project\'s fit (scripts/fit-pentodes.ts) to the Philips EL34 static figures at 250 V (from memory), mu from Koren\'s errata Table 1; kept over Koren\'s set, which misses the screen current by -68 % and ri by +167 %',
  heater: { wiring: 'single', volts: 6.3, amps: 1.5, source: 'from memory' },
  ratings: {
    maxPlateVoltage: 800,
    maxPlateDissipation: 25,
    maxScreenVoltage: 425,
    maxScreenDissipation: 8,
    maxCathodeCurrent: 0.15,
    maxHeaterCathodeVoltage: 100,
    maxGridResistanceCathodeBias: 700e3,
    maxGridResistanceFixedBias: 500e3,
    source: 'Philips EL34 data sheet, design-centre limits (from memory)',
  },
  capacitances: { cgk: 15e-12, cgp: 1e-12, cpk: 8e-12, source: 'Koren, errata Table 1' },
  singleEnded: [
    { connection: 'pentode', va: 250, vg2: 250, vg1: -13.5, ia: 100e-3, ig2: 14.9e-3, load: 2000, power: 11, thd: 0.1, source: 'Philips EL34 data sheet, single tube class A (from memory)' },
  ],
});
