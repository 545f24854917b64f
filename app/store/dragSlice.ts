import type { StateCreator } from 'zustand/vanilla';
import type { Failure } from '../../src/index';
import { designAtPlanePoint, findOutputTube, followerRkFor, nearestPreferred, nearestReachable, preferredAround, solveOutput, solvePushPull, solveStage } from '../../src/index';
import { pushPullDesignOf } from './outputPlan';
import { currentOutputRegion } from './outputTargets';
import { stageDesignOf } from './analysis';
import type { BenchDesign } from './analysis';
import type { WorkbenchState } from './workbenchStore';
import { DESIGN_LIMITS } from './designLimits';
import { currentFollowerRegion, failingAt, FOLLOWER_RK_RANGE, nearestInside, regionRequestOf } from './regionSlice';

/**
 * Dragging on the plate chart. While the operating point moves, B+ stays
 * fixed and the model gives the Ra and Rk that put the point under the
 * pointer (or at the nearest reachable place, with the reason). On release the
 * resistors snap to the chosen preferred series and the real, snapped point
 * is shown. Dragging the load line's foot on the voltage axis changes B+.
 * The chart window is pinned for the whole drag so the picture holds still.
 */
export type DragTarget = 'point' | 'follower-point' | 'bplus' | 'output-point' | 'output-load';

export interface DragSlice {
  dragging: DragTarget | null;
  /** The design the current drag started from: what cancelDrag puts back, and one undo step per drag. */
  dragStart: BenchDesign | null;
  /** Why the point is not where the pointer is, or what happened on release; null when all is well. */
  dragNote: string | null;
  beginDrag: (target: DragTarget) => void;
  dragPointTo: (vpk: number, ia: number) => void;
  dragBplusTo: (volts: number) => void;
  endDrag: () => void;
  /** Ends a drag by putting back the design it started from. */
  cancelDrag: () => void;
  /**
   * Keyboard: move the point by fractions of the chart window. Arrow presses
   * are a drag in progress (exact values); endDrag, on Enter or when the
   * handle loses focus, is the release that snaps.
   */
  nudgePoint: (dxFraction: number, dyFraction: number) => void;
}

/** Lowest B+ the foot of the load line can be dragged to, V. */
export const MIN_DRAG_BPLUS = DESIGN_LIMITS.bplus.min;

/**
 * With the drag held inside the target region, the preferred Ra and Rk
 * (each the nearest or its neighbour in the series) nearest the exact values
 * whose operating point is still inside; null when none is, or the drag is
 * not held.
 */
function snappedInside(s: WorkbenchState): { ra: number; rk: number } | null {
  const region = s.keepInside && s.region?.result.ok && s.region.key === regionRequestOf(s)?.key ? s.region.result : null;
  if (!region) return null;
  const d = s.design;
  const tube = s.analysis.tube;
  const base = stageDesignOf(d, tube, s.registry);
  const pairs = preferredAround(d.ra, d.series).flatMap((ra) => preferredAround(d.rk, d.series).map((rk) => ({ ra, rk })));
  const cost = (p: { ra: number; rk: number }) => Math.abs(Math.log(p.ra / d.ra)) + Math.abs(Math.log(p.rk / d.rk));
  for (const p of pairs.sort((a, b) => cost(a) - cost(b))) {
    const sol = solveStage({ ...base, ra: p.ra, rk: p.rk });
    if (sol.ok && failingAt(region, sol.op.vpk, sol.op.ia)?.length === 0) return p;
  }
  return null;
}

/**
 * The output stage's release held inside its target region: the preferred
 * cathode resistor (the nearest or its neighbour) whose idle point is still
 * inside; null when none is, the bias is fixed, or the drag is not held.
 */
