import { memo, type ReactNode } from 'react';
import { Capacitor, HResistor, Resistor, Winding, Wiper } from './parts';
import { Triode } from './tubes';
import { gridLeadBelow, OutputTubeSymbol, ScreenWire, screenWords, type ScreenWiring } from './screenWiring';
import { Dot, Ground, Wire } from './wiring';
import { farads, ohms, percentOf, plain, volts } from '../../format';
import type { FieldName } from '../../store/fields';
import type { FollowerPlan, GainPlan } from '../../store/stagePlans';
import type { SplitterPlan } from '../../store/outputPlan';

/**
 * The cells of the whole amplifier's drawing, one per stage, each drawn from
 * its left edge `x0` in the drawing's own units. A part's value is drawn by
 * `value`, which the drawing binds to that stage's box in the store, so every
 * value on the drawing can be edited where it stands.
 */

/** The drawing's rows: the B+ rail, the grids, the plate and cathode outputs, ground. */
export const RAIL = 30;
export const GRID = 120;
const PLATE_OUT = 84;
/** Where a cathode's output is taken: on its lead between the tube and Rk's body. */
const CATHODE_OUT = GRID + 27;
/** Where a phase splitter's second output (in phase) reaches the push-pull pair's second grid: the split-load's cathode row. */
export const SECOND_IN = CATHODE_OUT;
export const GROUND = 200;
export const H = 246;
export const LEAD_IN = 52;
/**
 * A stage with its own B+ (a gain stage, the splitter) starts its rail this far into its cell: each such rail is its
 * own node with its own value, so two stages at 275 V and 330 V are not drawn as one wire. A follower on the plate
 * before it shares that stage's rail and continues it.
 */
const RAIL_GAP = 8;
export const WIDTH = { gain: 160, follower: 104, splitter: 160, longTailedPair: 250, output: 176, pair: 290, load: 96 } as const;
/** Where a cell's coupling capacitor ends and its grid leak stands, from the cell's left edge. */
export const CC_END = 36;
export const RG_X = 48;
export const MUTED = '#4a535c';

export type Anchor = 'start' | 'middle' | 'end';
/** Draws one part's value at (x, y), named for a screen reader by `name` (e.g. "Ra"), bound to `field`. */
export type ValueLabel = (field: FieldName, name: string, x: number, y: number, text: string, anchor?: Anchor) => ReactNode;

export const label = (x: number, y: number, text: string, anchor: Anchor = 'start') => (
  <text x={x} y={y} fontSize={10.5} fill={MUTED} textAnchor={anchor}>{text}</text>
);

/**
 * Props equal entry by entry, objects one level down (a stage's plan is
 * rebuilt on every change of the design; its values are what matter): a
 * cell is drawn again only when its own stage changed, so a drag on one
 * stage does not redraw the others.
 */
export function sameProps<P extends object>(a: P, b: P): boolean {
  const same = (x: unknown, y: unknown) => Object.is(x, y) || (typeof x === 'object' && typeof y === 'object' && x !== null && y !== null && Object.keys(x).length === Object.keys(y).length && Object.entries(x).every(([k, v]) => Object.is(v, (y as Record<string, unknown>)[k])));
  const ka = Object.keys(a) as (keyof P)[];
  return ka.length === Object.keys(b).length && ka.every((k) => same(a[k], b[k]));
}

/** A capacitor across the cell's input at grid height, or a plain wire for direct coupling. */
export function Coupling({ x0, cc, value, field, name = 'Cc' }: { x0: number; cc: number | null; value: ValueLabel; field: FieldName; name?: string }) {
  return cc === null ? <Wire points={[[x0, GRID], [x0 + CC_END, GRID]]} /> : (
    <>
      <Capacitor at={GRID} from={x0} to={x0 + CC_END} vertical={false} />
      {value(field, name, x0 + 7, GRID - 16, farads(cc))}
    </>
  );
}

