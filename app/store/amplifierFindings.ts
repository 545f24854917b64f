import { amplifierFindings, type Finding, type StageFinding } from '../../src/index';
import { biasSupplyOf } from './biasSupply';
import { meterFindings } from './meterRows';
import type { WorkbenchState } from './workbenchStore';
import { benchIndex, voltageStages } from './stagePlans';
import { drivesPair, splitterName } from './outputPlan';
import { supplyBplusFindings } from './supplyBplus';

/** How the supply is named in the ratings list. */
export const SUPPLY_STAGE_NAME = 'B+ supply';
/** How the fixed-bias output stage's grid supply is named in the ratings list. */
export const BIAS_STAGE_NAME = 'Bias supply';
/** How the feedback loop is named in the ratings list. */
export const FEEDBACK_STAGE_NAME = 'Global feedback';

const KIND_NAME = { follower: 'cathode follower', 'common-cathode': 'gain stage' } as const;

/** The stages whose findings the bench lists, named as the builder sees them. */
function stagesOf(s: WorkbenchState): { name: string; findings: readonly Finding[] }[] {
  const d = s.design;
  const list = voltageStages(d);
  const bench = benchIndex(d);
  const chain = s.analysis.signal.chain;
  const link = chain?.ok ? chain.links[1] : undefined;
  // The bench's stage and its second stage from the bench's own analysis; the others from the whole amplifier's.
  const amp = s.amplifier?.result.ok ? s.amplifier.result : null;
  const stages: { name: string; findings: readonly Finding[] }[] = [];
  for (const [i, p] of list.entries()) {
    const name = `Stage ${i + 1}, ${p.tubeId} ${KIND_NAME[p.kind]}`;
    if (i === bench) stages.push({ name, findings: s.analysis.solution.findings });
    // The follower riding with it from the bench's own pass while that pass is there (it follows a drag);
    // when it waits (the output stage on the bench, after a reload) from the whole amplifier's, so its findings never drop out.
    else if (i === bench + 1 && d.stage2.kind !== 'none' && link) stages.push({ name, findings: link.findings });
    else if (amp?.stages[i]) stages.push({ name, findings: amp.stages[i]!.findings });
  }
  const splitter = amp && drivesPair(d) ? amp.stages[list.length] : undefined;
  if (splitter) stages.push({ name: `Phase splitter, ${splitterName(d.output.splitter)}`, findings: splitter.findings });
  if (d.stageKind === 'output' || d.drivesOutput) stages.push({ name: d.output.pair === 'push-pull' ? `Output stage, ${d.output.tubeId} pair` : `Output stage, ${d.output.tubeId}`, findings: s.outputBench.analysis.findings });
  // A loop that would oscillate, or nearly, is the amplifier's danger as much as any rating.
  const feedback = s.amplifier?.feedback;
  if (d.feedbackRf !== null && feedback?.ok && feedback.band.findings.length > 0) stages.push({ name: FEEDBACK_STAGE_NAME, findings: feedback.band.findings });
  // The supply's warnings and dangers belong in the same list (a capacitor over its voltage is as dangerous as a plate);
  // its notes, the margins, stay with its own table.
  const supply = s.supplyView?.result;
  // So does a stage designed for a B+ its node does not give: its figures describe another amplifier.
  // And the loop through the supply, once worked out: a low end it moves, or a loop that motorboats.
  const lowEnd = s.supplyView?.lowEnd;
  const coupling = lowEnd?.ok && !s.supplyView!.stale ? lowEnd.findings : [];
  if (d.supply.on && supply?.ok) stages.push({ name: SUPPLY_STAGE_NAME, findings: [...supply.supply.findings.filter((f) => f.severity !== 'note'), ...supplyBplusFindings(s), ...coupling] });
  // A fixed-bias stage's grid supply: a rail that cannot bias the tubes is the amplifier's danger; its warnings (the hot
  // end, the grid circuit's resistance) go with every other.
  const bias = biasSupplyOf(s);
  if (bias && !bias.ok) stages.push({ name: BIAS_STAGE_NAME, findings: [{ kind: 'bias-range', severity: 'danger', message: `The output tubes cannot be biased: ${bias.message}`, value: 0, limit: 0, percent: 0 }] });
  else if (bias?.ok && bias.findings.some((f) => f.severity !== 'note')) stages.push({ name: BIAS_STAGE_NAME, findings: bias.findings.filter((f) => f.severity !== 'note') });
  // The builder's meter readings: a tube past (or at) its rating as built belongs with the design's own checks.
  stages.push(...meterFindings(s));
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
