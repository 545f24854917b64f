import { activeTargets, type Targets, type TargetStageKind } from '../../src/index';

/**
 * The targets as the bench holds them: each box empty (null) or a value, in
 * SI units and fractions. Part of the design, so undo, autosave, files and
 * links carry them.
 */
export interface TargetPlan {
  readonly minGain: number | null;
  readonly minCleanOutputRms: number | null;
  /** THD at most `maxThd` (a fraction) at `thdLevelRms`: both set, or the target is off. */
  readonly thdLevelRms: number | null;
  readonly maxThd: number | null;
  readonly maxDissipationFraction: number | null;
  readonly maxZout: number | null;
  readonly raMin: number | null;
  readonly raMax: number | null;
  readonly rkMin: number | null;
  readonly rkMax: number | null;
  readonly minGridHeadroom: number | null;
  readonly heaterCathodeWithinRating: boolean;
  /** Output stages: at least `minPowerW` (W) within `powerThd` (a fraction): both set, or the target is off. */
  readonly minPowerW: number | null;
  readonly powerThd: number | null;
  /** Output stages: THD at most `maxThdAtPower` (a fraction) at `thdPowerW` (W): both set, or the target is off. */
  readonly thdPowerW: number | null;
  readonly maxThdAtPower: number | null;
  /** Output stages: B+ within these ends (either may be open), V. */
  readonly bplusMin: number | null;
  readonly bplusMax: number | null;
}

export const NO_TARGETS: TargetPlan = Object.freeze({
  minGain: null, minCleanOutputRms: null, thdLevelRms: null, maxThd: null, maxDissipationFraction: null, maxZout: null,
  raMin: null, raMax: null, rkMin: null, rkMax: null, minGridHeadroom: null, heaterCathodeWithinRating: false,
  minPowerW: null, powerThd: null, thdPowerW: null, maxThdAtPower: null, bplusMin: null, bplusMax: null,
});

/** A range from two optional ends: one end alone leaves the other open. */
const rangeOf = (lo: number | null, hi: number | null): readonly [number, number] | undefined =>
  lo === null && hi === null ? undefined : [lo ?? 0, hi ?? 1e12];

/** The model's targets for the plan: the boxes that hold a value. */
export function targetsOf(p: TargetPlan): Targets {
  const ra = rangeOf(p.raMin, p.raMax);
  const rk = rangeOf(p.rkMin, p.rkMax);
  const bplus = rangeOf(p.bplusMin, p.bplusMax);
  return {
    ...(p.minGain !== null ? { minGain: p.minGain } : {}),
    ...(p.minCleanOutputRms !== null ? { minCleanOutputRms: p.minCleanOutputRms } : {}),
    ...(p.thdLevelRms !== null && p.maxThd !== null ? { maxThdAt: { outputRms: p.thdLevelRms, thd: p.maxThd } } : {}),
    ...(p.maxDissipationFraction !== null ? { maxDissipationFraction: p.maxDissipationFraction } : {}),
    ...(p.maxZout !== null ? { maxZout: p.maxZout } : {}),
    ...(ra ? { raRange: ra } : {}),
    ...(rk ? { rkRange: rk } : {}),
    ...(p.minGridHeadroom !== null ? { minGridHeadroom: p.minGridHeadroom } : {}),
    ...(p.heaterCathodeWithinRating ? { heaterCathodeWithinRating: true } : {}),
    ...(p.minPowerW !== null && p.powerThd !== null ? { minPower: { power: p.minPowerW, thd: p.powerThd } } : {}),
    ...(p.thdPowerW !== null && p.maxThdAtPower !== null ? { maxThdAtPower: { power: p.thdPowerW, thd: p.maxThdAtPower } } : {}),
    ...(bplus ? { bplusRange: bplus } : {}),
  };
}

/** A design's three plans: the gain stage's, its follower's and the output stage's, each kept apart. */
interface Planned {
  readonly stageKind: string;
  readonly targets: TargetPlan;
  readonly followerTargets: TargetPlan;
  readonly outputTargets: TargetPlan;
}

/** The targets of the stage the bench shows (a target set for one stage says nothing of another's). */
export const targetPlanOf = (d: Planned): TargetPlan => (d.stageKind === 'output' ? d.outputTargets : d.stageKind === 'follower' ? d.followerTargets : d.targets);

/** The design with the shown stage's targets replaced. */
export function withTargetPlan<D extends Planned>(d: D, plan: TargetPlan): D {
  return d.stageKind === 'output' ? { ...d, outputTargets: plan } : d.stageKind === 'follower' ? { ...d, followerTargets: plan } : { ...d, targets: plan };
}

/** True when at least one target is set that says something of this kind of stage. */
export const anyTarget = (p: TargetPlan, kind: TargetStageKind = 'voltage') => activeTargets(targetsOf(p), kind).length > 0;
