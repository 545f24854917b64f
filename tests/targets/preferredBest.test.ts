import { describe, expect, it } from 'vitest';
import { feasibleRegion, findTube, judgeDesign, preferredAround, preferredBest, type Targets } from '../../src/index';

const au7 = findTube('12AU7')!;
const stage = { tube: au7, bplus: 275, rl: 220e3, rsource: 1e3, bypassed: true };
/** E24 (IEC 60063): the mantissas every value must come from. */
const E24 = [1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6, 6.2, 6.8, 7.5, 8.2, 9.1];
const inE24 = (v: number) => E24.some((m) => Math.abs(v / 10 ** Math.floor(Math.log10(v) + 1e-9) - m) < 1e-9);
const weakest = (m: Record<string, number | undefined>) => Math.min(...Object.values(m).filter((x): x is number => x !== undefined));

describe('the best point as parts to order', () => {
  const targets: Targets = { minGain: 13, maxDissipationFraction: 0.6 };
  const region = feasibleRegion(stage, targets, { nx: 30, ny: 20 });
  if (!region.ok || !region.best) throw new Error('a best point');
  const best = region.best;
  const exact = { ...stage, ra: best.ra, rk: best.rk };

  it('takes E24 values (IEC 60063) around the exact best, the pair whose weakest target holds best', () => {
    const r = preferredBest(exact, targets, 'E24');
    if (!r.ok) throw new Error(r.message);
    expect(inE24(r.ra) && inE24(r.rk)).toBe(true);
    expect(preferredAround(exact.ra, 'E24')).toContain(r.ra);
    expect(preferredAround(exact.rk, 'E24')).toContain(r.rk);
    // No other pair around it does better on its weakest target.
    const chosen = weakest(r.verdict.margins);
    for (const ra of preferredAround(exact.ra, 'E24')) for (const rk of preferredAround(exact.rk, 'E24')) {
      const v = judgeDesign({ ...exact, ra, rk }, targets);
      if (v.ok) expect(weakest(v.margins)).toBeLessThanOrEqual(chosen + 1e-12);
    }
    // The exact best meets both with room, so the parts to order do too.
    expect(best.score).toBeGreaterThan(0.05);
    expect(r.verdict.failing).toEqual([]);
  });

  it('an unknown series or a bad resistor is a typed failure', () => {
    expect(preferredBest(exact, targets, 'E7' as never).ok).toBe(false);
    const r = preferredBest({ ...exact, ra: -1 }, targets, 'E24');
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toMatch(/Ra and Rk must be positive/);
  });
});
