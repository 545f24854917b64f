import { outputPartsList, type OutputPartsList, type PreferredSeries } from '../../src/index';
import type { WorkbenchState } from './workbenchStore';

/** Parts per settled analysis and series: the model runs once for each, and panels may read it freely. */
const memo = new WeakMap<object, Map<PreferredSeries, OutputPartsList>>();

/** The output stage's parts to order, from its last full analysis (a drag's light pass does not change what to order). */
export function outputPartsOf(s: WorkbenchState): OutputPartsList {
  const a = s.outputBench.settled;
  const bySeries = memo.get(a) ?? new Map<PreferredSeries, OutputPartsList>();
  memo.set(a, bySeries);
  const hit = bySeries.get(s.design.series);
  if (hit) return hit;
  const parts = outputPartsList(a, s.design.series);
  bySeries.set(s.design.series, parts);
  return parts;
}
