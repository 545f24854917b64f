import { Pentode, Triode } from './tubes';
import { Dot, Wire } from './wiring';
import { volts } from '../../format';
import type { OutputPlan } from '../../store/outputPlan';

/**
 * How an output tube's screen is wired, as the whole amplifier's drawing
 * shows it: a power triode has none; a pentode's goes to its supply, a
 * triode-connected one's to its own plate, an ultralinear one's to a tap on
 * its half of the primary.
 */
export type ScreenWiring =
  | { readonly kind: 'none' }
  | { readonly kind: 'pentode'; readonly volts: number }
  | { readonly kind: 'triode' }
  | { readonly kind: 'ultralinear'; readonly tap: number };

/** The wiring the output stage's tube and connection give (`powerTriode`: the tube has no screen). */
export function screenWiringOf(o: Pick<OutputPlan, 'connection' | 'screenVolts' | 'ulTap'>, powerTriode: boolean): ScreenWiring {
  if (powerTriode) return { kind: 'none' };
  if (o.connection === 'pentode') return { kind: 'pentode', volts: o.screenVolts };
  return o.connection === 'ultralinear' ? { kind: 'ultralinear', tap: o.ulTap } : { kind: 'triode' };
}

/** An output tube's envelope at (cx, cy): a triode's, or a pentode's with its screen's lead to `side`. */
export function OutputTubeSymbol({ cx, cy, r, wiring, side }: { cx: number; cy: number; r: number; wiring: ScreenWiring; side: 1 | -1 }) {
  return wiring.kind === 'none' ? <Triode cx={cx} cy={cy} r={r} /> : <Pentode cx={cx} cy={cy} r={r} screenSide={side} />;
}

/** How far below the tube's centre its control grid's lead leaves the envelope: a pentode's (the Pentode symbol's), or a triode's at its centre. */
export const gridLeadBelow = (w: ScreenWiring) => (w.kind === 'none' ? 0 : 8);

/** The screen's lead leaves the envelope this far above the tube's centre (the Pentode symbol's). */
const SCREEN_ABOVE = 4;
/** How far out from the envelope its wire turns. */
const TURN = 4;

/**
 * One tube's screen wire, from its lead on `side` of the tube at (cx, cy)
 * with radius r: up to `tapAt` on the primary (ultralinear), across to its
 * plate lead at `plateY` (triode-connected), or up to `supplyY`, where its
 * supply is named or joined (pentode). Nothing for a power triode.
 */
export function ScreenWire({ cx, cy, r, side, wiring, tapAt, plateY, supplyY }: { cx: number; cy: number; r: number; side: 1 | -1; wiring: ScreenWiring; tapAt: readonly [number, number]; plateY: number; supplyY: number }) {
  if (wiring.kind === 'none') return null;
  const y = cy - SCREEN_ABOVE;
  const out = cx + side * (r + TURN);
  const lead: [number, number] = [cx + side * r, y];
  if (wiring.kind === 'ultralinear') {
    return (
      <>
        <Wire points={[lead, [out, y], [out, tapAt[1]], [tapAt[0], tapAt[1]]]} />
        <Dot x={tapAt[0]} y={tapAt[1]} />
      </>
    );
  }
  if (wiring.kind === 'triode') {
    return (
      <>
        <Wire points={[lead, [out, y], [out, plateY], [cx, plateY]]} />
        <Dot x={cx} y={plateY} />
      </>
    );
  }
  return <Wire points={[lead, [out, y], [out, supplyY]]} />;
}

/** A pentode-connected screen's supply in the drawing's words. */
export const screenWords = (w: Extract<ScreenWiring, { kind: 'pentode' }>) => `g2 ${volts(w.volts)}`;
