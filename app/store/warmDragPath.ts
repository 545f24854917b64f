import { designAtPlanePoint, nearestReachable } from '../../src/index';
import { analyze } from './analysis';
import type { WorkbenchStore } from './workbenchStore';

/** Model calls made while warming: a few hundred, as many as a second of dragging. */
export const WARM_ROUNDS = 300;

type Idle = (cb: (deadline: { timeRemaining: () => number }) => void) => void;

/**
 * Runs the drag path's model calls (reach, Ra/Rk for a point, the light
 * analysis) on throwaway points around the operating point while the page
 * sits idle after loading, so the JavaScript engine has compiled them
 * before the first real drag instead of during it. Nothing is stored; it
 * stops as soon as a drag begins.
 */
export function warmDragPath(store: WorkbenchStore, rounds = WARM_ROUNDS): void {
  const idle: Idle = typeof requestIdleCallback === 'function' ? (cb) => requestIdleCallback(cb) : (cb) => setTimeout(() => cb({ timeRemaining: () => 8 }), 30);
  let k = 0;
  const step = (deadline: { timeRemaining: () => number }) => {
    const s = store.getState();
    if (s.dragging || s.design.stageKind !== 'voltage') return;
    const { tube, sheet, solution } = s.analysis;
    while (k < rounds && deadline.timeRemaining() > 2) {
      const vpk = solution.op.vpk * (1 + 0.25 * Math.sin(k / 7));
      const ia = solution.op.ia * (1 + 0.25 * Math.cos(k / 5));
      const reach = nearestReachable(tube, s.design.bplus, vpk, ia, s.design.rg);
      const d = reach.ok ? designAtPlanePoint({ tube, bplus: s.design.bplus, vpk: reach.vpk, ia: reach.ia, rg: s.design.rg }) : reach;
      if (d.ok) analyze({ ...s.design, ra: d.ra, rk: d.rk }, s.registry, s.analysis, sheet.extent, true, s.curveCount);
      k++;
    }
    if (k < rounds) idle(step);
  };
  idle(step);
}
