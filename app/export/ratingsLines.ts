import { benchFindings } from '../store/amplifierFindings';
import type { WorkbenchState } from '../store/workbenchStore';

/**
 * Every stage's ratings findings as the card prints them, tagged with the
 * stage. Dangers and warnings of every stage and of the supply (whose notes
 * stay with its own table) are always there; notes (the margins) only for the stages the card is about, so the
 * parts still fit the page.
 */
export function ratingsLines(s: WorkbenchState): string[] {
  const onCard = (stageName: string) => (s.design.stageKind === 'output') === stageName.startsWith('Output stage');
  return benchFindings(s)
    .filter((f) => f.severity !== 'note' || onCard(f.stageName))
    .map((f) => `${f.severity.toUpperCase()}: ${f.stageName}: ${f.message}`);
}
