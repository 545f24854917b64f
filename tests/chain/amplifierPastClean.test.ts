import { describe, expect, it } from 'vitest';
import { amplifierAtLevel, distortion, findTube, solveChain, type ChainInput } from '../../src/index';
import { expectClose } from '../helpers/expectClose';
import { SPLIT_LOAD_EL84_PAIR } from '../helpers/pushPullAmplifier';

// Our own designs. The one-stage amplifier is the single stage the grid-current checks hold against ngspice
// (tests/spice/gridCurrent.spice.test.ts: a 12AX7 from a 100k source); the chain must give the same figures.
const ax7 = findTube('12AX7')!;
const au7 = findTube('12AU7')!;
const oneStage: ChainInput = {
  source: { rsource: 100e3 },
  stages: [{ kind: 'common-cathode', tube: ax7, bplus: 300, ra: 100e3, rk: 1500, bypassed: true, coupling: { kind: 'capacitor', cc: 1, rg: 1e6 } }],
  load: { rl: 470e3 },
};
const threeStages: ChainInput = {
  source: { rsource: 1e3 },
  stages: [
    { kind: 'common-cathode', tube: ax7, bplus: 300, ra: 100e3, rk: 1500, bypassed: true, coupling: { kind: 'capacitor', cc: 100e-9, rg: 1e6 } },
    { kind: 'common-cathode', tube: au7, bplus: 300, ra: 47e3, rk: 1000, bypassed: true, coupling: { kind: 'capacitor', cc: 100e-9, rg: 470e3 } },
    { kind: 'follower', tube: au7, bplus: 300, rk: 47e3, coupling: { kind: 'direct' } },
  ],
  load: { rl: 100e3 },
};
const pushPull = SPLIT_LOAD_EL84_PAIR;

const clean = (c: ChainInput) => {
  const r = solveChain(c);
  if (!r.ok) throw new Error(r.message);
  return r;
};

describe('an amplifier driven past its clean limit', () => {
  it('a one-stage amplifier gives the single stage\'s figures past the onset of grid current (the same law through the same source and leak)', () => {
    const level = amplifierAtLevel(oneStage, { outputRms: 1.3 * clean(oneStage).output.rms });
    if (!level.ok) throw new Error(level.message);
    expect(level.pastClean).toEqual({ stage: 0, by: 'grid-current' });
    // The stage's input is its grid's open-circuit swing: the source's across the divider Rs–Rg.
    const gridPeak = (level.inputPeak * 1e6) / (1e6 + 100e3);
    const own = distortion({ tube: ax7, bplus: 300, ra: 100e3, rk: 1500, bypassed: true, rl: 470e3, rsource: 100e3, rg: 1e6 }, { inputRms: gridPeak / Math.SQRT2 });
    if (!own.ok) throw new Error(own.message);
    expect(own.pastClean).toBe('grid-current');
    expectClose(level.output.peak, own.outputPeak, { rel: 2e-3 }, 'output');
    expectClose(level.thd * 100, own.thdPercent, { rel: 0.02 }, 'THD');
  });

  it('THD rises with the level past the limit, each stage\'s headroom past its own limit negative, and the first to clip named', () => {
    const c = clean(threeStages);
    let last = amplifierAtLevel(threeStages, { outputRms: 0.9 * c.output.rms });
    if (!last.ok) throw new Error(last.message);
    expect(last.pastClean).toBeNull();
    for (const over of [1.1, 1.3, 1.6, 2]) {
      const r = amplifierAtLevel(threeStages, { outputRms: over * c.output.rms });
      if (!r.ok) throw new Error(r.message);
      expect(r.pastClean).toEqual({ stage: c.clipsFirst.stage, by: c.clipsFirst.by });
      expect(r.thd).toBeGreaterThan(last.thd);
      expectClose(r.output.rms, over * c.output.rms, { rel: 1e-6 }, 'the level asked');
      expect(r.stages[c.clipsFirst.stage]!.headroomDb!).toBeLessThan(0);
      last = r;
    }
  });

  it('a level the amplifier cannot give is a typed failure saying how far it goes', () => {
    const r = amplifierAtLevel(threeStages, { outputRms: 50 * clean(threeStages).output.rms });
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.reason).toBe('clipping');
    expect(r.field).toBe('outputRms');
    expect(r.message).toMatch(/cannot be had.*reaches [\d.]+ V rms at 10 times the clean input/);
  });

  it('past the limit of a chain with a push-pull pair, whose grids\' current is not followed, it says so instead of guessing', () => {
    const c = clean(pushPull);
    const inside = amplifierAtLevel(pushPull, { outputRms: 0.8 * c.output.rms });
    expect(inside.ok && inside.pastClean).toBeNull();
    const r = amplifierAtLevel(pushPull, { outputRms: 1.2 * c.output.rms });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toMatch(/stage 3's grid current is not followed/);
  });
});
