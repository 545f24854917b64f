import { formatValue } from '../parts/formatValue';
import { finding, type Finding } from '../stage/ratingBands';
import { chainResponseAt, scratchFor, type ChainNetwork } from './chainResponse';

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
  /** The verdict for the ratings list: a loop that oscillates is a danger (it can overheat the output tubes' screens and burn a tweeter), a thin margin a warning; none when stable. */
  readonly findings: readonly Finding[];
}

export interface LoopMargins {
  /** Where the loop gain falls to one, Hz, and 180° less its phase shift from midband there, degrees (below 0: the loop oscillates). */
  readonly crossoverHz: number;
  readonly phaseMarginDeg: number;
  /** Where the loop's phase has turned 180°, Hz, and how far below one its gain is there, dB; null where it never turns that far. */
  readonly phaseCrossoverHz: number | null;
  readonly gainMarginDb: number | null;
}

const LO_HZ = 0.01;
const HI_HZ = 1e8;
const PER_DECADE = 24;
const MIDBAND_HZ = 1000;
/** Common practice for a loop at rest: 45° of phase margin and 10 dB of gain margin. */
const MIN_PHASE_MARGIN = 45;
const MIN_GAIN_MARGIN = 10;

/**
 * The loop across the band, from the open loop's network: its gain from the
 * first grid to the speaker, A(f), read with the grid driven directly, so
 * the loop gain is T(f) = T₀·A(f)/|A(1 kHz)|·sign (T₀ the midband loop gain,
 * the sign making it negative feedback there), and the closed loop
 * H(f) = A_source(f)/(1 + T(f)). The margins are read the Bode way along
 * the sweep from 1 kHz outward, the phase unwrapped as it turns (a
 * minimum-phase loop's: every one this workbench draws is). Checked against
 * ngspice (tests/spice/feedbackBand.spice.test.ts).
 */
export function feedbackBand(open: ChainNetwork, loopGain: number): FeedbackBand {
  const fromGrid: ChainNetwork = { ...open, rsource: 0, stages: open.stages.map((s, i) => (i === 0 ? { ...s, coupling: null } : s)) };
  const scratch = scratchFor(open);
  const gridScratch = scratchFor(fromGrid);
  const ref = chainResponseAt(fromGrid, MIDBAND_HZ, gridScratch) ?? [1, 0];
  const refMag = Math.hypot(ref[0], ref[1]) || 1;
  const sign = ref[0] < 0 ? -1 : 1;
  const k = (sign * loopGain) / refMag;
  /** T(f) and H(f) at one frequency. */
  const at = (f: number) => {
    const a = chainResponseAt(fromGrid, f, gridScratch) ?? [0, 0];
    const s = chainResponseAt(open, f, scratch) ?? [0, 0];
    const t: [number, number] = [k * a[0], k * a[1]];
    const d = Math.hypot(1 + t[0], t[1]);
    // 1 + T exactly nought (a loop balanced on the edge) is read as a vast but finite gain.
    return { t, h: Math.hypot(s[0], s[1]) / Math.max(d, 1e-300) };
  };
  const mid = at(MIDBAND_HZ);
  const decadesDown = Math.log10(MIDBAND_HZ / LO_HZ);
  const decadesUp = Math.log10(HI_HZ / MIDBAND_HZ);
  const side = (decades: number, dir: 1 | -1) => {
    const count = Math.round(decades * PER_DECADE);
    const points = [{ f: MIDBAND_HZ, ...mid, phase: Math.atan2(mid.t[1], mid.t[0]) }];
    for (let j = 1; j <= count; j++) {
      const f = MIDBAND_HZ * Math.pow(10, (dir * j) / PER_DECADE);
      const p = at(f);
      const raw = Math.atan2(p.t[1], p.t[0]);
      const last = points[points.length - 1]!.phase;
      // Unwrap: the step between neighbouring points is well under π at this density.
      const phase = raw + 2 * Math.PI * Math.round((last - raw) / (2 * Math.PI));
      points.push({ f, ...p, phase });
    }
    return points;
  };
  const sides = [side(decadesDown, -1), side(decadesUp, 1)] as const;
  const level = mid.h / Math.SQRT2;
  const edge = (pts: ReturnType<typeof side>): number | null => {
    for (let j = 1; j < pts.length; j++) if (pts[j]!.h < level) return between(pts[j - 1]!, pts[j]!, (p) => p.h / level);
    return null;
  };
  let peak = { db: 0, f: null as number | null };
  for (const pts of sides)
    for (const p of pts) {
      const db = 20 * Math.log10(p.h / mid.h);
      if (db > peak.db) peak = { db, f: p.f };
    }
  const margins = (pts: ReturnType<typeof side>): LoopMargins | null => {
    let crossing: number | null = null;
    for (let j = 1; j < pts.length; j++) {
      if (Math.hypot(...pts[j]!.t) < 1 && Math.hypot(...pts[j - 1]!.t) >= 1) {
        crossing = j;
        break;
      }
    }
    if (crossing === null) return null;
    const [a, b] = [pts[crossing - 1]!, pts[crossing]!];
    const crossoverHz = between(a, b, (p) => Math.hypot(...p.t));
    const u = Math.log(crossoverHz / a.f) / Math.log(b.f / a.f);
    const turn = Math.abs(a.phase + u * (b.phase - a.phase));
    let phaseCrossoverHz: number | null = null;
    let gainMarginDb: number | null = null;
    for (let j = 1; j < pts.length; j++) {
      if (Math.abs(pts[j]!.phase) >= Math.PI && Math.hypot(...pts[j - 1]!.t) > 0 && Math.hypot(...pts[j]!.t) > 0) {
        const [c, d] = [pts[j - 1]!, pts[j]!];
        const v = (Math.PI - Math.abs(c.phase)) / (Math.abs(d.phase) - Math.abs(c.phase));
        phaseCrossoverHz = Math.exp(Math.log(c.f) + v * Math.log(d.f / c.f));
        gainMarginDb = -20 * Math.log10(Math.hypot(...c.t) * Math.pow(Math.hypot(...d.t) / Math.hypot(...c.t), v));
        break;
      }
    }
    return { crossoverHz, phaseMarginDeg: 180 - (turn * 180) / Math.PI, phaseCrossoverHz, gainMarginDb };
  };
  const low = margins(sides[0]);
  const high = margins(sides[1]);
  const ends = [low, high].filter((m): m is LoopMargins => m !== null);
  const oscillates = ends.some((m) => m.phaseMarginDeg < 0 || (m.gainMarginDb !== null && m.gainMarginDb < 0));
  const marginal = ends.some((m) => m.phaseMarginDeg < MIN_PHASE_MARGIN || (m.gainMarginDb !== null && m.gainMarginDb < MIN_GAIN_MARGIN));
  const verdict = oscillates ? 'oscillates' : marginal ? 'marginal' : 'stable';
  return {
    lowHz: edge(sides[0]),
    highHz: edge(sides[1]),
    peakDb: peak.db,
    peakHz: peak.f,
    low,
    high,
    verdict,
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

/** Where a quantity that is ≥ 1 at a and < 1 at b crosses one, by interpolation in log frequency and log value. */
function between<P extends { f: number }>(a: P, b: P, value: (p: P) => number): number {
  const va = Math.log(value(a));
  const vb = Math.log(value(b));
  const u = vb === va ? 0.5 : va / (va - vb);
  return Math.exp(Math.log(a.f) + u * Math.log(b.f / a.f));
}
