import { fail, type Result } from '../result';
import type { StageDesign } from '../stage/stageDesign';
import { judgeStage, UNREACHABLE } from './evaluatePoint';
import { activeTargets, targetsProblem, type TargetName, type Targets } from './targets';

export interface DesignVerdict {
  /** The targets this design misses, in TARGET_NAMES order. */
  readonly failing: readonly TargetName[];
  /** Each set target's margin: 0 at its edge, positive inside (a share of the target), negative outside. */
  readonly margins: Partial<Record<TargetName, number>>;
  /** What each target measures at this design (see PointVerdict.values). */
  readonly values: Partial<Record<TargetName, number | null>>;
}

/**
 * One design held against the targets, as the region judges each of its
 * points: what the bench shows for the operating point it is at, and what the
 * build card records.
 */
export function judgeDesign(design: StageDesign, targets: Targets): Result<DesignVerdict> {
  const problem = targetsProblem(targets);
  if (problem) return problem;
  if (typeof design !== 'object' || design === null) return fail('invalid-input', 'No design given');
  const v = judgeStage(design, targets, activeTargets(targets));
  if (v.failing[0] === UNREACHABLE) return fail('invalid-input', 'This design does not solve: no operating point to judge', 'design');
  return { ok: true, failing: v.failing as TargetName[], margins: v.margins, values: v.values };
}
