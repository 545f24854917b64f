import { fail, type Result } from '../result';
import { decibelsOf } from '../signal/levels';
import { nearestPreferred } from '../parts/nearestPreferred';
import type { PreferredSeries } from '../parts/preferredValues';
import type { HeaterOption } from '../tube/types';
import { RATING_MARGIN, RESISTOR_WATTS, roundUpTo } from './ratings';
import { shown } from '../shown';

/** Heater voltage within ±10 % of nominal (common practice, no source). */
export const HEATER_TOLERANCE = 0.1;

export interface HeaterPlan {
  readonly totalAmps: number;
  readonly totalWatts: number;
  /** The heaters' common voltage, V (all chosen options must share it to be wired in parallel). */
  readonly volts: number;
}

export function heaterTotals(heaters: readonly HeaterOption[]): Result<HeaterPlan> {
  if (!Array.isArray(heaters) || heaters.length === 0) return fail('invalid-input', 'No heaters to supply');
  const usable = (v: unknown, min: number) => typeof v === 'number' && Number.isFinite(v) && v >= min && v <= 1000;
  const bad = heaters.findIndex((h) => typeof h !== 'object' || h === null || !usable(h.volts, 0.5) || !usable(h.amps, 0));
  if (bad >= 0) return fail('invalid-input', `Heater ${bad + 1} must give volts (0.5 to 1000 V) and amps (0 to 1000 A)`);
  const volts = heaters[0]!.volts;
  if (heaters.some((h) => Math.abs(h.volts - volts) > 1e-9)) return fail('invalid-input', 'The chosen heater wirings have different voltages: choose the same voltage for every tube to wire them in parallel');
  const totalAmps = heaters.reduce((a, h) => a + h.amps, 0);
  return { ok: true, totalAmps, totalWatts: totalAmps * volts, volts };
}

export interface DroppingResistor {
  /** Exact value, the preferred value, Ω. */
  readonly exact: number;
  readonly preferred: number;
  /** Heater voltage with the preferred value, V, taking the heaters as a resistance Vh/Ih. */
  readonly heaterVolts: number;
  readonly watts: number;
  readonly ratingWatts: number;
  /** Set when the heater voltage falls outside ±10 % of nominal. */
  readonly warning: string | null;
}

/**
 * The series resistor that drops a DC supply to the heaters' voltage, by
 * Ohm's law, R = (Vs − Vh)/Ih, and Joule's law for its dissipation, P = I²R.
 */
export function droppingResistor(plan: HeaterPlan, supplyVolts: number, series: PreferredSeries = 'E24'): Result<DroppingResistor> {
  const checked = typeof plan === 'object' && plan !== null ? heaterTotals([{ wiring: 'single', volts: plan.volts, amps: plan.totalAmps }]) : null;
  if (!checked?.ok) return fail('invalid-input', 'Give the heaters\' plan (from heaterTotals)', 'heaters');
  if (!(plan.totalAmps >= 1e-6)) return fail('invalid-input', 'The heaters draw no current', 'supply');
  if (!(typeof supplyVolts === 'number' && supplyVolts > 0 && supplyVolts <= 1000)) return fail('invalid-input', `Heater supply must be above 0 V and at most 1000 V (got ${shown(supplyVolts)} V)`, 'supply');
  if (supplyVolts < plan.volts) return fail('supply-too-low', `A ${supplyVolts} V supply is below the ${plan.volts} V the heaters need: no resistor can raise it`, 'supply');
  if (!(plan.totalAmps > 0)) return fail('invalid-input', 'The heaters draw no current', 'supply');
  const exact = (supplyVolts - plan.volts) / plan.totalAmps;
  if (exact === 0) return { ok: true, exact: 0, preferred: 0, heaterVolts: plan.volts, watts: 0, ratingWatts: 0, warning: null };
  const preferred = nearestPreferred(exact, series);
  const rHeaters = plan.volts / plan.totalAmps;
  const amps = supplyVolts / (rHeaters + preferred);
  const heaterVolts = amps * rHeaters;
  const watts = amps * amps * preferred;
  const off = heaterVolts / plan.volts - 1;
  return {
    ok: true,
    exact,
    preferred,
    heaterVolts,
    watts,
    ratingWatts: roundUpTo(RESISTOR_WATTS, RATING_MARGIN * watts),
    warning: Math.abs(off) > HEATER_TOLERANCE ? `The heaters would run at ${heaterVolts.toFixed(2)} V, ${Math.round(off * 100)} % off ${plan.volts} V (outside ±10 %)` : null,
  };
}

/**
 * The heater elevation that keeps every stage's heater–cathode voltage within
 * its rating: the intersection of [Vk − max₊, Vk + max₋] over the stages,
 * where max₊ is the rating with the cathode positive to the heater and max₋
 * the one with it negative (the same figure where the sheet gives one).
 * Returns the allowed window and a suggestion (0 V when grounding is fine,
 * else the point of the window nearest 0 V moved 10 % into it), or a message
 * when no single heater potential serves every stage.
 */
