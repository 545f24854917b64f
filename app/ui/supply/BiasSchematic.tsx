import type { FixedBiasSupply } from '../../../src/index';
import { farads, ohms, plain, volts } from '../../format';
import { capacitorDown, winding, zigzag, zigzagDown } from './drawnParts';

const TOP = 40;
const GROUND = 196;
const RESERVOIR_X = 150;
const RAIL_X = 270;
const STRING_X = 350;
const INK = '#1d2733';
const NOTE = '#0f5f8a';

/**
 * The bias supply as a drawing of our own: the winding, the diode turned so
 * the reservoir charges negative, the reservoir, the filter resistor and
 * the rail's capacitor (each capacitor's + to ground), then a tube's string
 * down to ground with the trimmer's wiper feeding the grid leak.
 */
export function BiasSchematic({ plan, result, tubes }: { plan: { secondaryRms: number; reservoir: number; r: number; c: number }; result: FixedBiasSupply | null; tubes: number }) {
  const s = result?.taps[0]?.string ?? null;
  const potTop = TOP + 50;
  const potBottom = potTop + 50;
  const wiper = potTop + 25;
  return (
    <svg className="bias-schematic" viewBox={`0 0 480 ${GROUND + 16}`} role="img" aria-label={`The bias supply drawn: ${plain(plan.secondaryRms)} V winding, one diode, ${farads(plan.reservoir)} reservoir, ${ohms(plan.r)} into ${farads(plan.c)}, ${tubes > 1 ? `a string for each of ${tubes} tubes` : 'the tube\'s string'}`}>
      <g stroke={INK} fill="none" strokeWidth={1.4}>
        <path d={`${winding(26, 36, 64, 1)} M14 36 H26 M14 100 H26`} />
        <path d="M40 32 V104 M44 32 V104" />
        <path d={`${winding(58, 36, 64, -1)} M58 36 H62 V${TOP} H70 M58 100 H62 V${GROUND} H${STRING_X + 10}`} />
        {/* The diode points back at the winding: it conducts while the winding swings below the reservoir. */}
        <path d={`M70 ${TOP} H96 M112 ${TOP - 9} L112 ${TOP + 9} L96 ${TOP} Z M96 ${TOP - 9} V${TOP + 9} M112 ${TOP} H${RESERVOIR_X}`} />
        <path d={capacitorDown(RESERVOIR_X, TOP, GROUND)} />
        <path d={zigzag(RESERVOIR_X, TOP, RAIL_X - RESERVOIR_X)} />
        <path d={`${capacitorDown(RAIL_X, TOP, GROUND)} M${RAIL_X} ${TOP} H${STRING_X}`} />
        {/* The string: rail end, trimmer (its wiper an arrow from the right), ground end. */}
        <path d={`${zigzagDown(STRING_X, TOP, potTop - TOP)} ${zigzagDown(STRING_X, potTop, potBottom - potTop)} ${zigzagDown(STRING_X, potBottom, GROUND - potBottom)}`} />
        <path d={`M${STRING_X + 22} ${wiper} H${STRING_X + 9} M${STRING_X + 14} ${wiper - 4} L${STRING_X + 9} ${wiper} L${STRING_X + 14} ${wiper + 4} M${STRING_X + 22} ${wiper} ${zigzag(STRING_X + 22, wiper, 70).slice(1)} M${STRING_X + 92} ${wiper} H${STRING_X + 104}`} />
        {[RESERVOIR_X, RAIL_X].map((x) => <circle key={x} cx={x} cy={TOP} r={2.5} fill={INK} />)}
      </g>
      <g fontSize={10} fill={INK}>
        <text x={8} y={120}>{plain(plan.secondaryRms)} V</text>
        <text x={80} y={TOP + 24}>1 diode</text>
        {/* The capacitors' + sides are at ground: the rail is below it. */}
        <text x={RESERVOIR_X + 16} y={TOP + 46}>+</text>
        <text x={RAIL_X + 16} y={TOP + 46}>+</text>
        <text x={RESERVOIR_X + 14} y={TOP + 30}>{farads(plan.reservoir)}</text>
        <text x={RAIL_X + 14} y={TOP + 30}>{farads(plan.c)}</text>
        <text x={RESERVOIR_X + (RAIL_X - RESERVOIR_X) / 2 - 16} y={TOP + 20}>{ohms(plan.r)}</text>
        {result ? (
          <>
            <text x={RESERVOIR_X - 14} y={TOP - 10} fill={NOTE}>−{volts(result.reservoir)}</text>
            <text x={RAIL_X - 14} y={TOP - 10} fill={NOTE}>−{volts(result.rail)}</text>
          </>
        ) : null}
        {s ? (
          <>
            <text x={STRING_X + 10} y={TOP + 28}>{ohms(s.top)}</text>
            <text x={STRING_X - 58} y={wiper + 4}>{ohms(s.pot)}</text>
            <text x={STRING_X + 10} y={potBottom + 32}>{ohms(s.bottom)}</text>
          </>
        ) : null}
        <text x={STRING_X + 40} y={wiper - 10}>grid leak</text>
        <text x={STRING_X + 106} y={wiper + 4}>grid</text>
        {tubes > 1 ? <text x={STRING_X + 16} y={GROUND - 6} fill={NOTE}>one string a tube (×{tubes})</text> : null}
      </g>
    </svg>
  );
}
