import { describe, expect, it, vi } from 'vitest';
import { NO_TARGETS } from '../../../app/store/targetPlan';
import { createWorkbenchStore } from '../../../app/store/workbenchStore';
import { chartCaption } from '../../../app/export/chartCaption';
import { benchIndex, voltageStages } from '../../../app/store/stagePlans';
import { findTube, nearestPreferred, solveFollower } from '../../../src/index';
import { expectClose } from '../../helpers/expectClose';

/** The demo with a cathode follower after its first stage, the follower put on the bench. */
function followerOnBench() {
  const store = createWorkbenchStore();
  store.getState().addStage(0, 'follower');
  const list = voltageStages(store.getState().design);
  const at = list.findIndex((p) => p.kind === 'follower');
  store.getState().showStage(at);
  return store;
}

describe('a cathode follower on the bench', () => {
  it('choosing its card shows the follower: its gain stage goes on the bench under it, its own curves and point come up', () => {
    const store = followerOnBench();
    const s = store.getState();
    expect(s.design.stageKind).toBe('follower');
    expect(benchIndex(s.design)).toBe(0);
    const f = s.followerBench!;
    expect(f.tube.id).toBe(s.design.stage2.tubeId);
    // Its grid is the gain stage's plate; the solved point is the follower's own (Ohm's law round its cathode).
    expectClose(f.vgrid, s.analysis.solution.op.va, { rel: 1e-12 });
    const again = solveFollower({ tube: findTube(f.tube.id)!, bplus: s.design.bplus, vgrid: f.vgrid, rk: s.design.stage2.rk });
    expect(again.ok && again.op.vk).toBeCloseTo(f.plane.solution.op.vk, 6);
  });

  it('dragging its point chooses its Rk (the one that draws the current under the pointer), snaps it on release, and is one undo step', () => {
    const store = followerOnBench();
    const before = store.getState().design;
    const f = store.getState().followerBench!;
    const target = f.plane.solution.op.ia * 1.3;
    store.getState().beginDrag('point');
    expect(store.getState().dragging).toBe('follower-point');
    store.getState().dragPointTo(0, target);
    const dragged = store.getState();
    expectClose(dragged.followerBench!.plane.solution.op.ia, target, { rel: 1e-6 }, 'the point follows the pointer\'s current');
    expect(dragged.design.stage2.rk).toBeLessThan(before.stage2.rk);
    // The gain stage under it does not move: only the follower's Rk changed.
    expect(dragged.design.ra).toBe(before.ra);
    store.getState().endDrag();
    const rk = store.getState().design.stage2.rk;
    expect(nearestPreferred(rk, store.getState().design.series), `${rk} is a preferred value`).toBe(rk);
    expect(rk).not.toBe(dragged.design.stage2.rk);
    store.getState().undo();
    expect(store.getState().design.stage2.rk).toBe(before.stage2.rk);
    expect(store.getState().design.stageKind).toBe('follower');
  });

  it('the arrow keys move it along its line (more current up, less down); Escape puts it back', () => {
    const store = followerOnBench();
    const ia0 = store.getState().followerBench!.plane.solution.op.ia;
    store.getState().nudgePoint(0, 0.01);
    expect(store.getState().followerBench!.plane.solution.op.ia).toBeGreaterThan(ia0);
    store.getState().nudgePoint(-0.05, 0);
    expect(store.getState().followerBench!.plane.solution.op.ia).toBeLessThan(ia0);
    store.getState().cancelDrag();
    expect(store.getState().followerBench!.plane.solution.op.ia).toBe(ia0);
  });

  it('more current than its grid allows is held where the grid meets the cathode, and the note says so', () => {
    const store = followerOnBench();
    store.getState().beginDrag('point');
    store.getState().dragPointTo(0, 1);
    const s = store.getState();
    expect(s.dragNote).toMatch(/grid current/);
    expect(Math.abs(s.followerBench!.plane.solution.op.vgk)).toBeLessThan(0.01);
  });

  it('a second tube goes in the same socket: same Rk, same grid', () => {
    const store = followerOnBench();
    store.getState().setRival({ on: true, tubeId: '12AX7' });
    const s = store.getState();
    const r = s.followerRival;
    if (!r?.ok) throw new Error('the 12AX7 follows');
    expect(r.tube.id).toBe('12AX7');
    expect(r.vgrid).toBe(s.followerBench!.vgrid);
    const own = solveFollower({ tube: findTube('12AX7')!, bplus: s.design.bplus, vgrid: r.vgrid, rk: s.design.stage2.rk });
    expect(own.ok && own.op.ia).toBeCloseTo(r.plane.solution.op.ia, 9);
    // Both families on one pair of axes.
    expect(r.sheet.extent).toEqual(s.followerBench!.sheet.extent);
  });

  it('taking its follower away puts the gain stage back on the bench', () => {
    const store = followerOnBench();
    const at = voltageStages(store.getState().design).findIndex((p) => p.kind === 'follower');
    store.getState().dropStage(at);
    expect(store.getState().design.stageKind).toBe('voltage');
    expect(store.getState().followerBench).toBeNull();
  });
});

