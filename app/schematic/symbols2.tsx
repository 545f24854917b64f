/** Horizontal variants of the schematic symbols, for the input network and the interstage link. */
const INK = '#1d2329';

export function HResistor({ x1, x2, y }: { x1: number; x2: number; y: number }) {
  const mid = (x1 + x2) / 2;
  const body = Math.min(36, (x2 - x1) * 0.6);
  return (
    <g stroke={INK} strokeWidth={2} fill="none">
      <line x1={x1} x2={mid - body / 2} y1={y} y2={y} />
      <rect x={mid - body / 2} y={y - 7} width={body} height={14} fill="#fff" />
      <line x1={mid + body / 2} x2={x2} y1={y} y2={y} />
    </g>
  );
}

export function Wire({ points }: { points: [number, number][] }) {
  return <polyline points={points.map((p) => p.join(',')).join(' ')} fill="none" stroke={INK} strokeWidth={2} />;
}

export function Dot({ x, y }: { x: number; y: number }) {
  return <circle cx={x} cy={y} r={3} fill={INK} />;
}

/**
 * A pentode or beam tetrode centred at (cx, cy): plate on top, screen grid
 * (dashed, its lead to the right at cy − 4), control grid (dashed, lead to
 * the left at cy + 8), cathode below.
 */
export function Pentode({ cx, cy, r = 40 }: { cx: number; cy: number; r?: number }) {
  return (
    <g stroke={INK} strokeWidth={2} fill="none">
      <circle cx={cx} cy={cy} r={r} />
      <line x1={cx - 16} x2={cx + 16} y1={cy - 20} y2={cy - 20} strokeWidth={3} />
      <line x1={cx} x2={cx} y1={cy - r} y2={cy - 20} />
      <line x1={cx - 20} x2={cx + 20} y1={cy - 4} y2={cy - 4} strokeDasharray="4 3" />
      <line x1={cx + 20} x2={cx + r} y1={cy - 4} y2={cy - 4} />
      <line x1={cx - 20} x2={cx + 20} y1={cy + 8} y2={cy + 8} strokeDasharray="4 3" />
      <line x1={cx - r} x2={cx - 20} y1={cy + 8} y2={cy + 8} />
      <polyline points={`${cx - 16},${cy + 18} ${cx - 16},${cy + 23} ${cx + 16},${cy + 23}`} />
      <line x1={cx} x2={cx} y1={cy + 23} y2={cy + r} />
    </g>
  );
}

/** A winding from (x, y1) down to (x, y2) as a row of half-loops bulging toward `side`. */
export function Winding({ x, y1, y2, side, turns = 5 }: { x: number; y1: number; y2: number; side: 1 | -1; turns?: number }) {
  const h = (y2 - y1) / turns;
  const d = Array.from({ length: turns }, (_, k) => `A ${h / 2} ${h / 2} 0 0 ${side > 0 ? 1 : 0} ${x} ${y1 + (k + 1) * h}`).join(' ');
  return <path d={`M ${x} ${y1} ${d}`} fill="none" stroke={INK} strokeWidth={2} />;
}
