import { outputBiasSupply, pairBiasSupply, type FixedBiasSupply, type Result } from '../../src/index';
import { biasDesignOf, type BiasPlan } from './supplyPlan';
import type { WorkbenchState } from './workbenchStore';

/** The bias supply per settled analysis of the output stage, with the plan and mains it was solved for (tens of milliseconds a solve: once each). */
const memo = new WeakMap<object, { plan: BiasPlan; mainsHz: number; result: Result<FixedBiasSupply> }>();

/** Whether the amplifier ends in a fixed-bias output stage, the one stage a bias supply feeds. */
export const needsBiasSupply = (s: WorkbenchState) => (s.design.stageKind === 'output' || s.design.drivesOutput) && s.design.output.bias === 'fixed';

/**
 * The fixed-bias output stage's grid supply, from the output stage's last
 * full analysis (a drag's light pass leaves its idle, and so the strings,
 * where they were); null when the output stage is cathode-biased or not part
 * of the amplifier.
 */
export function biasSupplyOf(s: WorkbenchState): Result<FixedBiasSupply> | null {
  if (!needsBiasSupply(s)) return null;
  const b = s.outputBench;
  const plan = s.design.supply.bias;
  const mainsHz = s.design.supply.mainsHz;
  const hit = memo.get(b.settled);
  if (hit && hit.plan === plan && hit.mainsHz === mainsHz) return hit.result;
  const design = biasDesignOf(s.design.supply);
  const result = b.pair === 'push-pull' ? pairBiasSupply(b.settled, design) : outputBiasSupply(b.settled, design);
  memo.set(b.settled, { plan, mainsHz, result });
  return result;
}

/** A fixed-bias single tube's hum at the speaker from its grid's ripple, V rms; null for a pair, cathode bias or a bias supply that does not solve. */
export function biasHumOf(s: WorkbenchState): number | null {
  const b = biasSupplyOf(s);
  return b?.ok ? b.humAtSpeaker : null;
}
