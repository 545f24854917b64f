import { fail, type Result } from '../result';
import { outputExtent } from '../output/outputSheet';
import { biasForPoint } from '../output/outputBias';
import { CUTOFF_SHARE } from '../output/outputSignal';
import { cycleForPower, driveToFloor, highestWithin, powerWithin, singleEndedTransfer, type GridTransfer } from '../output/gridTransfer';
import type { OutputDesign } from '../output/outputDesign';
import type { OutputTube } from '../output/outputTube';
import { outputTubeLibrary } from '../output/library/index';
import { solveOutput } from '../output/solveOutput';
import { checkOutputInput, checkOutputTube } from '../output/checkOutput';
import { pairBiasForPoint } from '../pushpull/pairBias';
import { pairTransfer } from '../pushpull/pairTransfer';
import { checkPushPull, type PushPullDesign } from '../pushpull/pushPullDesign';
import { plateToPlateImpedance } from '../pushpull/pushPullFigures';
import { solvePushPull } from '../pushpull/solvePushPull';
import { UNREACHABLE, UNREACHABLE_VERDICT, type PointVerdict } from './evaluatePoint';
import type { DesignVerdict } from './judgeDesign';
import { gridProblem, scanPlane, weakestOf, type PlaneBest, type PlaneRegion, type RegionGrid } from './planeRegion';
import { activeTargets, targetsProblem, type TargetName, type Targets } from './targets';
import { sharedMargin, verdictOf, type RatedLimits, type SharedFigures } from './verdict';

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
export type OutputTargetStage =
  | { readonly pair: 'single-ended'; readonly tube: OutputTube; readonly design: OutputDesign }
  | { readonly pair: 'push-pull'; readonly tube: OutputTube; readonly design: PushPullDesign };

/** The targets set that say something of an output stage (Rk's range only with cathode bias). */
export function outputTargetsOf(targets: Targets, stage: Pick<OutputTargetStage, 'design'>): TargetName[] {
  if (targetsProblem(targets)) return [];
  const cathode = typeof stage === 'object' && stage !== null && stage.design?.bias === 'cathode';
  return activeTargets(targets, 'output').filter((k) => k !== 'rkRange' || cathode);
}

/** What an output stage presents to its targets: the shared figures, and its large-signal ones worked out from one transfer when asked. */
interface OutputFigures extends SharedFigures {
  /** The clean grid swing to grid current or cutoff, V peak. */
  readonly headroom: () => number;
  /** The most power within a THD, W. */
  readonly powerWithin: (thd: number) => number;
  /** THD at a power (null past what the grid reaches before grid current), and the most power it reaches. */
  readonly thdAtPower: (power: number) => { readonly thd: number | null; readonly most: number };
}

function judgeOutputFigures(active: readonly TargetName[], targets: Targets, at: OutputFigures, limits: RatedLimits): PointVerdict {
  const margins: Partial<Record<TargetName, number>> = {};
  const values: Partial<Record<TargetName, number | null>> = {};
  for (const k of active) {
    const common = sharedMargin(k, at, limits, targets);
    if (common) {
      values[k] = common.value;
      margins[k] = common.margin;
      continue;
    }
    if (k === 'minPower') {
      const p = at.powerWithin(targets.minPower!.thd);
      values.minPower = p;
      margins.minPower = p / targets.minPower!.power - 1;
    } else if (k === 'maxThdAtPower') {
      // Held below grid current: a working power the grid cannot reach fails, by how far short the most it gives is.
      const want = targets.maxThdAtPower!;
      const r = at.thdAtPower(want.power);
      values.maxThdAtPower = r.thd;
      margins.maxThdAtPower = r.thd === null ? r.most / want.power - 1 : 1 - r.thd / want.thd;
    } else if (k === 'minGridHeadroom') {
      values.minGridHeadroom = at.headroom();
      margins.minGridHeadroom = at.headroom() / targets.minGridHeadroom! - 1;
    }
  }
  return verdictOf(active, margins, values, 0, at.rk);
}

const limitsOf = (tube: OutputTube): RatedLimits => ({ plateDissipation: tube.ratings.maxPlateDissipation, heaterCathode: tube.ratings.maxHeaterCathodeVoltage });

