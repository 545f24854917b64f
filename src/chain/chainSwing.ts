import type { ClipCause } from './chainTypes';
import type { LinkSample, SolvedLink } from './stageKind';

/** The largest input peak searched, V: past it a stage is taken never to clip. */
export const MAX_SEARCH_PEAK = 1e4;

/**
 * The chain at midband, large signal: the source's voltage divided onto the
 * first grid, then each stage's transfer fed the one before's output, sample
 * by sample. Each stage's transfer already carries the load the next grid
 * puts on it, so the composition is the whole circuit's response.
 */
export class ChainSignal {
  private readonly samples: LinkSample[];

  constructor(
    private readonly links: readonly SolvedLink[],
    /** First grid's share of the source voltage (its leak against the source impedance). */
    private readonly sourceShare: number,
  ) {
    this.samples = links.map(() => ({ vout: 0, vgk: 0, ia: 0 }));
  }

  /** Output for a source voltage vsrc (from quiescent), each stage's sample kept for inspection; `upTo` stops after that stage. */
  at(vsrc: number, upTo = this.links.length - 1): number {
    let v = vsrc * this.sourceShare;
    for (let i = 0; i <= upTo; i++) {
      this.links[i]!.sample(v, this.samples[i]!);
      v = this.samples[i]!.vout;
    }
    return v;
  }

  sampleOf(stage: number): LinkSample {
    return this.samples[stage]!;
  }

  /** Does stage `i` pass its limit `by` at either polarity of a source peak? */
  private hits(i: number, by: ClipCause, peak: number): boolean {
    const link = this.links[i]!;
    for (const v of [peak, -peak]) {
      this.at(v, i);
      const s = this.samples[i]!;
      if (by === 'grid-current' ? s.vgk >= 0 : s.ia <= link.cutoffCurrent) return true;
    }
    return false;
  }

  /** The source peak at which stage i's swing ends, and by what; null if it does not below MAX_SEARCH_PEAK. */
  clipOf(i: number): { inputPeak: number; by: ClipCause } | null {
    let best: { inputPeak: number; by: ClipCause } | null = null;
    for (const by of ['grid-current', 'cutoff'] as const) {
      let hi = 1e-3;
      while (hi < MAX_SEARCH_PEAK && !this.hits(i, by, hi)) hi *= 2;
      if (!this.hits(i, by, hi)) continue;
      let lo = hi === 1e-3 ? 0 : hi / 2;
      for (let k = 0; k < 50 && hi - lo > 1e-9 * hi; k++) {
        const mid = 0.5 * (lo + hi);
        if (this.hits(i, by, mid)) hi = mid;
        else lo = mid;
      }
      if (!best || hi < best.inputPeak) best = { inputPeak: hi, by };
    }
    return best;
  }

  /** Half the output's peak-to-peak for a source peak. */
  outputPeak(peak: number): number {
    return Math.abs(this.at(peak) - this.at(-peak)) / 2;
  }
}
