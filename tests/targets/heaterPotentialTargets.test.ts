import { describe, expect, it } from 'vitest';
import { feasibleRegion, findOutputTube, findTube, judgeDesign, judgeFollower, judgeOutput } from '../../src/index';
import { EL34_SCREEN_DROPPED } from '../helpers/outputDesigns';

// The heater–cathode target reads the cathode against the heaters' potential and holds it to the rating for its
// polarity: the 12AU7's 200 V with the cathode positive to the heater, 100 V with it negative (Tung-Sol 12AU7, 1962);
// the EL34's one figure, 100 V (the record's, from memory). Designs of our own.
const au7 = findTube('12AU7')!;
const stage = { tube: au7, bplus: 275, ra: 27e3, rk: 1200, bypassed: true, rl: 220e3 };
const target = { heaterCathodeWithinRating: true };

describe('the heater–cathode target with the heaters held above ground', () => {
  it('a 12AU7 gain stage at 5.4 V meets it at ground and misses it with the heaters at 150 V: 144.6 V negative against 100 V', () => {
    const atGround = judgeDesign(stage, target);
    const held = judgeDesign({ ...stage, heaterVolts: 150 }, target);
    if (!atGround.ok || !held.ok) throw new Error('judge');
    const vk = atGround.values.heaterCathodeWithinRating!;
    expect(vk).toBeGreaterThan(4);
    expect(vk).toBeLessThan(7);
    expect(atGround.margins.heaterCathodeWithinRating).toBeCloseTo(1 - vk / 200, 9);
    expect(held.values.heaterCathodeWithinRating).toBeCloseTo(vk - 150, 9);
    expect(held.margins.heaterCathodeWithinRating).toBeCloseTo(1 - (150 - vk) / 100, 9);
    expect(held.failing).toContain('heaterCathodeWithinRating');
  });

  it('a follower on a 250 V plate (B+ 400 V) misses its 200 V at ground and meets it with the heaters at 60 V', () => {
    const f = { tube: au7, bplus: 400, vgrid: 250, rl: 220e3 };
    const atGround = judgeFollower(f, 22e3, target);
    const held = judgeFollower({ ...f, heaterVolts: 60 }, 22e3, target);
    if (!atGround.ok || !held.ok) throw new Error('judge');
    const vk = atGround.values.heaterCathodeWithinRating!;
    expect(vk).toBeGreaterThan(200);
    expect(atGround.failing).toContain('heaterCathodeWithinRating');
    expect(held.values.heaterCathodeWithinRating).toBeCloseTo(vk - 60, 9);
    expect(held.failing).not.toContain('heaterCathodeWithinRating');
  });

  it('an EL34 output stage on a winding held at 150 V misses its 100 V with the cathode negative', () => {
    const tube = findOutputTube('EL34')!;
    const atGround = judgeOutput({ pair: 'single-ended', tube, design: EL34_SCREEN_DROPPED }, target);
    const held = judgeOutput({ pair: 'single-ended', tube, design: { ...EL34_SCREEN_DROPPED, heaterVolts: 150 } }, target);
    if (!atGround.ok || !held.ok) throw new Error('judge');
    const vk = atGround.values.heaterCathodeWithinRating!;
    expect(atGround.failing).not.toContain('heaterCathodeWithinRating');
    expect(held.values.heaterCathodeWithinRating).toBeCloseTo(vk - 150, 9);
    expect(held.margins.heaterCathodeWithinRating).toBeCloseTo(1 - (150 - vk) / 100, 9);
  });

  it('the region refuses a heater potential that is no number, naming it', () => {
    const r = feasibleRegion({ tube: au7, bplus: 275, rl: 220e3, rsource: 1e3, bypassed: true, heaterVolts: Number.NaN }, target, { nx: 4, ny: 3 });
    expect(r.ok).toBe(false);
    expect(!r.ok && r.field).toBe('heaterVolts');
  });
});
