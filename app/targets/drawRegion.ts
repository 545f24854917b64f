import { select } from 'd3';
import type { FeasibleRegion } from '../../src/index';
import type { PlateScales } from '../chart/plateScales';
import { PALETTE } from '../chart/palette';

/** The hatch pattern's id: diagonal lines, so the region reads in grayscale and whatever colours a reader sees. */
export const REGION_HATCH_ID = 'target-region-hatch';

/**
 * The target region on the plate chart: every cell where all targets hold,
 * hatched, and the best point ringed. Cells are drawn as the model gave them;
 * nothing is computed here beyond placing them.
 */
export function drawRegion(layer: SVGGElement, region: FeasibleRegion | null, scales: PlateScales): void {
  const g = select(layer);
  g.selectAll('*').remove();
  if (!region || region.va.length < 2 || region.ia.length < 2) return;
  const dv = region.va[1]! - region.va[0]!;
  const di = region.ia[1]! - region.ia[0]!;
  const cells: { v: number; i: number }[] = [];
  for (let i = 0; i < region.va.length; i++) for (let j = 0; j < region.ia.length; j++) if (region.inside[i]![j]) cells.push({ v: region.va[i]!, i: region.ia[j]! });
  const w = Math.abs(scales.x(dv) - scales.x(0));
  const h = Math.abs(scales.y(0) - scales.y(di));
  g.append('g')
    .attr('data-region', 'inside')
    .selectAll('rect')
    .data(cells)
    .join('rect')
    .attr('x', (c) => scales.x(c.v - dv / 2))
    .attr('y', (c) => scales.y(c.i + di / 2))
    .attr('width', w + 0.5)
    .attr('height', h + 0.5)
    .attr('fill', `url(#${REGION_HATCH_ID})`);
  const best = region.best;
  if (best && best.score >= 0) {
    g.append('circle')
      .attr('data-region', 'best')
      .attr('cx', scales.x(region.va[best.i]!))
      .attr('cy', scales.y(region.ia[best.j]!))
      .attr('r', 7)
      .attr('fill', 'none')
      .attr('stroke', PALETTE.rival)
      .attr('stroke-width', 2)
      .attr('stroke-dasharray', '3 2');
  }
}