function snappedOutputInside(s: WorkbenchState, o: BenchDesign['output']): number | null {
  const region = s.keepInside ? currentOutputRegion(s) : null;
  const tube = findOutputTube(o.tubeId);
  if (!region || !tube || o.bias !== 'cathode') return null;
  const candidates = preferredAround(o.rk, s.design.series).sort((a, b) => Math.abs(Math.log(a / o.rk)) - Math.abs(Math.log(b / o.rk)));
  for (const rk of candidates) {
    const d = { ...o, rk };
    const idle = o.pair === 'push-pull' ? solvePushPull(tube, pushPullDesignOf(d)) : solveOutput(tube, d);
    const at = !idle.ok ? null : 'idle' in idle ? idle.idle[0] : { vpk: idle.op.vpk, ip: idle.op.ip };
    if (at && failingAt(region, at.vpk, at.ip)?.length === 0) return rk;
  }
  return null;
}

/**
 * The follower's point under the pointer: the Rk that makes it draw the
 * pointer's current with its grid where it is (it can only move along that
 * one line); the window held still.
 */
function dragFollowerTo(s: WorkbenchState, ia: number, set: (patch: Partial<WorkbenchState>) => void): void {
  const f = s.followerBench;
  if (!f) return;
  // Held to the stretches of its line where the targets hold, when asked: the nearest inside sample to the pointer's.
  const region = s.keepInside ? currentFollowerRegion(s) : null;
  let want = ia;
  let held = false;
  if (region && region.inside.some(Boolean)) {
    const nearest = (ok: (k: number) => boolean) => region.ia.reduce((best, x, k) => (ok(k) && (best < 0 || Math.abs(x - ia) < Math.abs(region.ia[best]! - ia)) ? k : best), -1);
    const here = nearest(() => true);
    if (!region.inside[here]) {
      want = region.ia[nearest((k) => region.inside[k]!)]!;
      held = true;
    }
  }
  const r = followerRkFor({ tube: f.tube, bplus: f.bplus, vgrid: f.vgrid }, Math.max(want, 1e-7), FOLLOWER_RK_RANGE);
  if (!r.ok) {
    set({ dragNote: r.message });
    return;
  }
  const failure = s.commit({ ...s.design, stage2: { ...s.design.stage2, rk: r.rk } }, { followerExtent: f.sheet.extent, light: true });
  set({ dragNote: failure ? failure.message : held ? 'Held where the targets hold.' : r.reason });
}

