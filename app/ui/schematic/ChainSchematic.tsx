import { memo, type KeyboardEvent, type ReactNode } from 'react';
import { Capacitor, Resistor, Winding } from './parts';
import { Pentode, Triode } from './tubes';
import { Dot, Ground, Wire } from './wiring';
import { farads, ohms, volts } from '../../format';
import { sameEntries, useDragPaced } from '../panels/useDragPaced';
import { useWorkbench } from '../../store/StoreProvider';
import { benchIndex, voltageStages, type FollowerPlan, type GainPlan } from '../../store/stagePlans';
import { drivesPair, type SplitterPlan } from '../../store/outputPlan';

/** The drawing's rows, in its own units: the B+ rail, the grids, the plate and cathode outputs, ground. */
const RAIL = 30;
const GRID = 120;
const PLATE_OUT = 84;
const CATHODE_OUT = 156;
const GROUND = 200;
const H = 246;
const LEAD_IN = 34;
const WIDTH = { gain: 160, follower: 104, splitter: 160, output: 176, load: 60 } as const;
const INK = '#1d2329';
/** Where a cell's coupling capacitor ends and its grid leak stands, from the cell's left edge. */
const CC_END = 36;
const RG_X = 48;
const MUTED = '#4a535c';

const label = (x: number, y: number, text: string, anchor: 'start' | 'middle' | 'end' = 'start') => (
  <text x={x} y={y} fontSize={10.5} fill={MUTED} textAnchor={anchor}>{text}</text>
);

/** A capacitor across the cell's input at grid height, or a plain wire for direct coupling. */
function Coupling({ x0, cc }: { x0: number; cc: number | null }) {
  return cc === null ? <Wire points={[[x0, GRID], [x0 + CC_END, GRID]]} /> : (
    <>
      <Capacitor at={GRID} from={x0} to={x0 + CC_END} vertical={false} />
      {label(x0 + 2, GRID - 16, farads(cc))}
    </>
  );
}

function GainCell({ x0, p }: { x0: number; p: GainPlan }) {
  const cx = x0 + 112;
  const r = 22;
  return (
    <>
      <Coupling x0={x0} cc={p.cc} />
      <Wire points={[[x0 + CC_END, GRID], [cx - r, GRID]]} />
      {p.cc !== null && (
        <>
          <Dot x={x0 + RG_X} y={GRID} />
          <Resistor x={x0 + RG_X} y1={GRID} y2={GROUND - 8} />
          <Ground x={x0 + RG_X} y={GROUND} />
          {label(x0 + RG_X + 11, GRID + 32, ohms(p.rg))}
        </>
      )}
      <Triode cx={cx} cy={GRID} r={r} />
      <Wire points={[[x0, RAIL], [x0 + WIDTH.gain, RAIL]]} />
      <Resistor x={cx} y1={RAIL} y2={PLATE_OUT} />
      <Wire points={[[cx, PLATE_OUT], [cx, GRID - r]]} />
      {label(cx - 12, 60, ohms(p.ra), 'end')}
      <Dot x={cx} y={PLATE_OUT} />
      <Wire points={[[cx, PLATE_OUT], [x0 + WIDTH.gain, PLATE_OUT], [x0 + WIDTH.gain, GRID]]} />
      {p.rk > 0 ? <Resistor x={cx} y1={GRID + r} y2={GROUND - 8} /> : <Wire points={[[cx, GRID + r], [cx, GROUND - 8]]} />}
      <Ground x={cx} y={GROUND} />
      {p.rk > 0 && label(cx - 12, 176, ohms(p.rk), 'end')}
      {p.bypassed && p.rk > 0 && (
        <>
          <Wire points={[[cx, 150], [cx + 24, 150]]} />
          <Capacitor at={cx + 24} from={150} to={GROUND - 8} vertical polarised />
          <Wire points={[[cx + 24, GROUND - 8], [cx, GROUND - 8]]} />
        </>
      )}
      {label(x0 + 4, RAIL - 8, `B+ ${volts(p.bplus)}`)}
    </>
  );
}

/** A follower's cell is wider when capacitor-coupled: its capacitor and leak stand before the tube. */
const cellWidth = (p: FollowerPlan | GainPlan) => (p.kind === 'follower' ? WIDTH.follower + (p.coupling ? FOLLOWER_COUPLING_WIDTH : 0) : WIDTH.gain);
const FOLLOWER_COUPLING_WIDTH = 46;

