import { GRID_CURRENT_ONSET } from '../tube/gridCurrent';
import { illinois } from '../numeric/illinois';
import type { ClipCause } from './chainTypes';
import { settleCycle } from '../output/steadyState';
import { sineCycle } from '../signal/sineCycle';
import type { LinkSample, SolvedLink } from './stageKind';

/** The largest input peak searched, V: past it a stage is taken never to clip. */
export const MAX_SEARCH_PEAK = 1e4;
/** The clean limit to 10 ppm (a ten-thousandth of a dB): far finer than any figure shows. */
export const CLIP_REL_TOL = 1e-5;

/** A grid-current drop on the driving impedance below this, V, is left out (it moves an output by microvolts at most). */
const GRID_DROP_FLOOR = 1e-7;
/** Below these drops, V, one step or one secant step solves the loop (see drive). */
const TINY_DROP = 1e-5;
const SMALL_DROP = 1e-3;

/**
 * The chain at midband, large signal: the source's voltage divided onto the
 * first grid, then each stage's transfer fed the one before's output, sample
 * by sample. Each stage's transfer already carries the load the next grid
 * puts on it, so the composition is the whole circuit's response.
 *
 * A stage's input is its grid's open-circuit swing (the voltage on its leak
 * with no grid current). Where the grid draws current (`gridLaw`) it sits
 * lower by Ig times the impedance driving it: the stage before's output
 * impedance (the source's for the first) in parallel with the grid leak,
 * Thévenin's theorem on the small-signal output. That loop is solved at each
 * instant, so a stage driven into grid current compresses, and the stage
 * before it is not asked for more than its output impedance lets it give.
 */
export class ChainSignal {
  private readonly samples: LinkSample[];

  constructor(
    private readonly links: readonly SolvedLink[],
    /** First grid's share of the source voltage (its leak against the source impedance). */
    private readonly sourceShare: number,
    /** The impedance driving each stage's grid, Ω (0: an ideal source, no drop). */
    private readonly gridDrives: readonly number[] = links.map(() => 0),
    /** Each stage's volume control, the share of the output before it its wiper passes to the grid (1: none). */
    private readonly volumes: readonly number[] = links.map(() => 1),
  ) {
    this.samples = links.map(() => ({ vout: 0, vgk: 0, ia: 0, vout2: 0 }));
    this.lastIg = new Float64Array(links.length);
    this.quiescentIg = links.map((l) => (l.gridLaw ? l.gridLaw(l.op.vgk) : 0));
  }

  /** Each grid's quiescent current, A: it flows through the grid's DC path (its leak), already in the operating point. */
  private readonly quiescentIg: readonly number[];

  /** Each stage's grid current above its quiescent value at the last instant solved, A: the next instant's first guess. */
  private readonly lastIg: Float64Array;

  /**
   * Stage i at an open-circuit grid swing v: the grid current's loop solved
   * by Illinois on its excess x over the quiescent current q, the part that
   * flows through the driving impedance (x − (law(vgk at v − R·x) − q) rises
   * with x: one root, between 0 and its open-circuit value; below q on the
   * swing down); below the onset, where the loop is nearly linear, a step or two.
   */
  private drive(i: number, v: number, v2: number): LinkSample {
    const link = this.links[i]!;
    const out = this.samples[i]!;
    link.sample(v, out, v2);
    const law = link.gridLaw;
    const r = this.gridDrives[i]!;
    if (!law || !(r > 0)) return out;
    const q = this.quiescentIg[i]!;
    const open = law(out.vgk) - q;
    const drop = Math.abs(open) * r;
    if (!(drop >= GRID_DROP_FLOOR)) return out;
    // Below the onset the loop is nearly linear: one step at the open-circuit current is within 1.5·drop²/Vt of the root
    // (1.6e-9 V at TINY_DROP); a secant step from (0, −x) and (x, its residual) is within 1e-7 V of it to SMALL_DROP.
    if (drop < SMALL_DROP) {
      link.sample(v - r * open, out, v2);
      if (drop < TINY_DROP) return out;
      const f1 = open - (law(out.vgk) - q);
      const x = (open * open) / (f1 + open);
      link.sample(v - r * x, out, v2);
      return out;
    }
    const residual = (x: number) => {
      link.sample(v - r * x, out, v2);
      return x - (law(out.vgk) - q);
    };
    // To 1e-7 V of the drop, or a ten-millionth of it deep in grid current; from the last instant's excess when it is in the bracket.
    const last = this.lastIg[i]!;
    const inside = open > 0 ? last > 0 && last < open : last < 0 && last > open;
    const x = illinois(residual, 0, open, Math.max(GRID_DROP_FLOOR, 1e-7 * drop) / r, { fa: -open, ...(inside ? { start: last } : {}) });
    this.lastIg[i] = x;
    link.sample(v - r * x, out, v2);
    return out;
  }