export const createDragSlice: StateCreator<WorkbenchState, [], [], DragSlice> = (set, get) => ({
  dragging: null,
  dragStart: null,
  dragNote: null,

  // The chart's point handle is the follower's while the follower is the stage shown.
  beginDrag: (target) => set({ dragging: target === 'point' && get().design.stageKind === 'follower' ? 'follower-point' : target, dragStart: get().design, dragNote: null }),

  cancelDrag: () => {
    const start = get().dragStart;
    set({ dragging: null, dragStart: null, dragNote: null });
    if (start) get().commit(start);
  },

  dragPointTo: (vpk, ia) => {
    const s = get();
    if (s.dragging === 'follower-point') {
      dragFollowerTo(s, ia, set);
      return;
    }
    const { tube, sheet } = s.analysis;
    const reach = nearestReachable(tube, s.design.bplus, vpk, ia, s.design.rg);
    if (!reach.ok) {
      set({ dragNote: reach.message });
      return;
    }
    // Held inside the target region when asked (and the region is worked out for this very stage).
    const region = s.keepInside && s.region?.result.ok && s.region.key === regionRequestOf(s)?.key ? s.region.result : null;
    const held = region ? nearestInside(region, reach.vpk, reach.ia) : null;
    const to = held ?? reach;
    const d = designAtPlanePoint({ tube, bplus: s.design.bplus, vpk: to.vpk, ia: to.ia, rg: s.design.rg });
    if (!d.ok) {
      set({ dragNote: d.message });
      return;
    }
    const failure = s.commit({ ...s.design, ra: d.ra, rk: d.rk }, { extent: sheet.extent, light: true });
    const kept = held && (held.vpk !== reach.vpk || held.ia !== reach.ia) ? 'Held inside the target region.' : null;
    set({ dragNote: failure ? failure.message : (reach.reason ?? kept) });
  },

  dragBplusTo: (volts) => {
    const s = get();
    const { extent } = s.analysis.sheet;
    const bplus = Math.round(Math.min(Math.max(volts, MIN_DRAG_BPLUS), extent.vmax, DESIGN_LIMITS.bplus.max) * 2) / 2;
    if (bplus === s.design.bplus) return;
    const failure = s.commit({ ...s.design, bplus }, { extent, light: true });
    set({ dragNote: failure ? `B+ ${bplus} V: ${failure.message}` : null });
  },

  endDrag: () => {
    // Everything a release changes happens while `dragging` is still set, so
    // the undo history records the whole drag as one step when it clears.
    const s = get();
    const was = s.dragging;
    if (was === 'bplus') {
      s.commit(s.design, { force: true }); // release the pinned window: the axes now follow the new B+
    } else if (was === 'output-point') {
      // Release: B+ to the volt, the bias to a preferred resistor or a tenth of a volt, and the full analysis.
      const o = s.design.output;
      const rounded = { ...o, bplus: Math.round(o.bplus) };
      const patch = o.bias === 'cathode' && s.design.snap ? { rk: snappedOutputInside(s, rounded) ?? nearestPreferred(o.rk, s.design.series) } : o.bias === 'fixed' ? { vg: Math.round(o.vg * 10) / 10 } : {};
      // Unpinned (force): the window follows the new B+.
      if (s.commit({ ...s.design, output: { ...o, ...patch, bplus: Math.round(o.bplus) } }, { force: true }) !== null) s.commit(s.design, { force: true });
    } else if (was === 'follower-point') {
      // Release: Rk to the nearest preferred value that runs (next to a grid at its cathode's voltage, the nearest
      // may not: then its neighbour), else the exact value kept; and the full analysis.
      const s2 = s.design.stage2;
      let failure: Failure | null = null;
      for (const rk of s.design.snap ? preferredAround(s2.rk, s.design.series) : [s2.rk]) {
        failure = s.commit({ ...s.design, stage2: { ...s2, rk } });
        if (!failure) break;
      }
      if (failure) {
        s.commit(get().design);
        set({ dragNote: `Snapping Rk to ${s.design.series} values would fail (${failure.message}); the exact value is kept.` });
      }
    } else if (was === 'output-load') {
      s.commit(s.design, { force: true });
    } else if (was === 'point') {
      const { ra, rk, series } = s.design;
      // Held inside the region: the preferred pair nearest the exact values that still sits in it.
      const inside = s.design.snap ? snappedInside(s) : null;
      const failure = s.design.snap ? s.commit({ ...s.design, ...(inside ?? { ra: nearestPreferred(ra, series), rk: nearestPreferred(rk, series) }) }) : null;
      if (failure || !s.design.snap) s.commit(get().design); // the full signal analysis, deferred while dragging
      if (failure) set({ dragNote: `Snapping to ${series} values would fail (${failure.message}); the exact values are kept.` });
    }
    set({ dragging: null, dragStart: null });
  },

  nudgePoint: (dx, dy) => {
    const s = get();
    const follower = s.design.stageKind === 'follower' ? s.followerBench : null;
    if (follower) {
      // The follower moves along one line: right or up draws more current, left or down less.
      if (s.dragging !== 'follower-point') s.beginDrag('point');
      const { iaMax } = follower.sheet.extent;
      get().dragPointTo(0, follower.plane.solution.op.ia + (dy !== 0 ? dy : dx) * iaMax);
      return;
    }
    if (s.dragging !== 'point') s.beginDrag('point');
    const { vmax, iaMax } = s.analysis.sheet.extent;
    const { vpk, ia } = get().analysis.solution.op;
    get().dragPointTo(vpk + dx * vmax, ia + dy * iaMax);
  },
});