/** A grid leak from the grid line to ground (or, with `to`, to the divider holding the grid there). */
function GridLeak({ x0, rg, value, field, to, volume = null }: { x0: number; rg: number; value: ValueLabel; field: FieldName; to?: { field: FieldName; volts: number }; volume?: number | null }) {
  return (
    <>
      <Dot x={x0 + RG_X} y={GRID} />
      <Resistor x={x0 + RG_X} y1={GRID} y2={GROUND - 8} />
      {to ? value(to.field, 'grid leak returned', x0 + RG_X, GROUND + 4, `to ${volts(to.volts)}`, 'middle') : <Ground x={x0 + RG_X} y={GROUND} />}
      {value(field, volume === null ? 'Rg' : 'Volume control', x0 + RG_X + 11, GRID + 32, ohms(rg))}
      {volume !== null && (
        <>
          {/* From the left: the right of the track holds the cathode's labels. */}
          <Wiper x={x0 + RG_X} y={GRID + 52} side={-1} />
          {value('volume', 'set to', x0 + RG_X - 9, GRID + 44, `${plain(volume)} dB`, 'end')}
        </>
      )}
    </>
  );
}

/** A cathode resistor's bypass capacitor beside it, from its lead at `top` to its foot at `bottom` (the resistor stands at x). */
export function Bypass({ x, top, bottom }: { x: number; top: number; bottom: number }) {
  return (
    <>
      <Wire points={[[x, top], [x + 24, top]]} />
      <Capacitor at={x + 24} from={top} to={bottom} vertical polarised />
      <Wire points={[[x + 24, bottom], [x, bottom]]} />
    </>
  );
}

/** A triode with its plate resistor from the rail, its plate taken to the cell's right edge and down to the next grid's height. */
function PlateLoad({ x0, width, cx, r, ra, field, value }: { x0: number; width: number; cx: number; r: number; ra: number; field: FieldName; value: ValueLabel }) {
  return (
    <>
      <Triode cx={cx} cy={GRID} r={r} />
      <Wire points={[[x0 + RAIL_GAP, RAIL], [x0 + width, RAIL]]} />
      <Resistor x={cx} y1={RAIL} y2={PLATE_OUT} />
      <Wire points={[[cx, PLATE_OUT], [cx, GRID - r]]} />
      {value(field, 'Ra', cx - 12, 60, ohms(ra), 'end')}
      <Dot x={cx} y={PLATE_OUT} />
      <Wire points={[[cx, PLATE_OUT], [x0 + width, PLATE_OUT], [x0 + width, GRID]]} />
    </>
  );
}

/** A common-cathode gain stage: its coupling and leak (from the second stage on), its grid stopper, plate and cathode parts, B+. */
export const GainCell = memo(function GainCell({ x0, p, value }: { x0: number; p: GainPlan; value: ValueLabel }) {
  const cx = x0 + 112;
  const r = 22;
  const stopper = p.rstopper ?? 0;
  return (
    <>
      <Coupling x0={x0} cc={p.cc} value={value} field="cin" />
      {stopper > 0 ? (
        <>
          <Wire points={[[x0 + CC_END, GRID], [x0 + 56, GRID]]} />
          <HResistor x1={x0 + 56} x2={cx - r} y={GRID} />
          {value('rstopper', 'Grid stopper', x0 + 73, GRID - 12, ohms(stopper), 'middle')}
        </>
      ) : (
        <Wire points={[[x0 + CC_END, GRID], [cx - r, GRID]]} />
      )}
      {p.cc !== null && <GridLeak x0={x0} rg={p.rg} value={value} field="rg" volume={p.volume ?? null} />}
      <PlateLoad x0={x0} width={WIDTH.gain} cx={cx} r={r} ra={p.ra} field="ra" value={value} />
      {p.rk > 0 ? <Resistor x={cx} y1={GRID + r} y2={GROUND - 8} /> : <Wire points={[[cx, GRID + r], [cx, GROUND - 8]]} />}
      <Ground x={cx} y={GROUND} />
      {p.rk > 0 && value('rk', 'Rk', cx - 12, 176, ohms(p.rk), 'end')}
      {p.bypassed && p.rk > 0 && (
        <>
          <Bypass x={cx} top={150} bottom={GROUND - 8} />
          {value('ck', 'Ck', cx - 12, 189, p.ck === null ? 'Ck ideal' : farads(p.ck), 'end')}
        </>
      )}
      {value('bplus', 'B+', x0 + 4, RAIL - 8, `B+ ${volts(p.bplus)}`)}
    </>
  );
}, sameProps);

