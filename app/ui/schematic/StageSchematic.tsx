import { useState } from 'react';
import { InlineEditor } from './InlineEditor';
import { farads, ohms, plain, volts } from '../../format';
import { FIELDS, type FieldName } from '../../store/fields';
import { useWorkbench } from '../../store/StoreProvider';
import { sameEntries, useDragPaced } from '../panels/useDragPaced';
import type { BenchDesign } from '../../store/analysis';
import { benchSource } from '../../store/amplifierChain';
import { FOLLOWER_LEAK_END, FOLLOWER_LEAK_X, GRID_Y, H, RAIL, STOPPED_LEAK_TOP, STOPPED_LEAK_X, StageDrawing, X1, X2 } from './StageDrawing';

/**
 * The stage drawn as a schematic, and the main control surface: each part's
 * value is a button on the drawing that opens an editor in place, bound to the
 * same store field as the form (one source of truth). The drawing grows a
 * second tube when the design has one; RL and Cout then sit after it.
 */
type Spot = { x: number; y: number; anchor: 'start' | 'end' | 'middle' };

function labelSpots(kind: BenchDesign['stage2']['kind'], coupled: boolean, followerStopped: boolean): Partial<Record<FieldName, Spot>> {
  const out = kind === 'none' ? { x: 300, yC: 130 } : { x: 404, yC: kind === 'follower' ? 250 : 130 };
  return {
    bplus: { x: X1 + 14, y: RAIL - 18, anchor: 'start' },
    ra: { x: X1 + 14, y: 92, anchor: 'start' },
    rk: { x: X1 - 14, y: 302, anchor: 'end' },
    ck: { x: X1 + 66, y: 326, anchor: 'start' },
    rsource: { x: 45, y: GRID_Y - 16, anchor: 'middle' },
    cin: { x: 92, y: GRID_Y - 20, anchor: 'middle' },
    rg: { x: 114, y: 252, anchor: 'end' },
    rstopper: { x: 128, y: GRID_Y - 36, anchor: 'middle' },
    cout: { x: out.x - 24, y: out.yC - 20, anchor: 'middle' },
    rl: { x: out.x + 14, y: 290, anchor: 'start' },
    ...(kind === 'none' ? {} : { rk2: { x: X2 - 14, y: 302, anchor: 'end' as const } }),
    ...(kind === 'common-cathode' ? { ra2: { x: X2 + 14, y: 92, anchor: 'start' as const }, rg2: { x: 262, y: 300, anchor: 'end' as const } } : {}),
    ...(kind === 'follower' && coupled
      ? {
          fCc: { x: 226, y: 112, anchor: 'middle' as const },
          ...(followerStopped
            ? { fRg: { x: STOPPED_LEAK_X + 10, y: 108, anchor: 'start' as const }, fVbias: { x: STOPPED_LEAK_X, y: STOPPED_LEAK_TOP - 8, anchor: 'middle' as const } }
            : { fRg: { x: FOLLOWER_LEAK_X - 8, y: 230, anchor: 'end' as const }, fVbias: { x: FOLLOWER_LEAK_X, y: FOLLOWER_LEAK_END + 14, anchor: 'middle' as const } }),
        }
      : {}),
    // Above the stopper and the follower's grid, clear of stage 1's name and the follower's envelope.
    ...(kind === 'follower' && followerStopped ? { fRst: { x: 292, y: 150, anchor: 'middle' as const } } : {}),
  };
}

function partText(f: FieldName, d: BenchDesign): string {
  switch (f) {
    case 'bplus': return `B+ ${volts(d.bplus)}`;
    case 'ra': return `Ra ${ohms(d.ra)}`;
    case 'rk': return `Rk ${ohms(d.rk)}`;
    case 'rl': return Number.isFinite(d.rl) ? `RL ${ohms(d.rl)}` : 'RL none';
    case 'rsource': return `Rs ${ohms(d.rsource)}`;
    case 'cin': return d.cin === null ? 'direct' : farads(d.cin);
    case 'rg': return d.volume === null ? `Rg ${ohms(d.rg)}` : `VR ${ohms(d.rg)}`;
    case 'volume': return d.volume === null ? 'none' : `${plain(d.volume)} dB`;
    case 'rstopper': return d.rstopper ? `Rst ${ohms(d.rstopper)}` : 'Rst none';
    case 'ck': return d.ck === null ? 'Ck ideal' : farads(d.ck);
    case 'cout': return d.cout === null ? 'ideal' : farads(d.cout);
    case 'ra2': return `Ra ${ohms(d.stage2.ra)}`;
    case 'rk2': return `Rk ${ohms(d.stage2.rk)}`;
    case 'rg2': return `Rg ${ohms(d.stage2.rg)}`;
    case 'fCc': return d.stage2.coupling ? farads(d.stage2.coupling.cc) : '';
    case 'fRg': return d.stage2.coupling ? `Rg ${ohms(d.stage2.coupling.rg)}` : '';
    case 'fVbias': return d.stage2.coupling ? `to ${volts(d.stage2.coupling.vbias)}` : '';
    case 'fRst': return `Rst ${ohms(d.stage2.rstopper ?? 0)}`;
    default: return FIELDS[f].label;
  }
}

