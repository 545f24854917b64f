import { useEffect, useId, useRef, useState } from 'react';
import { ohms, volts } from '../format';
import { FIELDS, type FieldName } from '../store/fields';
import { useWorkbench } from '../store/StoreProvider';
import { Capacitor, Ground, Resistor, Triode } from './symbols';

/**
 * The stage drawn as a schematic, and the main control surface: each part's
 * value is a button on the drawing that opens an editor in place, bound to the
 * same store field as the form (one source of truth). The bypass capacitor
 * toggles on a click; drawn faint and dashed when absent.
 */
const W = 320;
const H = 400;
const X_TUBE = 130;

/** Where each editable label sits, in schematic units (also where its editor opens). */
const LABELS: Record<FieldName, { x: number; y: number; anchor: 'start' | 'end' }> = {
  bplus: { x: X_TUBE + 14, y: 24, anchor: 'start' },
  ra: { x: X_TUBE + 16, y: 82, anchor: 'start' },
  rk: { x: X_TUBE - 16, y: 298, anchor: 'end' },
  rl: { x: 256, y: 232, anchor: 'end' },
};

export function StageSchematic() {
  const design = useWorkbench((s) => s.design);
  const op = useWorkbench((s) => s.analysis.solution.op);
  const setBypassed = useWorkbench((s) => s.setBypassed);
  const [editing, setEditing] = useState<FieldName | null>(null);
  const hasLoad = Number.isFinite(design.rl);
  const text: Record<FieldName, string> = {
    bplus: `B+ ${volts(design.bplus)}`,
    ra: `Ra ${ohms(design.ra)}`,
    rk: `Rk ${ohms(design.rk)}`,
    rl: hasLoad ? `RL ${ohms(design.rl)}` : 'RL none',
  };

  return (
    <section className="panel schematic" aria-label="Stage schematic: click a value to change it">
      <div className="schematic-frame">
        <svg viewBox={`0 0 ${W} ${H}`} className="schematic-svg" role="group" aria-label={`Common-cathode ${design.tubeId} stage`}>
          {/* supply rail */}
          <line x1={X_TUBE - 40} x2={X_TUBE + 40} y1={40} y2={40} stroke="#1d2329" strokeWidth={3} />
          <Resistor x={X_TUBE} y1={40} y2={126} />
          {/* plate node, output coupling, load */}
          <circle cx={X_TUBE} cy={126} r={3} fill="#1d2329" />
          <line x1={X_TUBE} x2={X_TUBE} y1={126} y2={144} stroke="#1d2329" strokeWidth={2} />
          <line x1={X_TUBE} x2={190} y1={126} y2={126} stroke="#1d2329" strokeWidth={2} />
          <Capacitor at={126} from={190} to={240} vertical={false} />
          <line x1={240} x2={266} y1={126} y2={126} stroke="#1d2329" strokeWidth={2} />
          <text x={258} y={118} fontSize={12} fill="#4a535c">out</text>
          <Resistor x={266} y1={126} y2={346} faded={!hasLoad} />
          <Ground x={266} y={354} />
          {/* the tube and its grid input */}
          <Triode cx={X_TUBE} cy={180} />
          <line x1={40} x2={X_TUBE - 36} y1={180} y2={180} stroke="#1d2329" strokeWidth={2} />
          <text x={30} y={172} fontSize={12} fill="#4a535c">in</text>
          <text x={X_TUBE + 40} y={168} fontSize={13} fontWeight={600} fill="#1d2329">{design.tubeId}</text>
          <text x={X_TUBE + 40} y={186} fontSize={11} fill="#4a535c">{`Va ${volts(op.va)}`}</text>
          <text x={X_TUBE + 40} y={200} fontSize={11} fill="#4a535c">{`Vk ${volts(op.vk)}`}</text>
          {/* cathode: Rk with the bypass capacitor across it */}
          <line x1={X_TUBE} x2={X_TUBE} y1={216} y2={240} stroke="#1d2329" strokeWidth={2} />
          <circle cx={X_TUBE} cy={240} r={3} fill="#1d2329" />
          <Resistor x={X_TUBE} y1={240} y2={340} />
          <line x1={X_TUBE} x2={X_TUBE + 50} y1={240} y2={240} stroke="#1d2329" strokeWidth={2} opacity={design.bypassed ? 1 : 0.3} />
          <line x1={X_TUBE} x2={X_TUBE + 50} y1={340} y2={340} stroke="#1d2329" strokeWidth={2} opacity={design.bypassed ? 1 : 0.3} />
          <Capacitor at={X_TUBE + 50} from={240} to={340} vertical faded={!design.bypassed} polarised />
          <Ground x={X_TUBE} y={354} />
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
            <rect x={X_TUBE + 30} y={262} width={86} height={56} fill="transparent" />
            <text x={X_TUBE + 66} y={296} fontSize={12} fill="#1d2329">{design.bypassed ? 'Ck' : 'no Ck'}</text>
          </g>
          {(Object.keys(LABELS) as FieldName[]).map((f) => (
            <g
              key={f}
              role="button"
              tabIndex={0}
              className="schematic-part"
              data-part={f}
              aria-label={`${text[f]}: change`}
              onClick={() => setEditing(f)}
              onKeyDown={(e) => {
                if (e.key === 'Enter' || e.key === ' ') {
                  e.preventDefault();
                  setEditing(f);
                }
              }}
            >
              <text x={LABELS[f].x} y={LABELS[f].y} textAnchor={LABELS[f].anchor} fontSize={13} fill="#0f5f8a" className="part-value">
                {text[f]}
              </text>
            </g>
          ))}
        </svg>
        {editing ? <InlineEditor field={editing} onDone={() => setEditing(null)} /> : null}
      </div>
    </section>
  );
}

/** The in-place editor for one part's value, placed over its label. */
function InlineEditor({ field, onDone }: { field: FieldName; onDone: () => void }) {
  const draft = useWorkbench((s) => s.drafts[field]);
  const error = useWorkbench((s) => s.errors[field]);
  const editField = useWorkbench((s) => s.editField);
  const settleField = useWorkbench((s) => s.settleField);
  const input = useRef<HTMLInputElement>(null);
  const id = useId();
  useEffect(() => {
    input.current?.focus();
    input.current?.select();
  }, []);
  const at = LABELS[field];
  const close = () => {
    settleField(field);
    onDone();
  };
  return (
    <div
      className="inline-editor"
      style={{ left: `${(Math.min(at.x, W - 150) / W) * 100}%`, top: `${((at.y + 6) / H) * 100}%` }}
    >
      <label htmlFor={id} className="visually-hidden">{`${FIELDS[field].label} (${FIELDS[field].unit})`}</label>
      <input
        ref={input}
        id={id}
        value={draft}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-err` : undefined}
        onChange={(e) => editField(field, e.target.value)}
        onBlur={close}
        onKeyDown={(e) => {
          if (e.key === 'Enter' || e.key === 'Escape') close();
        }}
      />
      {error ? <p id={`${id}-err`} className="field-error" role="alert">{error}</p> : null}
    </div>
  );
}
