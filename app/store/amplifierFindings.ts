import { amplifierFindings, type Finding, type StageFinding } from '../../src/index';
import type { WorkbenchState } from './workbenchStore';

/** How the supply is named in the ratings list. */
export const SUPPLY_STAGE_NAME = 'B+ supply';

const STAGE2_NAME = { follower: 'cathode follower', 'common-cathode': 'second gain stage' } as const;

/** The stages whose findings the bench lists, named as the builder sees them. */
function stagesOf(s: WorkbenchState): { name: string; findings: readonly Finding[] }[] {
  const d = s.design;
  const stages: { name: string; findings: readonly Finding[] }[] = [{ name: `Stage 1, ${d.tubeId}`, findings: s.analysis.solution.findings }];
  const chain = s.analysis.signal.chain;
  const link = chain?.ok ? chain.links[1] : undefined;
  if (link && d.stage2.kind !== 'none') stages.push({ name: `Stage 2, ${d.stage2.tubeId} ${STAGE2_NAME[d.stage2.kind]}`, findings: link.findings });
  if (d.stageKind === 'output' || d.drivesOutput) stages.push({ name: `Output stage, ${d.output.tubeId}`, findings: s.outputBench.analysis.findings });
  // The supply's warnings and dangers belong in the same list (a capacitor over its voltage is as dangerous as a plate);
  // its notes, the margins, stay with its own table.
  const supply = s.supplyView?.result;
  if (d.supply.on && supply?.ok) stages.push({ name: SUPPLY_STAGE_NAME, findings: supply.supply.findings.filter((f) => f.severity !== 'note') });
  return stages;
}

/**
 * One ratings list for the amplifier: every stage's findings tagged with its
 * stage, most severe first. A fresh array each call: readers compare with
 * `sameFindings`.
 */
export function benchFindings(s: WorkbenchState): StageFinding[] {
  return amplifierFindings(stagesOf(s));
}

/** Two lists that read the same (same stages, checks, severities and words). */
export const sameFindings = (a: readonly StageFinding[], b: readonly StageFinding[]) =>
  a.length === b.length && a.every((f, k) => f.stage === b[k]!.stage && f.kind === b[k]!.kind && f.severity === b[k]!.severity && f.message === b[k]!.message);
