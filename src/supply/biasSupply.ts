import { fail, type Result } from '../result';
import { checkNumber } from '../stage/checkInput';
import { shown } from '../shown';
import { designString, reachOn, stillReaches, wiperAt, COLD_END_MARGIN, STRING_AMPS, type BiasReach, type BiasString } from './biasString';
import { solveSupply } from './solveSupply';
import type { SupplyDesign } from './supplyTypes';

/**
 * A fixed-bias output stage's grid supply: a winding (or a bias tap) into
 * one diode turned the negative way, a reservoir capacitor, one R–C section
 * to the rail, and from the rail one adjustment string per tube. SI units;
 * the volts are magnitudes below ground.
 */
export interface BiasSupplyDesign {
  readonly mainsHz: number;
  /** The winding's open-circuit rms voltage, V. */
  readonly secondaryRms: number;
  readonly windingOhms: number;
  /** Reservoir capacitor, F. */
  readonly reservoir: number;
  /** The section's resistor, Ω, and capacitor (the rail), F. */
  readonly r: number;
  readonly c: number;
}

/** One tube's setting and its string. */
export interface BiasTap {
  readonly string: BiasString;
  /** The law's own tube's setting, V below ground; where the wiper sits for it (0 the ground end, 1 the rail end). */
  readonly nominal: number;
  readonly travel: number;
  /** The resistance behind the wiper there, Ω: it adds to the grid leak. */
  readonly sourceOhms: number;
  /** The rail's ripple at the grid there (the wiper takes the rail's share), V rms. */
  readonly gridRippleRms: number;
}

export interface BiasSupplySolution {
  /** The rail and the reservoir, V below ground, and their ripple, V rms. */
  readonly rail: number;
  readonly railRippleRms: number;
  /** The rail's ripple peak to peak, V. */
  readonly railRipplePp: number;
  readonly reservoir: number;
  readonly reservoirRippleRms: number;
  /** Each capacitor's ripple current (rms), A: the reservoir's and the rail's. */
  readonly reservoirRippleAmps: number;
  readonly railRippleAmps: number;
  /** Every string's current together: what the rail carries, A. */
  readonly load: number;
  /** With nothing drawn: what both capacitors see, V below ground (the rail at switch-on is the same, the strings draw at once). */
  readonly noLoadVolts: number;
  /** The diode's current, peak and rms, A; its reverse voltage, the winding's peak plus the reservoir's, at no load, V. */
  readonly diodePeak: number;
  readonly diodeRms: number;
  readonly piv: number;
  /** The winding's volt-amperes: its rms voltage times the diode's rms current, which it carries, VA. */
  readonly windingVa: number;
  readonly taps: readonly BiasTap[];
}

/** Solves of the rail for one choice of strings (the secant settles in two or three), and choices of strings. */
const MAX_ROUNDS = 8;
const MAX_CHOICES = 6;
/** The lightest strings aimed at, A: a quarter of STRING_AMPS (a wiper with a few hundred kilohms behind it would add to the grid circuit's resistance). */
const LIGHTEST_AIM = STRING_AMPS / 4;
/** How far inside what they must reach the strings are chosen (a share): the rail moves less than this as their current settles. */
const CHOICE_GUARD = 0.01;
/** Strings one rail may carry: a pair's two for each of 8 channels. */
export const MAX_STRINGS = 16;
/** Agreement asked between the current the rail was solved at and what the strings draw there (a fraction of it). */
const LOAD_TOL = 1e-3;