/** Where the editor opens over a label: as fractions of the drawing, so it follows the drawing's scale. */
const editorAt = (spot: Spot, width: number) => ({ left: `${(Math.min(Math.max(spot.x - 60, 0), width - 150) / width) * 100}%`, top: `${((spot.y + 6) / H) * 100}%` });

export function StageSchematic() {
  // Values follow a drag at a readable pace; the figures strip carries them live.
  const [design, op] = useDragPaced((s) => [s.design, s.analysis.solution.op] as const, { equal: sameEntries });
  const setBypassed = useWorkbench((s) => s.setBypassed);
  const [editing, setEditing] = useState<FieldName | null>(null);
  const kind = design.stage2.kind;
  const width = kind === 'none' ? 385 : 490;
  const coupled = kind === 'follower' && design.stage2.coupling !== undefined;
  // A stage past the first is driven from the stage before's output impedance, not through the amplifier's source.
  // (benchSource remembers its answer per list of stages before, so the selector answers the same object while they stand.)
  const fedStage = useWorkbench((s) => s.design.before.length);
  const fedFrom = useWorkbench((s) => (s.design.before.length > 0 ? benchSource(s.design, s.registry) : null));
  const fedBy = fedStage > 0 && fedFrom ? { stage: fedStage, source: fedFrom } : null;
  // A volume control's setting sits by its wiper, drawn only when Rg is one.
  const followerStopped = kind === 'follower' && (design.stage2.rstopper ?? 0) > 0;
  const allSpots = { ...labelSpots(kind, coupled, followerStopped), ...(design.volume !== null ? { volume: { x: 146, y: 272, anchor: 'start' as const } } : {}) };
  const { rsource: _rs, ...laterSpots } = allSpots;
  const spots: Partial<Record<FieldName, Spot>> = fedBy ? laterSpots : allSpots;
  const hasLoad = Number.isFinite(design.rl);

  return (
    <section className="panel schematic" aria-label="Stage schematic: click a value to change it">
      <div className="schematic-frame">
        <svg viewBox={`0 0 ${width} ${H}`} className="schematic-svg" role="group" aria-label={`Schematic: ${design.tubeId} common-cathode stage${kind === 'none' ? '' : kind === 'follower' ? `, then a cathode follower${coupled ? ', capacitor-coupled' : ''}` : ', then a second gain stage'}`}>
          <StageDrawing kind={kind} coupled={coupled} bypassed={design.bypassed} hasLoad={hasLoad} stopped={(design.rstopper ?? 0) > 0} followerStopped={followerStopped} potted={design.volume !== null} tubeId={design.tubeId} tube2Id={design.stage2.tubeId} />
          {fedBy ? (
            <g fontSize={12} fill="#4a535c" textAnchor="middle">
              <text x={45} y={GRID_Y - 44}>{`from stage ${fedBy.stage}`}</text>
              {fedBy.source.ok ? <text x={45} y={GRID_Y - 16}>{ohms(fedBy.source.ohms)}</text> : null}
            </g>
          ) : null}
          <text x={X1 + 40} y={192} fontSize={11} fill="#4a535c">{`Va ${volts(op.va)}`}</text>
          <text x={X1 + 40} y={206} fontSize={11} fill="#4a535c">{`Vk ${volts(op.vk)}`}</text>
          <g
            role="switch"
            tabIndex={0}
            aria-checked={design.bypassed}
            aria-label="Cathode bypass capacitor"
            className="schematic-part"
            onClick={() => setBypassed(!design.bypassed)}
            onKeyDown={(e) => {
              if (e.key === 'Enter' || e.key === ' ') {
                e.preventDefault();
                setBypassed(!design.bypassed);
              }
            }}
          >
            <rect x={X1 + 28} y={276} width={40} height={44} fill="transparent" />
            <text x={X1 + 66} y={300} fontSize={12} fill="#1d2329">{design.bypassed ? 'Ck' : 'no Ck'}</text>
          </g>
          {(Object.keys(spots) as FieldName[]).map((f) => (
            <g
              key={f}
              role="button"
              tabIndex={0}
              className="schematic-part"
              data-part={f}
              aria-label={`${FIELDS[f].label} ${partText(f, design).replace(/^(Ra|Rk|Rg|Rs|RL|B\+) /, '')}: change`}
              onClick={() => setEditing(f)}
              onKeyDown={(e) => {
                if (e.key === 'Enter' || e.key === ' ') {
                  e.preventDefault();
                  setEditing(f);
                }
              }}
            >
              <text x={spots[f]!.x} y={spots[f]!.y} textAnchor={spots[f]!.anchor} fontSize={12} fill="#0f5f8a" className="part-value" paintOrder="stroke" stroke="#fbfaf5" strokeWidth={3}>
                {partText(f, design)}
              </text>
            </g>
          ))}
        </svg>
        {editing ? <InlineEditor field={editing} at={editorAt(spots[editing]!, width)} onDone={() => setEditing(null)} /> : null}
      </div>
    </section>
  );
}
