import { line, select } from 'd3';
import type { FollowerRegion } from '../../../src/index';
import { PALETTE } from '../chart/palette';
import type { PlateScales } from '../chart/plateScales';
import { ringBest } from './drawRegion';

/**
 * A follower's targets on the plate chart: each stretch of its line where
 * every target holds, as a broad band under the dotted line (a shape, not
 * only a colour, so it reads in grayscale), and the best sample ringed.
 */
export function drawFollowerRegion(layer: SVGGElement, region: FollowerRegion | null, scales: PlateScales): void {
  const g = select(layer);
  g.selectAll('*').remove();
  if (!region) return;
  const runs: { v: number; i: number }[][] = [];
  let run: { v: number; i: number }[] = [];
  region.inside.forEach((inside, k) => {
    if (inside) run.push({ v: region.vpk[k]!, i: region.ia[k]! });
    else if (run.length) {
      runs.push(run);
      run = [];
    }
  });
  if (run.length) runs.push(run);
  const path = line<{ v: number; i: number }>().x((p) => scales.x(p.v)).y((p) => scales.y(p.i));
  g.append('g')
    .attr('data-region', 'inside')
    .selectAll('path')
    .data(runs)
    .join('path')
    // A run of one sample still shows: a round cap draws it as a dot.
    .attr('d', (r) => path(r.length > 1 ? r : [r[0]!, r[0]!]))
    .attr('fill', 'none')
    .attr('stroke', PALETTE.rival)
    .attr('stroke-opacity', 0.35)
    .attr('stroke-width', 14)
    .attr('stroke-linecap', 'round');
  const best = region.best;
  if (best && best.score >= 0) ringBest(layer, scales.x(region.vpk[best.index]!), scales.y(region.ia[best.index]!));
}
