import { benchFindings } from '../store/amplifierFindings';
import type { WorkbenchState } from '../store/workbenchStore';

/** Every stage's ratings findings, tagged with the stage, as the card prints them. */
export function ratingsLines(s: WorkbenchState): string[] {
  return benchFindings(s).map((f) => `${f.severity.toUpperCase()}: ${f.stageName}: ${f.message}`);
}
