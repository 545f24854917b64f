/**
 * Schematic symbols, drawn in our own style: resistors as rectangles (the
 * IEC 60617 form), capacitors as two plates, the triode as an envelope with
 * plate, grid and cathode. Coordinates are the schematic's own user units.
 */
const INK = '#1d2329';

/** A vertical resistor between (x, y1) and (x, y2). */
export function Resistor({ x, y1, y2, faded = false }: { x: number; y1: number; y2: number; faded?: boolean }) {
  const mid = (y1 + y2) / 2;
  const body = Math.min(44, (y2 - y1) * 0.6);
  return (
    <g stroke={INK} strokeWidth={2} fill="none" opacity={faded ? 0.35 : 1}>
      <line x1={x} x2={x} y1={y1} y2={mid - body / 2} />
      <rect x={x - 8} y={mid - body / 2} width={16} height={body} fill="#fff" />
      <line x1={x} x2={x} y1={mid + body / 2} y2={y2} />
    </g>
  );
}

/** A capacitor between (x1, y) and (x2, y) when horizontal, or (x, y1)–(x, y2) when vertical. */
export function Capacitor({ at, from, to, vertical, faded = false, polarised = false }: { at: number; from: number; to: number; vertical: boolean; faded?: boolean; polarised?: boolean }) {
  const mid = (from + to) / 2;
  const gap = 5;
  const plate = 12;
  const lines = vertical
    ? [
        [at, from, at, mid - gap],
        [at, mid + gap, at, to],
        [at - plate, mid - gap, at + plate, mid - gap],
        [at - plate, mid + gap, at + plate, mid + gap],
      ]
    : [
        [from, at, mid - gap, at],
        [mid + gap, at, to, at],
        [mid - gap, at - plate, mid - gap, at + plate],
        [mid + gap, at - plate, mid + gap, at + plate],
      ];
  return (
    <g stroke={INK} strokeWidth={2} opacity={faded ? 0.3 : 1} strokeDasharray={faded ? '3 3' : undefined}>
      {lines.map(([a, b, c, d], k) => (
        <line key={k} x1={a} y1={b} x2={c} y2={d} />
      ))}
      {polarised ? (
        <text x={vertical ? at + plate + 2 : mid - gap - 10} y={vertical ? mid - gap - 3 : at - plate - 2} fontSize={11} stroke="none" fill={INK}>+</text>
      ) : null}
    </g>
  );
}

export function Ground({ x, y }: { x: number; y: number }) {
  return (
    <g stroke={INK} strokeWidth={2}>
      <line x1={x} x2={x} y1={y - 8} y2={y} />
      <line x1={x - 11} x2={x + 11} y1={y} y2={y} />
      <line x1={x - 7} x2={x + 7} y1={y + 4} y2={y + 4} />
      <line x1={x - 3} x2={x + 3} y1={y + 8} y2={y + 8} />
    </g>
  );
}

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
