import type { BenchDesign } from './analysis';

/**
 * The design the bench opens on: a line stage of our own making. A 12AU7
 * section on a 275 V rail, plate resistor 27 kΩ, cathode resistor 1.2 kΩ
 * bypassed, driving a 220 kΩ level control of the next unit.
 */
export const DEMO_DESIGN: BenchDesign = {
  tubeId: '12AU7',
  bplus: 275,
  ra: 27e3,
  rk: 1200,
  bypassed: true,
  rl: 220e3,
  series: 'E24',
  snap: true,
};

export const DEMO_TITLE = 'Line stage, 12AU7 into a 220 k level control';