/** A follower's cell is wider when capacitor-coupled (its capacitor and leak stand before the tube) and with a grid stopper. */
export const cellWidth = (p: FollowerPlan | GainPlan) => (p.kind === 'follower' ? WIDTH.follower + gridSide(p) : WIDTH.gain);
const FOLLOWER_COUPLING_WIDTH = 46;
const FOLLOWER_STOPPER_WIDTH = 28;
const gridSide = (p: FollowerPlan) => (p.coupling ? FOLLOWER_COUPLING_WIDTH : 0) + ((p.rstopper ?? 0) > 0 ? FOLLOWER_STOPPER_WIDTH : 0);

/**
 * A cathode follower: its grid straight from the plate before it, or through
 * its capacitor into its leak, returned to the divider that holds it; its
 * grid stopper, if any, last before the grid.
 */
export const FollowerCell = memo(function FollowerCell({ x0, p, value }: { x0: number; p: FollowerPlan; value: ValueLabel }) {
  const c = p.coupling;
  const cx = x0 + 54 + gridSide(p);
  const r = 22;
  const width = cellWidth(p);
  const stopper = p.rstopper ?? 0;
  // Where the stopper starts: past the leak's dot, or a little past the plate before.
  const from = c ? x0 + RG_X + 4 : x0 + 4;
  return (
    <>
      {c ? (
        <>
          <Coupling x0={x0} cc={c.cc} value={value} field="fCc" />
          <Wire points={[[x0 + CC_END, GRID], [stopper > 0 ? from : cx - r, GRID]]} />
          <GridLeak x0={x0} rg={c.rg} value={value} field="fRg" to={{ field: 'fVbias', volts: c.vbias }} />
        </>
      ) : (
        <Wire points={[[x0, GRID], [stopper > 0 ? from : cx - r, GRID]]} />
      )}
      {stopper > 0 ? (
        <>
          <HResistor x1={from} x2={cx - r} y={GRID} />
          {value('fRst', 'Grid stopper', (from + cx - r) / 2, GRID - 12, ohms(stopper), 'middle')}
        </>
      ) : null}
      <Triode cx={cx} cy={GRID} r={r} />
      <Wire points={[[x0, RAIL], [x0 + width, RAIL]]} />
      <Wire points={[[cx, RAIL], [cx, GRID - r]]} />
      <Resistor x={cx} y1={GRID + r} y2={GROUND - 8} />
      <Ground x={cx} y={GROUND} />
      {value('rk2', 'Rk', cx - 12, 176, ohms(p.rk), 'end')}
      <Dot x={cx} y={CATHODE_OUT} />
      <Wire points={[[cx, CATHODE_OUT], [x0 + width, CATHODE_OUT], [x0 + width, GRID]]} />
    </>
  );
}, sameProps);

/**
 * A phase splitter's input up to its (first) grid at `gridX`: fed through
 * Cout into its leak (returned to the divider that sets its grid), or
 * straight from the plate before it, with its grid stopper, if any, last
 * before the grid.
 */
export function SplitterInput({ x0, cc, sp, gridX, value }: { x0: number; cc: number | null; sp: SplitterPlan; gridX: number; value: ValueLabel }) {
  const stopper = sp.rstopper ?? 0;
  return (
    <>
      <Coupling x0={x0} cc={cc} value={value} field="cout" />
      {stopper > 0 ? (
        <>
          {/* Past the leak's dot, last before the grid. */}
          <Wire points={[[x0 + CC_END, GRID], [x0 + RG_X + 2, GRID]]} />
          <HResistor x1={x0 + RG_X + 2} x2={gridX} y={GRID} />
          {value('sRst', 'Grid stopper', (x0 + RG_X + 2 + gridX) / 2, GRID - 12, ohms(stopper), 'middle')}
        </>
      ) : (
        <Wire points={[[x0 + CC_END, GRID], [gridX, GRID]]} />
      )}
      {sp.coupling === 'capacitor' && <GridLeak x0={x0} rg={sp.rg} value={value} field="sRg" to={{ field: 'sVgrid', volts: sp.vgrid }} />}
    </>
  );
}

