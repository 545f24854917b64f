import { describe, expect, it } from 'vitest';
import { analyzeOutput, analyzePushPull, findOutputTube, solveOutput } from '../../src/index';
import { EL34_SCREEN_DROPPED, PAIR_6L6GC_AB1 } from '../helpers/outputDesigns';

// Our own designs (tests/helpers/outputDesigns.ts): an EL34 single-ended on cathode bias, and a 6L6GC pair on fixed bias.
// The heater–cathode ratings are the records' own, one figure for both polarities (EL34 100 V, 6L6GC 200 V: from memory).
const el34 = EL34_SCREEN_DROPPED;
const pair6l6 = PAIR_6L6GC_AB1;
const heaterCathode = (findings: readonly { kind: string; value: number; severity: string; message: string }[]) => findings.find((f) => f.kind === 'heater-cathode');

describe('an output stage whose heaters share a winding held above ground', () => {
  it('a cathode-biased EL34 reads its cathode against the heaters\' potential: Vk above ground, Vk − 60 V with the winding at 60 V', () => {
    const tube = findOutputTube('EL34')!;
    const atGround = analyzeOutput(tube, el34, { light: true });
    const held = analyzeOutput(tube, { ...el34, heaterVolts: 60 }, { light: true });
    if (!atGround.ok || !held.ok) throw new Error('solve');
    const vk = atGround.solution.op.vk;
    expect(vk).toBeGreaterThan(15);
    expect(heaterCathode(atGround.findings)).toMatchObject({ value: vk });
    // The heaters do not move the operating point: the same cathode, now negative to its heaters by 60 − Vk.
    expect(held.solution.op.vk).toBe(vk);
    expect(heaterCathode(held.findings)?.value).toBeCloseTo(60 - vk, 9);
    expect(heaterCathode(held.findings)?.message).toContain('cathode negative to the heater');
  });

  it('a fixed-bias pair, its cathodes at ground, has no heater–cathode figure at ground and 60 V negative on a 60 V winding; 250 V is past its 200 V and told to come down', () => {
    const tube = findOutputTube('6L6GC')!;
    const at = (heaterVolts?: number) => {
      const a = analyzePushPull(tube, heaterVolts === undefined ? pair6l6 : { ...pair6l6, heaterVolts }, { light: true });
      if (!a.ok) throw new Error(a.message);
      return heaterCathode(a.findings);
    };
    expect(at()).toBeUndefined();
    expect(at(60)).toMatchObject({ value: 60, severity: 'note' });
    expect(at(250)).toMatchObject({ value: 250, severity: 'danger' });
    expect(at(250)?.message).toMatch(/hold the heaters lower\.$/);
  });

  it('a heater potential that is no number is a typed failure naming the field', () => {
    const r = solveOutput(findOutputTube('EL34')!, { ...el34, heaterVolts: Number.NaN });
    expect(r.ok).toBe(false);
    expect(!r.ok && r.field).toBe('heaterVolts');
  });
});
