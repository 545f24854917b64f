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
