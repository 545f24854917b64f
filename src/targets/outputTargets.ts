import { fail, type Result } from '../result';
import { outputExtent } from '../output/outputSheet';
import type { OutputDesign } from '../output/outputDesign';
import type { OutputTube } from '../output/outputTube';
import { outputTubeLibrary } from '../output/library/index';
import { checkOutputInput, checkOutputTube } from '../output/checkOutput';
import { checkPushPull, type PushPullDesign } from '../pushpull/pushPullDesign';
import { UNREACHABLE_VERDICT, type PointVerdict } from './evaluatePoint';
import type { DesignVerdict } from './judgeDesign';
import { COSTLY_TARGETS, costlyPart, limitsOf, placeOutput, plainPart, solveOutputStage, type OutputParts, type OutputTargetStage, type SolvedOutput } from './outputPoint';
import { gridProblem, planeAxes, RANK_GRID, searchAroundBest, summarizePlane, weakestOf, type PlaneBest, type PlaneRegion, type RegionGrid } from './planeRegion';
import { refinePlane, type CostlyPart } from './refinePlane';
import { activeTargets, targetsProblem, type TargetName, type Targets } from './targets';
import { verdictOf } from './verdict';

export type { OutputParts, OutputTargetStage } from './outputPoint';

/**
 * Targets for an output stage: the power it gives within a distortion
 * limit, its THD at a working power, plate dissipation at idle against the
 * rating, output impedance at the speaker, Rk's range (cathode bias), the
 * grid's swing to grid current or cutoff, and the heater–cathode voltage.
 * On the output bench a point of the plate plane is a design: the bias (Rk
 * or the grid supply) and the B+ that put the tube there (as dragging the
 * point sets them), with the load, connection and screen as they are. So
 * the region over the plane answers "at this primary, where may the tube
 * idle and still give what I ask".
 */
export function outputTargetsOf(targets: Targets, stage: Pick<OutputTargetStage, 'design'>): TargetName[] {
  if (targetsProblem(targets)) return [];
  const cathode = typeof stage === 'object' && stage !== null && stage.design?.bias === 'cathode';
  return activeTargets(targets, 'output').filter((k) => k !== 'rkRange' || cathode);
}

/** Each target's margin and value from whichever part answers it, in the order the bench lists the targets. */
function verdictFrom(active: readonly TargetName[], plain: Pick<CostlyPart, 'margins' | 'values'>, costly: Pick<CostlyPart, 'margins' | 'values'> | null | undefined, rk: number): PointVerdict {
  const margins: Partial<Record<TargetName, number>> = {};
  const values: Partial<Record<TargetName, number | null>> = {};
  for (const k of active) {
    const from = k in plain.margins ? plain : costly;
    // A target no part answered is not met: never a silent pass.
    margins[k] = from && k in from.margins ? from.margins[k] : -1;
    values[k] = from?.values[k] ?? null;
  }
  return verdictOf(active, margins, values, 0, rk);
}

/** Every target judged at one solved stage: the plain ones from its figures, the costly ones from its transfer. */
function judgeSolved(s: SolvedOutput, targets: Targets, active: readonly TargetName[], tube: OutputTube): PointVerdict {
  return verdictFrom(active, plainPart(active, targets, s, limitsOf(tube)), costlyPart(active, targets, s), s.shared.rk);
}

function stageProblem(stage: OutputTargetStage) {
  if (typeof stage !== 'object' || stage === null) return fail('invalid-input', 'No output stage given');
  if (stage.pair === 'single-ended') return checkOutputInput(stage.tube, stage.design);
  if (stage.pair === 'push-pull') return checkPushPull(stage.tube, stage.design);
  return fail('invalid-input', 'The output stage is one tube (single-ended) or a pair (push-pull)', 'pair');
}

/** The output design on the bench held against the targets. */
export function judgeOutput(stage: OutputTargetStage, targets: Targets): Result<DesignVerdict> {
  const problem = targetsProblem(targets) ?? stageProblem(stage);
  if (problem) return problem;
  const s = solveOutputStage(stage);
  if (!s) return fail('invalid-input', 'This output stage does not solve: no operating point to judge', 'design');
  const v = judgeSolved(s, targets, outputTargetsOf(targets, stage), stage.tube);
  return { ok: true, failing: v.failing as TargetName[], margins: v.margins, values: v.values };
}

/** A point of the plane judged in full (the ranking's finer search). */
function judgePoint(stage: OutputTargetStage, targets: Targets, active: readonly TargetName[], vpk: number, ip: number): PointVerdict & { readonly parts: OutputParts | null } {
  const at = placeOutput(stage, vpk, ip);
  if (!at) return { ...UNREACHABLE_VERDICT, parts: null };
  return { ...judgeSolved(at.solved, targets, active, stage.tube), parts: at.parts };
}

export interface OutputRegionBest extends PlaneBest {
  readonly parts: OutputParts;
}

export interface OutputRegion extends PlaneRegion {
  /** The bias and B+ at each point (null where unreachable). */
  readonly parts: readonly (readonly (OutputParts | null)[])[];
  readonly best: OutputRegionBest | null;
}

/** Times the best cell may turn out, once worked out in full, not to be the best after all. */
const BEST_CHECKS = 8;