/** One output design against the targets: one solve, one transfer (only when a target needs the large signal). */
export function judgeOutputAt(stage: OutputTargetStage, targets: Targets, active: readonly TargetName[]): PointVerdict {
  // The transfer is built on the first target that needs the large signal, and only then.
  let transfer: GridTransfer | null = null;
  if (stage.pair === 'single-ended') {
    const solved = solveOutput(stage.tube, stage.design);
    if (!solved.ok) return UNREACHABLE_VERDICT;
    const { op, design } = solved;
    const t = () => (transfer ??= singleEndedTransfer(solved));
    return judgeOutputFigures(active, targets, {
      pa: op.pa,
      // The plate's source impedance (rp and the primary's resistance) seen through the turns ratio.
      zout: ((op.rp + design.rPrimary) * design.speakerOhms) / design.zPrimary,
      rk: design.bias === 'cathode' ? design.rk : 0,
      vhk: op.vk,
      headroom: () => driveToFloor(t(), CUTOFF_SHARE * op.ip) ?? t().span,
      powerWithin: (thd) => powerWithin(t(), thd).power,
      thdAtPower: (power) => {
        const r = cycleForPower(t(), power);
        return { thd: r.at?.thd ?? null, most: r.most };
      },
    }, limitsOf(stage.tube));
  }
  const solved = solvePushPull(stage.tube, stage.design);
  if (!solved.ok) return UNREACHABLE_VERDICT;
  const d = stage.design;
  const t = () => (transfer ??= pairTransfer(solved));
  const zpp = plateToPlateImpedance(solved);
  return judgeOutputFigures(active, targets, {
    pa: Math.max(solved.idle[0].pa, solved.idle[1].pa),
    zout: zpp === null ? Infinity : (zpp * d.speakerOhms) / d.raa,
    rk: d.bias === 'cathode' ? d.rk : 0,
    vhk: solved.vk,
    headroom: () => Math.max(0, Math.min(-solved.vgk, -solved.vgk2)),
    powerWithin: (thd) => highestWithin(t(), thd)?.power ?? 0,
    thdAtPower: (power) => {
      const r = cycleForPower(t(), power);
      return { thd: r.at?.thd ?? null, most: r.most };
    },
  }, limitsOf(stage.tube));
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
  const v = judgeOutputAt(stage, targets, outputTargetsOf(targets, stage));
  if (v.failing[0] === UNREACHABLE) return fail('invalid-input', 'This output stage does not solve: no operating point to judge', 'design');
  return { ok: true, failing: v.failing as TargetName[], margins: v.margins, values: v.values };
}

/** The bias and B+ that put the stage's tube (each tube of a pair) at a point of the plane. */
export interface OutputParts {
  readonly bplus: number;
  /** Cathode bias: the cathode resistor, Ω (the shared one for a pair). Fixed bias: 0. */
  readonly rk: number;
  /** Fixed bias: the grid supply, V. Cathode bias: the grid's voltage to its cathode, V. */
  readonly vg: number;
}

export interface OutputVerdict extends PointVerdict {
  readonly parts: OutputParts | null;
}

/** The stage moved to a point of the plane (its bias and B+ found as a drag finds them), or null where it cannot sit there. */
export function outputStageAt(stage: OutputTargetStage, vpk: number, ip: number): { readonly stage: OutputTargetStage; readonly parts: OutputParts } | null {
  const b = stage.pair === 'single-ended' ? biasForPoint(stage.tube, stage.design, vpk, ip) : pairBiasForPoint(stage.tube, stage.design, vpk, ip);
  if (!b.ok) return null;
  const cathode = stage.design.bias === 'cathode';
  const parts: OutputParts = { bplus: b.bplus, rk: cathode ? b.rk : 0, vg: b.vgk };
  const patch = cathode ? { bplus: b.bplus, rk: b.rk } : { bplus: b.bplus, vg: b.vgk };
  const moved = { ...stage, design: { ...stage.design, ...patch } } as OutputTargetStage;
  return { stage: moved, parts };
}

function judgePoint(stage: OutputTargetStage, targets: Targets, active: readonly TargetName[], vpk: number, ip: number): OutputVerdict {
  const at = outputStageAt(stage, vpk, ip);
  if (!at) return { ...UNREACHABLE_VERDICT, parts: null };
  const v = judgeOutputAt(at.stage, targets, active);
  return { ...v, parts: v.failing[0] === UNREACHABLE ? null : at.parts };
}

export interface OutputRegionBest extends PlaneBest {
  readonly parts: OutputParts;
}

export interface OutputRegion extends PlaneRegion {
  /** The bias and B+ at each point (null where unreachable). */
  readonly parts: readonly (readonly (OutputParts | null)[])[];
  readonly best: OutputRegionBest | null;
}

/**
 * Where on the output stage's plate plane every target holds, at its load:
 * each point the design whose bias and B+ put the tube there, solved once,
 * its large-signal targets read from one transfer (gridTransfer).
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
  const { cells, bestCell, ...region } = scanPlane(nx, ny, ext, active, (vpk, ip) => judgePoint(stage, targets, active, vpk, ip));
  return {
    ok: true,
    ...region,
    parts: cells.map((column) => column.map((v) => v.parts)),
    best: region.best && bestCell?.parts ? { ...region.best, parts: bestCell.parts } : null,
  };
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

/** The coarse look per tube, then a finer one around its best cell (as the gain stage's ranking). */
const COARSE = { nx: 16, ny: 12 };
const FINE = 7;

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
    const ext = outputExtent(tube, stage.design.bplus);
    const region = outputRegion(s, targets, { ...COARSE, extent: ext });
    if (!region.ok) {
      if (region.field === 'tube' || region.field === 'connection') continue;
      return region;
    }
    if (!region.best) continue;
    const dv = ext.vmax / COARSE.nx;
    const di = ext.iaMax / COARSE.ny;
    const centre = { vpk: region.va[region.best.i]!, ip: region.ia[region.best.j]! };
    let top = { ...centre, parts: region.best.parts, score: region.best.score, margins: region.best.margins };
    for (let a = 0; a < FINE; a++) {
      for (let b = 0; b < FINE; b++) {
        const vpk = centre.vpk + dv * ((a + 0.5) / FINE - 0.5);
        const ip = centre.ip + di * ((b + 0.5) / FINE - 0.5);
        const v = judgePoint(s, targets, active, vpk, ip);
        if (v.parts && v.score > top.score) top = { vpk, ip, parts: v.parts, score: v.score, margins: v.margins };
      }
    }
    ranks.push({ tubeId: tube.id, ...top, weakest: weakestOf(top.margins, active) });
  }
  return { ok: true, ranks: ranks.sort((x, y) => y.score - x.score) };
}
