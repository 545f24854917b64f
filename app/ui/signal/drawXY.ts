import { axisBottom, axisLeft, line, scaleLinear, scaleLog, select, type ScaleContinuousNumeric } from 'd3';
import { PALETTE } from '../chart/palette';

/**
 * A small XY chart drawn into an SVG group: axes (linear or log), line
 * series, bars and point markers. One function for the signal views, so they
 * share look and scale handling; it builds its scales once from the domains
 * given and returns them for overlays.
 */
export interface AxisSpec {
  readonly domain: readonly [number, number];
  readonly log?: boolean;
  readonly label: string;
  readonly ticks?: number;
  readonly format?: (v: number) => string;
}

export interface XYSeries {
  readonly points: readonly { x: number; y: number }[];
  readonly stroke: string;
  readonly width?: number;
  readonly dash?: string;
  readonly key: string;
}

export interface XYBar {
  readonly x: number;
  readonly y: number;
  readonly label: string;
}

export interface XYSpec {
  readonly width: number;
  readonly height: number;
  readonly x: AxisSpec;
  readonly y: AxisSpec;
  readonly series?: readonly XYSeries[];
  readonly bars?: readonly XYBar[];
  /** Points with a label; `below` writes it under the point (where another marker's label sits above). */
  readonly markers?: readonly { x: number; y: number; label?: string; color: string; below?: boolean }[];
  /** A cloud of unlabelled points (a fit's measured points, up to tens of thousands), drawn as one path. */
  readonly dots?: { readonly key: string; readonly color: string; readonly points: readonly { x: number; y: number }[] };
}

const M = { top: 10, right: 12, bottom: 36, left: 48 };

function scale(spec: AxisSpec, range: [number, number]): ScaleContinuousNumeric<number, number> {
  const s = spec.log ? scaleLog() : scaleLinear();
  return s.domain(spec.domain as [number, number]).range(range).clamp(true);
}

export function drawXY(layer: SVGGElement, spec: XYSpec) {
  const g = select(layer);
  g.selectAll('*').remove();
  const x = scale(spec.x, [M.left, spec.width - M.right]);
  const y = scale(spec.y, [spec.height - M.bottom, M.top]);
  g.append('rect').attr('x', M.left).attr('y', M.top).attr('width', spec.width - M.left - M.right).attr('height', spec.height - M.top - M.bottom).attr('fill', PALETTE.sheet).attr('stroke', PALETTE.gridMajor);
  const xTicks = x.ticks(spec.x.ticks ?? 6);
  const yTicks = y.ticks(spec.y.ticks ?? 5);
  g.append('g').selectAll('line').data(xTicks).join('line').attr('x1', (d) => x(d)).attr('x2', (d) => x(d)).attr('y1', M.top).attr('y2', spec.height - M.bottom).attr('stroke', PALETTE.gridMinor);
  g.append('g').selectAll('line').data(yTicks).join('line').attr('y1', (d) => y(d)).attr('y2', (d) => y(d)).attr('x1', M.left).attr('x2', spec.width - M.right).attr('stroke', PALETTE.gridMinor);
  const xa = axisBottom(x).ticks(spec.x.ticks ?? 6).tickSizeOuter(0);
  if (spec.x.format) xa.tickFormat((d) => spec.x.format!(d as number));
  else if (spec.x.log) xa.tickFormat((d) => (Math.log10(d as number) % 1 === 0 ? shortNumber(d as number) : ''));
  const ya = axisLeft(y).ticks(spec.y.ticks ?? 5).tickSizeOuter(0);
  if (spec.y.format) ya.tickFormat((d) => spec.y.format!(d as number));
  else if (spec.y.log) ya.tickFormat((d) => (Math.log10(d as number) % 1 === 0 ? shortNumber(d as number) : ''));
  g.append('g').attr('transform', `translate(0,${spec.height - M.bottom})`).call(xa).attr('font-size', 10).attr('color', PALETTE.inkSoft);
  g.append('g').attr('transform', `translate(${M.left},0)`).call(ya).attr('font-size', 10).attr('color', PALETTE.inkSoft);
  g.append('text').attr('x', (M.left + spec.width - M.right) / 2).attr('y', spec.height - 4).attr('text-anchor', 'middle').attr('font-size', 11).attr('fill', PALETTE.ink).text(spec.x.label);
  g.append('text').attr('transform', `translate(11,${(M.top + spec.height - M.bottom) / 2}) rotate(-90)`).attr('text-anchor', 'middle').attr('font-size', 11).attr('fill', PALETTE.ink).text(spec.y.label);
  const path = line<{ x: number; y: number }>().defined((p) => Number.isFinite(p.x) && Number.isFinite(p.y)).x((p) => x(p.x)).y((p) => y(p.y));
  for (const s of spec.series ?? []) {
    g.append('path').attr('data-series', s.key).attr('d', path(s.points as { x: number; y: number }[])).attr('fill', 'none').attr('stroke', s.stroke).attr('stroke-width', s.width ?? 1.6).attr('stroke-dasharray', s.dash ?? null);
  }
  const base = y(spec.y.domain[0]);
  // A bar at the floor is below what the chart shows: no figure on it (it is not that value). Negative with a true minus.
  for (const b of spec.bars ?? []) {
    const top = y(Math.max(b.y, spec.y.domain[0]));
    g.append('rect').attr('data-bar', b.label).attr('x', x(b.x) - 9).attr('width', 18).attr('y', top).attr('height', Math.max(0, base - top)).attr('fill', PALETTE.load);
    g.append('text').attr('x', x(b.x)).attr('y', top - 3).attr('text-anchor', 'middle').attr('font-size', 9).attr('fill', PALETTE.ink).text(Number.isFinite(b.y) && b.y > spec.y.domain[0] ? b.y.toFixed(0).replace('-', '−') : '');
  }
  if (spec.dots) {
    // One path of zero-length round-capped strokes, a dot each: 10,000 points as circles cost the page a
    // 130 to 210 ms task of element creation (measured, the bench's fit of 10,000 points); as one path, a few ms.
    const d = spec.dots.points.filter((p) => Number.isFinite(p.x) && Number.isFinite(p.y)).map((p) => `M${x(p.x).toFixed(1)},${y(p.y).toFixed(1)}h0`).join('');
    g.append('path').attr('data-dots', spec.dots.key).attr('d', d).attr('fill', 'none').attr('stroke', spec.dots.color).attr('stroke-width', 6).attr('stroke-linecap', 'round');
  }
  for (const m of spec.markers ?? []) {
    g.append('circle').attr('cx', x(m.x)).attr('cy', y(m.y)).attr('r', 4).attr('fill', m.color).attr('stroke', PALETTE.ink);
    // Labels in the right half of the plot are written leftward, so they stay inside it.
    const leftward = x(m.x) > (x.range()[0]! + x.range()[1]!) / 2;
    if (m.label) g.append('text').attr('x', x(m.x) + (leftward ? -6 : 6)).attr('text-anchor', leftward ? 'end' : 'start').attr('y', y(m.y) + (m.below ? 14 : -6)).attr('font-size', 10).attr('fill', PALETTE.ink).attr('paint-order', 'stroke').attr('stroke', PALETTE.sheet).attr('stroke-width', 3).text(m.label);
  }
  return { x, y };
}

function shortNumber(v: number): string {
  if (v >= 1e6) return `${v / 1e6}M`;
  if (v >= 1e3) return `${v / 1e3}k`;
  return String(v);
}
