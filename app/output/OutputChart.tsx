import { useEffect, useMemo, useRef, type KeyboardEvent } from 'react';
import { milliamps, ohms, volts } from '../format';
import { ChartLegend, OUTPUT_STAGE_LEGEND, PAIR_STAGE_LEGEND } from '../chart/ChartLegend';
import { PointMark, RivalMark, SheetLayers } from '../chart/SheetLayers';
import { PALETTE } from '../chart/palette';
import { plateScales } from '../chart/plateScales';
import { useChartBox } from '../chart/useChartBox';
import { CurveDensity } from '../chart/CurveDensity';
import { useWorkbench, useWorkbenchStore } from '../store/StoreProvider';
import { attachOutputDrag } from './attachOutputDrag';
import { drawOutputOverlay } from './drawOutputOverlay';
import { DESIGN_LIMITS } from '../store/designLimits';
import { benchPoint } from '../store/outputAnalysis';
import { currentOutputRegion } from '../store/outputTargets';
import { drawRegion, targetsWithEdges } from '../targets/drawRegion';
import { RegionHatch } from '../targets/RegionHatch';

/** Why the point is not under the pointer (the bias cannot put it there, or the targets held it), as the voltage chart says it. */
function DragNote() {
  const note = useWorkbench((s) => s.dragNote);
  return <div className="chart-status" aria-live="polite">{note ? <p className="drag-note">{note}</p> : null}</div>;
}

/** Arrow keys move the point by 1 % of the window (5 % with Shift); on the load handle they change Zpri by 2 % (10 %). */
const STEP = 0.01;
const BIG_STEP = 0.05;

/**
 * The output stage's plate chart: curves at the screen voltage as wired,
 * the DC and AC load lines, the point (drag: bias and B+) and the AC load
 * line's handle (drag: primary impedance). A rival tube's curves, lines and
 * point share the axes. The overlay follows the store by subscription.
 */
export function OutputChart() {
  const store = useWorkbenchStore();
  const sheet = useWorkbench((s) => s.outputBench.analysis.sheet);
  const tubeId = useWorkbench((s) => s.design.output.tubeId);
  const pair = useWorkbench((s) => s.outputBench.pair === 'push-pull');
  const rivalSheet = useWorkbench((s) => (s.outputRivalBench && s.outputRivalBench.ok ? s.outputRivalBench.analysis.sheet : null));
  const rivalId = useWorkbench((s) => (s.outputRival.on ? s.outputRival.tubeId : null));
  const frame = useRef<HTMLDivElement>(null);
  const box = useChartBox(frame);
  const scales = useMemo(() => plateScales(sheet.extent, box), [sheet.extent, box]);
  const lines = useRef<SVGGElement>(null);
  const point = useRef<SVGGElement>(null);
  const loadHandle = useRef<SVGGElement>(null);
  const rivalPoint = useRef<SVGGElement>(null);
  const regionLayer = useRef<SVGGElement>(null);
  const region = useWorkbench(currentOutputRegion);
  useEffect(() => {
    if (regionLayer.current) drawRegion(regionLayer.current, region, scales);
  }, [region, scales]);
  const regionKeys = useMemo(() => (region ? targetsWithEdges(region) : null), [region]);

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

  const onPointKey = (e: KeyboardEvent<SVGGElement>) => {
    const s = store.getState();
    if ((e.key === 'Enter' || e.key === 'Escape') && s.dragging === 'output-point') {
      e.preventDefault();
      if (e.key === 'Enter') s.endDrag();
      else s.cancelDrag();
      return;
    }
    const step = e.shiftKey ? BIG_STEP : STEP;
    const moves: Record<string, [number, number]> = { ArrowLeft: [-step, 0], ArrowRight: [step, 0], ArrowUp: [0, step], ArrowDown: [0, -step] };
    const m = moves[e.key];
    if (!m) return;
    e.preventDefault();
    if (s.dragging !== 'output-point') s.beginDrag('output-point');
    const { vmax, iaMax } = s.outputBench.analysis.sheet.extent;
    const { vpk, ip } = benchPoint(store.getState().outputBench);
    store.getState().dragOutputPointTo(vpk + m[0] * vmax, ip + m[1] * iaMax);
  };
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

  return (
    <div className="chart-frame" ref={frame}>
      <svg
        className="plate-chart"
        viewBox={`0 0 ${box.width} ${box.height}`}
        width={box.width}
        height={box.height}
        role="group"
        aria-label={pair ? `Plate curves of one ${tubeId} of the push-pull pair with its composite load lines, the path it takes at full drive and its operating point` : `Plate curves of the ${tubeId} output stage with its load lines and operating point`}
      >
        <RegionHatch />
        <SheetLayers sheet={sheet} rivalSheet={rivalSheet} scales={scales} />
        <g ref={regionLayer} className="layer-region" pointerEvents="none" />
        <g ref={lines} className="layer-lines" pointerEvents="none" />
        <g ref={rivalPoint} className="handle-rival fixed" role="img" aria-label={`Operating point of the ${rivalId ?? 'second tube'} with the same parts`} visibility="hidden">
          <RivalMark />
        </g>
        <g
          ref={loadHandle}
          className="handle handle-load"
          role="slider"
          tabIndex={0}
          onKeyDown={onLoadKey}
        >
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
          aria-valuemax={sheet.extent.vmax}
          onKeyDown={onPointKey}
          onBlur={onPointBlur}
        >
          <PointMark />
        </g>
      </svg>
      <DragNote />
      <CurveDensity />
      <ChartLegend first={tubeId} rival={rivalId && rivalSheet ? rivalId : null} items={pair ? PAIR_STAGE_LEGEND : OUTPUT_STAGE_LEGEND} region={regionKeys} readout={false} />
    </div>
  );
}
