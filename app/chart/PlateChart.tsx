import { useEffect, useMemo, useRef } from 'react';
import { useWorkbench } from '../store/StoreProvider';
import { drawAxes, drawFamily, drawGrid, drawLimits } from './drawSheet';
import { CHART_BOX, plateScales } from './plateScales';

/**
 * The plate chart. React owns the <svg> and its layer groups; d3 draws inside
 * them. The static layers redraw only when the curve sheet changes.
 */
export function PlateChart() {
  const sheet = useWorkbench((s) => s.sheet);
  const tubeId = useWorkbench((s) => s.tubeId);
  const scales = useMemo(() => plateScales(sheet.extent), [sheet.extent]);
  const grid = useRef<SVGGElement>(null);
  const curves = useRef<SVGGElement>(null);
  const limits = useRef<SVGGElement>(null);
  const axes = useRef<SVGGElement>(null);

  useEffect(() => {
    if (!grid.current || !curves.current || !limits.current || !axes.current) return;
    drawGrid(grid.current, scales);
    drawFamily(curves.current, sheet, scales);
    drawLimits(limits.current, sheet, scales);
    drawAxes(axes.current, scales);
  }, [sheet, scales]);

  return (
    <svg
      className="plate-chart"
      viewBox={`0 0 ${CHART_BOX.width} ${CHART_BOX.height}`}
      role="img"
      aria-label={`Plate curves of the ${tubeId}: plate current against plate voltage for a range of grid voltages`}
    >
      <g ref={grid} className="layer-grid" />
      <g ref={limits} className="layer-limits" />
      <g ref={curves} className="layer-curves" />
      <g ref={axes} className="layer-axes" />
    </svg>
  );
}
