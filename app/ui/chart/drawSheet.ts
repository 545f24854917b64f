import { axisBottom, axisLeft, line, select } from 'd3';
import type { CurveSheet, PlanePoint } from '../../../src/index';
import { LIMIT_STROKES, PALETTE } from './palette';
import type { PlateScales } from './plateScales';

/**
 * The static layer: grid, axes, plate-curve family with grid-voltage labels,
 * and the ratings limits. Redrawn only when the tube or B+ changes, never
 * while the operating point is dragged.
 */
export function planePath(scales: PlateScales) {
  return line<PlanePoint>()
    .defined((p) => Number.isFinite(p.i) && p.i <= scales.y.domain()[1]! * 1.02)
    .x((p) => scales.x(p.v))
    .y((p) => scales.y(Math.min(p.i, scales.y.domain()[1]! * 1.02)));
}

const fmtGrid = (vg: number) => (vg === 0 ? '0 V' : `${String(vg).replace('-', '−')} V`);

/**
 * How many major ticks each axis carries: ten on a full-width chart, fewer
 * where it is drawn narrow (a phone, a splitter's column), so the figures
 * never run into each other (about 60 px a label across, 36 down).
 */
function tickCounts({ x, y }: PlateScales): { nx: number; ny: number } {
  const w = Math.abs(x.range()[1]! - x.range()[0]!);
  const h = Math.abs(y.range()[0]! - y.range()[1]!);
  const clamp = (n: number) => Math.min(10, Math.max(3, Math.floor(n)));
  return { nx: clamp(w / 60), ny: clamp(h / 36) };
}

export function drawGrid(layer: SVGGElement, scales: PlateScales): void {
  const g = select(layer);
  g.selectAll('*').remove();
  const { x, y } = scales;
  const [x0, x1] = x.range() as [number, number];
  const [y0, y1] = y.range() as [number, number];
  g.append('rect').attr('x', x0).attr('y', y1).attr('width', x1 - x0).attr('height', y0 - y1).attr('fill', PALETTE.sheet);
  const { nx, ny } = tickCounts(scales);
  for (const [ticks, stroke] of [[x.ticks(4 * nx), PALETTE.gridMinor], [x.ticks(nx), PALETTE.gridMajor]] as const) {
    g.append('g').selectAll('line').data(ticks).join('line')
      .attr('x1', (d) => x(d)).attr('x2', (d) => x(d)).attr('y1', y0).attr('y2', y1)
      .attr('stroke', stroke).attr('stroke-width', 1).attr('shape-rendering', 'crispEdges');
  }
  for (const [ticks, stroke] of [[y.ticks(4 * ny), PALETTE.gridMinor], [y.ticks(ny), PALETTE.gridMajor]] as const) {
    g.append('g').selectAll('line').data(ticks).join('line')
      .attr('y1', (d) => y(d)).attr('y2', (d) => y(d)).attr('x1', x0).attr('x2', x1)
      .attr('stroke', stroke).attr('stroke-width', 1).attr('shape-rendering', 'crispEdges');
  }
}

export function drawAxes(layer: SVGGElement, scales: PlateScales): void {
  const g = select(layer);
  g.selectAll('*').remove();
  const { x, y, box } = scales;
  const { nx, ny } = tickCounts(scales);
  const bottom = g.append('g').attr('transform', `translate(0,${y.range()[0]})`).call(axisBottom(x).ticks(nx).tickSizeOuter(0));
  const left = g.append('g').attr('transform', `translate(${x.range()[0]},0)`).call(
    axisLeft(y).ticks(ny).tickSizeOuter(0).tickFormat((d) => String(Number(((d as number) * 1e3).toPrecision(3)))),
  );
  for (const axis of [bottom, left]) axis.attr('font-size', 12).attr('font-family', 'inherit').attr('color', PALETTE.inkSoft);
  g.append('text')
    .attr('x', (x.range()[0]! + x.range()[1]!) / 2).attr('y', box.height - 8)
    .attr('text-anchor', 'middle').attr('font-size', 13).attr('fill', PALETTE.ink)
    .text('Plate–cathode voltage Vpk (V)');
  g.append('text')
    .attr('transform', `translate(16,${(y.range()[0]! + y.range()[1]!) / 2}) rotate(-90)`)
    .attr('text-anchor', 'middle').attr('font-size', 13).attr('fill', PALETTE.ink)
    .text('Plate current Ia (mA)');
}

