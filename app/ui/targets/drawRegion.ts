import { select } from 'd3';
import { TARGET_LABELS, TARGET_NAMES, UNREACHABLE, type PlaneRegion, type TargetName } from '../../../src/index';
import { TARGET_DASH } from './targetStrokes';
import type { PlateScales } from '../chart/plateScales';
import { PALETTE } from '../chart/palette';

/** The hatch pattern's id: diagonal lines, so the region reads in grayscale and whatever colours a reader sees. */
export const REGION_HATCH_ID = 'target-region-hatch';

/**
 * The target region on the plate chart: every cell where all targets hold,
 * hatched, and the best point ringed. Cells are drawn as the model gave them;
 * nothing is computed here beyond placing them.
 */
export function drawRegion(layer: SVGGElement, region: PlaneRegion | null, scales: PlateScales): void {
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
  drawTargetEdges(g, region, scales, dv, di);
  const best = region.best;
  if (best && best.score >= 0) ringBest(layer, scales.x(region.va[best.i]!), scales.y(region.ia[best.j]!));
}

/** The ring round the point that meets the targets best (dashed, in the region's colour). */
export function ringBest(layer: SVGGElement, x: number, y: number): void {
  select(layer)
    .append('circle')
    .attr('data-region', 'best')
    .attr('cx', x)
    .attr('cy', y)
    .attr('r', 7)
    .attr('fill', 'none')
    .attr('stroke', PALETTE.rival)
    .attr('stroke-width', 2)
    .attr('stroke-dasharray', '3 2');
}

/** The targets whose edge crosses the region's grid: those that hold at some reachable points and fail at others. */
export function targetsWithEdges(region: PlaneRegion): TargetName[] {
  const seen = new Set<string>();
  for (const column of region.failing) for (const cell of column) for (const k of cell) seen.add(k);
  return TARGET_NAMES.filter((k) => seen.has(k) && region.failing.some((column) => column.some((cell) => cell[0] !== UNREACHABLE && !cell.includes(k))));
}

/**
 * Each target's own edge: the cell borders where it holds on one side and
 * fails on the other (both cells reachable), in its dash pattern, named once
 * at the middle of its run of borders. Where every target holds is the hatch.
 */
function drawTargetEdges(g: ReturnType<typeof select<SVGGElement, unknown>>, region: PlaneRegion, scales: PlateScales, dv: number, di: number): void {
  const fails = (i: number, j: number, k: string) => region.failing[i]![j]!.includes(k);
  const reach = (i: number, j: number) => region.failing[i]![j]![0] !== UNREACHABLE;
  for (const k of targetsWithEdges(region)) {
    const segs: [number, number, number, number][] = [];
    for (let i = 0; i < region.va.length; i++) {
      for (let j = 0; j < region.ia.length; j++) {
        if (!reach(i, j)) continue;
        const x = region.va[i]! + dv / 2;
        const y = region.ia[j]! + di / 2;
        if (i + 1 < region.va.length && reach(i + 1, j) && fails(i, j, k) !== fails(i + 1, j, k)) segs.push([x, region.ia[j]! - di / 2, x, y]);
        if (j + 1 < region.ia.length && reach(i, j + 1) && fails(i, j, k) !== fails(i, j + 1, k)) segs.push([region.va[i]! - dv / 2, y, x, y]);
      }
    }
    if (segs.length === 0) continue;
    const d = segs.map(([x1, y1, x2, y2]) => `M${scales.x(x1).toFixed(1)},${scales.y(y1).toFixed(1)}L${scales.x(x2).toFixed(1)},${scales.y(y2).toFixed(1)}`).join('');
    g.append('path').attr('data-target-edge', k).attr('d', d).attr('fill', 'none').attr('stroke', PALETTE.inkSoft).attr('stroke-width', 1.6).attr('stroke-dasharray', TARGET_DASH[k]);
    const [x1, y1, x2, y2] = segs[Math.floor(segs.length / 2)]!;
    g.append('text')
      .attr('x', scales.x((x1 + x2) / 2) + 4)
      .attr('y', scales.y((y1 + y2) / 2) - 4)
      .attr('font-size', 11)
      .attr('fill', PALETTE.inkSoft)
      .attr('paint-order', 'stroke')
      .attr('stroke', PALETTE.sheet)
      .attr('stroke-width', 3)
      .text(TARGET_LABELS[k]);
  }
}
