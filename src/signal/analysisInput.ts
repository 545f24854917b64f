import { normalizeStage, type CheckedStage, type StageDesign } from '../stage/stageDesign';
import { solveStage, type StageSolution } from '../stage/solveStage';
import type { Failure } from '../result';

/** A validated, solved stage: what every signal analysis starts from. */
export interface SolvedStage {
  readonly checked: CheckedStage;
  readonly solution: StageSolution;
}

export function solvedStage(design: StageDesign): SolvedStage | Failure {
  const solution = solveStage(design);
  if (!solution.ok) return solution;
  const checked = normalizeStage(design);
  if ('ok' in checked) return checked;
  return { checked, solution };
}
