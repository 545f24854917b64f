import type { KeyboardEvent } from 'react';
import type { WorkbenchState } from '../../store/workbenchStore';

/** Arrow keys move a chart's point by 1 % of its window, 5 % with Shift. */
const STEP = 0.01;
const BIG_STEP = 0.05;

/**
 * The keyboard on a chart's operating point, the same on every kind of
 * stage: arrows move it (a drag in progress, by fractions of the window),
 * Enter settles the move and Escape undoes it.
 */
export function pointKey(e: KeyboardEvent, s: WorkbenchState, dragging: boolean, nudge: (dx: number, dy: number) => void): void {
  if ((e.key === 'Enter' || e.key === 'Escape') && dragging) {
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
  nudge(m[0], m[1]);
}
