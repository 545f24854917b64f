import { describe, expect, it } from 'vitest';
import { findTube, followerRegion, judgeFollower, rankFollowers, solveAmplifier, solveFollower, type ChainInput } from '../../src/index';

// A demo scenario of our own (invented targets, marked so): a 12AU7 follower on a 12AU7 gain stage's plate, on 275 V,
// into a 220k grid leak; at most half its 2.75 W plate rating, 20 V rms clean, its cathode within its heater rating.
const au7 = findTube('12AU7')!;
const gain = { kind: 'common-cathode' as const, tube: au7, bplus: 275, ra: 27e3, rk: 1200, bypassed: true, coupling: { kind: 'capacitor' as const, cc: 470e-9, rg: 1e6 } };
const alone = solveAmplifier({ source: { rsource: 1e3 }, stages: [gain] });
if (!alone.ok) throw new Error(alone.message);
const vgrid = alone.stages[0]!.op.va;
const stage = { tube: au7, bplus: 275, vgrid, rl: 220e3 };
const targets = { maxDissipationFraction: 0.5, minCleanOutputRms: 20, heaterCathodeWithinRating: true };

describe('targets for a cathode follower: the stretches of its line where they hold', () => {
  const region = followerRegion(stage, targets);
  if (!region.ok) throw new Error(region.message);

  it('dissipation: the edge is where Vpk·Ia reaches half the rating, within one sample of the hand calculation', () => {
    // Hand-worked: along its line the cathode sits a volt or two above the grid (about −1.5 V from the 12AU7's curves near
    // 11 mA), so Vpk ≈ 275 − vgrid − 1.5 V, and the edge is at Ia = 1.375 W / Vpk.
    const vpk = 275 - vgrid - 1.5;
    const edge = 1.375 / vpk;
    const step = region.ia[0]! - region.ia[1]!;
    const over = region.ia.filter((_, k) => region.failing[k]!.includes('maxDissipationFraction'));
    const under = region.ia.filter((_, k) => !region.failing[k]!.includes('maxDissipationFraction'));
    expect(Math.min(...over)).toBeGreaterThan(edge - step - 0.01 * edge);
    expect(Math.max(...under)).toBeLessThan(edge + step + 0.01 * edge);
  });

  it('every sample marked inside, put in the real amplifier (direct-coupled to the gain stage), is within its ratings targets', () => {
    const insideRks = region.rk.filter((_, k) => region.inside[k]);
    expect(insideRks.length).toBeGreaterThan(5);
    for (const rk of insideRks) {
      const chain: ChainInput = { source: { rsource: 1e3 }, stages: [gain, { kind: 'follower', tube: au7, bplus: 275, rk, coupling: { kind: 'direct' } }], load: { rl: 220e3 } };
      const r = solveAmplifier(chain);
      if (!r.ok) throw new Error(r.message);
      const f = r.stages[1]!;
      expect(f.op.ia * (275 - f.op.vk), `Pa at Rk ${rk.toFixed(0)}`).toBeLessThanOrEqual(0.5 * 2.75 * 1.0001);
      // The 12AU7's heater–cathode rating, cathode positive: 200 V (record's ratings).
      expect(f.op.vk).toBeLessThan(200);
    }
  });

  it('and every sample marked outside fails at least one target when judged on its own', () => {
    region.rk.forEach((rk, k) => {
      if (region.inside[k]) return;
      const v = judgeFollower(stage, rk, targets);
      expect(v.ok && v.failing.length).toBeGreaterThan(0);
    });
  });

  it('the clean output fails near the top of the line: the grid there sits close to its cathode, and grid current comes early', () => {
    expect(region.failing[0]).toContain('minCleanOutputRms');
    expect(region.best && region.inside[region.best.index]).toBe(true);
  });

  it('a target no point meets is named, with the share of the line it excludes', () => {
    const none = followerRegion(stage, { maxZout: 50 });
    expect(none.ok && none.inside.some(Boolean)).toBe(false);
    expect(none.ok && none.excludesMost?.target).toBe('maxZout');
    // Ra's range does not apply to a follower: it is not judged.
    const ra = followerRegion(stage, { raRange: [1, 2] });
    expect(ra.ok && ra.inside.every(Boolean)).toBe(true);
  });

  it('ranks the tubes as followers in this socket, best first, the top one meeting every target at its Rk', () => {
    const r = rankFollowers(targets, { bplus: 275, vgrid, rl: 220e3 });
    if (!r.ok) throw new Error(r.message);
    expect(r.ranks.length).toBeGreaterThan(5);
    for (let k = 1; k < r.ranks.length; k++) expect(r.ranks[k - 1]!.score).toBeGreaterThanOrEqual(r.ranks[k]!.score);
    const top = r.ranks[0]!;
    const again = judgeFollower({ ...stage, tube: findTube(top.tubeId)! }, top.rk, targets);
    expect(again.ok && again.failing).toEqual([]);
    expect(solveFollower({ ...stage, tube: findTube(top.tubeId)!, rk: top.rk }).ok).toBe(true);
  });

  it('bad input is a typed failure', () => {
    expect(followerRegion(stage, targets, 1).ok).toBe(false);
    expect(judgeFollower(stage, -5, targets).ok).toBe(false);
    expect(followerRegion({ ...stage, vgrid: -200 }, targets).ok).toBe(false);
  });
});
