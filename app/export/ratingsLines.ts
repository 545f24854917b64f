import { benchFindings } from '../store/amplifierFindings';
import type { WorkbenchState } from '../store/workbenchStore';

/**
 * The ratings list as the card prints it: the workbench's own list, line for
 * line, every finding tagged with its stage (the supply's notes, its margins,
 * stay with its own table there as here). Every stage's notes too, not only
 * the bench's: a margin such as an output plate's swing to 1.7 × B+ is what
 * the builder checks the transformer and coupling parts against, and the card
 * runs on to more pages when it needs them.
 */
export function ratingsLines(s: WorkbenchState): string[] {
  return benchFindings(s).map((f) => `${f.severity.toUpperCase()}: ${f.stageName}: ${f.message}`);
}
