import { defineOutputTube, type OutputTube } from '../outputTube';

export const output6550: OutputTube = defineOutputTube({
  id: '6550',
  description: 'Beam power tetrode, octal; high-power single-ended and push-pull outputs.',
  construction: 'beam tetrode',
  law: { kind: 'pentode', params: { mu: 7.9, ex: 1.35, kg1: 890, kp: 60, kvb: 24, kg2: 4200 } },
  lawSource: 'Koren, errata Table 1, as published (no single-ended data-sheet example to check it against here)',
  heater: { wiring: 'single', volts: 6.3, amps: 1.6, source: 'from memory' },
  ratings: {
    maxPlateVoltage: 600,
    maxPlateDissipation: 35,
    maxScreenVoltage: 400,
    maxScreenDissipation: 6,
    maxCathodeCurrent: 0.19,
    maxHeaterCathodeVoltage: 300,
    source: 'Tung-Sol 6550 data sheet (from memory, low confidence; the 6550A is rated 42 W)',
  },
  capacitances: { cgk: 14e-12, cgp: 0.85e-12, cpk: 12e-12, source: 'Koren, errata Table 1' },
  singleEnded: [],
});
