import type { Result } from '../result';
import type { CurveSheet } from '../stage/curveSheet';
import type { Finding } from '../stage/findings';
import type { PlateExtent } from '../stage/plateExtent';
import { chartOptionsOf } from '../output/chartOptions';
import { outputSheet } from '../output/outputSheet';
import { OUTPUT_SAMPLES } from '../output/outputSignal';
import { decibelsOf } from '../signal/levels';
import type { OutputTube } from '../output/outputTube';
import { SHEET_FEED_TOLERANCE } from '../output/analyzeOutput';
import type { ScreenFeed } from '../output/electrodes';
import type { PushPullDesign } from './pushPullDesign';
import { pushPullDriveOf, screensAtDrive, type PushPullDrive } from './pushPullDrive';
import { pushPullFigures, type PushPullFigures } from './pushPullFigures';
import { pushPullFindings } from './pushPullFindings';
import { pushPullOverlay, type PushPullOverlay } from './pushPullOverlay';
import { settledCathodeBias, type SettledBias } from './settledBias';
import { screenFeedPlan, screenSagFinding } from '../output/screenFeed';
import { bySeverity } from '../stage/ratingBands';
import { solvePushPull, type PushPullSolution } from './solvePushPull';
import { pairSpread } from './pairSpread';
import { spreadFinding, type OutputSpread } from '../output/outputSpread';

const opOf = (p: { readonly ia: number; readonly ig2: number; readonly pa: number; readonly pg2: number }): PushPullTubeOp => ({ ia: p.ia, ig2: p.ig2, pa: p.pa, pg2: p.pg2 });

/** Points a cycle on the light pass (a power of two, over twice the tenth harmonic). */
const LIGHT_SAMPLES = 32;

export interface PushPullAnalysis {
  readonly solution: PushPullSolution;
  /** One tube's plate curves as wired (the pair shares them; a mismatched second tube is drawn by its point only). */
  readonly sheet: CurveSheet;
  readonly maxCurves: number;
  readonly overlay: PushPullOverlay;
  /** The grids driven to 0 V peak, in antiphase: the drive data sheets quote a pair's power at; `harmonicsDb` is H2 to H10 in dB under the fundamental (H2 first, DB_FLOOR for none). */
  readonly full: PushPullDrive & { readonly harmonicsDb: readonly number[] };
  /** Each tube's idle plate and screen current and dissipation (the second as the mismatch leaves it). */
  readonly op: readonly [PushPullTubeOp, PushPullTubeOp];
  /** True when a tube cuts off before the grids reach 0 V. */
  readonly classAB: boolean;
  /** The most either tube's plate and screen dissipate over the level sweep, W, and at which drive; null before a full pass. */
  readonly worstDissipation: { readonly plate: { readonly watts: number; readonly drive: number }; readonly screen: { readonly watts: number; readonly drive: number } } | null;
  /**
   * The level sweep's figures (power within the distortion limit, where class
   * AB begins, the worst dissipation, damping): on the light pass that runs
   * during a drag, the last full pass's, stale; null before any full pass.
   */
  readonly figures: PushPullFigures | null;
  /**
   * A shared cathode resistor's bias once its bypass has settled under full drive, and the pair there with its
   * grids driven to 0 V; null for fixed bias, where it does not settle, and before any full pass (the light pass
   * carries the last full pass's, stale, like the figures).
   */
  readonly settledBias: SettledBias | null;
  /** The current the stage draws from B+ (both cathodes), A: at idle and with the grids driven to 0 V. */
  readonly supplyCurrent: { readonly idle: number; readonly full: number };
  /** Primary (plate to plate) to secondary turns ratio for the chosen speaker. */
  readonly turnsRatio: number;
  readonly findings: readonly Finding[];
  /** A cathode-biased pair's idle with matched pairs of the type's weakest and strongest tubes (pairSpread); null under fixed bias or where either does not solve. */
  readonly spread: OutputSpread | null;
}

export interface PushPullTubeOp {
  readonly ia: number;
  readonly ig2: number;
  readonly pa: number;
  readonly pg2: number;
}

export interface PushPullAnalysisOptions {
  readonly extent?: PlateExtent;
  readonly maxCurves?: number;
  /** Light: skip the level sweep (the costly part), carrying the previous figures. */
  readonly light?: boolean;
  /** The last analysis: its curve sheet is reused when tube, window, curve count and screen feed are unchanged. */
  readonly previous?: PushPullAnalysis | null;
}

