import { screensOnNode } from '../../store/outputPlan';
import type { BenchDesign } from '../../store/analysis';

/**
 * Where a pentode output stage's screens get their voltage when the supply
 * feeds them from a node of their own, in words for the parts list and the
 * card (no dropper is listed then); null when they hang from their plates'
 * node (a dropper, when they sit lower, is on the list).
 */
export function screensNodeLine(d: Pick<BenchDesign, 'supply' | 'drivesOutput' | 'output'>): string | null {
  if (!screensOnNode(d)) return null;
  return `Screens: straight from the B+ supply's node ${d.supply.feeds.screens! + 1}, their own (no dropper; the supply's table gives its voltage under load).`;
}
