import { heaterCathodeRating } from '../stage/ratingBands';
import type { TubeRecord } from '../tube/types';
import type { TargetName, Targets } from './targets';
import type { PointVerdict } from './evaluatePoint';

/** The largest margin reported either way: a target met a million times over is met. */
const MAX_MARGIN = 1e6;

/** The margin of a value inside a range: positive inside, 0 at an end, negative outside (a share of the end it passes). */
export const withinRange = (x: number, [lo, hi]: readonly [number, number]): number => Math.min(lo > 0 ? x / lo - 1 : Infinity, hi > 0 ? 1 - x / hi : -1);

/** What a stage presents to its targets, whatever its kind. */
export interface StageFigures {
  /** Plate dissipation, W; output impedance, Ω; the cathode resistor, Ω; the cathode's voltage to its heater, V. */
  readonly pa: number;
  readonly zout: number;
  readonly rk: number;
  readonly vhk: number;
  /** The plate resistor, Ω (0 for a follower, which has none). */
  readonly ra: number;
  /** The voltage gain's magnitude. */
  readonly gain: number;
  /** The clean output (V rms) and the grid swing to the nearer limit (V peak), worked out only when a target needs them. */
  readonly clean: () => { readonly outputRms: number; readonly inputPeak: number };
  /** THD (a fraction) at an output level within the clean swing, or null where it cannot be had. */
  readonly thdAt: (outputRms: number) => number | null;
}

/** What every stage kind shares with the targets: plate dissipation, output impedance, Rk and the cathode's voltage to its heater. */
export type SharedFigures = Pick<StageFigures, 'pa' | 'zout' | 'rk' | 'vhk'>;

/**
 * The ratings the shared targets are held to: plate dissipation, W, and the
 * heater–cathode voltage with the cathode positive and negative to the
 * heater, V (the same figure where the sheet gives one); null where the tube
 * has none.
 */
export interface RatedLimits {
  readonly plateDissipation: number | null;
  readonly heaterCathode: number | null;
  readonly heaterCathodeNegative: number | null;
}

/** A small-signal tube's limits (none for an unknown tube; no heater–cathode rating for a directly heated one). */
export function limitsOfRecord(rec: TubeRecord | null): RatedLimits {
  return {
    plateDissipation: rec ? rec.ratings.maxPlateDissipation : null,
    heaterCathode: rec && !rec.directlyHeated ? (heaterCathodeRating(rec.ratings)?.cathodePositive ?? null) : null,
    heaterCathodeNegative: rec && !rec.directlyHeated ? (heaterCathodeRating(rec.ratings)?.cathodeNegative ?? null) : null,
  };
}

/**
 * The targets every stage kind judges alike (plate dissipation against the
 * rating, output impedance, Rk's range, heater–cathode against its rating):
 * the value and the margin, or null for a target that is not one of these.
 * A rating the tube does not have is met (margin 0) rather than guessed.
 */
export function sharedMargin(k: TargetName, at: SharedFigures, limits: RatedLimits, targets: Targets): { readonly value: number | null; readonly margin: number } | null {
  switch (k) {
    case 'maxDissipationFraction': {
      const pd = limits.plateDissipation;
      return pd ? { value: at.pa / pd, margin: 1 - at.pa / pd / targets.maxDissipationFraction! } : { value: null, margin: 0 };
    }
    case 'maxZout':
      return { value: at.zout, margin: 1 - at.zout / targets.maxZout! };
    case 'rkRange':
      return { value: at.rk, margin: withinRange(at.rk, targets.rkRange!) };
    case 'heaterCathodeWithinRating': {
      // Against the rating for its polarity: a cathode below heaters held above it meets the (often lower) negative figure.
      const hk = at.vhk >= 0 ? limits.heaterCathode : limits.heaterCathodeNegative;
      return { value: at.vhk, margin: hk ? 1 - Math.abs(at.vhk) / hk : 0 };
    }
    default:
      return null;
  }
}

/** Every active target judged from a stage's figures: each one's value and margin, and the verdict. */
export function judgeFigures(active: readonly TargetName[], targets: Targets, at: StageFigures, rec: TubeRecord | null): PointVerdict {
  const margins: Partial<Record<TargetName, number>> = {};
  const values: Partial<Record<TargetName, number | null>> = {};
  const limits = limitsOfRecord(rec);
  for (const k of active) {
    const common = sharedMargin(k, at, limits, targets);
    if (common) {
      values[k] = common.value;
      margins[k] = common.margin;
      continue;
    }
    switch (k) {
      case 'minGain':
        values.minGain = at.gain;
        margins.minGain = at.gain / targets.minGain! - 1;
        break;
      case 'minCleanOutputRms':
        values.minCleanOutputRms = at.clean().outputRms;
        margins.minCleanOutputRms = at.clean().outputRms / targets.minCleanOutputRms! - 1;
        break;
      case 'maxThdAt': {
        // Held within the clean swing: a working level past grid current or cutoff fails, by how far it is past.
        const want = targets.maxThdAt!;
        const clean = at.clean().outputRms;
        if (want.outputRms > clean) {
          values.maxThdAt = null;
          margins.maxThdAt = clean / want.outputRms - 1;
          break;
        }
        const thd = at.thdAt(want.outputRms);
        values.maxThdAt = thd;
        margins.maxThdAt = thd !== null ? 1 - thd / want.thd : -1;
        break;
      }
      case 'raRange':
        values.raRange = at.ra;
        margins.raRange = withinRange(at.ra, targets.raRange!);
        break;
      case 'minGridHeadroom':
        values.minGridHeadroom = at.clean().inputPeak;
        margins.minGridHeadroom = at.clean().inputPeak / targets.minGridHeadroom! - 1;
        break;
      default:
        break;
    }
  }
  return verdictOf(active, margins, values, at.ra, at.rk);
}

/** The verdict from each target's margin: held to ±MAX_MARGIN (a denormal target would overflow), the failing ones, the smallest. */
export function verdictOf(active: readonly TargetName[], margins: Partial<Record<TargetName, number>>, values: Partial<Record<TargetName, number | null>>, ra: number, rk: number): PointVerdict {
  let score = Infinity;
  const failing: string[] = [];
  for (const k of active) {
    const m = (margins[k] = Number.isNaN(margins[k]) ? -1 : Math.max(-MAX_MARGIN, Math.min(MAX_MARGIN, margins[k]!)));
    if (m < 0) failing.push(k);
    if (m < score) score = m;
  }
  return { ra, rk, failing, margins, score: active.length === 0 ? 0 : score, values };
}
