import type { Result } from '../result';
import type { CurveSheet } from '../stage/curveSheet';
import type { Finding } from '../stage/findings';
import type { PlateExtent } from '../stage/plateExtent';
import type { ScreenFeed } from './electrodes';
import type { OutputDesign } from './outputDesign';
import { outputFindings } from './outputFindings';
import { chartOptionsOf } from './chartOptions';
import { outputOverlay, outputSheet, type OutputOverlay } from './outputSheet';
import { atDrive, averageScreenCurrent, cleanLimit, OUTPUT_SAMPLES, SWEEP_SAMPLES, type CleanLimit, type DriveResult } from './outputSignal';
import { screenFeedPlan, screenSagFinding } from './screenFeed';
import { settledCathode, type SettledCathode } from './settledCathode';
import { outputSpread, spreadFinding, type OutputSpread } from './outputSpread';
import { bySeverity } from '../stage/ratingBands';
import type { OutputTube } from './outputTube';
import { powerAtDistortion, powerSweep, zPrimarySweep, type LimitedPower, type ZSweep } from './powerSweep';
import { solveOutput, type OutputSolution } from './solveOutput';

export interface OutputAnalysis {
  readonly solution: OutputSolution;
  readonly sheet: CurveSheet;
  readonly maxCurves: number;
  readonly overlay: OutputOverlay;
  /** Power at the onset of grid current or cutoff, whichever comes first. */
  readonly clean: CleanLimit;
  /** The stage with the grid driven to 0 V peak: the drive data sheets quote power at. */
  readonly full: DriveResult;
  /** Most power under the design's distortion limit; on the light pass, the last full pass's (or null). */
  readonly atLimit: LimitedPower | null;
  /** Speaker impedance over the stage's output impedance at the secondary. */
  readonly dampingFactor: number;
  /** Output impedance at the secondary, Ω: (rp + Rpri) reflected through the turns ratio. */
  readonly outputImpedance: number;
  /** Primary-to-secondary turns ratio for the chosen speaker. */
  readonly turnsRatio: number;
  readonly findings: readonly Finding[];
  /** Filled on the full pass; the light pass that runs during a drag carries the last full pass's, stale. */
  readonly sweep: readonly DriveResult[];
  readonly zSweep: ZSweep | null;
  /** A pentode-connected screen's current averaged over the cycle with the grid driven to 0 V, A (what its dropper drops then); null for the other connections. The light pass carries the last full pass's. */
  readonly screenAtFull: number | null;
  /** A cathode resistor's bias settled under full drive (settledCathode), on the full pass; null under fixed bias or where it does not settle. The light pass carries the last full pass's. */
  readonly settledCathode: SettledCathode | null;
  /** A cathode-biased stage's idle with the type's weakest and strongest tube (outputSpread); null under fixed bias (set tube by tube) or where either end does not solve. */
  readonly spread: OutputSpread | null;
}

/**
 * Curves drawn with screen feeds this close (V) look the same at chart
 * scale, so a drag that moves the cathode voltage a little keeps the sheet.
 */
export const SHEET_FEED_TOLERANCE = 0.5;

function sameFeed(a: ScreenFeed, b: ScreenFeed): boolean {
  if (a.kind === 'fixed' && b.kind === 'fixed') return Math.abs(a.vg2k - b.vg2k) < SHEET_FEED_TOLERANCE;
  if (a.kind === 'tap' && b.kind === 'tap') return a.fraction === b.fraction && Math.abs(a.supply - b.supply) < SHEET_FEED_TOLERANCE;
  return a.kind === 'tied' && b.kind === 'tied';
}

export interface OutputAnalysisOptions {
  readonly extent?: PlateExtent;
  readonly maxCurves?: number;
  /** Light: skip the distortion-limited power and both sweeps (the costly parts), carrying the previous ones. */
  readonly light?: boolean;
  /** The last analysis: its curve sheet is reused when tube, window, curve count and screen feed are unchanged. */
  readonly previous?: OutputAnalysis | null;
}

/**
 * Everything the output-stage screen shows, from the tube and the design.
 * The damping factor takes the cathode as bypassed and the transformer as
 * ideal apart from its primary resistance.
 */
