import { formatValue } from '../parts/formatValue';
import { fail, type Result } from '../result';
import { shown } from '../shown';
import { squareWave } from '../signal/squareWave';
import { finding, type Finding } from '../stage/ratingBands';
import { noiseFigures, type ChainNoise } from './chainNoise';
import { chainResponseAt, REFERENCE_HZ, scratchFor, type ChainNetwork } from './chainResponse';

/**
 * The closed loop across the band: its response and how far the loop is
 * from oscillating, at each end of the band.
 */
export interface FeedbackBand {
  /** The closed loop's −3 dB points against its gain at 1 kHz, Hz; null where it holds up to the sweep's end (0.01 Hz, 100 MHz). */
  readonly lowHz: number | null;
  readonly highHz: number | null;
  /** The closed loop's highest rise above its 1 kHz gain, dB (0 without one), and where, Hz. */
  readonly peakDb: number;
  readonly peakHz: number | null;
  /** Each end of the band: null where the loop gain never falls to one (no phase turns it there). */
  readonly low: LoopMargins | null;
  readonly high: LoopMargins | null;
  /** Common practice: at least 45° of phase margin and 10 dB of gain margin at each end; under that 'marginal', below zero 'oscillates'. */
  readonly verdict: 'stable' | 'marginal' | 'oscillates';
  /**
   * What a scope would show at the speaker for a square wave in, open and
   * closed loop, each against its own midband gain: a 100 Hz one (its tilt:
   * the low end) and a 10 kHz one (its rise and any ringing: the high end).
   * None for a loop that oscillates: it has no steady state to show.
   */
  readonly squareWaves: readonly LoopSquareWave[];
  /** The closed loop's own noise (chainNoise on the closed network), at the output and referred to the source; null for a loop that oscillates or when it cannot be found. */
  readonly noise: ChainNoise | null;
  /** The verdict for the ratings list: a loop that oscillates is a danger (it can overheat the output tubes' screens and burn a tweeter), a thin margin a warning; none when stable. */
  readonly findings: readonly Finding[];
}

export interface LoopSquareWave {
  readonly hz: number;
  /** Instants across one period from the rising edge, s. */
  readonly t: readonly number[];
  readonly open: readonly number[];
  readonly closed: readonly number[];
}

/** The square waves a builder puts through an amplifier on the bench (common practice): 100 Hz for the low end, 10 kHz for the high. */
const SQUARE_WAVE_HZ = [100, 10e3] as const;

export interface LoopMargins {
  /** Where the loop gain falls to one, Hz, and 180° less its phase shift from midband there, degrees (below 0: the loop oscillates). */
  readonly crossoverHz: number;
  readonly phaseMarginDeg: number;
  /** Where the loop's phase has turned 180°, Hz, and how far below one its gain is there, dB; null where it never turns that far. */
  readonly phaseCrossoverHz: number | null;
  readonly gainMarginDb: number | null;
}

/** The feedback divider: Rf from the speaker to the first cathode, its Rk to ground, and a capacitor across Rf (F) or null. */
export interface FeedbackDivider {
  readonly rk: number;
  readonly rf: number;
  readonly cf: number | null;
}

const LO_HZ = 0.01;
const HI_HZ = 1e8;
const PER_DECADE = 24;
const MIDBAND_HZ = REFERENCE_HZ;
/** Bisection steps for a crossing between two points of the sweep (a factor 1.1 apart): 20 put it within a part in 10⁷. */
const REFINE_STEPS = 20;
/** Common practice for a loop at rest: 45° of phase margin and 10 dB of gain margin. */
const MIN_PHASE_MARGIN = 45;
const MIN_GAIN_MARGIN = 10;

/**
 * The loop across the band, in the amplifier's own linear network with Rf
 * (and a capacitor across it) from the speaker to the first cathode, as a
 * circuit simulator's AC analysis would solve it: the loop broken at the
 * speaker (Rf driven, the input at rest) gives its transmission, scaled to
 * the midband loop gain T₀ at 1 kHz and phased for negative feedback there
 * (the secondary's leads chosen so); the loop closed gives the response.
 * The margins are read the Bode way along the sweep from 1 kHz outward, the
 * phase unwrapped as it turns (a minimum-phase loop's: every one this
 * workbench draws is). Checked against ngspice
 * (tests/spice/feedbackBand.spice.test.ts).
 */
