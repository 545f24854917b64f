import { normalizeStage, type CheckedStage, type StageDesign } from '../stage/stageDesign';
import { solveStage, type StageSolution } from '../stage/solveStage';
import type { Result } from '../result';

/** A validated, solved stage: what every signal analysis starts from. */
export interface SolvedStage {
  readonly checked: CheckedStage;
  readonly solution: StageSolution;
}

export function solvedStage(design: StageDesign): Result<SolvedStage> {
  const solution = solveStage(design);
  if (!solution.ok) return solution;
  const checked = normalizeStage(design);
  if (!checked.ok) return checked;
  return { ok: true, checked, solution };
}