/**
 * The split-load (cathodyne) phase splitter before a pair: its input, its
 * plate and cathode loads, and two outputs to the pair's grids, the plate's
 * (inverting) to the first and the cathode's (in phase) to the second.
 */
export const SplitterCell = memo(function SplitterCell({ x0, cc, sp, value }: { x0: number; cc: number | null; sp: SplitterPlan; value: ValueLabel }) {
  const cx = x0 + 100;
  const r = 22;
  const edge = x0 + WIDTH.splitter;
  return (
    <>
      <SplitterInput x0={x0} cc={cc} sp={sp} gridX={cx - r} value={value} />
      <PlateLoad x0={x0} width={WIDTH.splitter} cx={cx} r={r} ra={sp.ra} field="sRa" value={value} />
      <Resistor x={cx} y1={GRID + r} y2={GROUND - 8} />
      <Ground x={cx} y={GROUND} />
      {/* The cathode's values stand right of it, clear of the grid leak's. */}
      {value('sRk', 'Rk', cx + 12, 176, ohms(sp.rk))}
      <Dot x={cx} y={CATHODE_OUT} />
      <Wire points={[[cx, CATHODE_OUT], [edge, SECOND_IN]]} />
      {/* Under its wire, clear of the tube: the wire leads on to the pair's second grid. */}
      {label(cx + 12, CATHODE_OUT + 12, 'in phase')}
      {value('sBplus', 'B+', x0 + 4, RAIL - 8, `B+ ${volts(sp.bplus)}`)}
    </>
  );
}, sameProps);

/**
 * The single-ended output stage: its coupling capacitor (`ccField` names
 * whose box holds it) and grid resistor, the tube (a power triode, or a
 * pentode with its screen wired as chosen, its lead on the left, away from
 * the secondary) and its transformer.
 */
export const OutputCell = memo(function OutputCell({ x0, cc, ccField, rg, bias, bplus, tubeId, speakerOhms, wiring, value }: { x0: number; cc: number | null; ccField: FieldName; rg: number; bias: { kind: 'cathode'; rk: number } | { kind: 'fixed'; vg: number }; bplus: number; tubeId: string; speakerOhms: number; wiring: ScreenWiring; value: ValueLabel }) {
  const cx = x0 + 110;
  const r = 26;
  const primaryTop = RAIL + 10;
  const primaryEnd = GRID - r - 4;
  const tapY = primaryTop + (primaryEnd - primaryTop) * (wiring.kind === 'ultralinear' ? wiring.tap : 0);
  const screenX = cx - r - 4;
  const supplyY = GRID - r + 2;
  return (
    <>
      <Coupling x0={x0} cc={cc} value={value} field={ccField} />
      <GridLeak x0={x0} rg={rg} value={value} field="oRg" {...(bias.kind === 'fixed' ? { to: { field: 'oVg' as const, volts: bias.vg } } : {})} />
      <Wire points={[[x0 + CC_END, GRID], [x0 + 64, GRID], [x0 + 64, GRID + gridLeadBelow(wiring)], [cx - r, GRID + gridLeadBelow(wiring)]]} />
      <OutputTubeSymbol cx={cx} cy={GRID} r={r} wiring={wiring} side={-1} />
      <ScreenWire cx={cx} cy={GRID} r={r} side={-1} wiring={wiring} tapAt={[cx, tapY]} plateY={primaryEnd + 2} supplyY={supplyY} />
      {wiring.kind === 'pentode' && value('oScreen', 'screen supply', screenX, supplyY - 5, screenWords(wiring), 'middle')}
      {wiring.kind === 'ultralinear' && value('oTap', 'screen tap', screenX + 4, tapY - 4, percentOf(wiring.tap))}
      <Wire points={[[x0 + 64, RAIL], [cx, RAIL], [cx, primaryTop]]} />
      <Winding x={cx} y1={primaryTop} y2={primaryEnd} side={1} turns={4} />
      <Wire points={[[cx, primaryEnd], [cx, GRID - r]]} />
      <Winding x={cx + 22} y1={primaryTop} y2={primaryEnd} side={-1} turns={4} />
      {value('oSpeaker', 'speaker', cx + 30, 62, `${speakerOhms} Ω`)}
      {value('oBplus', 'B+', x0 + 66, RAIL - 8, `B+ ${volts(bplus)}`)}
      {bias.kind === 'cathode' ? <Resistor x={cx} y1={GRID + r} y2={GROUND - 8} /> : <Wire points={[[cx, GRID + r], [cx, GROUND - 8]]} />}
      {bias.kind === 'cathode' && (
        <>
          {value('oRk', 'Rk', cx - 12, 176, ohms(bias.rk), 'end')}
          {/* Sized on the build sheet for the stage's low corner: named here, its value there. */}
          <Bypass x={cx} top={GRID + r + 4} bottom={GROUND - 8} />
          {label(cx + 40, 176, 'Ck')}
        </>
      )}
      <Ground x={cx} y={GROUND} />
      {label(x0 + 140, H - 20, tubeId, 'middle')}
    </>
  );
}, sameProps);

