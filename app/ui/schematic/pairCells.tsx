import { memo } from 'react';
import { Capacitor, HResistor, HWinding, Resistor } from './parts';
import { Triode } from './tubes';
import { INK } from './ink';
import { Dot, Ground, HopWire, Wire } from './wiring';
import { Bypass, CC_END, Coupling, GRID, GROUND, H, label, RAIL, RG_X, sameProps, SECOND_IN, SplitterInput, WIDTH, type SpeakerTap, type ValueLabel } from './chainCells';
import { farads, ohms, percentOf, volts } from '../../format';
import { gridLeadBelow, OutputTubeSymbol, ScreenWire, screenWords, type ScreenWiring } from './screenWiring';
import type { FieldName } from '../../store/fields';
import type { SplitterPlan } from '../../store/outputPlan';

/**
 * The two cells of a push-pull amplifier's drawing that hold two tubes each:
 * the long-tailed pair phase splitter and the output pair. Each output of
 * the splitter reaches its own grid of the pair: the inverting one at grid
 * height, the one in phase lower (`SECOND_IN`). Where a wire must cross
 * another it hops over it.
 */

/** Where each plate's output is taken off its lead: apart, so the two run to the pair side by side. */
const FIRST_OUT = 84;
const SECOND_OUT = 94;
/** Where the plate resistors end and the plate leads run on to the tubes. */
const RA_END = 78;

/**
 * The long-tailed pair: the first grid driven, the second held at signal
 * ground (its leak to the divider's voltage, or to the first grid's when
 * direct-coupled, decoupled by the divider's capacitor); each plate with
 * its own resistor; the cathodes joined into the shared bias resistor over
 * the tail.
 */
export const LongTailedPairCell = memo(function LongTailedPairCell({ x0, cc, sp, value }: { x0: number; cc: number | null; sp: SplitterPlan; value: ValueLabel }) {
  const r = 22;
  const a = x0 + 100;
  const b = x0 + 196;
  const mid = (a + b) / 2;
  const edge = x0 + WIDTH.longTailedPair;
  const joined = GRID + r + 6;
  const tailTop = joined + 24;
  // The second grid's leak lies from its grid toward the first tube.
  const leakEnd = b - r - 34;
  return (
    <>
      <SplitterInput x0={x0} cc={cc} sp={sp} gridX={a - r} value={value} />
      <Wire points={[[x0 + 8, RAIL], [b, RAIL]]} />
      {[a, b].map((x) => (
        <g key={x}>
          <Triode cx={x} cy={GRID} r={r} />
          <Resistor x={x} y1={RAIL} y2={RA_END} />
          <Wire points={[[x, RA_END], [x, GRID - r]]} />
        </g>
      ))}
      {value('sRa', 'Ra', a - 12, 60, ohms(sp.ra), 'end')}
      {value('sRa2', 'second Ra', b - 12, 60, ohms(sp.ra2), 'end')}
      {/* The first plate (inverting) to the first grid of the pair, over the second plate's lead; the second plate to the second grid. */}
      <Dot x={a} y={FIRST_OUT} />
      <HopWire y={FIRST_OUT} from={a} to={edge} over={[b]} />
      <Wire points={[[edge, FIRST_OUT], [edge, GRID]]} />
      <Dot x={b} y={SECOND_OUT} />
      <Wire points={[[b, SECOND_OUT], [edge - 8, SECOND_OUT], [edge - 8, SECOND_IN], [edge, SECOND_IN]]} />
      {/* The second grid, held at signal ground through its leak. */}
      <HResistor x1={leakEnd} x2={b - r} y={GRID} />
      {sp.coupling === 'capacitor'
        ? value('sVgrid', 'second grid leak returned', (leakEnd + b - r) / 2, GRID - 10, `to ${volts(sp.vgrid)}`, 'middle')
        : label((leakEnd + b - r) / 2, GRID - 10, 'to grid 1', 'middle')}
      {value('sRg', 'second grid leak', (leakEnd + b - r) / 2, GRID + 22, ohms(sp.rg), 'middle')}
      {/* The cathodes joined, into the shared bias resistor and the tail below it. */}
      <Wire points={[[a, GRID + r], [a, joined], [b, joined], [b, GRID + r]]} />
      <Dot x={mid} y={joined} />
      <Resistor x={mid} y1={joined} y2={tailTop} />
      <Resistor x={mid} y1={tailTop} y2={GROUND - 8} />
      <Ground x={mid} y={GROUND} />
      {value('sRk', 'Rk', mid + 12, joined + 17, ohms(sp.rk))}
      {value('sRtail', 'tail', mid + 12, tailTop + 16, `tail ${ohms(sp.rtail)}`)}
      {value('sBplus', 'B+', x0 + 4, RAIL - 8, `B+ ${volts(sp.bplus)}`)}
    </>
  );
}, sameProps);

