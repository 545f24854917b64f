import { findRectifierTube } from '../../src/index';
import { buildSheetOf } from './buildSheet';
import { outputTubesPerChannel } from './outputPlan';
import type { WorkbenchState } from './workbenchStore';

/** One line of the tubes to order: how many of one type, and how many of its sections the design uses. */
export interface TubeOrder {
  readonly id: string;
  readonly count: number;
  /** Sections used across all channels, for a multi-section tube (a twin triode's spare half shows); null for one section. */
  readonly sectionsUsed: number | null;
  readonly sections: number;
}

/**
 * Every tube the design needs, for every channel: the voltage stages' and
 * splitter's envelopes (two stages on one twin triode share one), the
 * output tubes (two a channel for a push-pull pair) when the stages drive
 * them or the output stage is the bench's, and a rectifier tube.
 */
export function tubesToOrder(s: WorkbenchState): TubeOrder[] {
  const d = s.design;
  const channels = d.supply.channels;
  const withVoltage = d.drivesOutput || d.stageKind !== 'output';
  const withOutput = d.drivesOutput || d.stageKind === 'output';
  const small = withVoltage
    ? buildSheetOf(s).tubes.map((t) => ({ id: t.tube.id, count: t.envelopes * channels, sections: t.tube.sections ?? 1, sectionsUsed: (t.tube.sections ?? 1) > 1 ? t.sectionsUsed * channels : null }))
    : [];
  const output = withOutput ? [{ id: d.output.tubeId, count: channels * outputTubesPerChannel(d.output), sections: 1, sectionsUsed: null }] : [];
  const r = d.supply.rectifier;
  const rectifier = r.kind === 'tube' ? findRectifierTube(r.tubeId) : undefined;
  return [...small, ...output, ...(rectifier ? [{ id: rectifier.id, count: 1, sections: 1, sectionsUsed: null }] : [])];
}

/** The tubes to order in one line, "2 × 12AX7 (3 of 4 sections used), 1 × EL34, 1 × 5AR4". */
export const tubesToOrderLine = (s: WorkbenchState) =>
  `Tubes: ${tubesToOrder(s).map((t) => `${t.count} × ${t.id}${t.sectionsUsed !== null ? ` (${t.sectionsUsed} of ${t.count * t.sections} sections used)` : ''}`).join(', ')}`;
