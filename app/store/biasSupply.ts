import { outputBiasSupply, pairBiasSupply, type FixedBiasSupply, type Result } from '../../src/index';
import { biasDesignOf, type BiasPlan } from './supplyPlan';
import type { WorkbenchState, WorkbenchStore } from './workbenchStore';

/** The bias supply per settled analysis of the output stage, with the plan and mains it was solved for (tens of milliseconds a solve: once each). */
const memo = new WeakMap<object, { plan: BiasPlan; mainsHz: number; channels: number; result: Result<FixedBiasSupply> }>();

/** Whether the amplifier ends in a fixed-bias output stage, the one stage a bias supply feeds. */
export const needsBiasSupply = (s: WorkbenchState) => (s.design.stageKind === 'output' || s.design.drivesOutput) && s.design.output.bias === 'fixed';

/** What the bias supply's readers show: its last solve, and whether the design has moved on since. */
export interface BiasView {
  readonly result: Result<FixedBiasSupply>;
  readonly stale: boolean;
}

/** How long the design must hold still before the bias supply is solved again, ms (a solve takes tens of milliseconds: not on every keystroke). */
export const BIAS_SETTLE_MS = 150;

/**
 * The fixed-bias output stage's grid supply as last solved (watchBias);
 * null when the output stage is cathode-biased or not part of the amplifier,
 * and until the first solve comes in.
 */
export function biasSupplyOf(s: WorkbenchState): Result<FixedBiasSupply> | null {
  return needsBiasSupply(s) ? (s.biasView?.result ?? null) : null;
}

/**
 * Keeps the bias supply following the design: marked stale at once when the
 * output stage or the plan changes, solved once they hold still for
 * BIAS_SETTLE_MS (so typing and a drag's release pay nothing for it), and
 * dropped when the output stage no longer needs one.
 */
export function watchBias(store: WorkbenchStore): void {
  let timer: ReturnType<typeof setTimeout> | undefined;
  const solve = () => {
    const s = store.getState();
    store.setState({ biasView: needsBiasSupply(s) ? { result: solveBiasFor(s), stale: false } : null });
  };
  store.subscribe((s, prev) => {
    if (s.outputBench === prev.outputBench && s.design.supply === prev.design.supply && s.design.output.bias === prev.design.output.bias && s.design.drivesOutput === prev.design.drivesOutput && s.design.stageKind === prev.design.stageKind) return;
    clearTimeout(timer);
    if (!needsBiasSupply(s)) {
      if (s.biasView !== null) store.setState({ biasView: null });
      return;
    }
    if (s.biasView && !s.biasView.stale) store.setState({ biasView: { ...s.biasView, stale: true } });
    timer = setTimeout(solve, BIAS_SETTLE_MS);
  });
  if (needsBiasSupply(store.getState())) timer = setTimeout(solve, BIAS_SETTLE_MS);
}

/** The bias supply for the state's settled output analysis and plan (the model's solve, once per pair of them). */
function solveBiasFor(s: WorkbenchState): Result<FixedBiasSupply> {
  const b = s.outputBench;
  const plan = s.design.supply.bias;
  const mainsHz = s.design.supply.mainsHz;
  const hit = memo.get(b.settled);
  const channels = s.design.supply.channels;
  if (hit && hit.plan === plan && hit.mainsHz === mainsHz && hit.channels === channels) return hit.result;
  const design = biasDesignOf(s.design.supply);
  const result = b.pair === 'push-pull' ? pairBiasSupply(b.settled, design, channels) : outputBiasSupply(b.settled, design, channels);
  memo.set(b.settled, { plan, mainsHz, channels, result });
  return result;
}

/** A fixed-bias single tube's hum at the speaker from its grid's ripple, V rms; null for a pair, cathode bias or a bias supply that does not solve. */
export function biasHumOf(s: WorkbenchState): number | null {
  const b = biasSupplyOf(s);
  return b?.ok ? b.humAtSpeaker : null;
}
