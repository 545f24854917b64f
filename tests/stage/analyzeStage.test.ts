import { describe, expect, it } from 'vitest';
import { analyzeStage, findTube, solveStage } from '../../src/index';

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
