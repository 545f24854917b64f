import { fail, type Result } from '../result';
import { nearestPreferred } from '../parts/nearestPreferred';
import { SERIES, SERIES_TOLERANCE, type PreferredSeries } from '../parts/preferredValues';
import type { CheckedStage } from '../stage/stageDesign';
import type { StageSolution } from '../stage/solveStage';
import { CAPACITOR_VOLTS, RATING_MARGIN, RESISTOR_WATTS, roundUpTo } from './ratings';
import { shown } from '../shown';

/** Production spread of a tube's current around the model: ±20 % (common practice). */
export const TUBE_CURRENT_SPREAD = 0.2;

export interface ResistorLine {
  readonly ref: string;
  readonly role: string;
  /** The design's value and the preferred value to order, Ω. */
  readonly value: number;
  readonly preferred: number;
  readonly series: PreferredSeries;
  /** Dissipation at the operating point and in the worst case (tube current +20 %, resistor at −tolerance), W. */
  readonly watts: number;
  readonly wattsWorst: number;
  /** Suggested power rating: the next standard rating at or above twice the worst case (common practice). */
  readonly ratingWatts: number;
  /** A potentiometer (a volume control): ordered at its value as given, not from the series. */
  readonly potentiometer?: boolean;
}

export interface CapacitorLine {
  readonly ref: string;
  readonly role: string;
  readonly value: number | null;
  /** DC voltage across it in operation, and at switch-on (a cold tube draws no current: the plate sits at B+). */
  readonly volts: number;
  readonly voltsAtSwitchOn: number;
  /** Suggested voltage rating: the next standard rating at or above twice the larger (common practice). */
  readonly ratingVolts: number;
  /** Electrolytic polarity, where an electrolytic is the usual choice (large values). */
  readonly polarity: string | null;
}

/** Above this a capacitor is usually an electrolytic and has a polarity (common practice). */
const ELECTROLYTIC_FROM = 1e-6;
/** Film capacitors for coupling are rarely fitted below 63 V, and the source may carry DC (common practice). */
export const FILM_MIN_VOLTS = 63;

/** One resistor's line: preferred value, dissipation at the operating point and worst case, rating. */
export function resistorLine(ref: string, role: string, value: number, amps: number, series: PreferredSeries): ResistorLine {
  const preferred = nearestPreferred(value, series);
  const watts = amps * amps * preferred;
  // Worst case: the current up by the tube spread (I²R grows as its square), the resistor at the low end of its tolerance.
  const wattsWorst = Math.pow(amps * (1 + TUBE_CURRENT_SPREAD), 2) * preferred * (1 - SERIES_TOLERANCE[series]);
  return { ref, role, value, preferred, series, watts, wattsWorst, ratingWatts: roundUpTo(RESISTOR_WATTS, RATING_MARGIN * Math.max(watts, wattsWorst)) };
}

/**
 * A volume control in a grid leak's place: a potentiometer of the track's
 * value, ordered as given (pots come in their own few values), audio taper
 * (common practice for a volume control), carrying no DC.
 */
export function volumeLine(ref: string, role: string, track: number, series: PreferredSeries): ResistorLine {
  return { ...resistorLine(ref, role, track, 0, series), preferred: track, potentiometer: true };
}

/** One capacitor's line: voltages running and at switch-on, rating, polarity. */
export function capacitorLine(ref: string, role: string, value: number | null, volts: number, voltsAtSwitchOn: number, positive: string): CapacitorLine {
  const worst = Math.max(Math.abs(volts), Math.abs(voltsAtSwitchOn));
  const electrolytic = value !== null && value >= ELECTROLYTIC_FROM;
  return {
    ref,
    role,
    value,
    volts,
    voltsAtSwitchOn,
    ratingVolts: roundUpTo(CAPACITOR_VOLTS, Math.max(RATING_MARGIN * worst, electrolytic ? 0 : FILM_MIN_VOLTS)),
    polarity: electrolytic ? positive : null,
  };
}

/**
 * The parts of a common-cathode stage to order, from its checked design and
 * solution: each resistor with its preferred value, dissipation and rating;
 * each capacitor with the voltage it sees running and at switch-on, its
 * rating and polarity.
 */