/** The pair's geometry from its cell's left edge: the tubes, the primary's row, the secondary's. */
const PAIR = { a: 132, b: 222, r: 26, primary: 76, secondary: 50, secondLeak: 96, low: 164, leakBody: 30 } as const;

/** The pair's speaker end of the secondary, from its cell's left edge. */
export const pairTap = (x0: number): SpeakerTap => ({ x: x0 + 262, y: PAIR.secondary, edge: x0 + WIDTH.pair - 6 });

/**
 * A push-pull output pair: each grid through its own capacitor and resistor
 * (the two resistors returned together, to ground or to the bias), the two
 * tubes on a centre-tapped primary with B+ at the tap, the secondary to the
 * speaker, and the cathodes joined (into the shared Rk, or to ground with
 * fixed bias).
 */
export const PairCell = memo(function PairCell({ x0, cc, ccField, rg, bias, bplus, tubeId, speakerOhms, wiring, value }: { x0: number; cc: number; ccField: FieldName; rg: number; bias: { kind: 'cathode'; rk: number } | { kind: 'fixed'; vg: number }; bplus: number; tubeId: string; speakerOhms: number; wiring: ScreenWiring; value: ValueLabel }) {
  const { r } = PAIR;
  const a = x0 + PAIR.a;
  const b = x0 + PAIR.b;
  const mid = (a + b) / 2;
  const leak1 = x0 + RG_X;
  const leak2 = x0 + PAIR.secondLeak;
  const leakFoot = GROUND - 8;
  const joined = GRID + r + 30;
  const tap = pairTap(x0);
  const secondaryFrom = mid + 10;
  const secondaryTo = b + 10;
  const screensY = GRID - r + 6;
  const gridY = GRID + gridLeadBelow(wiring);
  return (
    <>
      {/* The first grid, from the splitter's inverting output. */}
      <Coupling x0={x0} cc={cc} value={value} field={ccField} />
      <Dot x={leak1} y={GRID} />
      <Wire points={[[x0 + CC_END, GRID], [x0 + 64, GRID], [x0 + 64, gridY], [a - r, gridY]]} />
      {/* Short, so the second grid's wire crosses its lead below it, not its body. */}
      <Resistor x={leak1} y1={GRID} y2={GRID + PAIR.leakBody} />
      <Wire points={[[leak1, GRID + PAIR.leakBody], [leak1, leakFoot]]} />
      {value('oRg', 'Rg', leak1 + 12, GRID + 22, ohms(rg))}
      {/* The second grid, from the output in phase: under the first grid's leak and the first cathode, up to its grid. */}
      <Wire points={[[x0, SECOND_IN], [x0 + 4, SECOND_IN], [x0 + 4, PAIR.low]]} />
      <Capacitor at={PAIR.low} from={x0 + 4} to={x0 + 4 + CC_END} vertical={false} />
      {/* Its own box, apart from the first capacitor's: the two are one value, kept in one field. */}
      <g>{value(ccField, 'second Cc', x0 + 6, PAIR.low + 26, farads(cc))}</g>
      <HopWire y={PAIR.low} from={x0 + 4 + CC_END} to={b - 40} over={[leak1, a]} />
      <Wire points={[[b - 40, PAIR.low], [b - 40, gridY], [b - r, gridY]]} />
      <Dot x={leak2} y={PAIR.low} />
      <Resistor x={leak2} y1={PAIR.low} y2={leakFoot} />
      <g>{value('oRg', 'second Rg', leak2 - 8, leakFoot - 6, ohms(rg), 'end')}</g>
      <Wire points={[[leak2, leakFoot], [leak1, leakFoot]]} />
      <Dot x={leak1} y={leakFoot} />
      {bias.kind === 'fixed' ? value('oVg', 'grid leaks returned', leak1, GROUND + 4, `to ${volts(bias.vg)}`, 'middle') : <Ground x={leak1} y={GROUND} />}
      {/*
        The tubes on the centre-tapped primary, B+ at the tap, the secondary beside it to the speaker; each screen's lead
        toward the other tube: to its tap on its own half of the primary, its own plate, or the screens' supply.
      */}
      <OutputTubeSymbol cx={a} cy={GRID} r={r} wiring={wiring} side={1} />
      <OutputTubeSymbol cx={b} cy={GRID} r={r} wiring={wiring} side={-1} />
      <ScreenWire cx={a} cy={GRID} r={r} side={1} wiring={wiring} tapAt={[a + r + 4, PAIR.primary]} plateY={PAIR.primary + 10} supplyY={screensY} />
      <ScreenWire cx={b} cy={GRID} r={r} side={-1} wiring={wiring} tapAt={[b - r - 4, PAIR.primary]} plateY={PAIR.primary + 10} supplyY={screensY} />
      {wiring.kind === 'pentode' && (
        <>
          <Wire points={[[a + r + 4, screensY], [b - r - 4, screensY]]} />
          {value('oScreen', 'screen supply', mid, screensY - 4, screenWords(wiring), 'middle')}
        </>
      )}
      {wiring.kind === 'ultralinear' && value('oTap', 'screen tap', mid, screensY + 8, percentOf(wiring.tap), 'middle')}
      <HWinding x1={a} x2={b} y={PAIR.primary} side={-1} turns={6} />
      <Wire points={[[a, PAIR.primary], [a, GRID - r]]} />
      <Wire points={[[b, PAIR.primary], [b, GRID - r]]} />
      <Wire points={[[x0 + 64, RAIL], [mid, RAIL], [mid, PAIR.primary]]} />
      <Dot x={mid} y={PAIR.primary} />
      <line x1={mid + 6} x2={b + 14} y1={PAIR.secondary + 10} y2={PAIR.secondary + 10} stroke={INK} strokeWidth={2} />
      <line x1={mid + 6} x2={b + 14} y1={PAIR.secondary + 13} y2={PAIR.secondary + 13} stroke={INK} strokeWidth={2} />
      <HWinding x1={secondaryFrom} x2={secondaryTo} y={PAIR.secondary} side={1} turns={4} />
      <Wire points={[[secondaryFrom, PAIR.secondary], [secondaryFrom, PAIR.secondary - 10], [tap.x, PAIR.secondary - 10]]} />
      <Wire points={[[secondaryTo, PAIR.secondary], [tap.x, PAIR.secondary]]} />
      {value('oSpeaker', 'speaker', tap.x + 4, PAIR.secondary - 2, `${speakerOhms} Ω`)}
      {value('oBplus', 'B+', x0 + 66, RAIL - 8, `B+ ${volts(bplus)}`)}
      {/* The cathodes joined: into the shared Rk, or straight to ground with fixed bias. */}
      <Wire points={[[a, GRID + r], [a, joined], [b, joined], [b, GRID + r]]} />
      <Dot x={mid} y={joined} />
      {bias.kind === 'cathode' ? <Resistor x={mid} y1={joined} y2={GROUND} /> : <Wire points={[[mid, joined], [mid, GROUND]]} />}
      {bias.kind === 'cathode' && (
        <>
          {value('oRk', 'Rk', mid - 12, joined + 20, ohms(bias.rk), 'end')}
          {/* Sized on the build sheet: named here, its value there. */}
          <Bypass x={mid} top={joined} bottom={GROUND} />
          <Dot x={mid + 24} y={joined} />
          {label(mid + 40, joined + 20, 'Ck')}
        </>
      )}
      <Ground x={mid} y={GROUND + 8} />
      {label(a, H - 20, tubeId, 'middle')}
      {label(b, H - 20, tubeId, 'middle')}
    </>
  );
}, sameProps);
