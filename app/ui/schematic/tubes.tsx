/** The tubes: a triode as an envelope with plate, grid and cathode; a pentode with its screen and suppressor grids. */
import { INK } from './ink';

/** A triode centred at (cx, cy): plate on top, grid across the middle (dashed), cathode below. */
export function Triode({ cx, cy, r = 36 }: { cx: number; cy: number; r?: number }) {
  return (
    <g stroke={INK} strokeWidth={2} fill="none">
      <circle cx={cx} cy={cy} r={r} />
      <line x1={cx - 14} x2={cx + 14} y1={cy - 16} y2={cy - 16} strokeWidth={3} />
      <line x1={cx} x2={cx} y1={cy - r} y2={cy - 16} />
      <line x1={cx - 18} x2={cx + 18} y1={cy} y2={cy} strokeDasharray="4 3" />
      <line x1={cx - r} x2={cx - 18} y1={cy} y2={cy} />
      <polyline points={`${cx - 14},${cy + 12} ${cx - 14},${cy + 17} ${cx + 14},${cy + 17}`} />
      <line x1={cx} x2={cx} y1={cy + 17} y2={cy + r} />
    </g>
  );
}

/**
 * A pentode or beam tetrode centred at (cx, cy): plate on top, screen grid
 * (dashed, its lead at cy − 4 to the right, or with `screenSide` −1 to the
 * left), control grid (dashed, lead to the left at cy + 8), cathode below.
 */
export function Pentode({ cx, cy, r = 40, screenSide = 1 }: { cx: number; cy: number; r?: number; screenSide?: 1 | -1 }) {
  return (
    <g stroke={INK} strokeWidth={2} fill="none">
      <circle cx={cx} cy={cy} r={r} />
      <line x1={cx - 16} x2={cx + 16} y1={cy - 20} y2={cy - 20} strokeWidth={3} />
      <line x1={cx} x2={cx} y1={cy - r} y2={cy - 20} />
      <line x1={cx - 20} x2={cx + 20} y1={cy - 4} y2={cy - 4} strokeDasharray="4 3" />
      <line x1={cx + screenSide * 20} x2={cx + screenSide * r} y1={cy - 4} y2={cy - 4} />
      <line x1={cx - 20} x2={cx + 20} y1={cy + 8} y2={cy + 8} strokeDasharray="4 3" />
      <line x1={cx - r} x2={cx - 20} y1={cy + 8} y2={cy + 8} />
      <polyline points={`${cx - 16},${cy + 18} ${cx - 16},${cy + 23} ${cx + 16},${cy + 23}`} />
      <line x1={cx} x2={cx} y1={cy + 23} y2={cy + r} />
    </g>
  );
}
