import { drag, select } from 'd3';
import type { WorkbenchStore } from '../../store/workbenchStore';
import { frameCoalescer } from './frameCoalescer';
import type { PlateScales } from './plateScales';

/**
 * d3-drag on the chart's two handles. Pointer positions arrive in SVG user
 * units (d3 accounts for the viewBox scaling) and are turned into plate-plane
 * values with the scales' inverses. At most one model update runs per
 * animation frame: moves that arrive faster are coalesced to the latest.
 */
export function attachDrag(store: WorkbenchStore, scales: PlateScales, point: SVGGElement, bplusHandle: SVGGElement, rivalHandle: SVGGElement): () => void {
  const { schedule, flush, cancel } = frameCoalescer();

  const onPoint = drag<SVGGElement, unknown>()
    .on('start', () => store.getState().beginDrag('point'))
    .on('drag', (event: { x: number; y: number }) => {
      const vpk = scales.x.invert(event.x);
      const ia = scales.y.invert(event.y);
      schedule(() => store.getState().dragPointTo(vpk, ia));
    })
    .on('end', () => {
      flush();
      store.getState().endDrag();
    });

  const onBplus = drag<SVGGElement, unknown>()
    .on('start', () => store.getState().beginDrag('bplus'))
    .on('drag', (event: { x: number }) => {
      const volts = scales.x.invert(event.x);
      schedule(() => store.getState().dragBplusTo(volts));
    })
    .on('end', () => {
      flush();
      store.getState().endDrag();
    });

  const onRival = drag<SVGGElement, unknown>()
    .filter(() => store.getState().rival.mode === 'own-values')
    .on('drag', (event: { x: number; y: number }) => {
      const vpk = scales.x.invert(event.x);
      const ia = scales.y.invert(event.y);
      schedule(() => store.getState().dragRivalTo(vpk, ia));
    })
    .on('end', () => {
      flush();
      store.getState().endRivalDrag();
    });

  select(point).call(onPoint);
  select(bplusHandle).call(onBplus);
  select(rivalHandle).call(onRival);
  return () => {
    cancel();
    for (const el of [point, bplusHandle, rivalHandle]) select(el).on('.drag', null);
  };
}
