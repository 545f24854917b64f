import { designAtPlanePoint } from '../stage/designAtPoint';
import { normalizeStage, type StageDesign } from '../stage/stageDesign';
import { solveStage } from '../stage/solveStage';
import { distortionOf } from '../signal/distortion';
import { stageTransfer } from '../signal/stageTransfer';
import { swingOf } from '../signal/swing';
import { recordOf, type TubeLike } from '../tube/types';
import type { TargetName, Targets } from './targets';
import { judgeFigures } from './verdict';

/** The stage a region is drawn for: everything but Ra and Rk, which each point of the plane sets. */
export interface RegionStage {
  readonly tube: TubeLike;
  readonly bplus: number;
  /** The next stage's load, Ω (Infinity for none). */
  readonly rl: number;
  /** What drives the grid, Ω. */
  readonly rsource: number;
  readonly bypassed: boolean;
  /** The stage's own grid leak, Ω (default 1 MΩ). */
  readonly rg?: number;
  /** Its grid stopper, Ω (default 0, none): the grid's current past its onset flows through it. */
  readonly rstopper?: number;
  /** A volume control in the leak's place, its wiper's share of the track (absent: a fixed leak). */
  readonly volume?: number;
  /** The heaters' potential to ground, V (default 0): the heater–cathode target reads the cathode against it. */
  readonly heaterVolts?: number;
}

/** A point no cathode-biased stage on this B+ can sit at (above the 0 V grid curve, or past the load line's end). */
export const UNREACHABLE = 'unreachable';

export interface PointVerdict {
  /** The parts that put the stage there, Ω; NaN-free: 0 where unreachable. */
  readonly ra: number;
  readonly rk: number;
  /** The targets that fail here, or [UNREACHABLE]. */
  readonly failing: readonly string[];
  /** Each target's margin: 0 at its edge, positive inside (a share of the target), negative outside. */
  readonly margins: Partial<Record<TargetName, number>>;
  /** The smallest margin: how well the worst target is met (negative: by how much it is missed); −Infinity where unreachable. */
  readonly score: number;
  /**
   * What each target measures, in SI units and fractions: the gain's
   * magnitude, the clean output (V rms), THD (a fraction; null when the level
   * is past the clean swing), plate dissipation as a share of the rating
   * (null with no rating), Zout, Ra, Rk (Ω), the clean grid swing (V peak),
   * the cathode's voltage to its heater (V; negative with the heater above it).
   */
  readonly values: Partial<Record<TargetName, number | null>>;
}

/** Bisection steps for a point's clean swing: its edges to a millionth of the bracket, far finer than a target needs. */
const SWING_BISECTIONS = 20;
/** Samples per cycle for a point's THD: 32 resolve H2 to H9 and more (a hundredth of a percent at the levels targets name). */
const THD_SAMPLES = 32;
/** The asked level met to a thousandth: THD moves by a thousandth of itself at most. */
const LEVEL_TOLERANCE = 1e-3;

/** The verdict of a point or design that does not solve. */
export const UNREACHABLE_VERDICT: PointVerdict = Object.freeze({ ra: 0, rk: 0, failing: Object.freeze([UNREACHABLE]), margins: Object.freeze({}), score: -Infinity, values: Object.freeze({}) });
const unreachable = UNREACHABLE_VERDICT;

/**
 * One point of the plate plane against the targets: the Ra and Rk that put a
 * cathode-biased stage there, one solve of that stage, and from it every
 * target, the costly ones (swing, THD) only when a target needs them.
 */
export function evaluatePoint(stage: RegionStage, targets: Targets, active: readonly TargetName[], vpk: number, ia: number): PointVerdict {
  const at = designAtPlanePoint({ tube: stage.tube, bplus: stage.bplus, vpk, ia, rg: (stage.rg ?? 1e6) * (stage.volume ?? 1) });
  if (!at.ok) return unreachable;
  const design: StageDesign = { tube: stage.tube, bplus: stage.bplus, ra: at.ra, rk: at.rk, bypassed: stage.bypassed, rl: stage.rl, rsource: stage.rsource, rg: stage.rg ?? 1e6, rstopper: stage.rstopper ?? 0, ...(stage.volume !== undefined ? { volume: stage.volume } : {}), ...(stage.heaterVolts !== undefined ? { heaterVolts: stage.heaterVolts } : {}) };
  return judgeStage(design, targets, active);
}

/** One stage design against the targets (as evaluatePoint judges each point of the plane). */
export function judgeStage(design: StageDesign, targets: Targets, active: readonly TargetName[]): PointVerdict {
  const solution = solveStage(design);
  const checked = normalizeStage(design);
  if (!solution.ok || !checked.ok) return unreachable;
  const s = { checked, solution };
  const needsSwing = active.includes('minCleanOutputRms') || active.includes('minGridHeadroom') || active.includes('maxThdAt');
  const transfer = needsSwing ? stageTransfer(checked, solution.op) : null;
  const swing = transfer ? swingOf(s, transfer, SWING_BISECTIONS) : null;
  return judgeFigures(active, targets, {
    pa: solution.op.pa,
    zout: solution.zout,
    rk: design.rk,
    vhk: solution.op.vk - checked.heaterVolts,
    ra: design.ra,
    gain: Math.abs(solution.gain),
    clean: () => ({ outputRms: swing!.output.rms, inputPeak: swing!.inputPeak }),
    thdAt: (outputRms) => {
      const r = distortionOf(s, { outputRms }, { samples: THD_SAMPLES, levelTolerance: LEVEL_TOLERANCE }, { transfer: transfer!, swing: swing! });
      return r.ok ? r.thdPercent / 100 : null;
    },
  }, recordOf(design.tube) ?? null);
}
