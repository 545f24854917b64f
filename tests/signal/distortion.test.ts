import { describe, expect, it } from 'vitest';
import { distortion, findTube, formatValue, sineLevel, solvedStage, swing } from '../../src/index';
import { expectClose } from '../helpers/expectClose';
import { distortionSweep } from '../../src/signal/distortionSweep';

const ax7 = findTube('12AX7')!;
const stage = { tube: ax7, bplus: 250, ra: 100e3, rk: 1500, rl: 470e3 };

describe('distortion and swing', () => {
  it('meets the asked output level, and H2 dominates in a single-ended triode stage (common practice)', () => {
    const r = distortion(stage, { outputRms: 5 });
    if (!r.ok) throw new Error(r.message);
    expectClose(r.outputRms, 5, { rel: 1e-6 });
    expect(r.harmonicsDb).toHaveLength(8);
    expect(r.harmonicsDb[0]!).toBeGreaterThan(r.harmonicsDb[1]!);
    expect(r.thdPercent).toBeGreaterThan(0.1);
    expect(r.thdPercent).toBeLessThan(5);
  });

  it('an unbypassed cathode lowers distortion and gain together (common practice)', () => {
    const by = distortion({ ...stage, bypassed: true }, { outputRms: 5 });
    const un = distortion({ ...stage, bypassed: false }, { outputRms: 5 });
    if (!by.ok || !un.ok) throw new Error('both should solve');
    expect(un.thdPercent).toBeLessThan(by.thdPercent);
    expect(un.inputRms).toBeGreaterThan(by.inputRms); // less gain: more input for the same output
  });

  // Common practice: a triode stage's distortion grows with level (mostly H2, about in proportion to it).
  it('THD rises with level from a small signal up to the clipping point (common practice)', () => {
    const s = solvedStage(stage);
    if (!s.ok) throw new Error(s.message);
    const sweep = distortionSweep(s, 10);
    expect(sweep).toHaveLength(10);
    for (let k = 1; k < sweep.length; k++) expect(sweep[k]!.thdPercent).toBeGreaterThan(sweep[k - 1]!.thdPercent);
  });

  it('a level no drive reaches is reported as clipping, with the level where clean ends', () => {
    const clean = swing(stage);
    if (!clean.ok) throw new Error(clean.message);
    const r = distortion(stage, { outputRms: 500 });
    expect(r).toEqual({
      ok: false,
      reason: 'clipping',
      message: `This stage cannot give 500 V rms: it is clean up to ${formatValue(clean.output.rms, 'V')} rms out (${formatValue(clean.input.rms, 'V')} rms in), where grid current sets in, and driven 10 times harder its output hardly grows.`,
      field: 'outputRms',
    });
  });

  it('past the clean limit the distortion is computed, and says which limit the level is past', () => {
    const clean = swing(stage);
    if (!clean.ok) throw new Error(clean.message);
    const inside = distortion(stage, { inputRms: clean.input.rms * 0.99 });
    const past = distortion(stage, { inputRms: clean.input.rms * 1.5 });
    if (!inside.ok || !past.ok) throw new Error('both should solve');
    expect(inside.pastClean).toBeNull();
    expect(past.pastClean).toBe('grid-current');
    expect(past.thdPercent).toBeGreaterThan(inside.thdPercent);
    const byOutput = distortion(stage, { outputRms: past.outputRms });
    if (!byOutput.ok) throw new Error(byOutput.message);
    expectClose(byOutput.inputRms, past.inputRms, { rel: 1e-6 }, 'the same level asked by its output');
  });

  it('with Rk bypassed, the positive half-cycle is clean until the grid reaches the onset of grid current: an input peak of −0.7 V − Vgk', () => {
    const r = swing(stage);
    if (!r.ok) throw new Error(r.message);
    expect(r.limitedBy).toBe('grid-current');
    expectClose(r.toGridCurrent, 1.3142747 - 0.7, { rel: 1e-3 }); // this stage's Vgk, from solveStage, less the onset
  });

  // dBV re 1 V rms and dBu re 0.7746 V rms (1 mW into 600 Ω): common practice in audio.
  it('levels: 1 V rms is 0 dBV and 0.7746 V rms is 0 dBu (1 mW into 600 Ω)', () => {
    expectClose(sineLevel(Math.SQRT2).dBV!, 0, { abs: 1e-12 });
    expectClose(sineLevel(Math.SQRT2 * Math.sqrt(0.6)).dBu!, 0, { abs: 1e-12 });
  });

  it('a level of nothing is exactly 0 V with no dB figure, never −Infinity or 6e−25 V', () => {
    expect(sineLevel(0)).toEqual({ peak: 0, rms: 0, dBV: null, dBu: null });
    expect(sineLevel(6.13e-25)).toEqual({ peak: 0, rms: 0, dBV: null, dBu: null });
  });

  it('a stage with Rk 0 and no fixed bias has no clean swing: exactly 0 V, limited by grid current', () => {
    const r = swing({ tube: findTube('12AX7')!, bplus: 250, ra: 100e3, rk: 0 });
    if (!r.ok) throw new Error(r.message);
    expect(r.output.rms).toBe(0);
    expect(r.output.dBu).toBeNull();
    expect(r.limitedBy).toBe('grid-current');
  });

  it('refuses a bad sample count and a non-positive level with specific messages', () => {
    expect(distortion(stage, { outputRms: 1 }, { samples: 1000 })).toEqual({ ok: false, reason: 'invalid-input', message: 'Samples per cycle must be a power of two from 32 to 16384 (got 1000)', field: 'samples' });
    expect(distortion(stage, { outputRms: 0 })).toEqual({ ok: false, reason: 'invalid-input', message: 'Output level must be above 0 V rms (got 0)', field: 'outputRms' });
  });
});
