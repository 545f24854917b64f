import { useEffect, useMemo, useRef, type KeyboardEvent, type PointerEvent } from 'react';
import { milliamps, volts } from '../../format';
import { useWorkbench, useWorkbenchStore } from '../../store/StoreProvider';
import { attachDrag } from './attachDrag';
import { ChartLegend, followerLegend, voltageStageLegend } from './ChartLegend';
import { PointMark, RivalMark } from './SheetLayers';
import { ChartShell } from './ChartShell';
import { pointKey } from './pointKeys';
import type { PlateScales } from './plateScales';
import { drawOverlay, drawRivalOverlay, drawSpread, linePath } from './drawOverlay';
import { followerShown, shownLines, shownRivalSheet, shownSheet, shownTubeId } from '../../store/shownStage';
import { buildSheetOf } from '../../store/buildSheet';
import { HoverReadout } from './HoverReadout';
import { ChartWindowSwitch } from './ChartWindowSwitch';
import { CurveDensity } from './CurveDensity';
import { PALETTE } from './palette';
import { DESIGN_LIMITS } from '../../store/designLimits';
import { targetsWithEdges } from '../targets/drawRegion';
import { currentFollowerRegion } from '../../store/regionSlice';

/**
 * The plate chart of the voltage stage on the bench: a gain stage, or its
 * cathode follower (shownStage.ts picks which), in the shell every plate
 * chart shares. React owns the <svg>, its layer groups and the focusable
 * handles; d3 draws inside the layers. Static layers redraw only when the
 * curve sheet changes; the overlay follows the store through a
 * subscription, so dragging never re-renders this component.
 */
export function PlateChart() {
  const sheet = useWorkbench(shownSheet);
  const rivalSheet = useWorkbench(shownRivalSheet);
  const rival = useWorkbench((s) => s.rival);
  const tubeId = useWorkbench(shownTubeId);
  const follower = useWorkbench(followerShown);
  const vgrid = useWorkbench((s) => (followerShown(s) ? s.followerBench!.vgrid : null));
  const region = useWorkbench((s) => (s.region?.result.ok && !followerShown(s) ? s.region.result : null));
  const followerRegion = useWorkbench((s) => (followerShown(s) ? currentFollowerRegion(s) : null));
  const regionKeys = useMemo(() => (region ? targetsWithEdges(region) : null), [region]);
  return (
    <ChartShell
      sheet={sheet}
      rivalSheet={rivalSheet}
      label={follower ? `Plate curves of the follower's ${tubeId} with its cathode load line, bias line and operating point` : `Plate curves of the ${tubeId} with the stage's load lines and operating point`}
      region={follower ? { line: followerRegion } : { plane: region }}
      layers={(scales) => <VoltageLayers scales={scales} />}
      below={
        <>
          <HoverReadout />
          <div className="chart-controls">
            {follower ? null : <ChartWindowSwitch />}
            <CurveDensity />
          </div>
          <ChartLegend rival={rival.on && rivalSheet ? rival.tubeId : null} first={tubeId} region={regionKeys} alongLine={followerRegion !== null} items={follower && vgrid !== null ? followerLegend(vgrid) : voltageStageLegend(sheet.gridLimit?.vg ?? null)} />
        </>
      }
    />
  );
}

