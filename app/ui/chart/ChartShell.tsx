import { useEffect, useMemo, useRef, type ReactNode } from 'react';
import type { CurveSheet, FollowerRegion, PlaneRegion } from '../../../src/index';
import { drawFollowerRegion } from '../targets/drawFollowerRegion';
import { drawRegion } from '../targets/drawRegion';
import { RegionHatch } from '../targets/RegionHatch';
import { plateScales, type PlateScales } from './plateScales';
import { SheetLayers } from './SheetLayers';
import { useChartBox } from './useChartBox';

/**
 * What every plate chart shares, whatever the stage: the frame that sizes
 * it, the scales of its window, the curve family (and a second tube's), the
 * target region's hatch and layer, and what goes under it. Each stage kind
 * brings its own layers and handles (`layers`, given the scales); its
 * targets are a region over the plane, or stretches of the one line a
 * follower moves along.
 */
export function ChartShell({ sheet, rivalSheet, label, region, layers, below }: {
  sheet: CurveSheet;
  rivalSheet: CurveSheet | null;
  label: string;
  /** Where the targets hold, drawn under the lines: hatched cells of the plane, or a band along a follower's line. */
  region: { readonly plane: PlaneRegion | null } | { readonly line: FollowerRegion | null };
  layers: (scales: PlateScales) => ReactNode;
  below: ReactNode;
}) {
  const frame = useRef<HTMLDivElement>(null);
  const box = useChartBox(frame);
  const scales = useMemo(() => plateScales(sheet.extent, box), [sheet.extent, box]);
  const regionLayer = useRef<SVGGElement>(null);
  const plane = 'plane' in region ? region.plane : null;
  const line = 'line' in region ? region.line : null;
  useEffect(() => {
    if (!regionLayer.current) return;
    if (line) drawFollowerRegion(regionLayer.current, line, scales);
    else drawRegion(regionLayer.current, plane, scales);
  }, [plane, line, scales]);
  return (
    <div className="chart-frame" ref={frame}>
      <svg className="plate-chart" viewBox={`0 0 ${box.width} ${box.height}`} width={box.width} height={box.height} role="group" aria-label={label}>
        <RegionHatch />
        <SheetLayers sheet={sheet} rivalSheet={rivalSheet} scales={scales} />
        <g ref={regionLayer} className="layer-region" pointerEvents="none" />
        {layers(scales)}
      </svg>
      {below}
    </div>
  );
}