export function feedbackBand(network: ChainNetwork, loopGain: number, divider: FeedbackDivider): Result<FeedbackBand> {
  const d = typeof divider === 'object' && divider !== null ? divider : ({} as Partial<FeedbackDivider>);
  const positive = (x: unknown): x is number => typeof x === 'number' && x > 0 && Number.isFinite(x);
  if (!positive(d.rk) || !positive(d.rf) || !(d.cf === null || positive(d.cf))) return fail('invalid-input', 'The feedback divider needs Rk and Rf above 0 Ω, and a capacitor above 0 F or none', 'rf');
  if (!(Number.isFinite(loopGain) && loopGain > 0)) return fail('invalid-input', `The midband loop gain must be above 0 (got ${shown(loopGain)})`, 'rf');
  if (!Array.isArray(network?.stages) || network.stages.length === 0) return fail('invalid-input', 'The loop needs an amplifier to go round', 'stages');
  const path = { rk: d.rk, rf: d.rf, cf: d.cf ?? null };
  const broken: ChainNetwork = { ...network, feedback: { ...path, mode: 'broken', polarity: 1 } };
  const scratch = scratchFor(broken);
  const openScratch = scratchFor(network);
  const ref = chainResponseAt(broken, MIDBAND_HZ, scratch);
  const refMag = ref === null ? 0 : Math.hypot(ref[0], ref[1]);
  if (ref === null || !(refMag > 0)) return fail('unreachable', 'The loop carries no signal at 1 kHz in this amplifier', 'rf');
  // The secondary's sense that makes the loop negative at midband, and the network's loop scaled to the large-signal T₀.
  const polarity = ref[0] > 0 ? -1 : 1;
  const k = (-polarity * loopGain) / refMag;
  const closed: ChainNetwork = { ...network, feedback: { ...path, mode: 'closed', polarity } };
  /** The loop's transmission T(f), and the closed loop's |H(f)|: each solved only where it is asked for. */
  const loopAt = (f: number): [number, number] => {
    const a = chainResponseAt(broken, f, scratch) ?? [0, 0];
    return [k * a[0], k * a[1]];
  };
  const closedAt = (f: number): number => {
    const h = chainResponseAt(closed, f, scratch) ?? [0, 0];
    return Math.hypot(h[0], h[1]);
  };
  type LoopPoint = { readonly f: number; readonly t: [number, number]; readonly phase: number };
  /** T at f, its phase unwrapped to lie nearest a neighbour's (the step between them is well under π). */
  const loopPoint = (f: number, near: number): LoopPoint => {
    const t = loopAt(f);
    const raw = Math.atan2(t[1], t[0]);
    return { f, t, phase: raw + 2 * Math.PI * Math.round((near - raw) / (2 * Math.PI)) };
  };
  type Point = LoopPoint & { readonly h: number };
  const midT = loopAt(MIDBAND_HZ);
  const mid: Point = { f: MIDBAND_HZ, t: midT, phase: Math.atan2(midT[1], midT[0]), h: closedAt(MIDBAND_HZ) };
  const side = (decades: number, dir: 1 | -1): Point[] => {
    const count = Math.round(decades * PER_DECADE);
    const points: Point[] = [mid];
    for (let j = 1; j <= count; j++) {
      const f = MIDBAND_HZ * Math.pow(10, (dir * j) / PER_DECADE);
      points.push({ ...loopPoint(f, points[j - 1]!.phase), h: closedAt(f) });
    }
    return points;
  };
  /** The first neighbours of the sweep (outward from 1 kHz) where `above` turns false, or null. */
  const firstTurn = <P,>(pts: readonly P[], above: (p: P) => boolean): [P, P] | null => {
    for (let j = 1; j < pts.length; j++) if (!above(pts[j]!)) return above(pts[j - 1]!) ? [pts[j - 1]!, pts[j]!] : null;
    return null;
  };
  /** Where the loop's `above` turns false between neighbours, by bisection in log frequency (T alone is solved). */
  const loopTurn = (pts: readonly LoopPoint[], above: (p: LoopPoint) => boolean): LoopPoint | null => {
    const pair = firstTurn(pts, above);
    if (!pair) return null;
    let [lo, hi] = pair;
    for (let j = 0; j < REFINE_STEPS; j++) {
      const m = loopPoint(Math.sqrt(lo.f * hi.f), lo.phase);
      if (above(m)) lo = m;
      else hi = m;
    }
    return loopPoint(Math.sqrt(lo.f * hi.f), lo.phase);
  };
  const sides = [side(Math.log10(MIDBAND_HZ / LO_HZ), -1), side(Math.log10(HI_HZ / MIDBAND_HZ), 1)] as const;
  const level = mid.h / Math.SQRT2;
  /** The closed loop's −3 dB point on one side, by bisection on |H| alone. */
  const edge = (pts: readonly Point[]): number | null => {
    const pair = firstTurn(pts, (p) => p.h >= level);
    if (!pair) return null;
    let [lo, hi] = [pair[0].f, pair[1].f];
    for (let j = 0; j < REFINE_STEPS; j++) {
      const m = Math.sqrt(lo * hi);
      if (closedAt(m) >= level) lo = m;
      else hi = m;
    }
    return Math.sqrt(lo * hi);
  };
  // The highest point of the sweep; a sharp rise falls between its points, so its top is then found by a golden-section
  // search between the neighbours.
  let best: { pts: readonly Point[]; j: number } | null = null;
  for (const pts of sides) for (const [j, p] of pts.entries()) if (p.h > (best ? best.pts[best.j]!.h : mid.h)) best = { pts, j };
  let peak = { db: 0, f: null as number | null };
  if (best) {
    const { pts, j } = best;
    const p = pts[j]!;
    const top = j > 0 && j < pts.length - 1 ? goldenTop(pts[j - 1]!.f, pts[j + 1]!.f, closedAt) : { f: p.f, value: p.h };
    peak = top.value > p.h ? { db: 20 * Math.log10(top.value / mid.h), f: top.f } : { db: 20 * Math.log10(p.h / mid.h), f: p.f };
  }
  const loop = (p: LoopPoint) => Math.hypot(p.t[0], p.t[1]);
  const margins = (pts: readonly Point[]): LoopMargins | null => {
    const cross = loopTurn(pts, (p) => loop(p) >= 1);
    if (cross === null) return null;
    const turned = loopTurn(pts, (p) => Math.abs(p.phase) < Math.PI || !(loop(p) > 0));
    return {
      crossoverHz: cross.f,
      phaseMarginDeg: 180 - (Math.abs(cross.phase) * 180) / Math.PI,
      phaseCrossoverHz: turned?.f ?? null,
      gainMarginDb: turned && loop(turned) > 0 ? -20 * Math.log10(loop(turned)) : null,
    };
  };
  const low = margins(sides[0]);
  const high = margins(sides[1]);
  const ends = [low, high].filter((m): m is LoopMargins => m !== null);
  const oscillates = ends.some((m) => m.phaseMarginDeg < 0 || (m.gainMarginDb !== null && m.gainMarginDb < 0));
  const marginal = ends.some((m) => m.phaseMarginDeg < MIN_PHASE_MARGIN || (m.gainMarginDb !== null && m.gainMarginDb < MIN_GAIN_MARGIN));
  const verdict = oscillates ? 'oscillates' : marginal ? 'marginal' : 'stable';
  const squareWaves: LoopSquareWave[] = [];
  if (verdict !== 'oscillates') {
    const openAt = (f: number) => chainResponseAt(network, f, openScratch);
    const closedResponse = (f: number) => chainResponseAt(closed, f, scratch);
    const openRef = openAt(MIDBAND_HZ);
    const closedRef = closedResponse(MIDBAND_HZ);
    for (const hz of SQUARE_WAVE_HZ) {
      const o = openRef && squareWave(openAt, hz, openRef);
      const c = closedRef && squareWave(closedResponse, hz, closedRef);
      if (o?.ok && c?.ok) squareWaves.push({ hz, t: c.t, open: o.v, closed: c.v });
    }
  }
  return {
    ok: true,
    lowHz: edge(sides[0]),
    highHz: edge(sides[1]),
    peakDb: peak.db,
    peakHz: peak.f,
    low,
    high,
    verdict,
    squareWaves,
    noise: verdict === 'oscillates' ? null : noiseFigures(closed),
    findings: loopFindings(verdict, low, high),
  };
}

