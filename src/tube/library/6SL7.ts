import { defineTube } from '../defineTube';

/** One plate curve's readings: its grid voltage and [plate volts, plate mA] pairs, as points in SI units. */
const curve = (vg: number, readings: readonly (readonly [number, number])[]) => readings.map(([va, mA]) => ({ va, vg, ia: mA * 1e-3 }));

/** 6SL7: Twin high-mu triode (6SL7GT), octal; input stages and phase splitters. Values SI (V, A, Ω, S, F, W). */
export const tube6SL7 = defineTube({
  id: '6SL7',
  description: 'Twin high-mu triode (6SL7GT), octal; input stages and phase splitters.',
  params: { mu: 73.539, ex: 1.2, kg1: 1447.95, kp: 561.338, kvb: 9663.22 },
  gridResistance: 2000,
  fit: {
    method: 'this project\'s fit to the 26 points read from the plate curves and the typical point below (scripts/fit-library.ts)',
    rmsPercent: 2.2,
    worst: 'mu at 250 V/-2 V: +3.4 %',
    rejected: 'the fit to the typical point alone: RMS 10.0 % over the curves, worst -29.5 % (1 mA at 110 V/-1 V)',
    curveRmsPercent: 3.9,
    curveWorst: 'Ia at 50 V/0 V on the curves: -13.1 %',
  },
  directlyHeated: false,
  sections: 2,
  heaters: [
    { wiring: 'single', volts: 6.3, amps: 0.3, source: 'from memory' },
  ],
  ratings: {
    maxPlateVoltage: 300,
    maxPlateDissipation: 1,
    maxHeaterCathodeVoltage: 90,
    source: 'design-centre, from memory',
  },
  capacitances: { cgk: 3e-12, cgp: 2.8e-12, cpk: 3.8e-12, source: 'from memory, low confidence' },
  // Points of 1 mA and more, seven grid voltages from 0 to -6 V. The readings at each curve's foot (near 0 mA) are left
  // out: a relative error means nothing there. Currents in A.
  curves: {
    source: 'a data sheet\'s "6SL7, 12SL7 Average Plate Characteristics" graph (0 to -6 V in 1 V steps), as read in words by the author of the "Fun with transistors" pages (angelfire.com/planet/funwithtransistors, figure 4A.6): their reading, not ours',
    points: [
      ...curve(0, [[50, 1], [97, 2], [140, 3], [180, 4], [215, 5]]),
      ...curve(-1, [[110, 1], [163, 2], [210, 3], [250, 4], [290, 5]]),
      ...curve(-2, [[185, 1], [235, 2], [280, 3], [322, 4], [349, 4.6]]),
      ...curve(-3, [[255, 1], [307, 2], [350, 3], [394, 4]]),
      ...curve(-4, [[320, 1], [375, 2], [423, 3]]),
      ...curve(-5, [[390, 1], [445, 2]]),
      ...curve(-6, [[460, 1], [480, 1.25]]),
    ],
  },
  typical: [
    { va: 250, vg: -2, ia: 2.3e-3, mu: 70, rp: 44000, gm: 1600e-6, source: 'typical point: from memory (mu quoted in a secondary source)' },
  ],
});
