import { describe, expect, it } from 'vitest';
import { analyzePushPull, findOutputTube, type PushPullDesign } from '../../src/index';
import { relErr } from '../helpers/expectClose';

/**
 * Data sheets' push-pull class AB1 examples, reproduced from the model with
 * the sheet's voltages and plate-to-plate load (no primary resistance), the
 * grids driven to 0 V peak as the sheets quote power. All four records are
 * from memory of the manufacturers' sheets (no sheet is in this project's
 * reference folder): power within 25 %, zero-signal plate current of the
 * pair within 25 %. A miss would be listed with its measured value and
 * asserted to still miss; none misses today.
 */
interface Example {
  readonly name: string;
  readonly design: PushPullDesign;
  readonly watts: number;
  /** Zero-signal plate current, both tubes, A. */
  readonly idlePlate: number;
  readonly source: string;
}

const base = { ulTap: 0.4, rPrimary: 0, rk: 1, vg: 0, rg: 100e3, speakerOhms: 8, thdLimit: 0.05, bias: 'fixed' as const };
const EXAMPLES: readonly Example[] = [
  { name: '6V6GT 285 V', design: { ...base, tubeId: '6V6GT', connection: 'pentode', bplus: 285, screenVolts: 285, vg: -19, raa: 8000 }, watts: 14, idlePlate: 0.070, source: 'RCA 6V6GT sheet, push-pull class AB1: 14 W at 3.5 %, 70 mA zero-signal (from memory)' },
  { name: '6L6GC 450 V', design: { ...base, tubeId: '6L6GC', connection: 'pentode', bplus: 450, screenVolts: 400, vg: -37, raa: 5600 }, watts: 55, idlePlate: 0.116, source: 'RCA 6L6GC sheet, push-pull class AB1: 55 W at 1.8 %, 116 mA zero-signal (from memory)' },
  { name: 'EL84 250 V, 130 Ω shared', design: { ...base, tubeId: 'EL84', connection: 'pentode', bplus: 250, screenVolts: 250, bias: 'cathode', rk: 130, raa: 8000 }, watts: 11, idlePlate: 0.062, source: 'Philips EL84 sheet, push-pull class AB, cathode bias: 11 W at 3 %, 2 × 31 mA zero-signal (from memory)' },
  { name: '2A3 300 V', design: { ...base, tubeId: '2A3', connection: 'triode', bplus: 300, screenVolts: 300, vg: -62, raa: 3000 }, watts: 15, idlePlate: 0.080, source: 'RCA 2A3 sheet, push-pull class AB1 fixed bias: 15 W at 2.5 %, 80 mA zero-signal (from memory)' },
];

const KNOWN_MISSES: Record<string, string> = {};

describe('push-pull pairs against data-sheet examples', () => {
  for (const ex of EXAMPLES) {
    it(`${ex.name}: power and idle current (${ex.source})`, () => {
      const a = analyzePushPull(findOutputTube(ex.design.tubeId)!, ex.design);
      if (!a.ok) throw new Error(a.message);
      const idle = a.solution.idle[0].ia + a.solution.idle[1].ia;
      const pErr = relErr(a.full.power, ex.watts);
      if (ex.name in KNOWN_MISSES) expect(Math.abs(pErr), `known miss (${KNOWN_MISSES[ex.name]}) now within 25 %: remove it from the list`).toBeGreaterThan(25);
      else expect(Math.abs(pErr), `${a.full.power.toFixed(2)} W against ${ex.watts} W`).toBeLessThanOrEqual(25);
      expect(Math.abs(relErr(idle, ex.idlePlate)), `${(idle * 1e3).toFixed(1)} mA against ${ex.idlePlate * 1e3} mA`).toBeLessThanOrEqual(25);
    });
  }
});