/** A resistive load after the last voltage stage (the RL box), through Cout (a wire when it is none). */
export const LoadCell = memo(function LoadCell({ x0, rl, cout, value }: { x0: number; rl: number; cout: number | null; value: ValueLabel }) {
  const x = x0 + CC_END + 24;
  return (
    <>
      <Coupling x0={x0} cc={cout} value={value} field="cout" name="Cout" />
      <Resistor x={x} y1={GRID} y2={GROUND - 8} />
      <Ground x={x} y={GROUND} />
      <Wire points={[[x0 + CC_END, GRID], [x, GRID]]} />
      {value('rl', 'RL', x + 10, GRID + 44, `RL ${ohms(rl)}`)}
    </>
  );
}, sameProps);

/** The row under the drawing that global feedback's path runs along. */
export const FEEDBACK_ROW = 24;

/** Where global feedback leaves the output stage's drawing: the speaker's end of the secondary, and the cell's right edge it runs down. */
export interface SpeakerTap {
  readonly x: number;
  readonly y: number;
  readonly edge: number;
}

/** The single-ended output cell's speaker end, from its left edge. */
export const singleEndedTap = (x0: number): SpeakerTap => ({ x: x0 + 110 + 22, y: GRID - 30, edge: x0 + WIDTH.output - 6 });

/**
 * Global feedback's resistor drawn from the secondary's speaker end (`from`)
 * round under the drawing to the first gain stage's cathode lead (its cell
 * at `toX`), above its Rk: where the loop returns. A capacitor across Rf is
 * named beside it (the row has no room for its plates).
 */
export function FeedbackPath({ from, toX, rf, cf, value }: { from: SpeakerTap; toX: number; rf: number; cf: number | null; value: ValueLabel }) {
  const out = from.edge;
  const cathode = toX + 112;
  const up = cathode + 16;
  const y = H + FEEDBACK_ROW / 2;
  const mid = (up + out) / 2;
  return (
    <g className="feedback-path">
      <Wire points={[[from.x, from.y], [out, from.y], [out, y], [mid + 20, y]]} />
      <rect x={mid - 20} y={y - 5} width={40} height={10} fill="#fff" stroke="#1d2329" strokeWidth={2} />
      <Wire points={[[mid - 20, y], [up, y], [up, CATHODE_OUT], [cathode, CATHODE_OUT]]} />
      <Dot x={cathode} y={CATHODE_OUT} />
      <Dot x={from.x} y={from.y} />
      {value('feedbackRf', 'Rf', mid, y - 8, `Rf ${ohms(rf)}`, cf === null ? 'middle' : 'end')}
      {cf === null ? null : value('feedbackCf', 'Cf', mid + 4, y - 8, `∥ Cf ${farads(cf)}`, 'start')}
    </g>
  );
}