export function stagePartsList(d: CheckedStage, s: StageSolution, series: PreferredSeries, prefix = ''): { resistors: ResistorLine[]; capacitors: CapacitorLine[] } {
  const { op } = s;
  const resistors = [resistorLine(`${prefix}Ra`, 'plate load', d.ra, op.ia, series)];
  if (d.rk > 0) resistors.push(resistorLine(`${prefix}Rk`, 'cathode bias', d.rk, op.ia, series));
  if (d.rg !== null) resistors.push(d.volumeGiven ? volumeLine(`${prefix}VR`, 'volume control, audio taper, in the grid leak\'s place: wiper to the grid', d.rg, series) : resistorLine(`${prefix}Rg`, 'grid leak', d.rg, 0, series));
  const capacitors: CapacitorLine[] = [];
  if (d.cin !== null) capacitors.push(capacitorLine(`${prefix}Cin`, 'input coupling', d.cin, 0, 0, 'either way (no DC across it)'));
  if (d.bypassed && d.rk > 0) capacitors.push(capacitorLine(`${prefix}Ck`, 'cathode bypass', d.ck, op.vk, 0, '+ to the cathode'));
  if (d.cout !== null || Number.isFinite(d.rl)) capacitors.push(capacitorLine(`${prefix}Cout`, 'output coupling', d.cout, op.va, d.bplus, '+ to the plate'));
  return { resistors, capacitors };
}

/** The preferred values of a series over several decades, ascending (for "next value up"). */
function preferredAtOrAbove(value: number, series: PreferredSeries): number {
  const decade = Math.floor(Math.log10(value));
  for (const d of [decade, decade + 1]) {
    for (const m of SERIES[series]) {
      const v = Number((m * Math.pow(10, d)).toPrecision(3));
      if (v >= value * (1 - 1e-9)) return v;
    }
  }
  return value;
}

export interface CapacitorForCorner {
  /** The exact value for the corner, F, and the next preferred value up (so the corner lands at or below the one asked). */
  readonly exact: number;
  readonly preferred: number;
  /** The corner the preferred value gives, Hz. */
  readonly cornerHz: number;
  /** The resistance the capacitor works against, Ω. */
  readonly resistance: number;
}

/**
 * Capacitor values from a wanted low-frequency corner f, each by the
 * first-order formula C = 1/(2π·f·R) (P. Horowitz, W. Hill, The Art of
 * Electronics, 3rd ed., §1.7), with R what the capacitor works against:
 *   input coupling:  Rs + Rg
 *   output coupling: Zout + RL
 *   cathode bypass:  Rk ∥ (rp + Ra∥RL)/(mu + 1), the resistance looking into
 *                    the cathode node (F. Langford-Smith, RDH4, ch. 12).
 */
export function capacitorsForCorner(d: CheckedStage, s: StageSolution, cornerHz: number, series: PreferredSeries = 'E12'): Result<{ cin: CapacitorForCorner | null; cout: CapacitorForCorner | null; ck: CapacitorForCorner | null }> {
  if (!(cornerHz >= 0.01 && cornerHz <= 1e6)) return fail('invalid-input', `The corner frequency must be from 0.01 Hz to 1 MHz (got ${shown(cornerHz)} Hz)`, 'cornerHz');
  if (typeof series !== 'string' || !Object.hasOwn(SERIES, series)) return fail('invalid-input', 'Choose the E12, E24 or E96 series', 'series');
  if (typeof s !== 'object' || s === null || typeof d !== 'object' || d === null || !(s.rp > 0) || !(s.zout > 0)) return fail('invalid-input', 'Give a checked stage and its solution', 'stage');
  const pick = (resistance: number) => capacitorForCorner(resistance, cornerHz, series);
  return {
    ok: true,
    cin: d.rg !== null ? pick(d.rsource + d.rg) : null,
    cout: Number.isFinite(d.rl) ? pick(s.zout + d.rl) : null,
    // An unbypassed stage has no bypass capacitor to size.
    ck: d.bypassed && d.rk > 0 ? pick(bypassResistance(d.rk, s.mu, s.rp, Number.isFinite(d.rl) ? (d.ra * d.rl) / (d.ra + d.rl) : d.ra)) : null,
  };
}

/** The capacitor for a first-order corner against a resistance: C = 1/(2π·f·R), then the next preferred value up. */
export function capacitorForCorner(resistance: number, cornerHz: number, series: PreferredSeries): CapacitorForCorner {
  const exact = 1 / (2 * Math.PI * cornerHz * resistance);
  const preferred = preferredAtOrAbove(exact, series);
  return { exact, preferred, cornerHz: 1 / (2 * Math.PI * preferred * resistance), resistance };
}

/** What a cathode bypass capacitor works against: Rk ∥ (rp + R_load)/(μ + 1) (Langford-Smith, RDH4, ch. 12). */
export function bypassResistance(rk: number, mu: number, rp: number, rLoad: number): number {
  const intoCathode = (rp + rLoad) / (mu + 1);
  return (rk * intoCathode) / (rk + intoCathode);
}
