import type { CurveSheet, OperatingPoint, PlanePoint, StageOverlay, TubeRecord } from '../../src/index';
import type { WorkbenchState } from './workbenchStore';

/**
 * What the bench's plate chart draws, read from the store: the gain stage's
 * curves, lines and point, or its follower's while the follower is the stage
 * shown. One chart, two stages: the follower's adapter leaves out what only a
 * gain stage has (the B+ handle, the target region, the spread of builds).
 */
export const followerShown = (s: WorkbenchState): boolean => s.design.stageKind === 'follower' && s.followerBench !== null;

export const shownSheet = (s: WorkbenchState): CurveSheet => (followerShown(s) ? s.followerBench!.sheet : s.analysis.sheet);

export const shownRivalSheet = (s: WorkbenchState): CurveSheet | null => {
  if (followerShown(s)) return s.followerRival?.ok ? s.followerRival.sheet : null;
  return s.rivalAnalysis?.ok ? s.rivalAnalysis.sheet : null;
};

export const shownTubeId = (s: WorkbenchState): string => (followerShown(s) ? s.design.stage2.tubeId : s.design.tubeId);

export const shownTube = (s: WorkbenchState): TubeRecord => (followerShown(s) ? s.followerBench!.tube : s.analysis.tube);

export interface ShownLines {
  readonly overlay: StageOverlay;
  readonly rival: StageOverlay | null;
  readonly op: OperatingPoint;
  /** The signal's span (gain stage), or where Rk moves the point (follower). */
  readonly trace: readonly PlanePoint[];
}

export function shownLines(s: WorkbenchState): ShownLines {
  if (followerShown(s)) {
    const f = s.followerBench!;
    return { overlay: f.plane.overlay, rival: s.followerRival?.ok ? s.followerRival.plane.overlay : null, op: f.plane.solution.op, trace: f.plane.locus };
  }
  return { overlay: s.analysis.overlay, rival: s.rivalAnalysis?.ok ? s.rivalAnalysis.overlay : null, op: s.analysis.solution.op, trace: s.analysis.signal.swingPath };
}