  /** Output for a source voltage vsrc (from quiescent), each stage's sample kept for inspection; `upTo` stops after that stage. */
  at(vsrc: number, upTo = this.links.length - 1): number {
    let v = vsrc * this.sourceShare;
    let v2 = 0;
    for (let i = 0; i <= upTo; i++) {
      const s = this.drive(i, v, v2);
      v = s.vout * (this.volumes[i + 1] ?? 1);
      v2 = s.vout2;
    }
    return v;
  }

  /**
   * Which of stage i's limits a source peak reaches, at either polarity (null:
   * neither; grid current named first where both are), and `margin`, how far
   * past the nearest limit it is: ≥ 0 exactly where one is reached. Each
   * limit's distance is taken over its own scale (the grid's distance from
   * bias to its limit, the cutoff swing, the operating current) so the pieces
   * meet in proportion: that sets how fast clipOf closes in, not where.
   */
  reachAt(i: number, peak: number): { margin: number; by: ClipCause | null } {
    const link = this.links[i]!;
    const gridLimit = link.gridLimit ?? GRID_CURRENT_ONSET;
    const gridScale = Math.abs(gridLimit - link.op.vgk) || 1;
    let margin = -Infinity;
    let cut = false;
    for (let sign = 1; sign >= -1; sign -= 2) {
      this.at(sign * peak, i);
      const s = this.samples[i]!;
      const grid = (s.vgk - gridLimit) / gridScale;
      // A settled primary's cutoff is its own clean limit's, read on the grid's swing below bias.
      const cutoff = link.cutoffSwing === undefined
        ? (link.cutoffCurrent - s.ia) / (Math.abs(link.op.ia) || 1)
        : link.cutoffSwing === null ? -Infinity : (link.op.vgk - s.vgk - link.cutoffSwing) / (Math.abs(link.cutoffSwing) || 1);
      margin = Math.max(margin, grid, cutoff);
      // Each scale is positive, so a limit is reached exactly where its margin is not below zero.
      if (grid >= 0) return { margin, by: 'grid-current' };
      if (cutoff >= 0) cut = true;
    }
    return { margin, by: cut ? 'cutoff' : null };
  }

  /**
   * The source peak at which stage i's swing ends, and by what; null if it
   * does not below MAX_SEARCH_PEAK. Either limit ends the swing, so one
   * search finds the first: a bracket grown by factors of 2 from `guess`
   * (the small-signal estimate), then closed to CLIP_REL_TOL by false
   * position on the margin with Illinois's halving of a stale end (see
   * numeric/illinois), each step kept a little inside the bracket so it
   * closes from both sides; bisection where a margin is not a number.
   */
  clipOf(i: number, guess = 1e-3): { inputPeak: number; by: ClipCause } | null {
    let hi = Math.min(Math.max(guess, 1e-9), MAX_SEARCH_PEAK);
    let lo = 0;
    let atHi = this.reachAt(i, hi);
    let fLo = NaN;
    if (atHi.by !== null) {
      for (;;) {
        if (!(hi > 1e-9)) {
          lo = hi / 2;
          break;
        }
        const half = this.reachAt(i, hi / 2);
        if (half.by === null) {
          lo = hi / 2;
          fLo = half.margin;
          break;
        }
        hi /= 2;
        atHi = half;
      }
    } else {
      while (atHi.by === null) {
        if (!(hi < MAX_SEARCH_PEAK)) return null;
        lo = hi;
        fLo = atHi.margin;
        hi = Math.min(hi * 2, MAX_SEARCH_PEAK);
        atHi = this.reachAt(i, hi);
      }
    }
    let fHi = atHi.margin;
    let kept = 0;
    // Every two steps the bracket must have halved, or the next step bisects: at worst a halving every three steps.
    let checkpoint = hi - lo;
    let bisect = false;
    for (let k = 0; k < 60 && hi - lo > CLIP_REL_TOL * hi; k++) {
      const inset = 0.4 * CLIP_REL_TOL * hi;
      const falsePosition = fHi > fLo ? (lo * fHi - hi * fLo) / (fHi - fLo) : NaN;
      const x = !bisect && Number.isFinite(falsePosition) ? Math.min(Math.max(falsePosition, lo + inset), hi - inset) : 0.5 * (lo + hi);
      bisect = false;
      const at = this.reachAt(i, x);
      if (at.by !== null) {
        hi = x;
        atHi = at;
        fHi = at.margin;
        if (kept === 1) fLo /= 2;
        kept = 1;
      } else {
        lo = x;
        fLo = at.margin;
        if (kept === -1) fHi /= 2;
        kept = -1;
      }
      if (k % 2 === 1) {
        bisect = hi - lo > 0.5 * checkpoint;
        checkpoint = hi - lo;
      }
    }
    return { inputPeak: hi, by: atHi.by! };
  }

