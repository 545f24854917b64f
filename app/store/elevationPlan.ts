import { elevationDivider, type ElevationDivider, type Failure } from '../../src/index';
import type { BenchDesign } from './analysis';
import { elevationOf } from './heaterChoice';
import { voltageStages } from './stagePlans';

/** The divider holding the heaters where the design asks: the gain stage whose B+ it hangs from (by place), that B+, and the model's divider. */
export interface ElevationPlan {
  readonly stage: number;
  readonly fromVolts: number;
  readonly divider: ({ ok: true } & ElevationDivider) | Failure;
}

const plans = new WeakMap<BenchDesign, ElevationPlan | null>();

/**
 * The heater elevation's divider, from the lowest gain stage's B+ (the
 * best-filtered node a gain stage uses; the first such on a tie); null with
 * the heaters at ground. Remembered per design, so the build sheet, the
 * supply's loads and its table read one object.
 */
export function elevationPlanOf(d: BenchDesign): ElevationPlan | null {
  if (plans.has(d)) return plans.get(d)!;
  const volts = elevationOf(d.heaters);
  const gains = volts === 0 ? [] : voltageStages(d).flatMap((p, stage) => (p.kind === 'common-cathode' ? [{ stage, fromVolts: p.bplus }] : []));
  const lowest = gains.reduce<(typeof gains)[number] | undefined>((a, g) => (a && a.fromVolts <= g.fromVolts ? a : g), undefined);
  const plan = lowest ? { ...lowest, divider: elevationDivider(lowest.fromVolts, volts, d.series) } : null;
  plans.set(d, plan);
  return plan;
}