/** The voltage stage's own layers and handles: the cursor's surface, the parts' spread, the lines, B+'s foot, the second tube's point and the operating point. */
function VoltageLayers({ scales }: { scales: PlateScales }) {
  const store = useWorkbenchStore();
  const sheet = useWorkbench(shownSheet);
  const rivalSheet = useWorkbench(shownRivalSheet);
  const rival = useWorkbench((s) => s.rival);
  const follower = useWorkbench(followerShown);
  const lines = useRef<SVGGElement>(null);
  const point = useRef<SVGGElement>(null);
  const bplusHandle = useRef<SVGGElement>(null);
  const rivalHandle = useRef<SVGGElement>(null);
  const spreadLayer = useRef<SVGGElement>(null);
  const spread = useWorkbench((s) => (s.buildInputs.showSpread && !s.dragging && !followerShown(s) ? buildSheetOf(s).spread : null));

  useEffect(() => {
    if (!spreadLayer.current) return;
    drawSpread(spreadLayer.current, spread && spread.ok ? spread.samples.map((p) => ({ v: p.vpk, i: p.ia })) : [], scales);
  }, [spread, scales]);

  useEffect(() => {
    const nodes = { lines: lines.current!, point: point.current!, bplusHandle: bplusHandle.current! };
    const draw = () => {
      const s = store.getState();
      const shown = shownLines(s);
      const { op } = shown;
      const isFollower = followerShown(s);
      drawOverlay(nodes, shown.overlay, s.design.bplus, scales, isFollower ? [] : shown.trace);
      // A follower's point can only move along this line (its grid is held by the plate before it).
      linePath(nodes.lines, 'locus', isFollower ? shown.trace : [], scales, { stroke: PALETTE.point, width: 1.2, dash: '1 4' });
      drawRivalOverlay(nodes.lines, rivalHandle.current!, shown.rival, scales);
      nodes.point.setAttribute('aria-valuenow', String(Math.round(op.vpk)));
      // Exact values for tests and exports to read; the figures strip shows them rounded.
      nodes.point.dataset.vpk = String(op.vpk);
      nodes.point.dataset.ia = String(op.ia);
      nodes.point.dataset.vgk = String(op.vgk);
      nodes.point.setAttribute('aria-valuetext', `plate ${volts(op.va)} to ground, ${volts(op.vpk)} plate to cathode, ${milliamps(op.ia)}`);
      nodes.bplusHandle.setAttribute('aria-valuenow', String(s.design.bplus));
      nodes.bplusHandle.setAttribute('aria-valuetext', `B+ ${volts(s.design.bplus)}`);
    };
    draw();
    const unsubscribe = store.subscribe((s, prev) => {
      if (s.analysis !== prev.analysis || s.rivalAnalysis !== prev.rivalAnalysis || s.followerBench !== prev.followerBench || s.followerRival !== prev.followerRival) draw();
    });
    const detach = attachDrag(store, scales, nodes.point, nodes.bplusHandle, rivalHandle.current!);
    return () => {
      unsubscribe();
      detach();
    };
  }, [store, scales]);

  const pointDragging = () => {
    const dragging = store.getState().dragging;
    return dragging === 'point' || dragging === 'follower-point';
  };
  const onPointKey = (e: KeyboardEvent<SVGGElement>) => pointKey(e, store.getState(), pointDragging(), (dx, dy) => store.getState().nudgePoint(dx, dy));

  /** Leaving the handle after arrow presses is the keyboard's release. */
  const onPointBlur = () => {
    if (pointDragging()) store.getState().endDrag();
  };

  const onBplusKey = (e: KeyboardEvent<SVGGElement>) => {
    const step = e.shiftKey ? 10 : 1;
    const delta = e.key === 'ArrowRight' || e.key === 'ArrowUp' ? step : e.key === 'ArrowLeft' || e.key === 'ArrowDown' ? -step : 0;
    if (delta === 0) return;
    e.preventDefault();
    const s = store.getState();
    s.beginDrag('bplus');
    s.dragBplusTo(s.design.bplus + delta);
    store.getState().endDrag();
  };

  const onHover = (e: PointerEvent<SVGRectElement>) => {
    const svg = e.currentTarget.ownerSVGElement;
    const ctm = svg?.getScreenCTM();
    if (!svg || !ctm) return;
    const p = new DOMPoint(e.clientX, e.clientY).matrixTransform(ctm.inverse());
    store.getState().setHover(scales.x.invert(p.x), scales.y.invert(p.y));
  };

  const [x0, x1] = scales.x.range() as [number, number];
  const [y0, y1] = scales.y.range() as [number, number];
  return (
    <>
      <rect
        className="hover-surface"
        x={x0}
        y={y1}
        width={x1 - x0}
        height={y0 - y1}
        fill="transparent"
        onPointerMove={onHover}
        onPointerLeave={() => store.getState().clearHover()}
      />
      <g ref={spreadLayer} className="layer-spread" pointerEvents="none" />
      <g ref={lines} className="layer-lines" pointerEvents="none" />
      <g
        ref={bplusHandle}
        className="handle handle-bplus"
        role="slider"
        tabIndex={follower ? -1 : 0}
        visibility={follower ? 'hidden' : 'visible'}
        aria-label="B+, the foot of the DC load line: drag or use the arrow keys"
        aria-valuemin={DESIGN_LIMITS.bplus.min}
        aria-valuemax={Math.min(sheet.extent.vmax, DESIGN_LIMITS.bplus.max)}
        onKeyDown={onBplusKey}
      >
        <path d="M0,0 L-8,14 L8,14 Z" fill={PALETTE.load} stroke={PALETTE.sheet} strokeWidth={1.5} />
        <rect x={-14} y={-6} width={28} height={26} fill="transparent" />
      </g>
      <g
        ref={rivalHandle}
        className={rival.mode === 'own-values' ? 'handle handle-rival' : 'handle-rival fixed'}
        role="img"
        aria-label={`Operating point of the ${rival.tubeId}${rival.mode === 'own-values' ? ' (drag it to choose its own Ra and Rk)' : ' with the same parts'}`}
        visibility={rival.on && rivalSheet ? 'visible' : 'hidden'}
      >
        <rect x={-14} y={-14} width={28} height={28} fill="transparent" />
        <RivalMark />
      </g>
      <g
        ref={point}
        className="handle handle-point"
        role="slider"
        tabIndex={0}
        aria-label={follower ? 'The follower\'s operating point: drag it along its dotted line to choose its Rk, or use the arrow keys (Shift for larger steps, Enter to settle, Escape to undo the move)' : 'Operating point: drag it, or use the arrow keys (Shift for larger steps, Enter to settle, Escape to undo the move)'}
        aria-valuemin={0}
        aria-valuemax={sheet.extent.vmax}
        onKeyDown={onPointKey}
        onBlur={onPointBlur}
      >
        <PointMark />
      </g>
    </>
  );
}
