/** Wires, their joints and the ground they return to. */
import { INK } from './ink';

export function Wire({ points }: { points: [number, number][] }) {
  return <polyline points={points.map((p) => p.join(',')).join(' ')} fill="none" stroke={INK} strokeWidth={2} />;
}

export function Dot({ x, y }: { x: number; y: number }) {
  return <circle cx={x} cy={y} r={3} fill={INK} />;
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

/** How far a wire's hop rises over the wire it crosses. */
const HOP = 5;

/**
 * A horizontal wire at `y` from `from` to `to` that hops over the upright
 * wires it crosses at `over` (a half-circle each): crossing, not joined.
 */
export function HopWire({ y, from, to, over }: { y: number; from: number; to: number; over: readonly number[] }) {
  const dir = Math.sign(to - from) || 1;
  const hops = [...over].sort((a, b) => (a - b) * dir);
  const d = hops.map((x) => `H ${x - dir * HOP} A ${HOP} ${HOP} 0 0 ${dir > 0 ? 1 : 0} ${x + dir * HOP} ${y}`).join(' ');
  return <path d={`M ${from} ${y} ${d} H ${to}`} fill="none" stroke={INK} strokeWidth={2} />;
}
