import { fail, type Failure, type Result } from '../result';
import { E12 } from '../parts/preferredValues';
import type { SupplyDesign } from './supplyTypes';
import { openCircuitWinding } from './winding';

/** A DC voltage taken as safe to touch: 60 V, the limit of extra-low voltage for DC (IEC 61140, from memory). */
export const SAFE_DC_VOLTS = 60;
/** How soon after switch-off the capacitors should be under it: 30 s (common practice). */
export const BLEED_SECONDS = 30;

/** A bleeder, or none needed (the supply never reaches the safe voltage). */
export type Bleeder = { readonly needed: false } | NeededBleeder;

const MAX_BLEEDER_OHMS = 10e6;

/**
 * A bleeder across a reservoir the supply solve takes: from 1 Ω (bleederFor
 * sizes none smaller) to MAX_BLEEDER_OHMS (none larger), so whatever the
 * design asks is taken; the first problem, or null.
 */
export function bleederOhmsProblem(ohms: unknown): Failure | null {
  return typeof ohms === 'number' && ohms >= 1 && ohms <= MAX_BLEEDER_OHMS ? null : fail('invalid-input', 'A bleeder across the reservoir must be from 1 Ω to 10 MΩ', 'bleederOhms');
}
/** Resistor power ratings commonly stocked, W. */
const POWER_RATINGS = [0.25, 0.5, 1, 2, 3, 5, 7, 10, 15, 25, 50];

export interface NeededBleeder {
  readonly needed: true;
  /** The largest E12 resistor that discharges the capacitors in time, Ω. */
  readonly ohms: number;
  /** What it dissipates at the highest voltage it sees (the no-load peak), W; common practice: a part rated at twice this. */
  readonly watts: number;
  /** The power rating to buy: the first common rating at least twice `watts` (common practice), W. */
  readonly partWatts: number;
  /** The current it adds to the supply's load at the running voltage, A. */
  readonly amps: number;
  /** How long it takes to bring the capacitors from the no-load peak to the safe voltage, s. */
  readonly seconds: number;
}

/**
 * A bleeder resistor across the reservoir that brings every filter
 * capacitor under `safeVolts` within `seconds` of switch-off: the charge
 * decays as e^(−t/RC), so R = t / (C·ln(V0/Vsafe)) with C every capacitor
 * together (the section resistors are taken as small beside the bleeder,
 * which holds for kilohms against hundreds of kilohms) and V0 the no-load
 * peak (the tubes cold or pulled). Rounded down to E12 so it is never slower.
 */
export function bleederFor(capacitance: number, peakVolts: number, runningVolts: number, seconds = BLEED_SECONDS, safeVolts = SAFE_DC_VOLTS): Result<Bleeder> {
  if (!(capacitance >= 1e-12 && capacitance < 10) || !(peakVolts > 0 && peakVolts < 1e5) || !(runningVolts >= 0 && runningVolts <= peakVolts) || !(seconds >= 0.1 && seconds <= 3600) || !(safeVolts >= 1)) {
    return fail('invalid-input', 'A bleeder needs the capacitance, the peak voltage, a discharge time from 0.1 s to an hour and a safe voltage of at least 1 V');
  }
  if (peakVolts <= safeVolts) return { ok: true, needed: false };
  // Common practice: no bleeder above 10 MΩ (it would hardly beat the capacitors' own leakage); a supply barely over the safe voltage gets that.
  const exact = Math.min(seconds / (capacitance * Math.log(peakVolts / safeVolts)), MAX_BLEEDER_OHMS);
  if (!(exact >= 1)) return fail('invalid-input', 'That discharge would need a bleeder under 1 Ω: check the capacitance and the time');
  const decade = 10 ** Math.floor(Math.log10(exact));
  const mantissa = exact / decade;
  const below = [...E12].reverse().find((m) => m <= mantissa * (1 + 1e-9)) ?? E12[0]!;
  const ohms = below * decade;
  const watts = (peakVolts * peakVolts) / ohms;
  const partWatts = POWER_RATINGS.find((w) => w >= 2 * watts) ?? 2 * watts;
  return { ok: true, needed: true, ohms, watts, partWatts, amps: runningVolts / ohms, seconds: ohms * capacitance * Math.log(peakVolts / safeVolts) };
}

/**
 * The bleeder a supply's capacitors need (bleederFor), from its design alone:
 * every filter capacitor together, charged to the winding's open-circuit
 * peak (the tubes cold or pulled: what the supply solve calls its no-load
 * voltage). Known before the supply is solved, so the solve can carry its
 * current; `runningVolts` (the reservoir's, once solved; the peak before)
 * sets the current reported.
 */
export function bleederForSupply(d: SupplyDesign, runningVolts?: number): Result<Bleeder> {
  const caps = typeof d === 'object' && d !== null && typeof d.input === 'object' && d.input !== null && Array.isArray(d.sections) ? [d.input.c, ...d.sections.map((s) => s?.c)] : [];
  if (caps.length === 0 || !caps.every((c) => typeof c === 'number' && Number.isFinite(c) && c > 0)) return fail('invalid-input', 'A bleeder needs every filter capacitor of the supply');
  const peak = Math.SQRT2 * openCircuitWinding(d).emfRms;
  const total = (caps as number[]).reduce((a, c) => a + c, 0);
  return bleederFor(total, peak, runningVolts === undefined || !(runningVolts >= 0) ? peak : Math.min(runningVolts, peak));
}