/** The design checked field by field: the first that cannot be used, or null. */
export function checkBiasSupply(d: unknown): ReturnType<typeof checkNumber> {
  if (typeof d !== 'object' || d === null) return fail('invalid-input', 'No bias supply given');
  const b = d as BiasSupplyDesign;
  return (
    checkNumber('mainsHz', 'Mains frequency', b.mainsHz, 'Hz', 40, 70) ??
    checkNumber('secondaryRms', 'Bias winding voltage', b.secondaryRms, 'V', 5, 500) ??
    // The B+ solver's own limit: the rail is solved by it.
    checkNumber('windingOhms', 'Bias winding resistance', b.windingOhms, 'Ω', 0, 10_000) ??
    checkNumber('reservoir', 'Bias reservoir capacitor', b.reservoir, 'F', 1e-7, 0.1) ??
    checkNumber('r', 'Bias filter resistor', b.r, 'Ω', 1, 1e6) ??
    checkNumber('c', 'Bias filter capacitor', b.c, 'F', 1e-7, 0.1) ??
    // A section's R·C past 30 s is a slip (as checkSupply holds for the B+).
    (b.r * b.c > 30 ? fail('invalid-input', `The bias filter's R·C of ${shown(b.r * b.c)} s would take minutes to settle: lower the resistor or the capacitor`, 'r') : null)
  );
}

/** The rail and reservoir as the B+ solver sees them: half-wave silicon, the strings' current drawn at the rail. */
function railOf(d: BiasSupplyDesign, load: number): SupplyDesign {
  return {
    mainsHz: d.mainsHz,
    secondaryRms: d.secondaryRms,
    windingOhms: d.windingOhms,
    rectifier: { kind: 'silicon-half-wave' },
    input: { kind: 'capacitor', c: d.reservoir },
    sections: [{ kind: 'rc', r: d.r, c: d.c }],
    loads: [0, load],
  };
}

/**
 * The bias supply solved with its strings: the rail by the B+ supply's own
 * solver (a negative rail is the positive one mirrored, the diode turned
 * round), each tube's string chosen on it (designString) and the rail solved
 * again under the strings' current until the two agree and every string
 * still reaches (else chosen again on the settled rail, lighter).
 * Each tap's ripple is the rail's times the wiper's share of it (the grid
 * leak carries no current, so the grid sits at the wiper). A rail that
 * cannot reach past the strongest tube's setting is a failure naming the
 * winding's voltage.
 */
