import { emptyCurrents, stageCurrentsInto } from '../output/electrodes';
import type { PlateCurve } from '../stage/planeSeries';
import type { PlateExtent } from '../stage/plateExtent';
import type { PushPullSolution } from './solvePushPull';

/**
 * The pair's composite characteristics (Langford-Smith, Radiotron Designer's
 * Handbook, 4th ed., ch. 13): with tube 1's grid at Vgk + x and tube 2's at
 * Vgk − x, and tube 1's plate at v (so tube 2's at 2E − v, E the centre tap
 * to the cathode), the net current the two halves couple to the core,
 * i1 − i2, against v. The composite load line is the straight Raa/4 line
 * through (E, 0); where each curve crosses it is the pair's instant at that
 * drive. Drawn for tube 1's grid from the bias up to 0 V, where the net
 * current is positive (it rises with v, through zero at E for x = 0); the
 * primary's DC resistance is left out.
 */
export function compositeCurves(s: PushPullSolution, extent: PlateExtent, count = 5, n = 48): PlateCurve[] {
  const e = s.supply;
  const top = Math.min(2 * e, extent.vmax);
  const c1 = emptyCurrents();
  const c2 = emptyCurrents();
  const curves: PlateCurve[] = [];
  for (let k = 0; k < count; k++) {
    const x = (-s.vgk * k) / Math.max(count - 1, 1);
    const points = [];
    for (let j = 0; j <= n; j++) {
      const v = (top * j) / n;
      const w = e - v;
      stageCurrentsInto(s.tube, s.feed, v, s.vgk + x, c1, w);
      stageCurrentsInto(s.tube2, s.feed, 2 * e - v, s.vgk2 - x, c2, -w);
      // The net current rises with tube 1's plate voltage: below zero (its partner ahead) it is off the chart.
      const net = c1.mmf - c2.mmf;
      if (!(net >= 0)) continue;
      points.push({ v, i: Math.min(net, extent.iaMax * 1.05) });
    }
    if (points.length > 1) curves.push({ vg: s.vgk + x, points });
  }
  return curves;
}
