import { drag, select } from 'd3';
import { frameCoalescer } from '../chart/frameCoalescer';
import type { PlateScales } from '../chart/plateScales';
import type { WorkbenchStore } from '../../store/workbenchStore';

/**
 * d3-drag on the output chart's handles: the operating point (sets the bias
 * and B+) and the AC load line's handle (sets the primary impedance). One
 * model update per animation frame; the release snaps and runs the full pass.
 */
export function attachOutputDrag(store: WorkbenchStore, scales: PlateScales, point: SVGGElement, loadHandle: SVGGElement): () => void {
  const { schedule, flush, cancel } = frameCoalescer();
  const handle = (target: 'output-point' | 'output-load', move: (v: number, i: number) => void) =>
    drag<SVGGElement, unknown>()
      .on('start', () => store.getState().beginDrag(target))
      .on('drag', (event: { x: number; y: number }) => {
        const v = scales.x.invert(event.x);
        const i = scales.y.invert(event.y);
        schedule(() => move(v, i));
      })
      .on('end', () => {
        flush();
        store.getState().endDrag();
      });
  select(point).call(handle('output-point', (v, i) => store.getState().dragOutputPointTo(v, i)));
  select(loadHandle).call(handle('output-load', (v, i) => store.getState().dragOutputLoadTo(v, i)));
  return () => {
    cancel();
    for (const el of [point, loadHandle]) select(el).on('.drag', null);
  };
}