export function solveBiasSupply(d: BiasSupplyDesign, reaches: readonly (BiasReach & { readonly nominal: number })[]): Result<BiasSupplySolution> {
  const problem = checkBiasSupply(d);
  if (problem) return problem;
  if (!Array.isArray(reaches) || reaches.length < 1 || reaches.length > MAX_STRINGS) return fail('invalid-input', `Give each fixed-bias tube's settings (1 to ${MAX_STRINGS} tubes)`, 'reaches');
  for (const r of reaches) {
    const ok = typeof r === 'object' && r !== null && [r.weakest, r.nominal, r.strongest].every((v) => typeof v === 'number' && Number.isFinite(v) && v > 0) && r.weakest <= r.nominal && r.nominal <= r.strongest;
    if (!ok) return fail('invalid-input', 'Each tube\'s settings must be volts below ground, the weakest tube\'s the least and the strongest\'s the most', 'reaches');
  }
  let load = reaches.length * STRING_AMPS;
  let rail = solveSupply(railOf(d, load));
  if (!rail.ok) return rail;
  // Choose the strings on the rail as it stands, then find the current they and the rail agree on; a string that no
  // longer reaches on the settled rail is chosen again there, a little lighter. Each is chosen with a guard, so the
  // rail's own small move under the strings' current leaves it reaching. `aim` is the strings' current aimed at: lighter
  // when the rail sags too far under heavier ones (several strings through a large filter resistor).
  let aim = STRING_AMPS;
  for (let attempt = 0; attempt < MAX_CHOICES; attempt++) {
    const v0 = rail.nodes[1]!.dc;
    // Tubes of one type share one reach: each distinct reach is searched once.
    const chosen = new Map<BiasReach, BiasString | null>();
    const choose = (r: BiasReach) => designString(v0, r, CHOICE_GUARD, aim) ?? designString(v0, r, 0, aim);
    const strings = reaches.map((r) => (chosen.has(r) ? chosen.get(r)! : chosen.set(r, choose(r)).get(r)!));
    const missing = strings.findIndex((s) => s === null);
    if (missing >= 0 && aim > LIGHTEST_AIM * 1.01) {
      aim = Math.max(aim / 2, LIGHTEST_AIM);
      load = reaches.length * aim;
      const lighter = solveSupply(railOf(d, load), { start: rail.nodes.map((n) => n.dc) });
      if (!lighter.ok) return lighter;
      rail = lighter;
      continue;
    }
    if (missing >= 0) {
      const need = reaches[missing]!.strongest * (1 + COLD_END_MARGIN);
      return fail('supply-too-low', `The bias rail gives −${v0.toFixed(1)} V; tube ${missing + 1}'s adjustment must reach −${need.toFixed(1)} V (the strongest tube's setting and ${Math.round(COLD_END_MARGIN * 100)} % past it). Raise the bias winding's voltage or lower the filter resistor`, 'secondaryRms');
    }
    // The strings are resistors: they draw the rail's voltage times their conductance.
    const conductance = strings.reduce((a, s) => a + 1 / (s!.top + s!.pot + s!.bottom), 0);
    let before: { readonly load: number; readonly v: number } | null = null;
    for (let round = 0; round < MAX_ROUNDS; round++) {
      const v = rail.nodes[1]!.dc;
      const drawn = conductance * v;
      if (Math.abs(drawn - load) <= LOAD_TOL * load) {
        if (strings.every((s, i) => stillReaches(s!, v, reaches[i]!))) return { ok: true, ...solution(rail, v, drawn, strings as BiasString[], reaches) };
        // Chosen again on the settled rail, a little lighter, so the rail sags less under them.
        aim = Math.max(aim / 1.5, LIGHTEST_AIM);
        break;
      }
      // The rail's slope under load (the secant of the last two solves) points straight at the current the strings and
      // the rail agree on: one more solve confirms it, where stepping by the strings' current alone takes several.
      const slope = before && before.load !== load ? (v - before.v) / (load - before.load) : NaN;
      const agreed = slope < 0 && Number.isFinite(slope) ? (conductance * (v - slope * load)) / (1 - slope * conductance) : drawn;
      before = { load, v };
      load = agreed > 0 && Number.isFinite(agreed) ? agreed : drawn;
      const next = solveSupply(railOf(d, load), { start: rail.nodes.map((n) => n.dc) });
      if (!next.ok) return next;
      rail = next;
    }
  }
  return fail('no-convergence', 'The bias rail and its strings did not settle: try a stiffer rail (a smaller filter resistor)', 'r');
}

function solution(rail: Extract<ReturnType<typeof solveSupply>, { ok: true }>, v: number, load: number, strings: readonly BiasString[], reaches: readonly { readonly nominal: number }[]): BiasSupplySolution {
  const railRipple = rail.nodes[1]!.rippleRms;
  const taps = strings.map((s0, i): BiasTap => {
    const s = { ...s0, ...reachOn(s0, v) };
    const nominal = reaches[i]!.nominal;
    const w = wiperAt(s, v, nominal);
    return { string: s, nominal, travel: w.travel, sourceOhms: w.sourceOhms, gridRippleRms: (railRipple * nominal) / v };
  });
  return {
    rail: v,
    railRippleRms: railRipple,
    railRipplePp: rail.nodes[1]!.ripplePp,
    reservoir: rail.nodes[0]!.dc,
    reservoirRippleRms: rail.nodes[0]!.rippleRms,
    reservoirRippleAmps: rail.nodes[0]!.capacitorRippleRms,
    railRippleAmps: rail.nodes[1]!.capacitorRippleRms,
    load,
    noLoadVolts: rail.noLoadVolts,
    diodePeak: rail.rectifierPeak,
    diodeRms: rail.rectifierRms,
    // Half-wave into a capacitor: reverse, the reservoir holds the peak while the winding swings the other way (the textbook relation).
    piv: 2 * rail.noLoadVolts,
    windingVa: rail.secondaryVa,
    taps,
  };
}
