import { select } from 'd3';
import type { PlanePoint, StageOverlay } from '../../../src/index';
import { planePath } from './drawSheet';
import { PALETTE } from './palette';
import type { PlateScales } from './plateScales';

/**
 * The moving layer: DC and AC load lines, the cathode bias line, and the
 * positions of the operating-point and B+ handles. Called on every design
 * change (many times a second while dragging); it touches only these few
 * elements, never the curve family.
 */
export interface OverlayNodes {
  readonly lines: SVGGElement;
  readonly point: SVGGElement;
  readonly bplusHandle: SVGGElement;
}

export function linePath(layer: SVGGElement, key: string, points: readonly PlanePoint[], scales: PlateScales, style: { stroke: string; width: number; dash?: string }): void {
  const sel = select(layer).selectAll<SVGPathElement, string>(`path[data-series="${key}"]`).data(points.length > 1 ? [key] : []);
  sel.exit().remove();
  sel.enter().append('path').attr('data-series', key).attr('fill', 'none')
    .merge(sel)
    .attr('stroke', style.stroke).attr('stroke-width', style.width).attr('stroke-dasharray', style.dash ?? null)
    .attr('d', planePath(scales)(points as PlanePoint[]));
}

export function drawOverlay(nodes: OverlayNodes, overlay: StageOverlay, bplus: number, scales: PlateScales, swing: readonly PlanePoint[] = []): void {
  linePath(nodes.lines, 'swing', swing, scales, { stroke: PALETTE.pointWash, width: 9 });
  linePath(nodes.lines, 'dc-load', overlay.dcLoad, scales, { stroke: PALETTE.load, width: 2 });
  linePath(nodes.lines, 'ac-load', overlay.acLoad, scales, { stroke: PALETTE.load, width: 1.6, dash: '9 5' });
  linePath(nodes.lines, 'bias', overlay.bias, scales, { stroke: PALETTE.bias, width: 1.8, dash: '2 3' });
  const { x, y } = scales;
  nodes.point.setAttribute('transform', `translate(${x(overlay.point.v)},${y(overlay.point.i)})`);
  nodes.bplusHandle.setAttribute('transform', `translate(${x(Math.min(bplus, x.domain()[1]!))},${y(0)})`);
}

/** The second tube's lines and point, dashed in its own colour so a grayscale print still tells them apart. */
export function drawRivalOverlay(lines: SVGGElement, handle: SVGGElement, overlay: StageOverlay | null, scales: PlateScales): void {
  linePath(lines, 'rival-dc-load', overlay?.dcLoad ?? [], scales, { stroke: PALETTE.rival, width: 1.8, dash: '10 4' });
  linePath(lines, 'rival-ac-load', overlay?.acLoad ?? [], scales, { stroke: PALETTE.rival, width: 1.4, dash: '3 3' });
  linePath(lines, 'rival-bias', overlay?.bias ?? [], scales, { stroke: PALETTE.rival, width: 1.4, dash: '1 3' });
  if (overlay) handle.setAttribute('transform', `translate(${scales.x(overlay.point.v)},${scales.y(overlay.point.i)})`);
}

/** The production-spread cloud: one faint dot per simulated build around the operating point. */
export function drawSpread(layer: SVGGElement, points: readonly PlanePoint[], scales: PlateScales): void {
  select(layer)
    .selectAll<SVGCircleElement, PlanePoint>('circle')
    .data(points)
    .join('circle')
    .attr('cx', (p) => scales.x(p.v))
    .attr('cy', (p) => scales.y(p.i))
    .attr('r', 1.8)
    .attr('fill', PALETTE.point)
    .attr('fill-opacity', 0.35);
}
