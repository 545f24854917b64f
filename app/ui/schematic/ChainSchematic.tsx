import { memo, useRef, useState, type KeyboardEvent, type ReactNode } from 'react';
import { Wire } from './wiring';
import { FEEDBACK_ROW, FeedbackPath, FollowerCell, GainCell, GRID, H, LEAD_IN, LoadCell, MUTED, OutputCell, RAIL, SplitterCell, WIDTH, cellWidth, label, singleEndedTap, type Anchor, type ValueLabel } from './chainCells';
import { LongTailedPairCell, PairCell, pairTap } from './pairCells';
import { InlineEditor } from './InlineEditor';
import { sameEntries, useDragPaced } from '../panels/useDragPaced';
import { useWorkbench } from '../../store/StoreProvider';
import type { FieldName } from '../../store/fields';
import { benchIndex, nodeOfStage, voltageStages } from '../../store/stagePlans';
import { nodeOf } from '../../store/supplyPlan';
import { drivesPair, splitterName } from '../../store/outputPlan';
import { ohms } from '../../format';
import { findOutputTube } from '../../../src/index';
import { screenWiringOf } from './screenWiring';

const INK = '#1d2329';
/** The in-place editor's width, px (as styled). */
const EDITOR_WIDTH = 150;

/** Presses as a button does: Enter or Space. */
const onPress = (act: () => void) => (e: KeyboardEvent) => {
  if (e.key === 'Enter' || e.key === ' ') {
    e.preventDefault();
    act();
  }
};

/**
 * A drawing cell that puts its stage on the bench when pressed. The press
 * target lies under the drawing, which lets presses through to it except on
 * the values, each a button of its own.
 */
function Cell({ x0, width, onBench, name, onOpen, tubeId, node = null, children }: { x0: number; width: number; onBench: boolean; name: string; onOpen: () => void; tubeId: string | null; node?: number | null; children: ReactNode }) {
  return (
    <g>
      <rect
        role="button" tabIndex={0} aria-label={`${name}: put it on the bench`} aria-pressed={onBench} className="chain-cell"
        x={x0 + 2} y={4} width={width - 4} height={H - 8} rx={6} fill={onBench ? '#f3efe2' : '#fff'} stroke={onBench ? INK : 'transparent'} strokeWidth={onBench ? 1.5 : 0}
        onClick={onOpen} onKeyDown={onPress(onOpen)}
      />
      <g className="chain-ink">
        {children}
        {/* The supply node its rail hangs from, numbered as the supply's table numbers them. */}
        {node !== null && label(x0 + width - 6, RAIL - 8, `node ${node + 1}`, 'end')}
        {tubeId && label(x0 + width / 2, H - 20, tubeId, 'middle')}
        {/* Above the highlighted frame's lower edge (at H − 4), so its descenders are not cut. */}
        <text x={x0 + width / 2} y={H - 9} fontSize={10} fill={MUTED} textAnchor="middle">{name.split(',')[0]}</text>
      </g>
    </g>
  );
}

/** One part's value on the drawing: a button that opens its editor in place. */
function Value({ x, y, text, anchor, name, onEdit }: { x: number; y: number; text: string; anchor: Anchor; name: string; onEdit: (at: Element) => void }) {
  return (
    <g role="button" tabIndex={0} className="schematic-part" aria-label={`${name}: change`} onClick={(e) => onEdit(e.currentTarget)} onKeyDown={(e) => onPress(() => onEdit(e.currentTarget))(e)}>
      <text x={x} y={y} fontSize={10.5} fill="#0f5f8a" textAnchor={anchor} className="part-value" paintOrder="stroke" stroke="#fff" strokeWidth={3}>{text}</text>
    </g>
  );
}

/** Where the editor opens: just below the value pressed, inside the frame. */
function editorSpot(at: Element, frame: HTMLElement | null): { left: string; top: string } {
  const box = at.getBoundingClientRect();
  const f = frame?.getBoundingClientRect();
  if (!f) return { left: '0px', top: '0px' };
  const left = Math.min(Math.max(box.left - f.left - 20, 0), Math.max(f.width - EDITOR_WIDTH, 0));
  return { left: `${left}px`, top: `${box.bottom - f.top + 2}px` };
}

/**
 * The whole amplifier drawn input to output: every voltage stage with its
 * coupling, grid leak, plate and cathode parts, then the phase splitter and
 * output stage (or the load). The stage on the bench is shaded; pressing a
 * stage puts it there. Every value is a button: pressing it puts its stage on
 * the bench and opens that value's box in place, so the whole amplifier can
 * be edited from its drawing (the same boxes, checks and undo as the forms).
 */
