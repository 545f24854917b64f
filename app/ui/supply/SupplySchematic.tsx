import { farads, ohms, plain } from '../../format';
import { useWorkbench } from '../../store/StoreProvider';
import { oneWinding, rectifierName } from './rectifierWords';
import { fedFrom } from '../../store/supplySlice';
import { capacitorDown, coil, winding, zigzag } from './drawnParts';

const STEP = 118;
const TOP = 46;
const GROUND = 118;
const LEFT = 150;
const INK = '#1d2733';

/** A node's label lines, its names packed so each line fits between two nodes (about 19 characters at this size). */
const LINE_CHARS = 19;
const LINE_HEIGHT = 11;
function labelLines(names: readonly string[]): string[] {
  const lines: string[] = [];
  for (const n of names) {
    const last = lines.length - 1;
    if (last >= 0 && lines[last]!.length + 2 + n.length <= LINE_CHARS) lines[last] = `${lines[last]}, ${n}`;
    else lines.push(lines.length === 0 ? `→ ${n}` : n);
  }
  return lines;
}


/**
 * The supply as a drawing of our own: the transformer and rectifier, then
 * the ladder node by node (each node's capacitor to ground, the series R or
 * choke between nodes), each node numbered as in the table and marked with
 * the stages it feeds.
 */
export function SupplySchematic() {
  const p = useWorkbench((s) => s.design.supply);
  // The lists only: a view marked stale keeps them, so a keystroke does not redraw the drawing.
  const names = useWorkbench((s) => s.supplyView?.names ?? null);
  const feeds = useWorkbench((s) => s.supplyView?.feeds ?? null);
  const screenFeeds = useWorkbench((s) => s.supplyView?.screenFeeds ?? null);
  const nodes = p.sections.length + 1;
  const width = LEFT + nodes * STEP + 40;
  const nodeX = (k: number) => LEFT + 40 + k * STEP;
  // Each node's label lines; a node feeding more than a line's worth stacks them upward, and the drawing moves down to make room.
  const labels = Array.from({ length: nodes }, (_, k) => (names && feeds && screenFeeds ? labelLines(fedFrom({ names, feeds, screenFeeds }, k).map((n) => n.title)) : []));
  const extra = (Math.max(1, ...labels.map((l) => l.length)) - 1) * LINE_HEIGHT;
  return (
    <svg className="supply-schematic" viewBox={`0 ${-extra} ${width} ${150 + extra}`} role="img" aria-label={`The supply drawn: ${plain(p.secondaryRms)} V secondary, ${rectifierName(p.rectifier)} rectifier, ${nodes} filter nodes`}>
      <g stroke={INK} fill="none" strokeWidth={1.4}>
        {/* Transformer: primary and secondary coils with the core between. */}
        <path d={`${winding(26, 36, 64, 1)} M14 36 H26 M14 100 H26`} />
        <path d="M40 32 V104 M44 32 V104" />
        <path d={`${winding(58, 36, 64, -1)} M58 36 H62 V${TOP} H70 M58 100 H62 V${GROUND} H${nodeX(0) - 10}`} />
        {/* Rectifier: a diode into the reservoir node. */}
        <path d={`M70 ${TOP} H96 M96 ${TOP - 9} L96 ${TOP + 9} L112 ${TOP} Z M112 ${TOP - 9} V${TOP + 9} M112 ${TOP} H${nodeX(0)}`} />
        {p.input.kind === 'choke' ? <path d={coil(118, TOP, nodeX(0) - 118 - 4)} stroke={INK} /> : null}
        {/* Ground rail. */}
        <path d={`M${nodeX(0) - 10} ${GROUND} H${nodeX(nodes - 1) + 10}`} />
        {Array.from({ length: nodes }, (_, k) => (
          <g key={k}>
            <path d={capacitorDown(nodeX(k), TOP, GROUND)} />
            {k > 0 ? <path d={p.sections[k - 1]!.kind === 'rc' ? zigzag(nodeX(k - 1), TOP, STEP) : coil(nodeX(k - 1), TOP, STEP)} /> : null}
            <circle cx={nodeX(k)} cy={TOP} r={2.5} fill={INK} />
          </g>
        ))}
      </g>
      <g fontSize={10} fill={INK}>
        <text x={8} y={120}>{plain(p.secondaryRms)} V{oneWinding(p.rectifier) ? '' : ' ×2'}</text>
        <text x={80} y={TOP + 24}>{rectifierName(p.rectifier)}</text>
        {p.input.kind === 'choke' ? <text x={120} y={TOP - 12}>{plain(p.input.l)} H</text> : null}
        {Array.from({ length: nodes }, (_, k) => {
          const s = p.sections[k - 1];
          const c = k === 0 ? p.input.c : s!.c;
          return (
            <g key={k}>
              <text x={nodeX(k) + 14} y={TOP + 36}>{farads(c)}</text>
              <text x={nodeX(k) - 4} y={TOP - 26 - Math.max(0, labels[k]!.length - 1) * LINE_HEIGHT} fontWeight={700}>{k + 1}</text>
              {labels[k]!.map((line, j, all) => (
                <text key={j} x={nodeX(k) - 4} y={TOP - 12 - (all.length - 1 - j) * LINE_HEIGHT} fill="#0f5f8a">{line}</text>
              ))}
              {s ? <text x={nodeX(k - 1) + STEP / 2 - 16} y={TOP + 20}>{s.kind === 'rc' ? ohms(s.r) : `${plain(s.l)} H`}</text> : null}
            </g>
          );
        })}
      </g>
    </svg>
  );
}
