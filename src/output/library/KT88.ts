import { defineOutputTube, type OutputTube } from '../outputTube';

export const outputKT88: OutputTube = defineOutputTube({
  id: 'KT88',
  description: 'Beam power tetrode, octal; high-power single-ended and push-pull outputs.',
  construction: 'beam tetrode',
  law: { kind: 'pentode', params: { mu: 8.8, ex: 1.35, kg1: 730, kp: 32, kvb: 16, kg2: 4200 } },
  lawSource: 'Koren, errata Table 1, as published (no single-ended data-sheet example to check it against here)',
  heater: { wiring: 'single', volts: 6.3, amps: 1.6, source: 'from memory' },
  ratings: {
    maxPlateVoltage: 800,
    maxPlateDissipation: 35,
    maxScreenVoltage: 600,
    maxScreenDissipation: 6,
    maxCathodeCurrent: 0.23,
    maxHeaterCathodeVoltage: 200,
    source: 'GEC KT88 data sheet (from memory; later issues rate 42 W plate)',
  },
  capacitances: { cgk: 14e-12, cgp: 0.85e-12, cpk: 12e-12, source: 'Koren, errata Table 1' },
  singleEnded: [],
});