export function drawFamily(layer: SVGGElement, sheet: CurveSheet, scales: PlateScales, style: { stroke: string; dash?: string; labelRow?: number } = { stroke: PALETTE.ink }): void {
  const g = select(layer);
  g.selectAll('*').remove();
  const path = planePath(scales);
  g.selectAll('path').data(sheet.family).join('path')
    .attr('d', (c) => path(c.points))
    .attr('fill', 'none').attr('stroke', style.stroke).attr('stroke-width', 1.4)
    .attr('stroke-dasharray', style.dash ?? null)
    .attr('data-vg', (c) => c.vg);
  // Label each curve where it leaves the chart (top edge or right edge).
  const [, iTop] = scales.y.domain() as [number, number];
  const labels = sheet.family.map((c) => {
    const exit = c.points.find((p) => p.i >= iTop) ?? c.points[c.points.length - 1]!;
    const atTop = exit.i >= iTop;
    // A second family's labels go one row lower, so two families on one chart keep their labels apart.
    const row = (style.labelRow ?? 0) * 14;
    return { vg: c.vg, x: scales.x(exit.v) + (atTop ? 3 : 4), y: atTop ? scales.y(iTop) + 12 + row : scales.y(exit.i) + 4 + row };
  }).filter((l) => Number.isFinite(l.x) && Number.isFinite(l.y));
  g.selectAll('text').data(spaced(labels)).join('text')
    .attr('x', (l) => l.x).attr('y', (l) => l.y)
    .attr('font-size', 11).attr('fill', style.stroke)
    .attr('paint-order', 'stroke').attr('stroke', PALETTE.sheet).attr('stroke-width', 3)
    .text((l) => fmtGrid(l.vg));
}

/**
 * The curve labels that fit: along the top edge each at least a label's
 * width from the last kept, down the right edge a line's height, so a
 * narrow chart names every second or third curve instead of overprinting.
 */
function spaced<L extends { x: number; y: number }>(labels: readonly L[]): L[] {
  const kept: L[] = [];
  for (const l of labels) {
    const clash = kept.some((k) => Math.abs(k.x - l.x) < LABEL_WIDTH && Math.abs(k.y - l.y) < LABEL_HEIGHT);
    if (!clash) kept.push(l);
  }
  return kept;
}
/** A curve label's room, px: "−12 V" at 11 px, and a line. */
const LABEL_WIDTH = 30;
const LABEL_HEIGHT = 12;

export function drawLimits(layer: SVGGElement, sheet: CurveSheet, scales: PlateScales): void {
  const g = select(layer);
  g.selectAll('*').remove();
  if (sheet.dissipation.length > 0) {
    g.append('path')
      .attr('d', planePath(scales)(sheet.dissipation as PlanePoint[]))
      .attr('fill', 'none').attr('stroke', PALETTE.limit).attr('stroke-width', LIMIT_STROKES.dissipation.width).attr('stroke-dasharray', LIMIT_STROKES.dissipation.dash)
      .attr('data-series', 'dissipation');
    const last = sheet.dissipation[sheet.dissipation.length - 1]!;
    g.append('text').attr('x', scales.x(last.v) - 4).attr('y', scales.y(last.i) - 6).attr('text-anchor', 'end')
      .attr('font-size', 11).attr('fill', PALETTE.limit)
      .attr('paint-order', 'stroke').attr('stroke', PALETTE.sheet).attr('stroke-width', 3)
      .text(`${sheet.maxPlateDissipation} W rated dissipation`);
  }
  if (sheet.gridLimit) {
    const curve = sheet.gridLimit;
    g.append('path')
      .attr('d', planePath(scales)(curve.points as PlanePoint[]))
      .attr('fill', 'none').attr('stroke', PALETTE.limit).attr('stroke-width', LIMIT_STROKES.gridLeak.width).attr('stroke-dasharray', LIMIT_STROKES.gridLeak.dash)
      .attr('data-series', 'grid-leak-limit').attr('data-vg', curve.vg);
    // Named low on the curve, clear of the grid-voltage labels along the top and right edges.
    const [, iTop] = scales.y.domain() as [number, number];
    const at = curve.points.find((p) => p.i >= 0.35 * iTop);
    if (at) {
      g.append('text').attr('x', scales.x(at.v) + 6).attr('y', scales.y(at.i)).attr('text-anchor', 'start')
        .attr('font-size', 11).attr('fill', PALETTE.limit)
        .attr('paint-order', 'stroke').attr('stroke', PALETTE.sheet).attr('stroke-width', 3)
        .text(`${fmtGrid(Number(curve.vg.toFixed(2)))}: grid-leak limit`);
    }
  }
  if (sheet.maxPlateVoltage !== null && sheet.maxPlateVoltage <= sheet.extent.vmax) {
    const xv = scales.x(sheet.maxPlateVoltage);
    const [yBottom, yTop] = scales.y.range() as [number, number];
    g.append('line').attr('x1', xv).attr('x2', xv).attr('y1', yBottom).attr('y2', yTop)
      .attr('stroke', PALETTE.limit).attr('stroke-width', LIMIT_STROKES.maxPlateVoltage.width).attr('stroke-dasharray', LIMIT_STROKES.maxPlateVoltage.dash).attr('data-series', 'max-plate-voltage');
    // Written up the line, clear of the curve labels along the top and the load line along the bottom.
    const yText = yBottom - (yBottom - yTop) * 0.72;
    g.append('text').attr('transform', `translate(${xv - 5},${yText}) rotate(-90)`).attr('text-anchor', 'middle')
      .attr('font-size', 11).attr('fill', PALETTE.limit)
      .attr('paint-order', 'stroke').attr('stroke', PALETTE.sheet).attr('stroke-width', 3)
      .text(`${sheet.maxPlateVoltage} V max plate`);
  }
}
