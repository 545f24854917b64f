import { useEffect, useMemo, useRef, type KeyboardEvent, type PointerEvent } from 'react';
import { milliamps, ohms, plain, volts } from '../../format';
import { ChartLegend, OUTPUT_STAGE_LEGEND, PAIR_STAGE_LEGEND } from '../chart/ChartLegend';
import { PointMark, RivalMark } from '../chart/SheetLayers';
import { ChartShell } from '../chart/ChartShell';
import { PALETTE } from '../chart/palette';
import type { PlateScales } from '../chart/plateScales';
import { pointKey } from '../chart/pointKeys';
import { CurveDensity } from '../chart/CurveDensity';
import { useWorkbench, useWorkbenchStore } from '../../store/StoreProvider';
import { attachOutputDrag } from './attachOutputDrag';
import { drawOutputOverlay } from './drawOutputOverlay';
import { DESIGN_LIMITS } from '../../store/designLimits';
import { benchPoint } from '../../store/outputAnalysis';
import { currentOutputRegion } from '../../store/outputTargets';
import { failingAt } from '../../store/regionSlice';
import { cursorTargetWords } from '../targets/cursorTargets';
import { targetsWithEdges } from '../targets/drawRegion';

/**
 * Under the chart: why the point is not under the pointer (the bias cannot
 * put it there, or the targets held it), and, with targets set, which of
 * them fail at the cursor (the region's own verdict of that cell).
 */
function OutputStatus() {
  const note = useWorkbench((s) => s.dragNote);
  const hover = useWorkbench((s) => s.outputHover);
  const region = useWorkbench(currentOutputRegion);
  const failing = hover && region ? failingAt(region, hover.vpk, hover.ip) : null;
  const targets = cursorTargetWords(failing, 'no bias puts the tube here');
  return (
    <div className="chart-status" aria-live="polite">
      {note ? <p className="drag-note">{note}</p> : null}
      {hover && region ? <p className="hover-readout" data-testid="output-hover-readout">{`Cursor: Vpk ${plain(hover.vpk)} V · Ip ${milliamps(hover.ip)}${targets}`}</p> : null}
    </div>
  );
}

/**
 * The output stage's plate chart, in the shell every plate chart shares:
 * curves at the screen voltage as wired, the DC and AC load lines, the
 * point (drag: bias and B+) and the AC load line's handle (drag: primary
 * impedance), the targets' region over the plane of bias and B+. A rival
 * tube's curves, lines and point share the axes. The overlay follows the
 * store by subscription.
 */
export function OutputChart() {
  const sheet = useWorkbench((s) => s.outputBench.analysis.sheet);
  const tubeId = useWorkbench((s) => s.design.output.tubeId);
  const pair = useWorkbench((s) => s.outputBench.pair === 'push-pull');
  const rivalSheet = useWorkbench((s) => (s.outputRivalBench && s.outputRivalBench.ok ? s.outputRivalBench.analysis.sheet : null));
  const rivalId = useWorkbench((s) => (s.outputRival.on ? s.outputRival.tubeId : null));
  const region = useWorkbench(currentOutputRegion);
  const regionKeys = useMemo(() => (region ? targetsWithEdges(region) : null), [region]);
  return (
    <ChartShell
      sheet={sheet}
      rivalSheet={rivalSheet}
      label={pair ? `Plate curves of one ${tubeId} of the push-pull pair with its composite load lines, the path it takes at full drive and its operating point` : `Plate curves of the ${tubeId} output stage with its load lines and operating point`}
      region={{ plane: region }}
      layers={(scales) => <OutputLayers scales={scales} />}
      below={
        <>
          <OutputStatus />
          <CurveDensity />
          <ChartLegend first={tubeId} rival={rivalId && rivalSheet ? rivalId : null} items={pair ? PAIR_STAGE_LEGEND : OUTPUT_STAGE_LEGEND} region={regionKeys} />
        </>
      }
    />
  );
}

