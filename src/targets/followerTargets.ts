import { fail, type Result } from '../result';
import { solveAmplifier } from '../chain/solveAmplifier';
import type { ChainInput } from '../chain/chainTypes';
import { checkNumber, checkTube, LIMITS } from '../stage/checkInput';
import { followerRkFor } from '../stage/followerPlane';
import { solveFollower } from '../stage/solveFollower';
import { plateCurrent } from '../tube/triode';
import { recordOf, type TubeLike, type TubeRecord } from '../tube/types';
import { tubeLibrary } from '../tube/library';
import { UNREACHABLE, UNREACHABLE_VERDICT, type PointVerdict } from './evaluatePoint';
import { weakestOf } from './feasibleRegion';
import type { DesignVerdict } from './judgeDesign';
import type { TubeRank } from './rankTubes';
import { activeTargets, targetsProblem, type TargetName, type Targets } from './targets';
import { judgeFigures } from './verdict';

/**
 * Targets for a cathode follower. With its grid held by the plate before it,
 * a follower's point has one way to go: its Rk moves it along one line of the
 * plate plane, so where a gain stage's targets hold over an area, a
 * follower's hold over stretches of that line. Every target a gain stage has
 * applies but Ra's range (a follower has no plate resistor): gain (below 1),
 * clean output and grid headroom (to the onset of grid current or cutoff,
 * through its real load), THD at a level, plate dissipation, output
 * impedance, Rk's range, and the heater-to-cathode voltage, which a follower
 * runs high.
 */
export interface FollowerTargetStage {
  readonly tube: TubeLike;
  readonly bplus: number;
  /** The grid's voltage to ground: the plate before it, V. */
  readonly vgrid: number;
  /** The load on its cathode through the coupling capacitor, Ω (Infinity for none). */
  readonly rl: number;
  /** The heaters' potential to ground, V (default 0): the heater–cathode target reads the cathode against it. */
  readonly heaterVolts?: number;
}

/** The targets set that say something of a follower (not Ra's range: it has no plate resistor). */
export const followerTargetsOf = (targets: Targets): TargetName[] => activeTargets(targets, 'follower');

const unreachable = UNREACHABLE_VERDICT;

/** The follower as a one-stage amplifier (its grid held at `vgrid` by an ideal coupling): its clean limit and THD come from the chain's own composed transfer. */
function asChain(stage: FollowerTargetStage, rk: number): ChainInput {
  return {
    source: { rsource: 0 },
    stages: [{ kind: 'follower', tube: stage.tube, bplus: stage.bplus, rk, vbias: stage.vgrid, coupling: { kind: 'capacitor', cc: 1, rg: LIMITS.maxOhms } }],
    ...(Number.isFinite(stage.rl) ? { load: { rl: stage.rl } } : {}),
  };
}

/** A follower with cathode resistor `rk` against the targets: one solve, the chain's transfer only when a target needs it. */
export function judgeFollowerAt(stage: FollowerTargetStage, rk: number, targets: Targets, active: readonly TargetName[]): PointVerdict {
  const solved = solveFollower({ tube: stage.tube, bplus: stage.bplus, vgrid: stage.vgrid, rk, rl: stage.rl, ...(stage.heaterVolts !== undefined ? { heaterVolts: stage.heaterVolts } : {}) });
  if (!solved.ok) return unreachable;
  const needsSwing = active.includes('minCleanOutputRms') || active.includes('minGridHeadroom') || active.includes('maxThdAt');
  const want = targets.maxThdAt;
  const chain = needsSwing ? solveAmplifier(asChain(stage, rk), want ? { outputRms: want.outputRms } : undefined) : null;
  if (chain && !chain.ok) return unreachable;
  return judgeFigures(active, targets, {
    pa: solved.op.pa,
    zout: solved.zout,
    rk,
    vhk: solved.vhk,
    ra: 0,
    gain: solved.gain,
    // The follower's clean limit and THD from the chain's composed transfer (its grid swing: the chain's clean input).
    clean: () => ({ outputRms: chain!.output.rms, inputPeak: chain!.inputPeak }),
    thdAt: () => (chain!.atLevel?.ok ? chain!.atLevel.thd : null),
  }, recordOf(stage.tube) ?? null);
}

function stageProblem(stage: FollowerTargetStage) {
  if (typeof stage !== 'object' || stage === null) return fail('invalid-input', 'No follower given');
  return (
    checkTube(stage.tube) ??
    checkNumber('bplus', 'B+', stage.bplus, 'V', 0, LIMITS.maxVolts, { minExclusive: true }) ??
    checkNumber('vgrid', 'Grid voltage', stage.vgrid, 'V', -LIMITS.maxVolts, LIMITS.maxVolts) ??
    checkNumber('rl', 'RL', stage.rl, 'Ω', LIMITS.minOhms, LIMITS.maxOhms, { allowInfinity: true }) ??
    (stage.heaterVolts === undefined ? null : checkNumber('heaterVolts', 'Heater potential', stage.heaterVolts, 'V', -LIMITS.maxVolts, LIMITS.maxVolts))
  );
}

/** One follower design held against the targets (what the bench shows for the follower's point). */
export function judgeFollower(stage: FollowerTargetStage, rk: number, targets: Targets): Result<DesignVerdict> {
  const problem = targetsProblem(targets) ?? stageProblem(stage) ?? checkNumber('rk', 'Rk', rk, 'Ω', LIMITS.minOhms, LIMITS.maxOhms);
  if (problem) return problem;
  const v = judgeFollowerAt(stage, rk, targets, followerTargetsOf(targets));
  if (v.failing[0] === UNREACHABLE) return fail('invalid-input', 'This follower does not solve: no operating point to judge', 'rk');
  return { ok: true, failing: v.failing as TargetName[], margins: v.margins, values: v.values };
}

