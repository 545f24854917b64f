import { E12 } from '../parts/preferredValues';

/**
 * One tube's bias adjustment, fed from the negative rail: a resistor from
 * the rail to the potentiometer's top, the potentiometer, a resistor from
 * its bottom to ground; the wiper feeds the grid leak. Magnitudes here (the
 * rail and every wiper voltage are negative), SI units.
 */
export interface BiasString {
  /** Rail end resistor, pot track, ground end resistor, Ω. */
  readonly top: number;
  readonly pot: number;
  readonly bottom: number;
  /** The string's current at the rail's voltage, A. */
  readonly amps: number;
  /** The wiper's reach: its ground end (least negative, the hot end) and its rail end (the cold end), V below ground. */
  readonly least: number;
  readonly most: number;
}

/** What a string must reach, V below ground: the weakest tube's setting and the strongest's (from biasAdjustment). */
export interface BiasReach {
  readonly weakest: number;
  readonly strongest: number;
}

/** The current a string is designed to, A (our choice: its wiper then has tens of kilohms behind it, small beside a grid leak of hundreds). */
export const STRING_AMPS = 1e-3;
/**
 * The hot end sits at most this far below the weakest tube's setting (our
 * threshold): turned all the way the wrong way, the pot cannot take a tube
 * much hotter than the weakest needs.
 */
export const HOT_END_SLACK = 0.15;
/** The cold end reaches this far past the strongest tube's setting (our margin, for the mains running low). */
export const COLD_END_MARGIN = 0.1;

/** Linear trimmer tracks, 1-2-5 from 1 kΩ to 100 kΩ (the usual trimmer values, from memory). */
export const POT_VALUES: readonly number[] = [1e3, 2e3, 5e3, 10e3, 20e3, 50e3, 100e3];

/** E12 resistors from 100 Ω to 820 kΩ. */
const RESISTORS: readonly number[] = [2, 3, 4, 5].flatMap((d) => E12.map((m) => Number((m * 10 ** d).toPrecision(3))));

/**
 * The string for one tube on a rail of `rail` volts: E12 end resistors and a
 * trimmer whose hot end lies between the weakest tube's setting and
 * HOT_END_SLACK below it (as near it as the values allow: a pot turned the
 * wrong way then overheats no tube more than it must), whose cold end
 * reaches COLD_END_MARGIN past the strongest tube's and not far beyond (the
 * narrower the span, the finer the setting), at a current from half to
 * twice `aim` (STRING_AMPS unless a rail too weak for it asks less),
 * nearest it among equals. With a `guard` (a share),
 * both ends keep that much inside what they must reach. Null when the rail
 * cannot reach that far (or the reach is not a range of negative settings).
 */
export function designString(rail: number, reach: BiasReach, guard = 0, aim = STRING_AMPS): BiasString | null {
  // A guard narrows what the string may do at this rail, so it still reaches when the rail moves by that share.
  const lo = reach.weakest * (1 - guard);
  const hi = reach.strongest * (1 + COLD_END_MARGIN) * (1 + guard);
  if (!(rail > 0 && lo > 0 && hi >= lo && hi < rail) || !Number.isFinite(rail + hi)) return null;
  let best: BiasString | null = null;
  let bestScore = Infinity;
  for (const pot of POT_VALUES) {
    for (const bottom of RESISTORS) {
      for (const top of RESISTORS) {
        const { least, most, amps } = reachOn({ top, pot, bottom }, rail);
        if (!inReach(least, most, lo, hi) || amps < aim / 2 || amps > aim * 2) continue;
        // The hot end as near the weakest tube's setting as the values allow; then the cold end not far past its margin
        // (a trimmer that spans little more than the tubes need sets finely); then the current near its aim.
        const score = (lo - least) / lo + 0.3 * ((most - hi) / hi) + 0.1 * Math.abs(Math.log(amps / aim));
        if (score < bestScore) {
          bestScore = score;
          best = { top, pot, bottom, amps, least, most };
        }
      }
    }
  }
  return best;
}

/** Whether a string's ends meet what it must reach: the hot end at or just below the weakest setting, the cold end past `hi`. */
const inReach = (least: number, most: number, lo: number, hi: number) => least <= lo && least >= lo * (1 - HOT_END_SLACK) && most >= hi;

/** A string's current and its wiper's two ends on a rail of `rail` volts (Ohm's law along the string). */
export function reachOn(s: Pick<BiasString, 'top' | 'pot' | 'bottom'>, rail: number): { readonly amps: number; readonly least: number; readonly most: number } {
  const total = s.top + s.pot + s.bottom;
  return { amps: rail / total, least: (rail * s.bottom) / total, most: (rail * (s.bottom + s.pot)) / total };
}

/** Whether a string chosen on one rail still reaches what it must on a rail of `rail` volts. */
export function stillReaches(s: Pick<BiasString, 'top' | 'pot' | 'bottom'>, rail: number, reach: BiasReach): boolean {
  const { least, most } = reachOn(s, rail);
  return inReach(least, most, reach.weakest, reach.strongest * (1 + COLD_END_MARGIN));
}

/** The string's wiper set to `volts` below ground: where its track divides (0 the ground end, 1 the rail end), and the resistance the grid leak sees behind it, Ω. */
export function wiperAt(s: BiasString, rail: number, volts: number): { readonly travel: number; readonly sourceOhms: number } {
  const total = s.top + s.pot + s.bottom;
  const below = Math.min(Math.max((volts / rail) * total - s.bottom, 0), s.pot);
  const lower = s.bottom + below;
  return { travel: below / s.pot, sourceOhms: (lower * (total - lower)) / total };
}