/**
 * Where on the output stage's plate plane every target holds, at its load.
 * Each point is the design whose bias and B+ put the tube there; every cell
 * is solved and judged on its plain targets, and the costly ones (from the
 * stage's transfer) are worked out along their edges and read between
 * neighbours elsewhere (refinePlane). The best cell is always worked out in
 * full.
 */
export function outputRegion(stage: OutputTargetStage, targets: Targets, grid: RegionGrid = {}): Result<OutputRegion> {
  const problem = stageProblem(stage) ?? targetsProblem(targets);
  if (problem) return problem;
  const nx = grid?.nx ?? 60;
  const ny = grid?.ny ?? 40;
  const ext = grid?.extent ?? outputExtent(stage.tube, stage.design.bplus);
  const bad = gridProblem(nx, ny, ext);
  if (bad) return bad;
  const active = outputTargetsOf(targets, stage);
  const costlyActive = active.filter((k) => COSTLY_TARGETS.includes(k));
  const limits = limitsOf(stage.tube);
  const { va, ia } = planeAxes(nx, ny, ext);
  const placed = va.map((v) => ia.map((i) => placeOutput(stage, v, i)));
  const work = (i: number, j: number): CostlyPart | null => {
    const p = placed[i]![j];
    return p ? costlyPart(costlyActive, targets, p.solved) : null;
  };
  const costly = costlyActive.length > 0 ? refinePlane(nx, ny, costlyActive, work) : null;
  const cellAt = (i: number, j: number): PointVerdict => {
    const p = placed[i]![j];
    if (!p) return UNREACHABLE_VERDICT;
    return verdictFrom(active, plainPart(active, targets, p.solved, limits), costly?.[i]![j], p.solved.shared.rk);
  };
  const cells = va.map((_, i) => ia.map((_, j) => cellAt(i, j)));
  let region = summarizePlane(va, ia, cells, active);
  // A best cell read between neighbours is worked out in full, and the best looked for again.
  for (let k = 0; k < BEST_CHECKS && region.best && costly && !costly[region.best.i]![region.best.j]!.exact; k++) {
    const { i, j } = region.best;
    costly[i]![j] = work(i, j);
    cells[i]![j] = cellAt(i, j);
    region = summarizePlane(va, ia, cells, active);
  }
  const { cells: _c, bestCell: _b, ...summary } = region;
  const parts = placed.map((column) => column.map((p) => p?.parts ?? null));
  const best = summary.best ? parts[summary.best.i]![summary.best.j] : null;
  return { ok: true, ...summary, parts, best: summary.best && best ? { ...summary.best, parts: best } : null };
}

/** An output tube's best design in the same socket. */
export interface OutputRank {
  readonly tubeId: string;
  readonly parts: OutputParts;
  readonly margins: Partial<Record<TargetName, number>>;
  readonly score: number;
  readonly weakest: TargetName | null;
  /** Where it idles on the plate plane, V and A. */
  readonly vpk: number;
  readonly ip: number;
}

/**
 * Every output tube (the library's, or those given) in the same socket, the
 * same load, bias kind and connection (a power triode is always a triode),
 * ranked by how well its best bias and B+ meet the targets: best first.
 */
export function rankOutputTubes(targets: Targets, stage: { readonly pair: OutputTargetStage['pair']; readonly design: OutputDesign | PushPullDesign }, tubes: readonly OutputTube[] = outputTubeLibrary): Result<{ ranks: OutputRank[] }> {
  if (!Array.isArray(tubes)) return fail('invalid-input', 'Tubes must be a list', 'tubes');
  if (typeof stage !== 'object' || stage === null || typeof stage.design !== 'object' || stage.design === null) return fail('invalid-input', 'No output stage given');
  const problem = targetsProblem(targets);
  if (problem) return problem;
  const ranks: OutputRank[] = [];
  for (const tube of tubes) {
    if (checkOutputTube(tube)) continue;
    const connection = tube.law.kind === 'triode' ? 'triode' : stage.design.connection;
    const s = { pair: stage.pair, tube, design: { ...stage.design, tubeId: tube.id, connection } } as OutputTargetStage;
    const active = outputTargetsOf(targets, s);
    // With a B+ range the plate cannot sit above its top: the coarse look is spent on the voltages it can reach.
    const whole = outputExtent(tube, stage.design.bplus);
    const ext = targets.bplusRange ? { ...whole, vmax: Math.min(whole.vmax, Math.max(targets.bplusRange[1], 1) * 1.02) } : whole;
    const region = outputRegion(s, targets, { ...RANK_GRID, extent: ext });
    if (!region.ok) {
      if (region.field === 'tube' || region.field === 'connection') continue;
      return region;
    }
    if (!region.best) continue;
    const start = { ...UNREACHABLE_VERDICT, failing: [], score: region.best.score, margins: region.best.margins, parts: region.best.parts as OutputParts | null };
    const top = searchAroundBest(region, ext, start, (vpk, ip) => judgePoint(s, targets, active, vpk, ip));
    if (!top?.verdict.parts) continue;
    const v = top.verdict;
    ranks.push({ tubeId: tube.id, vpk: top.vpk, ip: top.ia, parts: v.parts!, score: v.score, margins: v.margins, weakest: weakestOf(v.margins, active) });
  }
  return { ok: true, ranks: ranks.sort((x, y) => y.score - x.score) };
}
