import { finding, type Finding } from '../stage/ratingBands';
import { fail, type Result } from '../result';
import { checkSupply } from '../supply/checkSupply';
import { bleederOhmsProblem } from '../supply/bleeder';
import { cdetPolar } from '../signal/complex';
import { chainCorners, chainGainAt, fillChain, REFERENCE_HZ, scratchFor, type ChainNetwork, type SupplyLadder } from './chainResponse';
import { prepareAmplifier } from './prepareAmplifier';
import { networkOf } from './solveAmplifier';
import { placedOnSupply, type AmplifierOnSupply, type AmplifierOnSupplyResult } from './solveOnSupply';

/**
 * A rise this far above midband below the band is taken as the loop through
 * the supply near oscillation (our threshold: a second-order peak of 3 dB is
 * a Q of about 1.6, a loop that rings for cycles at a few hertz), and said.
 */
export const SUPPLY_PEAK_WARNING_DB = 3;

/**
 * The supply moving the low −3 dB point up by this factor or more, to this
 * frequency or above, is said (our threshold: an octave, and up to where the
 * audio band's bottom octave starts to lose level; below it the move is
 * inaudible).
 */
export const SUPPLY_CORNER_WARNING_RATIO = 2;
export const SUPPLY_CORNER_WARNING_HZ = 10;

/**
 * The gain margin the loop through the supply should keep: 10 dB (common
 * practice for a feedback loop, as the global loop's check asks). A loop that
 * oscillates with its gain raised this much is said to be thin. Its phase
 * margin is not read here.
 */
export const SUPPLY_GAIN_MARGIN_DB = 10;

/** The low end's sweep: from 0.1 Hz to 1 kHz at 20 points a decade, the peak then refined. */
const SWEEP_LO_HZ = 0.1;
const PER_DECADE = 20;

export interface SupplyLowEnd {
  /** The amplifier's low −3 dB point against 1 kHz with the supply's ladder in its network, Hz; null where it stays up to 0.01 Hz. */
  readonly lowHz: number | null;
  /** The same with every node at signal ground (an ideal supply), Hz: the amplifier's own. */
  readonly idealLowHz: number | null;
  /** The largest rise of the response above its gain at 1 kHz, below 1 kHz, dB (0 where it never rises), and where, Hz. */
  readonly peakDb: number;
  readonly peakHz: number | null;
  /** The reservoir's source resistance taken (the supply's regulation from no load to its load, as a resistance), Ω. */
  readonly sourceOhms: number;
  /** The loop through the supply: how many natural frequencies it puts in the right half plane (0: stable; more: it motorboats), or null where it could not be told. */
  readonly unstablePoles: number | null;
  /** True when the loop is stable but would oscillate with SUPPLY_GAIN_MARGIN_DB more gain around it; null where it could not be told. */
  readonly thinLoop: boolean | null;
  /** An output transformer taken as ideal down to DC (no primary inductance given): the low end then leaves out the primary's own roll-off. */
  readonly idealTransformer: boolean;
  readonly findings: readonly Finding[];
}

/** The ladder as the signal sees it, from the supply and the node feeding each stage. */
export function ladderOf(input: AmplifierOnSupply, r: AmplifierOnSupplyResult): SupplyLadder {
  const s = input.supply;
  const total = r.loads.reduce((a, x) => a + x, 0);
  const drop = r.supply.noLoadVolts - r.supply.nodes[0]!.dc;
  // A choke input puts its choke between the rectifier and the reservoir: in series with the source.
  const choke = s.input.kind === 'choke' ? { r: s.input.rdc, l: s.input.l } : null;
  const sourceOhms = total > 0 && drop > 0 ? drop / total : Infinity;
  return {
    sourceOhms,
    caps: [s.input.c, ...s.sections.map((x) => x.c)],
    links: s.sections.map((x) => (x.kind === 'rc' ? { r: x.r, l: 0 } : { r: x.rdc, l: x.l })),
    feeds: input.feeds,
    ...(input.screenFeeds ? { screens: input.screenFeeds } : {}),
    ...(choke ? { choke } : {}),
    ...(input.bleederOhms !== undefined ? { bleederOhms: input.bleederOhms } : {}),
  };
}