export const ChainSchematic = memo(function ChainSchematic() {
  const [design] = useDragPaced((s) => [s.design] as const, { equal: sameEntries });
  const showStage = useWorkbench((s) => s.showStage);
  const setStageKind = useWorkbench((s) => s.setStageKind);
  const frame = useRef<HTMLDivElement>(null);
  const [editing, setEditing] = useState<{ field: FieldName; at: { left: string; top: string } } | null>(null);
  // One value-drawing function per stage, kept across renders, so the cells (memoised) redraw only when their own values change.
  const labels = useRef(new Map<string, ValueLabel>()).current;
  /** Value labels for one stage: `stage` names it (for a screen reader, and uniquely), `open` puts it on the bench. */
  const valuesOf = (stage: string, open: () => void): ValueLabel => {
    const hit = labels.get(stage);
    if (hit) return hit;
    const made: ValueLabel = (field, name, x, y, text, anchor = 'start') => (
      <Value key={field} x={x} y={y} text={text} anchor={anchor} name={`${stage} ${name} ${text.replace(/^(B\+|RL|Rs|tail) /, '')}`} onEdit={(at) => {
        const spot = editorSpot(at, frame.current);
        open();
        setEditing({ field, at: spot });
      }} />
    );
    labels.set(stage, made);
    return made;
  };
  const list = voltageStages(design);
  const bench = benchIndex(design);
  const followerOnBench = design.stage2.kind !== 'none';
  let x = LEAD_IN;
  const cells = list.map((p, i) => {
    const x0 = x;
    x += cellWidth(p);
    const onBench = (design.stageKind === 'voltage' && i === bench) || (design.stageKind === 'follower' && followerOnBench && i === bench + 1);
    const name = `Stage ${i + 1}, ${p.tubeId} ${p.kind === 'follower' ? `cathode follower${p.coupling ? ', capacitor-coupled' : ''}` : 'gain stage'}`;
    const open = () => showStage(i);
    const value = valuesOf(`Stage ${i + 1}`, open);
    return (
      <Cell key={i} x0={x0} width={cellWidth(p)} onBench={onBench} name={name} tubeId={p.tubeId} node={p.kind === 'follower' ? null : nodeOfStage(design, list, i)} onOpen={open}>
        {p.kind === 'follower' ? <FollowerCell x0={x0} p={p} value={value} /> : <GainCell x0={x0} p={p} value={value} />}
      </Cell>
    );
  });
  const o = design.output;
  const pair = drivesPair(design);
  const openOutput = () => setStageKind('output');
  const splitterX = x;
  const ltp = o.splitter.kind === 'long-tailed-pair';
  const splitterWidth = ltp ? WIDTH.longTailedPair : WIDTH.splitter;
  if (pair) x += splitterWidth;
  const splitterValues = valuesOf('Phase splitter', openOutput);
  const splitterCc = o.splitter.coupling === 'direct' ? null : design.cout;
  const splitter = pair ? (
    <Cell key="splitter" x0={splitterX} width={splitterWidth} onBench={design.stageKind === 'output'} name={`Phase splitter, ${splitterName(o.splitter)}`} tubeId={o.splitter.tubeId} node={nodeOf(design.supply, 'splitter')} onOpen={openOutput}>
      {ltp ? <LongTailedPairCell x0={splitterX} cc={splitterCc} sp={o.splitter} value={splitterValues} /> : <SplitterCell x0={splitterX} cc={splitterCc} sp={o.splitter} value={splitterValues} />}
    </Cell>
  ) : null;
  const bias = o.bias === 'fixed' ? { kind: 'fixed' as const, vg: o.vg } : { kind: 'cathode' as const, rk: o.rk };
  const outputValues = valuesOf('Output stage', openOutput);
  const wiring = screenWiringOf(o, findOutputTube(o.tubeId)?.law.kind === 'triode');
  const outputWidth = pair ? WIDTH.pair : WIDTH.output;
  const end = design.drivesOutput ? (
    <Cell key="output" x0={x} width={outputWidth} onBench={design.stageKind === 'output'} name={pair ? `Output stage, two ${o.tubeId} in push-pull` : `Output stage, ${o.tubeId}`} tubeId={null} node={nodeOf(design.supply, 'output')} onOpen={openOutput}>
      {pair
        ? <PairCell x0={x} cc={o.splitter.cc} ccField="sCc" rg={o.rg} bias={bias} bplus={o.bplus} tubeId={o.tubeId} speakerOhms={o.speakerOhms} wiring={wiring} value={outputValues} />
        : <OutputCell x0={x} cc={design.cout} ccField="cout" rg={o.rg} bias={bias} bplus={o.bplus} tubeId={o.tubeId} speakerOhms={o.speakerOhms} wiring={wiring} value={outputValues} />}
    </Cell>
  ) : Number.isFinite(design.rl) ? (
    <g key="load">
      <LoadCell x0={x} rl={design.rl} cout={design.cout} value={valuesOf('Load', () => undefined)} />
    </g>
  ) : null;
  const width = x + (design.drivesOutput ? outputWidth : WIDTH.load);
  // Global feedback: Rf from the speaker's end of the secondary round under the drawing to the first cathode (unbypassed).
  const first = list[0];
  const feedback = design.drivesOutput && design.feedbackRf !== null && first?.kind === 'common-cathode' && !first.bypassed
    ? <FeedbackPath from={pair ? pairTap(x) : singleEndedTap(x)} toX={LEAD_IN} rf={design.feedbackRf} cf={design.feedbackCf} value={valuesOf('Global feedback', () => undefined)} />
    : null;
  const height = feedback ? H + FEEDBACK_ROW : H;
  return (
    <div className="schematic-frame chain-frame" ref={frame}>
      <svg className="chain-schematic" preserveAspectRatio="xMinYMid meet" viewBox={`0 0 ${width} ${height}`} role="group" aria-label={`Schematic of the whole amplifier, ${list.length + (design.drivesOutput ? 1 : 0) + (pair ? 1 : 0)} stages`}>
        <Wire points={[[4, GRID], [LEAD_IN, GRID]]} />
        {label(4, GRID - 8, 'in')}
        {valuesOf('Source', () => undefined)('rsource', 'Rs', 4, GRID + 16, `Rs ${ohms(design.rsource)}`)}
        {cells}
        {splitter}
        {end}
        {feedback}
      </svg>
      {editing ? <InlineEditor field={editing.field} at={editing.at} onDone={() => setEditing(null)} /> : null}
    </div>
  );
});
