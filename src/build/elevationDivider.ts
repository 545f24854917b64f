import { fail, type Result } from '../result';
import type { PreferredSeries } from '../parts/preferredValues';
import { shown } from '../shown';
import { gridDivider } from './gridDivider';
import type { CapacitorLine, ResistorLine } from './partsList';

export interface ElevationDivider {
  /** The divider's parts: Rh1 from the node, Rh2 to ground, Ch across Rh2. */
  readonly resistors: readonly ResistorLine[];
  readonly capacitor: CapacitorLine;
  /** The heaters' DC potential the preferred values give, V (Ohm's law: no current flows into the heater return). */
  readonly volts: number;
  /** What the divider draws from its node, A. */
  readonly amps: number;
}

/**
 * The divider that elevates the small tubes' heater supply to `volts` DC
 * from a B+ node at `fromVolts`: the heater winding's centre tap (or one
 * side) returns to its middle instead of to ground, so a cathode sitting
 * high (a direct-coupled follower, a cathodyne) stays within its
 * heater–cathode rating. The same divider as a grid's: a few hundred kΩ to
 * ground, so it wastes little current, decoupled well under the band so no
 * hum rides on the heaters' return (common practice).
 */
export function elevationDivider(fromVolts: number, volts: number, series: PreferredSeries = 'E24'): Result<ElevationDivider> {
  // Volts, not denormals: a divider for a node of a few picovolts would want an infinite decoupling capacitor.
  if (!(fromVolts >= 1) || !(fromVolts <= 10_000)) return fail('invalid-input', `The node the divider hangs from must be from 1 V to 10 kV (got ${shown(fromVolts)} V)`, 'fromVolts');
  if (!(volts >= 0.1) || !(volts <= 10_000)) return fail('invalid-input', `The heater elevation must be from 0.1 V to 10 kV (got ${shown(volts)} V)`, 'elevation');
  if (series !== 'E12' && series !== 'E24' && series !== 'E96') return fail('invalid-input', 'The preferred series must be E12, E24 or E96', 'series');
  // A divider only divides: leave it a tenth of the node at least, or the upper resistor is nothing and the heaters carry the node's ripple.
  if (volts > 0.9 * fromVolts) return fail('unreachable', `A divider from ${shown(fromVolts)} V cannot hold the heaters at ${shown(volts)} V: take it from a higher node, or elevate less`, 'elevation');
  const { resistors, capacitor } = gridDivider({ upper: 'Rh1', lower: 'Rh2', cap: 'Ch' }, fromVolts, volts, series, 'the heaters');
  const upper = resistors[0]!.preferred;
  const lower = resistors[1]!.preferred;
  return { ok: true, resistors, capacitor, volts: (fromVolts * lower) / (upper + lower), amps: fromVolts / (upper + lower) };
}