/** The usual cures at each end (common practice): less feedback, or the loop's corners set apart so one of them rules there. */
const CURE = {
  low: 'one coupling network left to set the loop\'s low corner and the others (and the primary\'s) moved well below it',
  high: 'a step network on a voltage stage or a small capacitor across Rf',
} as const;

/** The ends short of the margins, worded for the ratings list. */
function loopFindings(verdict: FeedbackBand['verdict'], low: LoopMargins | null, high: LoopMargins | null): Finding[] {
  if (verdict === 'stable') return [];
  const ends = ([['low', low], ['high', high]] as const).filter((e): e is readonly ['low' | 'high', LoopMargins] => e[1] !== null);
  const short = ends.filter(([, m]) => m.phaseMarginDeg < MIN_PHASE_MARGIN || (m.gainMarginDb !== null && m.gainMarginDb < MIN_GAIN_MARGIN));
  const worded = short.map(([end, m]) => {
    const gain = m.gainMarginDb === null ? '' : `, gain margin ${m.gainMarginDb.toFixed(1)} dB`;
    return `at the ${end} end phase margin ${m.phaseMarginDeg.toFixed(0).replace('-', '−')}° at ${formatValue(m.crossoverHz, 'Hz')}${gain.replace('-', '−')}`;
  });
  const cure = `Less feedback (a larger Rf), or ${short.map(([end]) => `at the ${end} end ${CURE[end]}`).join('; ')}.`;
  const worst = Math.min(...short.map(([, m]) => m.phaseMarginDeg));
  if (verdict === 'oscillates') {
    const unstable = new Set(short.filter(([, m]) => m.phaseMarginDeg < 0 || (m.gainMarginDb !== null && m.gainMarginDb < 0)).map(([end]) => end));
    const how = [unstable.has('low') ? 'it will motorboat, a slow oscillation at the low end' : '', unstable.has('high') ? 'it will oscillate above the audio band' : ''].filter(Boolean).join(', and ');
    return [finding('loop-stability', 'danger', `The loop is unstable (${how}): ${worded.join('; ')}. ${cure} Do not switch on with the loop closed.`, worst, MIN_PHASE_MARGIN)];
  }
  return [finding('loop-stability', 'warning', `Thin stability margins: ${worded.join('; ')} (common practice asks ${MIN_PHASE_MARGIN}° and ${MIN_GAIN_MARGIN} dB). Expect ringing on a square wave; a capacitive load makes it worse. ${cure}`, worst, MIN_PHASE_MARGIN)];
}

/** The top of a single hump between a and b (Hz), by golden-section search in log frequency. */
function goldenTop(a: number, b: number, value: (f: number) => number): { f: number; value: number } {
  const r = (Math.sqrt(5) - 1) / 2;
  let [lo, hi] = [Math.log(Math.min(a, b)), Math.log(Math.max(a, b))];
  let x1 = hi - r * (hi - lo);
  let x2 = lo + r * (hi - lo);
  let v1 = value(Math.exp(x1));
  let v2 = value(Math.exp(x2));
  for (let k = 0; k < REFINE_STEPS; k++) {
    if (v1 > v2) {
      hi = x2;
      [x2, v2] = [x1, v1];
      x1 = hi - r * (hi - lo);
      v1 = value(Math.exp(x1));
    } else {
      lo = x1;
      [x1, v1] = [x2, v2];
      x2 = lo + r * (hi - lo);
      v2 = value(Math.exp(x2));
    }
  }
  return v1 > v2 ? { f: Math.exp(x1), value: v1 } : { f: Math.exp(x2), value: v2 };
}
