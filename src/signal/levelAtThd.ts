import { fail, type Result } from '../result';
import { shown } from '../shown';
import type { StageDesign } from '../stage/stageDesign';
import { solvedStage, type SolvedStage } from './analysisInput';
import { MAX_OVERDRIVE, distortionOf } from './distortion';
import { illinois } from '../numeric/illinois';
import { stageTransfer, type StageTransfer } from './stageTransfer';
import { swingOf, type SwingLimit, type SwingResult } from './swing';

export interface LevelAtThd {
  /** Output (fundamental) and grid input, V rms, where THD reaches the limit. */
  readonly outputRms: number;
  readonly inputRms: number;
  /**
   * What brings THD there: the limit the level is past (grid current through
   * the real source and grid leak, or cutoff), or 'curvature' when THD reaches
   * the limit inside the clean swing (the curves' own bend).
   */
  readonly limitedBy: SwingLimit | 'curvature';
}

/** The distortion published resistance-coupled tables state their output at: 5 %. */
export const TABLE_THD = 0.05;

/** Samples per cycle while searching: THD to far better than a tenth of a percent. */
const SEARCH_SAMPLES = 256;

/**
 * The output level at which a stage's THD reaches `thd` (a fraction: 0.05 is
 * the 5 % published resistance-coupled tables use), past the clean limit when
 * that is where it lands: THD rises with drive, so Illinois on the input peak
 * between no signal and the first doubling past the clean peak that reaches it.
 */
export function levelAtThdOf(s: SolvedStage, thd: number, precomputed?: { transfer: StageTransfer; swing: SwingResult }): Result<LevelAtThd> {
  if (typeof thd !== 'number' || !Number.isFinite(thd) || !(thd > 0 && thd < 1)) return fail('invalid-input', `The THD limit must be a fraction between 0 and 1, as 0.05 for 5 % (got ${shown(thd)})`, 'thd');
  const transfer = precomputed?.transfer ?? stageTransfer(s.checked, s.solution.op);
  const swing = precomputed?.swing ?? swingOf(s, transfer);
  const pre = { transfer, swing };
  const wanted = 100 * thd;
  const at = (peak: number) => distortionOf(s, { inputRms: peak / Math.SQRT2 }, { samples: SEARCH_SAMPLES }, pre);
  const excess = (peak: number) => {
    const r = at(peak);
    return r.ok ? r.thdPercent - wanted : Infinity;
  };
  const most = MAX_OVERDRIVE * Math.max(swing.inputPeak, 1);
  let top = swing.inputPeak > 0 ? swing.inputPeak : Math.min(1e-3, most);
  while (excess(top) < 0) {
    if (top >= most) return fail('clipping', `THD stays under ${shown(wanted)} % up to ${MAX_OVERDRIVE} times this stage's clean input: it never reaches that limit`, 'thd');
    top = Math.min(2 * top, most);
  }
  const peak = illinois(excess, 0, top, 1e-4 * wanted, { fa: -wanted, start: top / 2 });
  const r = at(peak);
  if (!r.ok) return r;
  return { ok: true, outputRms: r.outputRms, inputRms: r.inputRms, limitedBy: r.pastClean ?? 'curvature' };
}

/** The output level at which THD reaches `thd` (a fraction), with `design.rsource` the generator's impedance. */
export function levelAtThd(design: StageDesign, thd: number): Result<LevelAtThd> {
  const s = solvedStage(design);
  if (!s.ok) return s;
  return levelAtThdOf(s, thd);
}
