import { fail, type Failure } from '../result';
import { shown } from '../shown';

/**
 * What a builder asks of a stage, each optional: a target left out does not
 * count. Fractions are fractions (0.01 is 1 %), levels V rms, impedances Ω.
 */
export interface Targets {
  /** Least voltage gain into the load (magnitude), ×. */
  readonly minGain?: number;
  /** Least clean output (to the onset of grid current or cutoff), V rms. */
  readonly minCleanOutputRms?: number;
  /** Most THD (a fraction) at an output level, V rms, the level within the clean swing (a working level past it fails). */
  readonly maxThdAt?: { readonly outputRms: number; readonly thd: number };
  /** Most plate dissipation as a share of the rating. */
  readonly maxDissipationFraction?: number;
  /** Most output impedance at the plate, Ω. */
  readonly maxZout?: number;
  /** Plate and cathode resistors within these ranges, Ω. */
  readonly raRange?: readonly [number, number];
  readonly rkRange?: readonly [number, number];
  /** Least clean grid swing, V peak: the distance from the bias to the nearer of grid current and cutoff. */
  readonly minGridHeadroom?: number;
  /** The cathode's voltage to its heaters (at ground, unless the design holds them above it) within the tube's heater–cathode rating for its polarity. */
  readonly heaterCathodeWithinRating?: boolean;
  /** Output stages: the least power into the load (W) with THD at most `thd` (a fraction) and the grid never driven past 0 V. */
  readonly minPower?: { readonly power: number; readonly thd: number };
  /** Output stages: the most THD (a fraction) at an output power, W, the power within reach before grid current. */
  readonly maxThdAtPower?: { readonly power: number; readonly thd: number };
  /** Output stages: B+ within this range, V (what the supply can give: an output stage's point sets its B+). */
  readonly bplusRange?: readonly [number, number];
}

export type TargetName = keyof Targets;

/** Every target, in the order the bench lists them. */
export const TARGET_NAMES: readonly TargetName[] = ['minGain', 'minCleanOutputRms', 'maxThdAt', 'minPower', 'maxThdAtPower', 'maxDissipationFraction', 'maxZout', 'raRange', 'rkRange', 'bplusRange', 'minGridHeadroom', 'heaterCathodeWithinRating'];

/** What a stage on the bench is, as far as targets go. */
export type TargetStageKind = 'voltage' | 'follower' | 'output';

/**
 * The targets that say something of each kind of stage. A follower has no
 * plate resistor; an output stage is judged by its power and distortion
 * into the speaker (not a voltage gain or level), has no plate resistor,
 * and its output impedance is the one the speaker sees.
 */
export const TARGETS_OF_KIND: Readonly<Record<TargetStageKind, readonly TargetName[]>> = {
  voltage: ['minGain', 'minCleanOutputRms', 'maxThdAt', 'maxDissipationFraction', 'maxZout', 'raRange', 'rkRange', 'minGridHeadroom', 'heaterCathodeWithinRating'],
  follower: ['minGain', 'minCleanOutputRms', 'maxThdAt', 'maxDissipationFraction', 'maxZout', 'rkRange', 'minGridHeadroom', 'heaterCathodeWithinRating'],
  output: ['minPower', 'maxThdAtPower', 'maxDissipationFraction', 'maxZout', 'rkRange', 'bplusRange', 'minGridHeadroom', 'heaterCathodeWithinRating'],
};

/** Each target in a builder's words, for keys, readouts and messages. */
export const TARGET_LABELS: Readonly<Record<TargetName, string>> = {
  minGain: 'gain',
  minCleanOutputRms: 'clean output',
  maxThdAt: 'THD at level',
  maxDissipationFraction: 'plate dissipation',
  maxZout: 'output impedance',
  raRange: 'Ra range',
  rkRange: 'Rk range',
  minGridHeadroom: 'grid headroom',
  heaterCathodeWithinRating: 'heater–cathode',
  minPower: 'power',
  maxThdAtPower: 'THD at power',
  bplusRange: 'B+ range',
};

