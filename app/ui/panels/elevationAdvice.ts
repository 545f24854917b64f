import { farads, ohms, smallAmps, volts } from '../../format';
import type { BuildSheet } from '../../store/buildSheet';

type Window = { lo: number | null; hi: number | null; suggested: number; groundedOk: boolean };

/** The window in words: where the heaters may sit, from ground up (a potential below ground is no one's design). */
function windowWords(e: Window): string {
  const lo = e.lo !== null && e.lo > 0 ? e.lo : null;
  if (e.hi === null) return lo === null ? 'at any potential' : `anywhere above ${volts(lo)}`;
  return lo === null ? `anywhere up to ${volts(e.hi)}` : `anywhere from ${volts(lo)} to ${volts(e.hi)}`;
}

/** True when heaters at `heldAt` volts keep every stage within its heater–cathode rating. */
export const keepsWithin = (e: Window, heldAt: number): boolean => (e.lo === null || heldAt >= e.lo) && (e.hi === null || heldAt <= e.hi);

/** The one-click remedy's words: back to ground where ground will do, else the suggestion in whole volts. */
export const remedyWords = (e: Window): string => (wholeVoltsSuggested(e) === 0 ? 'Return them to ground' : `Hold them at ${wholeVoltsSuggested(e)} V`);

/** The suggestion in whole volts, as a builder sets it, kept inside the window (a window under a volt wide keeps its edge). */
export function wholeVoltsSuggested(e: Window): number {
  const v = Math.round(e.suggested);
  return Math.min(e.hi ?? v, Math.max(e.lo ?? v, v));
}

/**
 * The heater-elevation advice in words, for the build sheet and the card
 * alike: with the heaters at ground, whether they may stay there; held at
 * `heldAt` volts, whether that keeps every stage within its rating.
 */
export function elevationAdvice(e: Window, heldAt = 0): string {
  if (heldAt === 0) {
    if (e.groundedOk) return 'Heater–cathode voltages are within every rating with the heaters at ground.';
    return `Elevate the heater supply to about ${volts(e.suggested)} DC (${windowWords(e)} keeps every stage within its heater–cathode rating).`;
  }
  if (keepsWithin(e, heldAt)) return `With the heaters held at ${volts(heldAt)}, every stage is within its heater–cathode rating (${windowWords(e)} would do).`;
  const back = e.groundedOk ? ', or return them to ground' : ` (about ${volts(e.suggested)})`;
  return `Held at ${volts(heldAt)}, the heaters leave a stage past its heater–cathode rating: hold them ${windowWords(e)}${back}.`;
}

/** The elevation divider in words (its parts, where it hangs and what the heaters then sit at), or why it cannot be built. */
export function dividerWords(e: NonNullable<BuildSheet['elevationDivider']>): string {
  if (!e.divider.ok) return e.divider.message;
  const [upper, lower] = e.divider.resistors;
  const c = e.divider.capacitor;
  return `Divider from stage ${e.stage + 1}'s B+ (${volts(e.fromVolts)}): Rh1 ${ohms(upper!.preferred)} (${upper!.ratingWatts} W) to Rh2 ${ohms(lower!.preferred)} (${lower!.ratingWatts} W) to ground, Ch ${farads(c.value ?? 0)} ${c.ratingVolts} V across Rh2; the heater winding's centre tap (or one side) to their junction. The heaters sit at ${volts(e.divider.volts)}; the divider draws ${smallAmps(e.divider.amps)} from that node (a load on the supply there when the amplifier is solved on it).`;
}