function sameFeed(a: ScreenFeed, b: ScreenFeed, light: boolean): boolean {
  if (light) return a.kind === b.kind;
  if (a.kind === 'fixed' && b.kind === 'fixed') return Math.abs(a.vg2k - b.vg2k) < SHEET_FEED_TOLERANCE;
  if (a.kind === 'tap' && b.kind === 'tap') return a.fraction === b.fraction && Math.abs(a.supply - b.supply) < SHEET_FEED_TOLERANCE;
  return a.kind === 'tied' && b.kind === 'tied';
}

/**
 * Everything the bench shows of a push-pull pair: the idle point, one tube's
 * curves with the composite load lines and the path it takes at full drive,
 * power and distortion with the grids driven to 0 V, and on the full pass
 * the level sweep (power within the distortion limit, class AB onset, worst
 * dissipation, damping factor) that the findings check against the ratings.
 */
export function analyzePushPull(tube: OutputTube, design: PushPullDesign, optionsGiven: PushPullAnalysisOptions | null = {}): Result<PushPullAnalysis> {
  const solved = solvePushPull(tube, design);
  if (!solved.ok) return solved;
  const s = solved;
  const chart = chartOptionsOf(optionsGiven, tube, design.bplus);
  if (!chart.ok) return chart;
  const { extent, maxCurves } = chart;
  const options: typeof chart.options & Partial<NonNullable<typeof optionsGiven>> = chart.options;
  const light = options.light ?? false;
  const prev = typeof options.previous?.solution === 'object' && typeof options.previous?.sheet?.extent === 'object' ? options.previous : undefined;
  const reuse = prev && prev.solution.tube === tube && prev.sheet.extent.vmax === extent.vmax && prev.sheet.extent.iaMax === extent.iaMax && prev.maxCurves === maxCurves && sameFeed(prev.solution.feed, s.feed, light);
  const sheet = reuse ? prev.sheet : outputSheet(tube, s.feed, extent, maxCurves);
  // The light pass reads its cycle at 32 points: harmonics to the tenth still resolve, at half the cost a drag frame pays.
  const full = pushPullDriveOf(s, Math.max(0, Math.min(-s.vgk, -s.vgk2)), light ? LIGHT_SAMPLES : OUTPUT_SAMPLES);
  let figures: PushPullFigures | null = prev?.figures ?? null;
  let settledBias: SettledBias | null = design.bias === 'cathode' ? (prev?.settledBias ?? null) : null;
  if (!light) {
    const f = pushPullFigures(s);
    figures = f.ok ? f : null;
    const b = design.bias === 'cathode' ? settledCathodeBias(s) : null;
    settledBias = b?.ok ? b : null;
  }
  // Two idle solves of the pair, a small share of even the light pass: on every pass.
  const spreadResult = design.bias === 'cathode' ? pairSpread(s) : null;
  const spread = spreadResult?.ok ? spreadResult : null;
  const hot = spread ? spreadFinding(tube, spread) : null;
  const overlay = pushPullOverlay(s, extent, full);
  // Tube 1's path reaches its highest plate voltage where its partner pulls hardest: the pair's peak (mirrored for tube 2).
  const peak = overlay.swing.length > 0 ? Math.max(...overlay.swing.map((p) => p.v)) : null;
  return {
    ok: true,
    solution: s,
    sheet,
    maxCurves,
    overlay,
    full: { ...full, harmonicsDb: full.harmonics.slice(2).map(decibelsOf) },
    op: [opOf(s.idle[0]), opOf(s.idle[1])],
    classAB: full.classAB,
    worstDissipation: figures ? { plate: figures.worstPlate, screen: figures.worstScreen } : null,
    figures,
    settledBias,
    supplyCurrent: { idle: s.supplyCurrent, full: full.supplyCurrent },
    turnsRatio: Math.sqrt(design.raa / design.speakerOhms),
    findings: withScreenSag(hot ? bySeverity([...pushPullFindings(s, light ? null : figures, peak), hot]) : pushPullFindings(s, light ? null : figures, peak), s, full),
    spread,
  };
}

/** The pair's findings with a dropper's sag at full drive, where its screens are fed a fixed voltage below B+. */
function withScreenSag(findings: Finding[], s: PushPullSolution, full: PushPullDrive): Finding[] {
  const d = s.design;
  const atFull = screensAtDrive(s, full);
  if (atFull === null) return findings;
  const plan = screenFeedPlan(d.bplus, d.screenVolts, s.idle[0].ig2 + s.idle[1].ig2, d.screenFromNode);
  const sag = screenSagFinding(plan, d.screenVolts, atFull);
  return sag ? bySeverity([...findings, sag]) : findings;
}
