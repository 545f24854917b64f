import { fail, type Result } from '../result';
import { shown } from '../shown';
import { finding, type Finding } from '../stage/ratingBands';
import { formatValue } from '../parts/formatValue';

/**
 * How far a stage's B+ as designed may sit from what its supply node gives
 * before the design's figures stop describing the build: 5 % (common
 * practice: about what the filter's parts and the tubes' spread move a node
 * by; the mains alone move it ±10 %, IEC 60038, which the design cannot
 * choose). Past it the gain, swing, power and every rating check are for a
 * B+ the supply does not give.
 */
export const BPLUS_AGREEMENT = 0.05;

/** Past any supply a tube amplifier has: a value above it is a slip, not a design. */
const MAX_VOLTS = 100e3;
/** Below any B+ a tube stage is designed for (a millivolt): a smaller one is a slip, and would make the percentages infinite. */
const MIN_HELD_VOLTS = 1e-3;

/**
 * A stage's (or a group of stages') B+ as designed against the voltage its
 * node delivers under the whole amplifier's load: a warning past
 * BPLUS_AGREEMENT, saying which way and what the figures are for; null
 * within it. `who` names the stages as the ratings list does ("Voltage
 * stages"), `node` is the node's index (0: the reservoir). `what` names
 * the voltage compared: 'B+' (the plates'), or 'screens' for an output
 * stage's screens on a node of their own.
 */
export function bplusAgreement(who: string, node: number, held: number, supplied: number, what: 'B+' | 'screens' = 'B+'): Result<{ finding: Finding | null }> {
  if (typeof who !== 'string' || who.length === 0) return fail('invalid-input', 'Name the stages whose B+ is compared', 'who');
  if (!(Number.isInteger(node) && node >= 0 && node < 1000)) return fail('invalid-input', `The node must be a whole number from 0 (got ${shown(node)})`, 'node');
  if (!(typeof held === 'number' && held >= MIN_HELD_VOLTS && held <= MAX_VOLTS)) return fail('invalid-input', `The B+ as designed must be from ${MIN_HELD_VOLTS * 1e3} mV to ${MAX_VOLTS} V (got ${shown(held)})`, 'held');
  if (!(typeof supplied === 'number' && supplied >= 0 && supplied <= MAX_VOLTS)) return fail('invalid-input', `The node's voltage must be from 0 to ${MAX_VOLTS} V (got ${shown(supplied)})`, 'supplied');
  const off = (supplied - held) / held;
  if (Math.abs(off) <= BPLUS_AGREEMENT) return { ok: true, finding: null };
  const pct = Math.round(Math.abs(off) * 100);
  const way = off < 0 ? `${pct} % less: less swing and gain than shown` : `${pct} % more: more current and dissipation than the ratings checked here`;
  const designed = what === 'screens' ? `screens at ${formatValue(held, 'V')}` : `B+ ${formatValue(held, 'V')}`;
  const message = `${who}: designed for ${designed}, but node ${node + 1} gives ${formatValue(supplied, 'V')} under load (${way}). Every figure and rating check for them is at ${formatValue(held, 'V')}: design them for the node's ${what === 'screens' ? 'voltage' : 'B+'}, or change the supply.`;
  return { ok: true, finding: finding('supply-bplus', 'warning', message, supplied, held) };
}