/** A cathode follower: its grid straight from the plate before it, or through its capacitor into its leak, returned to the divider that holds it. */
function FollowerCell({ x0, p }: { x0: number; p: FollowerPlan }) {
  const c = p.coupling;
  const cx = x0 + 54 + (c ? FOLLOWER_COUPLING_WIDTH : 0);
  const r = 22;
  const width = cellWidth(p);
  return (
    <>
      {c ? (
        <>
          <Coupling x0={x0} cc={c.cc} />
          <Wire points={[[x0 + CC_END, GRID], [cx - r, GRID]]} />
          <Dot x={x0 + RG_X} y={GRID} />
          <Resistor x={x0 + RG_X} y1={GRID} y2={GROUND - 8} />
          {label(x0 + RG_X + 11, GRID + 32, ohms(c.rg))}
          {label(x0 + RG_X, GROUND + 4, `to ${volts(c.vbias)}`, 'middle')}
        </>
      ) : (
        <Wire points={[[x0, GRID], [cx - r, GRID]]} />
      )}
      <Triode cx={cx} cy={GRID} r={r} />
      <Wire points={[[x0, RAIL], [x0 + width, RAIL]]} />
      <Wire points={[[cx, RAIL], [cx, GRID - r]]} />
      <Resistor x={cx} y1={GRID + r} y2={GROUND - 8} />
      <Ground x={cx} y={GROUND} />
      {label(cx - 12, 176, ohms(p.rk), 'end')}
      <Dot x={cx} y={CATHODE_OUT} />
      <Wire points={[[cx, CATHODE_OUT], [x0 + width, CATHODE_OUT], [x0 + width, GRID]]} />
    </>
  );
}

/**
 * The phase splitter before a pair: fed through Cout into its leak (returned
 * to the divider that sets its grid), its plate and cathode loads (for a
 * long-tailed pair, the first triode with the tail below; the second is
 * named), and two outputs to the pair's grids.
 */
function SplitterCell({ x0, cc, sp }: { x0: number; cc: number | null; sp: SplitterPlan }) {
  const cx = x0 + 100;
  const r = 22;
  const ltp = sp.kind === 'long-tailed-pair';
  return (
    <>
      <Coupling x0={x0} cc={cc} />
      <Wire points={[[x0 + CC_END, GRID], [cx - r, GRID]]} />
      {sp.coupling === 'capacitor' && (
        <>
          <Dot x={x0 + RG_X} y={GRID} />
          <Resistor x={x0 + RG_X} y1={GRID} y2={GROUND - 8} />
          {label(x0 + RG_X + 11, GRID + 32, ohms(sp.rg))}
          {label(x0 + RG_X, GROUND + 4, `to ${volts(sp.vgrid)}`, 'middle')}
        </>
      )}
      <Triode cx={cx} cy={GRID} r={r} />
      <Wire points={[[x0, RAIL], [x0 + WIDTH.splitter, RAIL]]} />
      <Resistor x={cx} y1={RAIL} y2={PLATE_OUT} />
      <Wire points={[[cx, PLATE_OUT], [cx, GRID - r]]} />
      {label(cx - 12, 60, ohms(sp.ra), 'end')}
      <Dot x={cx} y={PLATE_OUT} />
      <Wire points={[[cx, PLATE_OUT], [x0 + WIDTH.splitter, PLATE_OUT], [x0 + WIDTH.splitter, GRID]]} />
      <Resistor x={cx} y1={GRID + r} y2={GROUND - 8} />
      <Ground x={cx} y={GROUND} />
      {label(cx - 12, 170, ohms(sp.rk), 'end')}
      {ltp ? (
        <>
          {label(cx - 12, 183, `+ ${ohms(sp.rtail)}`, 'end')}
          {label(cx + 12, 60, `2nd ${ohms(sp.ra2)}`)}
        </>
      ) : (
        <>
          <Dot x={cx} y={CATHODE_OUT} />
          <Wire points={[[cx, CATHODE_OUT], [x0 + WIDTH.splitter - 8, CATHODE_OUT]]} />
          {label(x0 + WIDTH.splitter - 10, CATHODE_OUT - 5, 'in phase →', 'end')}
        </>
      )}
      {label(x0 + 4, RAIL - 8, `B+ ${volts(sp.bplus)}`)}
    </>
  );
}

function OutputCell({ x0, cc, rg, tubeId, speakerOhms }: { x0: number; cc: number | null; rg: number; tubeId: string; speakerOhms: number }) {
  const cx = x0 + 110;
  const r = 26;
  return (
    <>
      <Coupling x0={x0} cc={cc} />
      <Dot x={x0 + RG_X} y={GRID} />
      <Resistor x={x0 + RG_X} y1={GRID} y2={GROUND - 8} />
      <Ground x={x0 + RG_X} y={GROUND} />
      {label(x0 + RG_X + 11, GRID + 32, ohms(rg))}
      <Wire points={[[x0 + CC_END, GRID], [x0 + 64, GRID], [x0 + 64, GRID + 8], [cx - r, GRID + 8]]} />
      <Pentode cx={cx} cy={GRID} r={r} />
      <Wire points={[[x0 + 64, RAIL], [cx, RAIL], [cx, RAIL + 10]]} />
      <Winding x={cx} y1={RAIL + 10} y2={GRID - r - 4} side={1} turns={4} />
      <Wire points={[[cx, GRID - r - 4], [cx, GRID - r]]} />
      <Winding x={cx + 22} y1={RAIL + 10} y2={GRID - r - 4} side={-1} turns={4} />
      {label(cx + 30, 62, `${speakerOhms} Ω`)}
      <Resistor x={cx} y1={GRID + r} y2={GROUND - 8} />
      <Ground x={cx} y={GROUND} />
      {label(x0 + 150, H - 16, tubeId, 'middle')}
    </>
  );
}

