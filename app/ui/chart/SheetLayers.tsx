import { useEffect, useRef } from 'react';
import type { CurveSheet } from '../../../src/index';
import { drawAxes, drawFamily, drawGrid, drawLimits } from './drawSheet';
import { PALETTE } from './palette';
import type { PlateScales } from './plateScales';

/**
 * The static layers of a plate chart, in drawing order: grid, ratings
 * limits, a second tube's family, the family, axes. React owns the groups;
 * d3 draws inside them. Grid and axes follow the window only; the families
 * and limits follow their sheets, never the moving point.
 */
export function SheetLayers({ sheet, rivalSheet, scales }: { sheet: CurveSheet; rivalSheet: CurveSheet | null; scales: PlateScales }) {
  const grid = useRef<SVGGElement>(null);
  const limits = useRef<SVGGElement>(null);
  const rivalCurves = useRef<SVGGElement>(null);
  const curves = useRef<SVGGElement>(null);
  const axes = useRef<SVGGElement>(null);

  useEffect(() => {
    if (!grid.current || !axes.current) return;
    drawGrid(grid.current, scales);
    drawAxes(axes.current, scales);
  }, [scales]);

  useEffect(() => {
    if (!curves.current || !limits.current) return;
    drawFamily(curves.current, sheet, scales);
    drawLimits(limits.current, sheet, scales);
  }, [sheet, scales]);

  useEffect(() => {
    if (!rivalCurves.current) return;
    if (rivalSheet) drawFamily(rivalCurves.current, rivalSheet, scales, { stroke: PALETTE.rival, dash: '6 3', labelRow: 1 });
    else rivalCurves.current.replaceChildren();
  }, [rivalSheet, scales]);

  return (
    <>
      <g ref={grid} className="layer-grid" />
      <g ref={limits} className="layer-limits" />
      <g ref={rivalCurves} className="layer-rival-curves" />
      <g ref={curves} className="layer-curves" />
      <g ref={axes} className="layer-axes" />
    </>
  );
}

/** The operating point's mark: a ring with a dot, inside a larger transparent target for the pointer. */
export function PointMark() {
  return (
    <>
      <circle r={16} fill="transparent" />
      <circle r={7} fill={PALETTE.point} stroke={PALETTE.ink} strokeWidth={1.8} />
      <circle r={1.8} fill={PALETTE.ink} />
    </>
  );
}

/** A second tube's point: a square, so grayscale prints still tell the two apart. */
export function RivalMark() {
  return <rect x={-6} y={-6} width={12} height={12} fill={PALETTE.rival} stroke={PALETTE.ink} strokeWidth={1.6} />;
}