/** The stretches of a follower's line where its targets hold: sampled along the line, each sample a verdict. */
export interface FollowerRegion {
  /** Each sample's Rk, Ω, and where it sits on the plate plane (Vpk, V; Ia, A), most current first. */
  readonly rk: readonly number[];
  readonly vpk: readonly number[];
  readonly ia: readonly number[];
  readonly inside: readonly boolean[];
  readonly failing: readonly (readonly string[])[];
  /** The sample that meets the targets best, or null when none solves. */
  readonly best: { readonly index: number; readonly rk: number; readonly score: number; readonly weakest: TargetName | null; readonly margins: Partial<Record<TargetName, number>> } | null;
  /** Where no sample holds: the target failing at the most samples, and at what share. */
  readonly excludesMost: { readonly target: TargetName; readonly share: number } | null;
}

/** Samples along the line: a point every pixel or two at chart sizes. */
export const FOLLOWER_SAMPLES = 64;
/** The least current a sample may draw: the line's far end, near cutoff. */
const FLOOR_A = 2e-5;

/**
 * The follower's line from where its grid meets its cathode (its most
 * current) down to near cutoff, sampled evenly in current (each sample the Rk
 * that draws it, `followerRkFor`), each judged against the targets.
 */
export function followerRegion(stage: FollowerTargetStage, targets: Targets, samples = FOLLOWER_SAMPLES, rkRange: readonly [number, number] = [LIMITS.minOhms, LIMITS.maxOhms]): Result<FollowerRegion> {
  const problem = stageProblem(stage) ?? targetsProblem(targets);
  if (problem) return problem;
  if (!(Number.isInteger(samples) && samples >= 2 && samples <= 1000)) return fail('invalid-input', 'Sample the line at 2 to 1,000 points', 'samples');
  const active = followerTargetsOf(targets);
  // The most current: the cathode as low as the grid lets it (at the grid's voltage, or ground for a grid below it).
  const lowest = Math.min(Math.max(stage.vgrid, 0), stage.bplus);
  const top = plateCurrent(stage.tube, stage.bplus - lowest, stage.vgrid - lowest);
  if (!(top > FLOOR_A)) return fail('cutoff', 'The follower is cut off at this grid voltage, whatever its Rk', 'vgrid');
  const rks: number[] = [];
  const vpks: number[] = [];
  const ias: number[] = [];
  const inside: boolean[] = [];
  const failing: string[][] = [];
  let best: FollowerRegion['best'] = null;
  const fails = new Map<TargetName, number>();
  let solved = 0;
  for (let k = 0; k < samples; k++) {
    // Most current first; the very top (grid at the cathode's voltage) is left to the drag's own limit.
    const ia = top - ((top - FLOOR_A) * (k + 0.5)) / samples;
    const at = followerRkFor(stage, ia, rkRange);
    if (!at.ok) return at;
    const v = judgeFollowerAt(stage, at.rk, targets, active);
    const op = v.failing[0] === UNREACHABLE ? null : solveFollower({ tube: stage.tube, bplus: stage.bplus, vgrid: stage.vgrid, rk: at.rk, rl: stage.rl });
    rks.push(at.rk);
    vpks.push(op?.ok ? op.op.vpk : stage.bplus - at.rk * ia);
    ias.push(op?.ok ? op.op.ia : ia);
    inside.push(v.failing.length === 0);
    failing.push([...v.failing]);
    if (v.failing[0] === UNREACHABLE) continue;
    solved++;
    for (const f of v.failing) fails.set(f as TargetName, (fails.get(f as TargetName) ?? 0) + 1);
    if (!best || v.score > best.score) best = { index: k, rk: at.rk, score: v.score, weakest: weakestOf(v.margins, active), margins: v.margins };
  }
  let excludesMost: FollowerRegion['excludesMost'] = null;
  if (!inside.some(Boolean) && solved > 0) {
    for (const [target, count] of fails) if (!excludesMost || count / solved > excludesMost.share) excludesMost = { target, share: count / solved };
  }
  return { ok: true, rk: rks, vpk: vpks, ia: ias, inside, failing, best, excludesMost };
}

/**
 * Every tube (the library's, or those given) as the follower in this
 * socket, ranked by how well its best Rk meets the targets: best first.
 */
export function rankFollowers(targets: Targets, stage: Omit<FollowerTargetStage, 'tube'>, tubes: readonly TubeRecord[] = tubeLibrary): Result<{ ranks: TubeRank[] }> {
  if (!Array.isArray(tubes)) return fail('invalid-input', 'Tubes must be a list', 'tubes');
  const problem = targetsProblem(targets);
  if (problem) return problem;
  const active = followerTargetsOf(targets);
  const ranks: TubeRank[] = [];
  for (const tube of tubes) {
    const r = followerRegion({ ...stage, tube }, targets, 24);
    if (!r.ok) {
      if (r.reason === 'cutoff' || r.field === 'tube') continue;
      return r;
    }
    if (!r.best) continue;
    const b = r.best;
    ranks.push({ tubeId: tube.id, ra: 0, rk: b.rk, margins: b.margins, score: b.score, weakest: weakestOf(b.margins, active), vpk: r.vpk[b.index]!, ia: r.ia[b.index]! });
  }
  return { ok: true, ranks: ranks.sort((x, y) => y.score - x.score) };
}
