import { describe, expect, it } from 'vitest';
import { findOutputTube, findTube, type ChainInput } from '../../src/index';
import { ChainSignal, CLIP_REL_TOL } from '../../src/chain/chainSwing';
import type { LinkSample, SolvedLink } from '../../src/chain/stageKind';
import { prepareAmplifier } from '../../src/chain/solveAmplifier';
import { SPLIT_LOAD_EL84_PAIR } from '../helpers/pushPullAmplifier';

// Our own amplifiers, one for each way a stage's swing ends: a voltage stage into grid current, a direct-coupled
// follower, a single-ended output stage (cutoff read on its settled swing) and a push-pull pair (cutoff at the instant).
const ax7 = findTube('12AX7')!;
const au7 = findTube('12AU7')!;
const fourStages: ChainInput = {
  source: { rsource: 1e3 },
  stages: [
    { kind: 'common-cathode', tube: ax7, bplus: 290, ra: 100e3, rk: 1500, bypassed: true, coupling: { kind: 'capacitor', cc: 100e-9, rg: 1e6 } },
    { kind: 'common-cathode', tube: au7, bplus: 290, ra: 33e3, rk: 3300, bypassed: false, coupling: { kind: 'capacitor', cc: 68e-9, rg: 470e3 } },
    { kind: 'follower', tube: au7, bplus: 290, rk: 33e3, coupling: { kind: 'direct' } },
    {
      kind: 'single-ended-output', tube: findOutputTube('EL34')!, connection: 'ultralinear', bplus: 330, screenVolts: 300, ulTap: 0.43, zPrimary: 3300, rPrimary: 120,
      bias: 'cathode', rk: 330, vg: -20, speakerOhms: 8, thdLimit: 0.05, coupling: { kind: 'capacitor', cc: 220e-9, rg: 270e3 },
    },
  ],
};
const pushPull = SPLIT_LOAD_EL84_PAIR;

// A cold-biased 6SN7 with a light plate load: its plate current runs out before its grid reaches current.
const coldStage: ChainInput = {
  source: { rsource: 1e3 },
  stages: [{ kind: 'common-cathode', tube: findTube('6SN7')!, bplus: 300, ra: 10e3, rk: 6800, bypassed: true, coupling: { kind: 'capacitor', cc: 100e-9, rg: 1e6 } }],
};

describe("the search for each stage's clean limit", () => {
  it.each([['four stages to a single-ended output', fourStages], ['a split-load splitter and a push-pull pair', pushPull], ['a cold stage that cuts off first', coldStage]])(
    '%s: every stage stops at the first source peak where a limit is reached, to CLIP_REL_TOL, whatever the first guess',
    (_name, chain) => {
      const a = prepareAmplifier(chain);
      if (!a.ok) throw new Error(a.message);
      a.clips.forEach((clip, i) => {
        if (!clip) return;
        // By definition: reached at the answer, not reached a tolerance below it (each limit rises with the drive).
        expect(a.signal.reachAt(i, clip.inputPeak).by, `stage ${i + 1} at its limit`).toBe(clip.by);
        expect(a.signal.reachAt(i, clip.inputPeak * (1 - CLIP_REL_TOL)).by, `stage ${i + 1} just below`).toBeNull();
        // A guess a hundred times off either way grows or shrinks a different bracket, and must land on the same peak.
        for (const scale of [0.01, 100]) {
          const again = a.signal.clipOf(i, clip.inputPeak * scale)!;
          expect(again.by).toBe(clip.by);
          expect(Math.abs(again.inputPeak / clip.inputPeak - 1), `stage ${i + 1}, guess × ${scale}`).toBeLessThanOrEqual(2 * CLIP_REL_TOL);
        }
      });
      expect(a.clips.filter((c) => c).length, 'every stage reaches a limit').toBe(chain.stages.length);
    },
  );

  it('finds cutoff as well as grid current', () => {
    const a = prepareAmplifier(coldStage);
    if (!a.ok) throw new Error(a.message);
    expect(a.clips[0]!.by).toBe('cutoff');
  });

  it('closes in on a limit approached in a shape false position handles badly (a ninth power), within tolerance and the step budget', () => {
    // A stand-in stage of our own: its grid swings as the ninth power of the drive, so the margin is flat, then a wall;
    // plain false position would creep from one side. The link carries only what the search reads.
    let calls = 0;
    const link = {
      op: { va: 200, vk: 2, ia: 1e-3, vgk: -2 }, outputDc: 200, supplyCurrent: 1e-3, gain: -10, zin: 1e6, zout: 1e4, cutoffCurrent: 1e-5,
      sample: (vin: number, out: LinkSample) => {
        calls++;
        out.vgk = -2 + 1e-3 * Math.sign(vin) * Math.abs(vin) ** 9;
        out.vout = -10 * vin;
        out.ia = 1e-3;
        out.vout2 = 0;
      },
      findings: [],
    } as unknown as SolvedLink;
    const signal = new ChainSignal([link], 1);
    // The grid reaches −0.7 V (GRID_CURRENT_ONSET) where 1e-3·v⁹ = 1.3.
    const exact = (1.3 / 1e-3) ** (1 / 9);
    const clip = signal.clipOf(0, exact / 50)!;
    expect(clip.by).toBe('grid-current');
    expect(Math.abs(clip.inputPeak / exact - 1)).toBeLessThanOrEqual(CLIP_REL_TOL);
    expect(clip.inputPeak).toBeGreaterThanOrEqual(exact);
    // No slower than bisection from the same bracket: six doublings from a fiftieth, then 17 halvings to 10 ppm, each reach two passes.
    expect(calls).toBeLessThanOrEqual(2 * (6 + 17));
  });
});