export function analyzeOutput(tube: OutputTube, design: OutputDesign, optionsGiven: OutputAnalysisOptions | null = {}): Result<OutputAnalysis> {
  const solved = solveOutput(tube, design);
  if (!solved.ok) return solved;
  const s = solved;
  const chart = chartOptionsOf(optionsGiven, tube, design.bplus);
  if (!chart.ok) return chart;
  const { extent, maxCurves } = chart;
  const options: typeof chart.options & Partial<NonNullable<typeof optionsGiven>> = chart.options;
  // A previous analysis is only a cache: anything that does not look like one is ignored.
  const prev = typeof options.previous?.solution === 'object' && typeof options.previous?.sheet?.extent === 'object' ? options.previous : undefined;
  // On the light pass (a drag) the sheet is kept while the screen feed's kind is unchanged: the curves
  // of an ultralinear or cathode-biased pentode move a little with B+ and Vk, and are redrawn exactly
  // on the full pass at release. Redrawing the family every frame would cost the drag its frame rate.
  const light = options.light ?? false;
  const reuse =
    prev &&
    prev.solution.tube === tube &&
    prev.sheet.extent.vmax === extent.vmax &&
    prev.sheet.extent.iaMax === extent.iaMax &&
    prev.maxCurves === maxCurves &&
    (light ? prev.solution.op.feed.kind === s.op.feed.kind : sameFeed(prev.solution.op.feed, s.op.feed));
  const sheet = reuse ? prev.sheet : outputSheet(tube, s.op.feed, extent, maxCurves);
  // The light pass reads its two waveforms at the sweeps' resolution (agreeing to four digits).
  const samples = light ? SWEEP_SAMPLES : OUTPUT_SAMPLES;
  const clean = cleanLimit(s, design.zPrimary, samples);
  const full = atDrive(s, Math.max(0, -s.op.vgk), design.zPrimary, samples);
  const screenAtFull = s.op.feed.kind !== 'fixed' ? null : light ? (prev?.screenAtFull ?? null) : averageScreenCurrent(s, full.drive);
  const screenPlan = screenFeedPlan(design.bplus, design.screenVolts, s.op.ig2, design.screenFromNode);
  const sag = screenAtFull === null ? null : screenSagFinding(screenPlan, design.screenVolts, screenAtFull);
  // Two operating points, a small share of even the light pass: solved on every pass.
  const spreadResult = design.bias === 'cathode' ? outputSpread(s) : null;
  const spread = spreadResult?.ok ? spreadResult : null;
  const hot = spread ? spreadFinding(tube, spread) : null;
  const zOut = s.op.rp + design.rPrimary;
  const dampingFactor = Number.isFinite(zOut) && zOut > 0 ? design.zPrimary / zOut : 0;
  return {
    ok: true,
    solution: s,
    sheet,
    maxCurves,
    overlay: outputOverlay(s, extent, clean.at),
    clean,
    full,
    atLimit: light ? (prev?.atLimit ?? null) : powerAtDistortion(s, design.thdLimit),
    dampingFactor,
    outputImpedance: dampingFactor > 0 ? design.speakerOhms / dampingFactor : Infinity,
    turnsRatio: Math.sqrt(design.zPrimary / design.speakerOhms),
    findings: sag || hot ? bySeverity([...outputFindings(s, full.vpkMax), ...(sag ? [sag] : []), ...(hot ? [hot] : [])]) : outputFindings(s, full.vpkMax),
    sweep: light ? (prev?.sweep ?? []) : powerSweep(s),
    zSweep: light ? (prev?.zSweep ?? null) : zPrimarySweep(s),
    screenAtFull,
    settledCathode: settledOf(s, light, prev),
    spread,
  };
}

/** The settled cathode on the full pass (20 to 35 ms, more than a drag frame can spend); the light pass carries the last one. */
function settledOf(s: OutputSolution, light: boolean, prev: OutputAnalysis | undefined): SettledCathode | null {
  if (s.design.bias !== 'cathode') return null;
  if (light) return prev?.settledCathode ?? null;
  const r = settledCathode(s);
  return r.ok ? r : null;
}