  /** Every stage's output for one source voltage, written into `into` (one pass through the chain). */
  stageOutputs(vsrc: number, into: Float64Array): void {
    let v = vsrc * this.sourceShare;
    let v2 = 0;
    for (let i = 0; i < this.links.length; i++) {
      const s = this.drive(i, v, v2);
      into[i] = s.vout;
      v = s.vout * (this.volumes[i + 1] ?? 1);
      v2 = s.vout2;
    }
  }

  /**
   * One cycle of the output at a source peak, n points (a multiple of 4), in
   * its steady state: with a single-ended output stage last, the stages
   * before it run once (its grid's swing at each point does not depend on its
   * primary), then its magnetising current is settled on that swing
   * (settleCycle, from the last cycle's: the chain's searches ask for
   * cycles at nearby levels in turn) and put back to idle after. `extremes`,
   * when given, gets each stage's lowest and highest output over the cycle.
   */
  cycle(n: number, peak: number, into = new Float64Array(n), extremes?: { readonly lows: Float64Array; readonly highs: Float64Array }): Float64Array {
    const last = this.links.length - 1;
    const link = this.links[last]!;
    const state = link.magnetising;
    const outs = (this.outs ??= new Float64Array(this.links.length));
    const track = (upTo: number) => {
      if (!extremes) return;
      for (let i = 0; i <= upTo; i++) {
        extremes.lows[i] = Math.min(extremes.lows[i]!, outs[i]!);
        extremes.highs[i] = Math.max(extremes.highs[i]!, outs[i]!);
      }
    };
    if (!state) {
      return sineCycle(n, peak, (v) => {
        this.stageOutputs(v, outs);
        track(last);
        return outs[last]!;
      }, into);
    }
    // The last grid's swing from its bias at each point, the stages before it run once.
    const sample = this.samples[last]!;
    state.gridOnly = true;
    const swing = sineCycle(n, peak, (v) => {
      this.stageOutputs(v, outs);
      track(last - 1);
      return sample.vgk - link.op.vgk;
    }, new Float64Array(n));
    state.gridOnly = false;
    const solveAt = (k: number, mm: number, near: number | undefined) => {
      state.value = mm;
      state.near = near;
      link.sample(swing[k]!, sample);
      into[k] = sample.vout;
      return state.coupled;
    };
    // The swing is a sine's cycle (sineCycle mirrors it), so the stage solves its distinct points only.
    state.guess = settleCycle(n, solveAt, state.idle, state.tol, state.guess, (from, to) => (into[to] = into[from]!));
    state.value = state.idle;
    state.near = undefined;
    if (extremes) {
      for (let k = 0; k < n; k++) {
        extremes.lows[last] = Math.min(extremes.lows[last]!, into[k]!);
        extremes.highs[last] = Math.max(extremes.highs[last]!, into[k]!);
      }
    }
    return into;
  }

  /** Every stage's outputs, one pass's scratch. */
  private outs: Float64Array | null = null;

  /** Whether the output stage's primary settles with the drive: its cycles then are not the instants' (outputPeak). */
  get settles(): boolean {
    return this.links[this.links.length - 1]!.magnetising !== undefined;
  }

  /** Half the output's peak-to-peak at the source's extremes, for a source peak, read at those instants (see `settles`). */
  outputPeak(peak: number): number {
    return Math.abs(this.at(peak) - this.at(-peak)) / 2;
  }
}