/**
 * The amplifier's low end as built on its supply: its linear network (open
 * loop) with each stage's plate load returned to the node feeding it and the
 * filter ladder behind them (SupplyLadder), so a stage's signal current
 * develops a voltage at its node that every stage on the ladder amplifies.
 * Gives the low −3 dB point against 1 kHz with and without the ladder, and
 * any rise above midband below it: the loop through the supply that, left
 * undamped, motorboats. The reservoir is fed through the supply's
 * regulation taken as a resistance (its drop from no load over the current
 * drawn: the chord of its load line, an approximation at a few hertz, where
 * the rectifier tops the reservoir up every half cycle). Checked against
 * ngspice's AC analysis of the same circuit (tests/spice/supplyLowEnd.spice.test.ts).
 */
export function supplyLowEnd(input: AmplifierOnSupply, r: AmplifierOnSupplyResult): Result<SupplyLowEnd> {
  if (!input || typeof input !== 'object' || !r || typeof r !== 'object') return fail('invalid-input', 'The amplifier on its supply is incomplete: solve it first', 'supply');
  const s = input.supply;
  const problem = s && typeof s === 'object' ? checkSupply(s) : fail('invalid-input', 'The amplifier on its supply is incomplete: solve it first', 'supply');
  if (problem) return problem;
  const stages = input.amplifier?.stages;
  const nodes = s.sections.length + 1;
  if (!Array.isArray(stages) || !Array.isArray(input.feeds) || input.feeds.length !== stages.length || !input.feeds.every((k) => Number.isInteger(k) && k >= 0 && k < nodes)) {
    return fail('invalid-input', 'Each stage needs the supply node feeding it', 'supply');
  }
  const finite = (xs: unknown, count: number) => Array.isArray(xs) && xs.length === count && xs.every((x) => typeof x === 'number' && Number.isFinite(x));
  const solved = r.supply;
  if (!solved || !Array.isArray(solved.nodes) || !finite(solved.nodes.map((n) => n?.dc), nodes) || !Number.isFinite(solved.noLoadVolts) || !finite(r.loads, nodes) || !finite(r.bplus, stages.length)) {
    return fail('invalid-input', 'The solved supply does not match the supply given: solve it again', 'supply');
  }
  const ladder = ladderOf(input, r);
  if (!ladder.caps.every((c) => Number.isFinite(c) && c > 0)) return fail('invalid-input', 'Every node needs its capacitor', 'supply');
  const bleederProblem = ladder.bleederOhms === undefined ? null : bleederOhmsProblem(ladder.bleederOhms);
  if (bleederProblem) return bleederProblem;
  const screens = Array.isArray(r.screenVolts) && r.screenVolts.length === stages.length ? r.screenVolts : stages.map(() => null);
  const placed = placedOnSupply(input.amplifier, r.bplus, screens);
  const prepared = prepareAmplifier(placed);
  if (!prepared.ok) return prepared;
  const ideal = networkOf(placed, prepared);
  const withSupply: ChainNetwork = { ...ideal, supply: ladder };
  const own = chainCorners(ideal);
  const built = chainCorners(withSupply);
  const peak = peakBelowBand(withSupply);
  if (!Number.isFinite(built.midbandGain) || built.midbandGain <= 0) return fail('unreachable', 'The amplifier passes no signal at 1 kHz on its supply', 'stages');
  const unstablePoles = supplyLoopUnstablePoles(withSupply);
  const raised = unstablePoles === 0 ? supplyLoopUnstablePoles(withSupply, Math.pow(10, SUPPLY_GAIN_MARGIN_DB / 20)) : null;
  const thinLoop = unstablePoles === 0 ? (raised === null ? null : raised > 0) : null;
  const idealTransformer = stages.some((st) => (st.kind === 'single-ended-output' || st.kind === 'push-pull-output') && !(st.primaryInductance! > 0));
  const idealWords = idealTransformer ? ' (Output transformer taken as ideal: give its primary inductance.)' : '';
  const findings: Finding[] = [];
  if (unstablePoles !== null && unstablePoles > 0) {
    findings.push(finding('supply-coupling', 'danger', `The loop through the supply oscillates (motorboating): the stages couple through the B+ nodes they share. Feed the early stages from later nodes of their own, with larger decoupling capacitors (common practice).${idealWords}`, unstablePoles, 0));
  } else if (thinLoop) {
    findings.push(finding('supply-coupling', 'warning', `The loop through the supply is stable but thin: with ${SUPPLY_GAIN_MARGIN_DB} dB more gain around it (a hotter tube, a higher mains) it would motorboat. Larger decoupling capacitors, or the early stages on later nodes of their own, give it room (common practice).${idealWords}`, SUPPLY_GAIN_MARGIN_DB, SUPPLY_GAIN_MARGIN_DB));
  } else if (peak.db >= SUPPLY_PEAK_WARNING_DB) {
    findings.push(finding('supply-coupling', 'warning', `The response rises ${peak.db.toFixed(1)} dB above midband at ${peak.hz.toPrecision(2)} Hz through the supply, a loop near motorboating: the stages couple through the B+ nodes they share. Larger decoupling capacitors, or the early stages on later nodes of their own, damp it (common practice).${idealWords}`, peak.db, SUPPLY_PEAK_WARNING_DB));
  } else if (built.lowHz !== null && own.lowHz !== null && built.lowHz >= SUPPLY_CORNER_WARNING_RATIO * own.lowHz && built.lowHz >= SUPPLY_CORNER_WARNING_HZ) {
    findings.push(finding('supply-coupling', 'warning', `The supply sets the low end: −3 dB at ${built.lowHz.toPrecision(2)} Hz on it, ${own.lowHz.toPrecision(2)} Hz on an ideal supply; the stages couple through the B+ nodes they share. Decouple the early stages on later nodes of their own, with larger capacitors (common practice).${idealWords}`, built.lowHz, own.lowHz));
  }
  return {
    ok: true,
    lowHz: built.lowHz,
    idealLowHz: own.lowHz,
    peakDb: peak.db,
    peakHz: peak.db > 0 ? peak.hz : null,
    sourceOhms: ladder.sourceOhms,
    unstablePoles,
    thinLoop,
    idealTransformer,
    findings,
  };
}

