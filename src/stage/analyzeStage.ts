import { fail, type Failure, type Result } from '../result';
import type { ChainLink } from '../signal/solveLinks';
import { solvedStage } from '../signal/analysisInput';
import type { TubeRecord } from '../tube/types';
import { curveSheet, withGridLimit, type CurveSheet } from './curveSheet';
import { leakLimit } from './designAtPoint';
import { checkCount } from './checkInput';
import { DENSEST_FAMILY_CURVES, MAX_FAMILY_CURVES } from './planeSeries';
import { plateExtent, type PlateExtent } from './plateExtent';
import type { StageSolution } from './solveStage';
import type { StageDesign } from './stageDesign';
import { stageOverlay, type StageOverlay } from './stageOverlay';
import { followerProblem, stageSignal, type SignalLevels, type StageSignal } from './stageSignal';

/** Everything the workbench shows of a voltage stage on its plate curves: its solution, what the chart draws, and its signal. */
export interface StageAnalysis {
  readonly tube: TubeRecord;
  readonly solution: StageSolution;
  readonly overlay: StageOverlay;
  readonly sheet: CurveSheet;
  readonly signal: StageSignal;
  /** The most plate curves the sheet was drawn with. */
  readonly maxCurves: number;
}

export interface StageAnalysisOptions {
  /** The stage after it on the same bench (its follower, or a gain stage of a design from before the chain), or null. */
  readonly second: ChainLink | null;
  readonly levels: SignalLevels;
  /** Pins the chart's extent (as while B+ is dragged); the tube's own for this B+ otherwise. */
  readonly extent?: PlateExtent;
  /** A drag's frame: the signal's span on the load line only, the rest kept from `prev` and marked stale. */
  readonly light?: boolean;
  readonly maxCurves?: number;
}

/**
 * A voltage stage analysed for the workbench, as analyzeOutput is for the
 * output stage: one stage solve, one overlay, and the curve sheet only when
 * the tube or the chart's extent changed (the sheet of `prev` is reused otherwise, so
 * a drag never rebuilds the curve family). A second stage that cannot run
 * on this plate is a failure naming it (field 'stage2').
 */
export function analyzeStage(stage: StageDesign & { readonly tube: TubeRecord }, options: StageAnalysisOptions, prev: StageAnalysis | null): Result<StageAnalysis> {
  if (typeof options !== 'object' || options === null || typeof options.levels !== 'object' || options.levels === null) {
    return fail('invalid-input', 'Give the output level and THD limit the stage is analysed at', 'levels');
  }
  const { second = null, levels, light = false, maxCurves = MAX_FAMILY_CURVES } = options;
  const curves = checkCount('maxCurves', 'Plate curves', maxCurves, 1, DENSEST_FAMILY_CURVES);
  if (curves) return curves;
  const solved = solvedStage(stage);
  if (!solved.ok) return solved;
  const { checked, solution } = solved;
  const tube = stage.tube;
  const extent = options.extent ?? plateExtent(tube, stage.bplus);
  const sameSheet = prev && prev.tube === tube && prev.sheet.extent.vmax === extent.vmax && prev.sheet.extent.iaMax === extent.iaMax && prev.maxCurves === maxCurves;
  // The grid-leak limit moves with Rg, not with the window: a new leak redraws the sheet with its curve, a drag keeps it.
  const limit = leakLimit(tube, stage.rg ?? null);
  const base = sameSheet ? prev.sheet : curveSheet(tube, stage.bplus, extent, maxCurves);
  const sheet = base.gridLimit !== undefined && (base.gridLimit?.vg ?? 0) === limit ? base : withGridLimit(base, tube, limit);
  if (light) {
    const problem = followerProblem(solution.op.va, second);
    if (problem) return problem;
  }
  const signal = stageSignal({ checked, solution }, stage, second, levels, prev?.signal ?? null, light);
  // The stage itself solved above: what fails now is the second stage on it.
  if (signal.chain && !signal.chain.ok) return { ...signal.chain, field: 'stage2' } satisfies Failure;
  return { ok: true, tube, solution, overlay: stageOverlay(checked, solution.op, sheet.extent), sheet, signal, maxCurves };
}
