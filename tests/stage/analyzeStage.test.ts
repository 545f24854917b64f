import { describe, expect, it } from 'vitest';
import { analyzeStage, findTube, nearestReachable, solveStage } from '../../src/index';
import { korenPlateCurrent } from '../../src/tube/koren';
import { gridCurrent } from '../../src/tube/gridCurrent';
import { expectClose } from '../helpers/expectClose';

// Our own stage: a 12AX7 at 300 V, 100k and 1.5k bypassed, into 470k.
const ax7 = findTube('12AX7')!;
const au7 = findTube('12AU7')!;
const stage = { tube: ax7, bplus: 300, ra: 100e3, rk: 1500, bypassed: true, rl: 470e3, rsource: 1e3, rg: 1e6 };
const levels = { levelRms: 2, thdLimit: 0.05 };

describe('analyzeStage: a voltage stage as the workbench shows it', () => {
  it('its solution is the stage\'s own, its overlay is drawn at that point, and the curve sheet is reused while the tube and window stay', () => {
    const a = analyzeStage(stage, { second: null, levels }, null);
    if (!a.ok) throw new Error(a.message);
    const own = solveStage(stage);
    if (!own.ok) throw new Error(own.message);
    expect(a.solution.op).toEqual(own.op);
    expect(a.overlay.point).toEqual({ v: own.op.vpk, i: own.op.ia });
    const moved = analyzeStage({ ...stage, ra: 120e3 }, { second: null, levels }, a);
    if (!moved.ok) throw new Error(moved.message);
    expect(moved.sheet).toBe(a.sheet);
    const otherTube = analyzeStage({ ...stage, tube: au7, rk: 1000 }, { second: null, levels }, a);
    expect(otherTube.ok && otherTube.sheet).not.toBe(a.sheet);
  });

  it('draws up to 24 curves when asked (the densest sheet the workbench offers) and refuses a count outside 1 to 24, naming it', () => {
    const dense = analyzeStage(stage, { second: null, levels, maxCurves: 24 }, null);
    const usual = analyzeStage(stage, { second: null, levels }, null);
    if (!dense.ok || !usual.ok) throw new Error('the demo stage runs');
    expect(dense.sheet.family.length).toBeGreaterThan(usual.sheet.family.length);
    expect(dense.sheet.family.length).toBeLessThanOrEqual(24);
    for (const maxCurves of [0, 25, 2.5, Number.NaN]) {
      const r = analyzeStage(stage, { second: null, levels, maxCurves }, null);
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r.field).toBe('maxCurves');
    }
  });

  // Ohm's law at the grid: where the leak alone biases it, Vgk + Rg·Ig(Vgk) = 0 (no Rk). The curve drawn there is where
  // the drag stops (nearestReachable), so the chart shows the limit the pointer meets.
  it('draws the plate curve at the grid-leak limit, where the drag stops; none with no leak; kept while Rg stays', () => {
    const a = analyzeStage(stage, { second: null, levels }, null);
    if (!a.ok) throw new Error(a.message);
    const limit = a.sheet.gridLimit!;
    expect(limit.vg).toBeLessThan(-0.5);
    expect(Math.abs(limit.vg + stage.rg * gridCurrent(ax7.model, limit.vg))).toBeLessThan(1e-6);
    for (const p of limit.points.filter((_, k) => k % 20 === 0)) expectClose(p.i, korenPlateCurrent(ax7.model.params, p.v, limit.vg), { rel: 1e-12, abs: 1e-15 }, `Ia at ${p.v} V`);
    const stop = nearestReachable(ax7, stage.bplus, 150, 0.05, stage.rg);
    if (!stop.ok) throw new Error(stop.message);
    expectClose(stop.ia, korenPlateCurrent(ax7.model.params, stop.vpk, limit.vg), { rel: 1e-5 }, 'the drag stops on the curve drawn');
    // A drag keeps the sheet; a new leak redraws its limit; no leak, no limit.
    const moved = analyzeStage({ ...stage, ra: 120e3 }, { second: null, levels }, a);
    expect(moved.ok && moved.sheet).toBe(a.sheet);
    const lower = analyzeStage({ ...stage, rg: 220e3 }, { second: null, levels }, a);
    if (!lower.ok) throw new Error(lower.message);
    expect(lower.sheet.gridLimit!.vg).toBeGreaterThan(limit.vg);
    expect(lower.sheet.family).toBe(a.sheet.family);
    const none = analyzeStage({ ...stage, rg: undefined }, { second: null, levels }, null);
    expect(none.ok && none.sheet.gridLimit).toBeNull();
  });

  it('a drag\'s frame keeps the heavy signal views from before, marked stale', () => {
    const a = analyzeStage(stage, { second: null, levels }, null);
    if (!a.ok) throw new Error(a.message);
    const frame = analyzeStage({ ...stage, ra: 120e3 }, { second: null, levels, light: true }, a);
    if (!frame.ok) throw new Error(frame.message);
    expect(frame.signal.stale).toBe(true);
    expect(frame.signal.response).toBe(a.signal.response);
  });

  // Common practice: a follower direct-coupled to a plate above its own B+'s reach draws grid current; a 12AU7
  // follower with 1 kΩ in its cathode cannot rise to a 12AX7's plate at about 200 V, so its grid would draw current.
  it('a follower that cannot run on this plate is a failure naming the second stage, in the full pass and a drag\'s frame', () => {
    const second = { kind: 'follower' as const, tube: au7, bplus: 300, rk: 1000 };
    for (const light of [false, true]) {
      const r = analyzeStage(stage, { second, levels, light }, analyzeStage(stage, { second: null, levels }, null) as never);
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r.field).toBe('stage2');
    }
  });
});
