import { bySeverity, type Finding } from './ratingBands';

/** A finding with the stage it belongs to, for one list over the whole amplifier. */
export interface StageFinding extends Finding {
  /** The stage's place in the amplifier, 0 first. */
  readonly stage: number;
  /** The stage as a builder names it ("Stage 1, 12AX7"), shown beside the finding. */
  readonly stageName: string;
}

/**
 * Every stage's findings in one list, each tagged with its stage, most
 * severe first (stages in order within a severity), so a danger found in any
 * stage is shown wherever the amplifier's ratings are.
 */
export function amplifierFindings(stages: readonly { readonly name: string; readonly findings: readonly Finding[] }[]): StageFinding[] {
  const all: StageFinding[] = [];
  stages.forEach((s, stage) => {
    for (const f of s.findings) all.push({ ...f, stage, stageName: s.name });
  });
  return bySeverity(all) as StageFinding[];
}
