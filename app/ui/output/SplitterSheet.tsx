import { useEffect, useId, useRef } from 'react';
import type { SplitterPlane } from '../../../src/index';
import { ChartLegend, splitterLegend } from '../chart/ChartLegend';
import { ChartShell } from '../chart/ChartShell';
import { linePath } from '../chart/drawOverlay';
import { PALETTE } from '../chart/palette';
import type { PlateScales } from '../chart/plateScales';
import { PointMark, RivalMark } from '../chart/SheetLayers';
import { splitterPlaneOf } from '../../store/splitterPlane';
import { useWorkbench } from '../../store/StoreProvider';
import { drivesPair, splitterName } from '../../store/outputPlan';
import { milliamps, volts } from '../../format';

/**
 * The phase splitter's triode on its plate curves, in the one plate-chart
 * shell every stage uses: the DC load line, the bias line and the operating
 * point (a long-tailed pair's second triode in the rival's colour and mark).
 * Its own panel in the bench's main column, at a width its curve and line
 * labels can be read at (in the values' column they had crowded each
 * other); its values are set in the splitter's table, and it follows them.
 */
export function SplitterSheet() {
  const id = useId();
  const plane = useWorkbench(splitterPlaneOf);
  const sp = useWorkbench((s) => (drivesPair(s.design) ? s.design.output.splitter : null));
  if (!plane || !sp) return null;
  const ltp = sp.kind === 'long-tailed-pair';
  return (
    <section className="panel splitter-sheet" aria-labelledby={`${id}-h`}>
      <h2 id={`${id}-h`}>{`Phase splitter, ${splitterName(sp)}, on its plate curves`}</h2>
      <ChartShell
        sheet={plane.sheet}
        rivalSheet={null}
        label={`Plate curves of the phase splitter's ${sp.tubeId} with its DC load line, bias line and operating point (${volts(plane.point.v)}, ${milliamps(plane.point.i)})`}
        region={{ plane: null }}
        layers={(scales) => <SplitterLayers plane={plane} scales={scales} />}
        below={<ChartLegend first={sp.tubeId} rival={null} items={splitterLegend(ltp)} />}
      />
    </section>
  );
}

function SplitterLayers({ plane, scales }: { plane: SplitterPlane; scales: PlateScales }) {
  const lines = useRef<SVGGElement>(null);
  useEffect(() => {
    if (!lines.current) return;
    linePath(lines.current, 'dc-load', plane.load, scales, { stroke: PALETTE.load, width: 2 });
    linePath(lines.current, 'bias', plane.bias, scales, { stroke: PALETTE.bias, width: 1.8, dash: '5 3' });
    linePath(lines.current, 'second-load', plane.second?.load ?? [], scales, { stroke: PALETTE.rival, width: 1.6, dash: '10 4' });
  }, [plane, scales]);
  const at = (p: { v: number; i: number }) => `translate(${scales.x(p.v)},${scales.y(p.i)})`;
  return (
    <>
      <g ref={lines} className="layer-lines" pointerEvents="none" />
      {plane.second ? (
        <g transform={at(plane.second.point)} data-splitter-point="second">
          <RivalMark />
        </g>
      ) : null}
      <g transform={at(plane.point)} data-splitter-point="first">
        <PointMark />
      </g>
    </>
  );
}