/** The response's largest rise above its 1 kHz gain below 1 kHz: sampled, then refined by golden-section search in log frequency. */
function peakBelowBand(net: ChainNetwork): { db: number; hz: number } {
  const scratch = scratchFor(net);
  const ref = chainGainAt(net, REFERENCE_HZ, scratch);
  const decades = Math.log10(REFERENCE_HZ / SWEEP_LO_HZ);
  const count = Math.round(decades * PER_DECADE) + 1;
  const at = (x: number) => chainGainAt(net, Math.pow(10, x), scratch);
  const x0 = Math.log10(SWEEP_LO_HZ);
  let best = 0;
  let bestMag = -Infinity;
  for (let k = 0; k < count; k++) {
    const m = at(x0 + k / PER_DECADE);
    if (m > bestMag) {
      bestMag = m;
      best = k;
    }
  }
  let a = x0 + Math.max(best - 1, 0) / PER_DECADE;
  let b = x0 + Math.min(best + 1, count - 1) / PER_DECADE;
  const phi = (Math.sqrt(5) - 1) / 2;
  for (let k = 0; k < 30; k++) {
    const c = b - phi * (b - a);
    const d = a + phi * (b - a);
    if (at(c) > at(d)) b = d;
    else a = c;
  }
  const x = 0.5 * (a + b);
  const mag = Math.max(at(x), bestMag);
  const db = ref > 0 && mag > ref ? 20 * Math.log10(mag / ref) : 0;
  return { db: Number.isFinite(db) ? db : 0, hz: Math.pow(10, x) };
}

/** The stability sweep: 1 mHz to 100 MHz at 20 points a decade, each step halved until the argument moves under π/3 (at most 14 times). */
const LOOP_LO_HZ = 1e-3;
const LOOP_HI_HZ = 1e8;
const LOOP_PER_DECADE = 20;
const MAX_HALVINGS = 14;

/**
 * How many of the amplifier's natural frequencies the loop through its
 * supply puts in the right half plane (0: stable), by Nyquist's criterion
 * on the return difference of that loop: F(jω) = det M / (det A · det D),
 * with M the whole network's equations, A the amplifier's alone (every
 * supply node at signal ground: the open-loop amplifier, stable) and D the
 * supply's nodes alone (a passive ladder, stable). F has no poles in the
 * right half plane and tends to 1 at high frequency (the nodes' capacitors
 * short them). Near DC it goes as s^m (an inductor to a node D holds at
 * ground gives D a pole there, F a zero): the contour passes the origin on
 * a small half circle through the right half plane, turning F by mπ. With
 * conjugate symmetry, the zeros of M there number −(2Δ + mπ)/2π, Δ the
 * argument's change from DC to ∞. Null where a determinant cannot be taken.
 */
