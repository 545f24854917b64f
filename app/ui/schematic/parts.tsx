/**
 * The passive parts, drawn in our own style: resistors as rectangles (the
 * IEC 60617 form), upright or lying; capacitors as two plates; a
 * transformer's winding as a row of loops. Coordinates are the schematic's
 * own user units.
 */
import { INK } from './ink';

/** A potentiometer's wiper: an arrow onto a vertical track at (x, y), from the right (side 1) or the left (−1). */
export function Wiper({ x, y, side = 1 }: { x: number; y: number; side?: 1 | -1 }) {
  return (
    <g stroke={INK} strokeWidth={1.5} fill={INK}>
      <line x1={x + side * 22} y1={y} x2={x + side * 14} y2={y} />
      <path d={`M${x + side * 9} ${y} l${side * 7} -4 v8 z`} stroke="none" />
    </g>
  );
}

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

/** A winding from (x, y1) down to (x, y2) as a row of half-loops bulging toward `side`. */
export function Winding({ x, y1, y2, side, turns = 5 }: { x: number; y1: number; y2: number; side: 1 | -1; turns?: number }) {
  const h = (y2 - y1) / turns;
  const d = Array.from({ length: turns }, (_, k) => `A ${h / 2} ${h / 2} 0 0 ${side > 0 ? 1 : 0} ${x} ${y1 + (k + 1) * h}`).join(' ');
  return <path d={`M ${x} ${y1} ${d}`} fill="none" stroke={INK} strokeWidth={2} />;
}

/** A winding lying from (x1, y) to (x2, y) as a row of half-loops bulging up (`side` −1) or down (1). */
export function HWinding({ x1, x2, y, side, turns = 5 }: { x1: number; x2: number; y: number; side: 1 | -1; turns?: number }) {
  const w = (x2 - x1) / turns;
  const d = Array.from({ length: turns }, (_, k) => `A ${w / 2} ${w / 2} 0 0 ${side > 0 ? 0 : 1} ${x1 + (k + 1) * w} ${y}`).join(' ');
  return <path d={`M ${x1} ${y} ${d}`} fill="none" stroke={INK} strokeWidth={2} />;
}