describe('targets for the follower on the bench', () => {
  it('marks where along its line they hold, judges its point, moves to the best, keeps a drag inside, and ranks the tubes as the follower', async () => {
    const store = followerOnBench();
    store.getState().editField('tDiss', '50');
    store.getState().editField('tClean', '20');
    // The follower's own targets: its gain stage's stay as they were.
    expect(store.getState().design.followerTargets).toMatchObject({ maxDissipationFraction: 0.5, minCleanOutputRms: 20 });
    expect(store.getState().design.targets).toEqual(NO_TARGETS);
    await vi.waitFor(() => expect(store.getState().followerRegion?.result.ok).toBe(true), { timeout: 10_000 });
    const region = store.getState().followerRegion!.result;
    if (!region.ok) throw new Error(region.message);
    expect(region.inside.some(Boolean)).toBe(true);
    // The gain stage's region is not drawn while the follower is shown.
    expect(store.getState().region).toBeNull();
    // Its point judged: each target with its margin.
    await vi.waitFor(() => {
      const v = store.getState().verdict;
      expect(v?.ok && Object.keys(v.margins)).toEqual(['minCleanOutputRms', 'maxDissipationFraction']);
    });
    store.getState().moveToBest();
    expect(store.getState().design.stage2.rk).toBe(region.best!.rk);
    // Held inside: a drag toward the most current (where the clean output fails) stays on a stretch that holds.
    store.getState().setKeepInside(true);
    store.getState().beginDrag('point');
    store.getState().dragPointTo(0, region.ia[0]!);
    expect(store.getState().dragNote).toBe('Held where the targets hold.');
    const k = region.rk.indexOf(store.getState().design.stage2.rk);
    const ia = store.getState().followerBench!.plane.solution.op.ia;
    const nearest = region.ia.reduce((b, x, j) => (Math.abs(x - ia) < Math.abs(region.ia[b]! - ia) ? j : b), 0);
    expect(k === -1 ? region.inside[nearest] : region.inside[k]).toBe(true);
    store.getState().endDrag();
    // Every tube ranked as the follower in this socket; taking one puts it in the socket at its Rk.
    store.getState().rankTubesNow();
    await vi.waitFor(() => expect(store.getState().ranking?.result?.ok).toBe(true), { timeout: 10_000 });
    const ranks = store.getState().ranking!.result!;
    if (!ranks.ok) throw new Error(ranks.message);
    const top = ranks.ranks[0]!;
    expect(top.ra).toBe(0);
    store.getState().takeRanked(top);
    expect(store.getState().design.stage2.tubeId).toBe(top.tubeId);
    expect(store.getState().design.stage2.rk).toBe(top.rk);
    expect(store.getState().design.stageKind).toBe('follower');
  });
});

describe('the follower in the build notes', () => {
  it('an exported chart of the follower carries the follower\'s parts, point and key, not its gain stage\'s', () => {
    const store = followerOnBench();
    const s = store.getState();
    const c = chartCaption(s);
    expect(c.title).toMatch(new RegExp(`^${s.design.stage2.tubeId} cathode follower, B\\+ 275 V, grid at`));
    expect(c.figures).toMatch(/heater–cathode/);
    expect(c.legend.some((l) => /^Bias line \(grid at /.test(l.label))).toBe(true);
  });
});
