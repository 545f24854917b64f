import { describe, expect, it } from 'vitest';
import { distortion, findTube, levelAtThd, solveStage, swing, type StageDesign } from '../../src/index';
import { expectClose } from '../helpers/expectClose';

// A row of the published resistance-coupled table for the 12AU7, as the issue reporting it quotes it:
// B+ 300 V, Ra 0.1 MΩ, Rk 1.8 kΩ bypassed, next grid 0.1 MΩ, generator 0.1 MΩ: gain 14, 40 V rms out at 5 % THD.
const au7Row: StageDesign = { tube: findTube('12AU7')!, bplus: 300, ra: 100e3, rk: 1800, bypassed: true, rl: 100e3, rsource: 100e3, rg: 1e6 };
const ax7: StageDesign = { tube: findTube('12AX7')!, bplus: 300, ra: 100e3, rk: 1500, bypassed: true, rl: 470e3, rsource: 100e3, rg: 1e6 };

describe('the output level at a chosen THD', () => {
  it('THD at the level found is the limit asked, past the clean swing when that is where it lands', () => {
    for (const design of [au7Row, ax7]) {
      for (const thd of [0.01, 0.05]) {
        const r = levelAtThd(design, thd);
        if (!r.ok) throw new Error(r.message);
        const check = distortion(design, { outputRms: r.outputRms });
        if (!check.ok) throw new Error(check.message);
        expectClose(check.thdPercent, 100 * thd, { rel: 0.01 }, `THD at the level found, ${design.tube.kind === 'tube' ? design.tube.id : ''} ${thd}`);
        expect(r.limitedBy === 'curvature').toBe(check.pastClean === null);
      }
    }
  });

  it('1 % lands inside the clean swing, on the curves\u2019 own bend; 5 % on the 12AU7 row past the onset of grid current', () => {
    const one = levelAtThd(au7Row, 0.01);
    const five = levelAtThd(au7Row, 0.05);
    const clean = swing(au7Row);
    if (!one.ok || !five.ok || !clean.ok) throw new Error('should solve');
    expect(one.limitedBy).toBe('curvature');
    expect(one.outputRms).toBeLessThan(clean.output.rms);
    expect(five.limitedBy).toBe('grid-current');
    expect(five.outputRms).toBeGreaterThan(clean.output.rms);
  });

  it('the table\u2019s 40 V rms is computed, past the clean swing, not refused', () => {
    const r = distortion(au7Row, { outputRms: 40 });
    if (!r.ok) throw new Error(r.message);
    expect(r.pastClean).toBe('grid-current');
    expect(r.thdPercent).toBeGreaterThan(5);
  });

  it('the gain on the 12AU7 row is the table\u2019s 14 within 10 %', () => {
    const s = solveStage(au7Row);
    if (!s.ok) throw new Error(s.message);
    expectClose(-s.gain, 14, { rel: 0.1 });
  });

  // Known miss, listed: the 12AU7's output at 5 % THD is about a quarter under the table's 40 V rms (30 V):
  // its curves are fitted to two high-current points, not where it is biased here (see the issue on fitting
  // whole plate-curve families). This fails the day it comes within 15 %, and then becomes a plain check.
  it.fails('known miss: the 12AU7 row gives the table\u2019s 40 V rms at 5 % THD within 15 %', () => {
    const r = levelAtThd(au7Row, 0.05);
    if (!r.ok) throw new Error(r.message);
    expectClose(r.outputRms, 40, { rel: 0.15 });
  });

  it('a limit that is not a fraction between 0 and 1 is a typed failure naming the field', () => {
    for (const bad of [0, -0.05, 1, 5, Number.NaN, Infinity]) expect(levelAtThd(au7Row, bad)).toMatchObject({ ok: false, reason: 'invalid-input', field: 'thd' });
  });

  it('past the onset, more source impedance pulls the grid lower: the output for the same drive falls as the source rises (Ohm\u2019s law on the grid current)', () => {
    const clean = swing(au7Row);
    if (!clean.ok) throw new Error(clean.message);
    const outputs = [0, 10e3, 100e3, 470e3].map((rsource) => {
      const r = distortion({ ...au7Row, rsource }, { inputRms: 2 * clean.input.rms });
      if (!r.ok) throw new Error(r.message);
      return r.outputRms;
    });
    for (let k = 1; k < outputs.length; k++) expect(outputs[k]!).toBeLessThan(outputs[k - 1]!);
  });
});