/** The output stage's own layers and handles: its lines, the second tube's point, the AC load line's handle and the operating point. */
function OutputLayers({ scales }: { scales: PlateScales }) {
  const store = useWorkbenchStore();
  const vmax = useWorkbench((s) => s.outputBench.analysis.sheet.extent.vmax);
  const rivalId = useWorkbench((s) => (s.outputRival.on ? s.outputRival.tubeId : null));
  const lines = useRef<SVGGElement>(null);
  const point = useRef<SVGGElement>(null);
  const loadHandle = useRef<SVGGElement>(null);
  const rivalPoint = useRef<SVGGElement>(null);

  useEffect(() => {
    const nodes = { lines: lines.current!, point: point.current!, loadHandle: loadHandle.current!, rivalPoint: rivalPoint.current! };
    const draw = () => {
      const s = store.getState();
      const a = s.outputBench.analysis;
      const r = s.outputRivalBench && s.outputRivalBench.ok ? s.outputRivalBench.analysis.overlay : null;
      drawOutputOverlay(nodes, a.overlay, r, scales);
      const op = benchPoint(s.outputBench);
      nodes.point.dataset.vpk = String(op.vpk);
      nodes.point.dataset.ip = String(op.ip);
      nodes.point.setAttribute('aria-valuenow', String(Math.round(op.vpk)));
      nodes.point.setAttribute('aria-valuetext', `plate ${volts(op.vpk)} to cathode, ${milliamps(op.ip)}, grid ${volts(op.vgk)}`);
      const pair = s.outputBench.pair === 'push-pull';
      const load = pair ? s.design.output.raa : s.design.output.zPrimary;
      nodes.loadHandle.setAttribute('aria-valuenow', String(load));
      nodes.loadHandle.setAttribute('aria-valuetext', pair ? `plate-to-plate load ${ohms(load)}` : `primary impedance ${ohms(load)}`);
      nodes.loadHandle.setAttribute('aria-valuemin', String(pair ? DESIGN_LIMITS.output.raa.min : DESIGN_LIMITS.output.zPrimary.min));
      nodes.loadHandle.setAttribute('aria-valuemax', String(pair ? DESIGN_LIMITS.output.raa.max : DESIGN_LIMITS.output.zPrimary.max));
      nodes.loadHandle.setAttribute('aria-label', pair ? 'Plate-to-plate load: drag the composite load line\'s handle, or use the arrow keys' : 'Primary impedance: drag the AC load line\'s handle, or use the arrow keys');
    };
    draw();
    const unsubscribe = store.subscribe((s, prev) => {
      if (s.outputBench !== prev.outputBench || s.outputRivalBench !== prev.outputRivalBench) draw();
    });
    const detach = attachOutputDrag(store, scales, nodes.point, nodes.loadHandle);
    return () => {
      unsubscribe();
      detach();
    };
  }, [store, scales]);

  const onPointKey = (e: KeyboardEvent<SVGGElement>) =>
    pointKey(e, store.getState(), store.getState().dragging === 'output-point', (dx, dy) => {
      const s = store.getState();
      if (s.dragging !== 'output-point') s.beginDrag('output-point');
      const { vmax: vm, iaMax } = s.outputBench.analysis.sheet.extent;
      const { vpk, ip } = benchPoint(store.getState().outputBench);
      store.getState().dragOutputPointTo(vpk + dx * vm, ip + dy * iaMax);
    });
  const onPointBlur = () => {
    if (store.getState().dragging === 'output-point') store.getState().endDrag();
  };
  const onLoadKey = (e: KeyboardEvent<SVGGElement>) => {
    const up = e.key === 'ArrowRight' || e.key === 'ArrowUp';
    const down = e.key === 'ArrowLeft' || e.key === 'ArrowDown';
    if (!up && !down) return;
    e.preventDefault();
    const s = store.getState();
    const factor = 1 + (e.shiftKey ? 0.1 : 0.02) * (up ? 1 : -1);
    s.beginDrag('output-load');
    const o = s.design.output;
    s.changeOutput(o.pair === 'push-pull' ? { raa: Number((o.raa * factor).toPrecision(3)) } : { zPrimary: Number((o.zPrimary * factor).toPrecision(3)) });
    store.getState().endDrag();
  };

  const onHover = (e: PointerEvent<SVGRectElement>) => {
    const ctm = e.currentTarget.ownerSVGElement?.getScreenCTM();
    if (!ctm) return;
    const p = new DOMPoint(e.clientX, e.clientY).matrixTransform(ctm.inverse());
    store.getState().setOutputHover({ vpk: scales.x.invert(p.x), ip: scales.y.invert(p.y) });
  };
  const [x0, x1] = scales.x.range() as [number, number];
  const [y0, y1] = scales.y.range() as [number, number];
  return (
    <>
      <rect className="hover-surface" x={x0} y={y1} width={x1 - x0} height={y0 - y1} fill="transparent" onPointerMove={onHover} onPointerLeave={() => store.getState().setOutputHover(null)} />
      <g ref={lines} className="layer-lines" pointerEvents="none" />
      <g ref={rivalPoint} className="handle-rival fixed" role="img" aria-label={`Operating point of the ${rivalId ?? 'second tube'} with the same parts`} visibility="hidden">
        <RivalMark />
      </g>
      <g ref={loadHandle} className="handle handle-load" role="slider" tabIndex={0} onKeyDown={onLoadKey}>
        <rect x={-14} y={-14} width={28} height={28} fill="transparent" />
        <rect x={-5.5} y={-5.5} width={11} height={11} fill={PALETTE.sheet} stroke={PALETTE.load} strokeWidth={2.2} transform="rotate(45)" />
      </g>
      <g
        ref={point}
        className="handle handle-point"
        role="slider"
        tabIndex={0}
        aria-label="Operating point: drag it to set the bias and B+, or use the arrow keys (Shift for larger steps, Enter to settle, Escape to undo the move)"
        aria-valuemin={0}
        aria-valuemax={vmax}
        onKeyDown={onPointKey}
        onBlur={onPointBlur}
      >
        <PointMark />
      </g>
    </>
  );
}
