import { outputPartsList, pushPullPartsList, type OutputPartsList, type PreferredSeries, type PushPullPartsList } from '../../src/index';
import type { WorkbenchState } from './workbenchStore';

/** The output stage's parts: one tube's, or the pair's. */
export type OutputStageParts = ({ readonly pair: 'single-ended' } & OutputPartsList) | ({ readonly pair: 'push-pull' } & PushPullPartsList);

/** Parts per settled analysis and series: the model runs once for each, and panels may read it freely. */
const memo = new WeakMap<object, Map<PreferredSeries, OutputStageParts>>();

/** The output stage's parts to order, from its last full analysis (a drag's light pass does not change what to order). */
export function outputPartsOf(s: WorkbenchState): OutputStageParts {
  const b = s.outputBench;
  const a = b.settled;
  const bySeries = memo.get(a) ?? new Map<PreferredSeries, OutputStageParts>();
  memo.set(a, bySeries);
  const hit = bySeries.get(s.design.series);
  if (hit) return hit;
  const parts: OutputStageParts = b.pair === 'push-pull' ? { pair: 'push-pull', ...pushPullPartsList(b.settled, s.design.series) } : { pair: 'single-ended', ...outputPartsList(b.settled, s.design.series) };
  bySeries.set(s.design.series, parts);
  return parts;
}
