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