/** The targets that are set and say something of this kind of stage (a gain stage unless named), in TARGET_NAMES order. */
export function activeTargets(t: Targets, kind: TargetStageKind = 'voltage'): TargetName[] {
  const applies = TARGETS_OF_KIND[kind];
  return TARGET_NAMES.filter((k) => t[k] !== undefined && t[k] !== false && applies.includes(k));
}

const positive = (x: unknown): x is number => typeof x === 'number' && Number.isFinite(x) && x > 0;
const range = (x: unknown): x is readonly [number, number] => Array.isArray(x) && x.length === 2 && x.every((v) => typeof v === 'number' && Number.isFinite(v) && v >= 0) && x[0] <= x[1];

/** Checks a set of targets at the edge: a typed failure naming the first bad one, or null. */
export function targetsProblem(t: unknown): Failure | null {
  if (typeof t !== 'object' || t === null) return fail('invalid-input', 'Targets must be an object (every target optional)', 'targets');
  const x = t as Record<string, unknown>;
  const bad = (field: TargetName, what: string, got: unknown) => fail('invalid-input', `${TARGET_LABELS[field][0]!.toUpperCase()}${TARGET_LABELS[field].slice(1)}: ${what} (got ${shown(got as number)})`, `targets.${field}`);
  if (x.minGain !== undefined && !positive(x.minGain)) return bad('minGain', 'the least gain must be a number above 0', x.minGain);
  if (x.minCleanOutputRms !== undefined && !positive(x.minCleanOutputRms)) return bad('minCleanOutputRms', 'the least clean output must be above 0 V rms', x.minCleanOutputRms);
  if (x.maxThdAt !== undefined) {
    const m = x.maxThdAt as { outputRms?: unknown; thd?: unknown } | null;
    if (typeof m !== 'object' || m === null || !positive(m.outputRms) || !positive(m.thd) || !(m.thd < 1)) return bad('maxThdAt', 'give a level above 0 V rms and a THD between 0 and 1, as 0.01 for 1 %', m === null || typeof m !== 'object' ? m : m.thd);
  }
  for (const field of ['minPower', 'maxThdAtPower'] as const) {
    if (x[field] === undefined) continue;
    const m = x[field] as { power?: unknown; thd?: unknown } | null;
    if (typeof m !== 'object' || m === null || !positive(m.power) || !positive(m.thd) || !(m.thd < 1)) return bad(field, 'give a power above 0 W and a THD between 0 and 1, as 0.05 for 5 %', m === null || typeof m !== 'object' ? m : m.thd);
  }
  if (x.maxDissipationFraction !== undefined && !(positive(x.maxDissipationFraction) && x.maxDissipationFraction <= 1.5)) return bad('maxDissipationFraction', 'the share of the rating must be above 0 and at most 1.5', x.maxDissipationFraction);
  if (x.maxZout !== undefined && !positive(x.maxZout)) return bad('maxZout', 'the most output impedance must be above 0 Ω', x.maxZout);
  if (x.raRange !== undefined && !range(x.raRange)) return bad('raRange', 'give two resistances, the lower first', x.raRange);
  if (x.rkRange !== undefined && !range(x.rkRange)) return bad('rkRange', 'give two resistances, the lower first', x.rkRange);
  if (x.bplusRange !== undefined && !range(x.bplusRange)) return bad('bplusRange', 'give two voltages, the lower first', x.bplusRange);
  if (x.minGridHeadroom !== undefined && !positive(x.minGridHeadroom)) return bad('minGridHeadroom', 'the least grid swing must be above 0 V', x.minGridHeadroom);
  if (x.heaterCathodeWithinRating !== undefined && typeof x.heaterCathodeWithinRating !== 'boolean') return bad('heaterCathodeWithinRating', 'must be true or false', x.heaterCathodeWithinRating);
  return null;
}
