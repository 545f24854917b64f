import {
  curveSheet,
  findTube,
  normalizeStage,
  plateExtent,
  solveStage,
  stageOverlay,
  type CurveSheet,
  type Failure,
  type PlateExtent,
  type PreferredSeries,
  type StageOverlay,
  type StageSolution,
  type TubeRecord,
} from '../../src/index';

/** The design as the bench holds it: what the user chose, in SI units. */
export interface BenchDesign {
  readonly tubeId: string;
  readonly bplus: number;
  readonly ra: number;
  readonly rk: number;
  readonly bypassed: boolean;
  /** Next-stage load, Ω; Infinity for none. */
  readonly rl: number;
  /** Preferred-value series resistors snap to when a drag ends. */
  readonly series: PreferredSeries;
  readonly snap: boolean;
}

/** Everything the screen shows that the model derives from a design. */
export interface Analysis {
  readonly tube: TubeRecord;
  readonly solution: StageSolution;
  readonly overlay: StageOverlay;
  readonly sheet: CurveSheet;
}

/**
 * Runs the model for a design: one stage solve, one overlay, and the curve
 * sheet only when the tube or the chart window changed (the sheet of `prev`
 * is reused otherwise, so a drag never rebuilds the curve family). `extent`
 * pins the chart window, as while B+ is being dragged.
 */
export function analyze(design: BenchDesign, prev: Analysis | null, extent?: PlateExtent): ({ ok: true } & Analysis) | Failure {
  const tube = findTube(design.tubeId);
  if (!tube) return { ok: false, reason: 'invalid-tube', message: `No tube called “${design.tubeId}” in the library`, field: 'tube' };
  const stage = { tube, bplus: design.bplus, ra: design.ra, rk: design.rk, bypassed: design.bypassed, rl: design.rl };
  const solution = solveStage(stage);
  if (!solution.ok) return solution;
  const checked = normalizeStage(stage);
  if ('ok' in checked) return checked;
  const window = extent ?? plateExtent(tube, design.bplus);
  const sameSheet = prev && prev.tube === tube && prev.sheet.extent.vmax === window.vmax && prev.sheet.extent.iaMax === window.iaMax;
  const sheet = sameSheet ? prev.sheet : curveSheet(tube, design.bplus, window);
  return { ok: true, tube, solution, overlay: stageOverlay(checked, solution.op, sheet.extent), sheet };
}
