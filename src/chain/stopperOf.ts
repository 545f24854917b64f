import type { ChainStage } from './chainTypes';

/**
 * A stage's grid stopper, Ω (0: none): in series between its grid leak and
 * its grid, so whatever its grid draws (the small-signal slope of its grid
 * current, its current past the onset, its Miller capacitance) is fed
 * through it. Gain stages carry one; other kinds none.
 */
export function stopperOf(stage: ChainStage): number {
  return stage.kind === 'common-cathode' ? (stage.rstopper ?? 0) : 0;
}