/** A drawing cell that puts its stage on the bench when pressed (or Enter / Space). */
function Cell({ x0, width, onBench, name, onOpen, tubeId, children }: { x0: number; width: number; onBench: boolean; name: string; onOpen: () => void; tubeId: string | null; children: ReactNode }) {
  const key = (e: KeyboardEvent) => {
    if (e.key === 'Enter' || e.key === ' ') {
      e.preventDefault();
      onOpen();
    }
  };
  return (
    <g>
      <rect x={x0 + 2} y={4} width={width - 4} height={H - 8} rx={6} fill={onBench ? '#f3efe2' : '#fff'} stroke={onBench ? INK : 'transparent'} strokeWidth={onBench ? 1.5 : 0} />
      {children}
      {tubeId && label(x0 + width / 2, H - 16, tubeId, 'middle')}
      <text x={x0 + width / 2} y={H - 4} fontSize={10} fill={MUTED} textAnchor="middle">{name.split(',')[0]}</text>
      {/* The press target lies over the drawing and holds no text: its name says what pressing it does. */}
      <rect
        role="button" tabIndex={0} aria-label={`${name}: put it on the bench`} aria-pressed={onBench} className="chain-cell"
        x={x0 + 2} y={4} width={width - 4} height={H - 8} rx={6} fill="transparent" onClick={onOpen} onKeyDown={key}
      />
    </g>
  );
}

/**
 * The whole amplifier drawn input to output: every voltage stage with its
 * coupling, grid leak, plate and cathode parts, then the output stage (or
 * the load). The stage on the bench is shaded; pressing another stage puts
 * it there. Its values are edited on the bench's own schematic below.
 */
export const ChainSchematic = memo(function ChainSchematic() {
  const [design] = useDragPaced((s) => [s.design] as const, { equal: sameEntries });
  const showStage = useWorkbench((s) => s.showStage);
  const setStageKind = useWorkbench((s) => s.setStageKind);
  const list = voltageStages(design);
  const bench = benchIndex(design);
  const followerOnBench = design.stage2.kind !== 'none';
  let x = LEAD_IN;
  const cells = list.map((p, i) => {
    const x0 = x;
    x += cellWidth(p);
    const onBench = (design.stageKind === 'voltage' && i === bench) || (design.stageKind === 'follower' && followerOnBench && i === bench + 1);
    const name = `Stage ${i + 1}, ${p.tubeId} ${p.kind === 'follower' ? `cathode follower${p.coupling ? ', capacitor-coupled' : ''}` : 'gain stage'}`;
    return (
      <Cell key={i} x0={x0} width={cellWidth(p)} onBench={onBench} name={name} tubeId={p.tubeId} onOpen={() => showStage(i)}>
        {p.kind === 'follower' ? <FollowerCell x0={x0} p={p} /> : <GainCell x0={x0} p={p} />}
      </Cell>
    );
  });
  const o = design.output;
  const pair = drivesPair(design);
  const splitterX = x;
  if (pair) x += WIDTH.splitter;
  const splitter = pair ? (
    <Cell key="splitter" x0={splitterX} width={WIDTH.splitter} onBench={design.stageKind === 'output'} name={`Phase splitter, ${o.splitter.tubeId} ${o.splitter.kind === 'split-load' ? 'split-load' : 'long-tailed pair'}`} tubeId={o.splitter.tubeId} onOpen={() => setStageKind('output')}>
      <SplitterCell x0={splitterX} cc={o.splitter.coupling === 'direct' ? null : design.cout} sp={o.splitter} />
    </Cell>
  ) : null;
  const end = design.drivesOutput ? (
    <Cell key="output" x0={x} width={WIDTH.output} onBench={design.stageKind === 'output'} name={pair ? `Output stage, two ${o.tubeId} in push-pull (one drawn)` : `Output stage, ${o.tubeId}`} tubeId={null} onOpen={() => setStageKind('output')}>
      <OutputCell x0={x} cc={pair ? o.splitter.cc : design.cout} rg={o.rg} tubeId={pair ? `${o.tubeId} × 2` : o.tubeId} speakerOhms={o.speakerOhms} />
    </Cell>
  ) : Number.isFinite(design.rl) ? (
    <g key="load">
      <Resistor x={x + 24} y1={GRID} y2={GROUND - 8} />
      <Ground x={x + 24} y={GROUND} />
      <Wire points={[[x, GRID], [x + 24, GRID]]} />
      {label(x + 34, GRID + 44, `RL ${ohms(design.rl)}`)}
    </g>
  ) : null;
  const width = x + (design.drivesOutput ? WIDTH.output : WIDTH.load);
  return (
    <svg className="chain-schematic" preserveAspectRatio="xMinYMid meet" viewBox={`0 0 ${width} ${H}`} role="group" aria-label={`Schematic of the whole amplifier, ${list.length + (design.drivesOutput ? 1 : 0) + (pair ? 1 : 0)} stages`}>
      <Wire points={[[4, GRID], [LEAD_IN, GRID]]} />
      {label(4, GRID - 8, 'in')}
      {cells}
      {splitter}
      {end}
    </svg>
  );
});