export function supplyLoopUnstablePoles(net: ChainNetwork, loopScale = 1): number | null {
  if (!net.supply) return 0;
  const scratch = scratchFor(net);
  // Which equations are the amplifier's and which the supply's: fixed by the network's shape, the same at every frequency.
  let parts: { all: number[]; amp: number[]; sup: number[] } | null = null;
  const at = (f: number): { arg: number; logAbs: number } | null => {
    const filled = fillChain(net, f, scratch, null);
    const w = filled.n + 1;
    if (!parts) {
      const { start, count } = filled.supplyNodes;
      const all = Array.from({ length: filled.n }, (_, k) => k);
      parts = { all, amp: all.filter((k) => k < start || k >= start + count), sup: all.filter((k) => k >= start && k < start + count) };
    }
    const { all, amp, sup } = parts;
    // The loop's gain times loopScale: each supply node's voltage acts on the amplifier's equations that much harder
    // (det M then is det A · det(D − loopScale · C A⁻¹ B); A and D stand).
    if (loopScale !== 1) {
      for (const r of amp) {
        for (const c of sup) {
          scratch.re[r * w + c] = scratch.re[r * w + c]! * loopScale;
          scratch.im[r * w + c] = scratch.im[r * w + c]! * loopScale;
        }
      }
    }
    const m = cdetPolar(scratch.re, scratch.im, w, all);
    const a = cdetPolar(scratch.re, scratch.im, w, amp);
    const d = cdetPolar(scratch.re, scratch.im, w, sup);
    if (!m || !a || !d) return null;
    return { arg: wrap(m.arg - a.arg - d.arg), logAbs: m.logAbs - a.logAbs - d.logAbs };
  };
  const argAt = (x: number): number | null => at(Math.pow(10, x))?.arg ?? null;
  const x0 = Math.log10(LOOP_LO_HZ);
  const steps = Math.round(Math.log10(LOOP_HI_HZ / LOOP_LO_HZ) * LOOP_PER_DECADE);
  const lowest = at(LOOP_LO_HZ);
  const decadeUp = at(LOOP_LO_HZ * 10);
  if (lowest === null || decadeUp === null) return null;
  // F's order at the origin, from its slope over the lowest decade.
  const order = Math.round((decadeUp.logAbs - lowest.logAbs) / Math.LN10);
  // The change between two frequencies whose arguments are known, halving the step where it moves fast (a resonance near the axis).
  const change = (xa: number, aa: number, xb: number, ab: number, depth: number): number | null => {
    const d = wrap(ab - aa);
    if (Math.abs(d) < Math.PI / 3 || depth >= MAX_HALVINGS) return d;
    const xm = 0.5 * (xa + xb);
    const am = argAt(xm);
    if (am === null) return null;
    const left = change(xa, aa, xm, am, depth + 1);
    const right = change(xm, am, xb, ab, depth + 1);
    return left === null || right === null ? null : left + right;
  };
  let prev = lowest.arg;
  let total = 0;
  for (let k = 1; k <= steps; k++) {
    const xb = x0 + k / LOOP_PER_DECADE;
    const ab = argAt(xb);
    if (ab === null) return null;
    const d = change(xb - 1 / LOOP_PER_DECADE, prev, xb, ab, 0);
    if (d === null) return null;
    total += d;
    prev = ab;
  }
  // Near DC F = c·(jω)^m with c real: its argument is mπ/2, or that and π.
  const base = (order * Math.PI) / 2;
  const startArg = Math.abs(wrap(lowest.arg - base)) <= Math.PI / 2 ? base : base + Math.PI;
  const startUnwrapped = lowest.arg - wrap(lowest.arg - startArg);
  // At ∞, F = 1: the unwrapped end less its small wrapped remainder.
  const delta = lowest.arg + total - prev - startUnwrapped;
  return Math.max(0, Math.round(-delta / Math.PI - order / 2));
}

/** An angle brought to (−π, π]. */
function wrap(a: number): number {
  const t = a - 2 * Math.PI * Math.floor((a + Math.PI) / (2 * Math.PI));
  return t === -Math.PI ? Math.PI : t;
}