export function heaterElevation(stages: readonly { name: string; vk: number; maxVhk: number | null; maxVhkCathodeNegative?: number }[]): Result<{ lo: number | null; hi: number | null; suggested: number; groundedOk: boolean }> {
  if (!Array.isArray(stages)) return fail('invalid-input', 'Give the stages as a list of { name, vk, maxVhk }', 'stages');
  const finite = (v: unknown) => typeof v === 'number' && Number.isFinite(v);
  const bad = stages.findIndex((s) => typeof s !== 'object' || s === null || !finite(s.vk) || !(s.maxVhk === null || (finite(s.maxVhk) && s.maxVhk >= 0)) || !(s.maxVhkCathodeNegative === undefined || (finite(s.maxVhkCathodeNegative) && s.maxVhkCathodeNegative >= 0)));
  if (bad >= 0) return fail('invalid-input', `Stage ${bad + 1} must give its cathode voltage and heater–cathode ratings as numbers`, 'stages');
  let lo = -Infinity;
  let hi = Infinity;
  for (const s of stages) {
    if (s.maxVhk === null) continue;
    lo = Math.max(lo, s.vk - s.maxVhk);
    hi = Math.min(hi, s.vk + (s.maxVhkCathodeNegative ?? s.maxVhk));
  }
  if (lo > hi) return fail('unreachable', 'No single heater potential keeps every stage within its heater–cathode rating: give the follower its own heater winding');
  const groundedOk = lo <= 0 && 0 <= hi;
  const nearest = Math.min(Math.max(0, lo), hi);
  const width = Number.isFinite(hi - lo) ? hi - lo : 0;
  const suggested = groundedOk ? 0 : nearest + (nearest === lo ? 0.1 : -0.1) * width;
  // No bound on a side (no indirectly heated stage limits it) is null, never ±Infinity.
  return { ok: true, lo: Number.isFinite(lo) ? lo : null, hi: Number.isFinite(hi) ? hi : null, suggested, groundedOk };
}

export interface DecouplingResult {
  /** The stage's B+ after the filter's drop, V, and the drop, V. */
  readonly stageBplus: number;
  readonly dropVolts: number;
  readonly amps: number;
  /** Ripple attenuation of the first-order RC low-pass at 100 Hz and 120 Hz (mains ×2), dB (negative). */
  readonly ripple100Db: number;
  readonly ripple120Db: number;
  readonly resistorWatts: number;
}

/**
 * An RC decoupling filter between the supply rail and the stage: the drop
 * I·R (Ohm's law), where the current itself depends on the stage's B+, so
 * B+ = rail − R·I(B+) is solved by bisection (the right side falls as B+
 * rises); and the ripple attenuation |1/(1 + jωRC)| of a first-order RC
 * low-pass (Horowitz & Hill, The Art of Electronics, 3rd ed., §1.7).
 */
export function decouplingFilter(railVolts: number, r: number, c: number, currentAt: (bplus: number) => number | null): Result<DecouplingResult> {
  if (!(railVolts > 0) || !(railVolts <= 10_000)) return fail('invalid-input', `The supply rail must be above 0 V and at most 10 kV (got ${shown(railVolts)} V)`, 'rail');
  if (!(r >= 0) || !(r <= 1e9)) return fail('invalid-input', `The filter resistor must be from 0 Ω to 1 GΩ (got ${shown(r)} Ω)`, 'filterR');
  if (!(c >= 1e-12) || !(c <= 10)) return fail('invalid-input', `The filter capacitor must be from 1 pF to 10 F (got ${shown(c)} F)`, 'filterC');
  if (typeof currentAt !== 'function') return fail('invalid-input', 'Give the stage\'s current as a function of its B+', 'current');
  const drawn = (b: number) => {
    const i = currentAt(b);
    return typeof i === 'number' && Number.isFinite(i) && i >= 0 ? i : 0;
  };
  let lo = 0;
  let hi = railVolts;
  for (let k = 0; k < 80; k++) {
    const mid = 0.5 * (lo + hi);
    const i = drawn(mid);
    if (mid < railVolts - r * i) lo = mid;
    else hi = mid;
  }
  const stageBplus = 0.5 * (lo + hi);
  const amps = drawn(stageBplus);
  // |1/(1 + jωRC)| in dB; an absurd RC reads the floor, never −Infinity.
  const att = (f: number) => decibelsOf(1 / Math.hypot(1, 2 * Math.PI * f * r * c));
  return { ok: true, stageBplus, dropVolts: railVolts - stageBplus, amps, ripple100Db: att(100), ripple120Db: att(120), resistorWatts: amps * amps * r };
}
