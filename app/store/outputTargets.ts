import { findOutputTube, type OutputRegion, type OutputTargetStage, type PlaneRegion, type Targets } from '../../src/index';
import { pushPullDesignOf } from './outputPlan';
import { outputPlaced } from './heaterSharing';
import { anyTarget, targetsOf } from './targetPlan';
import type { WorkbenchState } from './workbenchStore';

/**
 * The output stage's targets' inputs, while the output stage is on the bench
 * and a target that says something of it is set; else null. The key leaves
 * out B+ and the bias, which the region is a map of (dragging the point
 * moves them), so a drag never asks for a new region.
 */
export function outputRequestOf(s: WorkbenchState): { key: string; stage: OutputTargetStage; targets: Targets; extent: { vmax: number; iaMax: number } } | null {
  const d = s.design;
  if (d.stageKind !== 'output' || !anyTarget(d.outputTargets, 'output')) return null;
  // As the amplifier places it: its screens on their node when the supply feeds them, its heaters at their winding's potential.
  const o = outputPlaced(d, d.output, s.registry);
  const tube = findOutputTube(o.tubeId);
  if (!tube) return null;
  const stage: OutputTargetStage = o.pair === 'push-pull' ? { pair: 'push-pull', tube, design: pushPullDesignOf(o) } : { pair: 'single-ended', tube, design: outputDesignOf(o) };
  const targets = targetsOf(d.outputTargets);
  const { vmax, iaMax } = s.outputBench.analysis.sheet.extent;
  const { bplus: _b, rk: _r, vg: _v, ...fixed } = stage.design;
  const key = JSON.stringify(['output', stage.pair, fixed, targets, vmax, iaMax]);
  return { key, stage, targets, extent: { vmax, iaMax } };
}

/** The single-ended stage's own values (the plan also carries the pair's and the splitter's). */
function outputDesignOf(o: WorkbenchState['design']['output']) {
  const { pair: _p, splitter: _s, raa: _r, mismatch: _m, idleMismatch: _i, ...design } = o;
  return design;
}

/** The output region, when it was worked out for the output stage now on the bench. */
export function currentOutputRegion(s: WorkbenchState): OutputRegion | null {
  const r = s.outputRegion;
  return r?.result.ok && r.key === outputRequestOf(s)?.key ? r.result : null;
}

/** The region on the chart now shown, whichever kind of stage it maps (the gain stage's or the output stage's). */
export function shownPlaneRegion(s: WorkbenchState): PlaneRegion | null {
  if (s.design.stageKind === 'output') return currentOutputRegion(s);
  return s.region?.result.ok ? s.region.result : null;
}
