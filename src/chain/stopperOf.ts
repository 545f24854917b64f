import type { ChainStage } from './chainTypes';

/**
 * A stage's grid stopper, Ω (0: none): in series between what feeds its grid
 * (its grid leak, or the plate before it when direct-coupled) and its grid,
 * so whatever its grid draws (the small-signal slope of its grid current,
 * its current past the onset, its Miller capacitance) is fed through it.
 * Every triode kind carries one (a long-tailed pair's at its driven grid);
 * output stages none (theirs are on their own parts lists, outside the band).
 */
export function stopperOf(stage: ChainStage): number {
  return stage.kind === 'single-ended-output' || stage.kind === 'push-pull-output' ? 0 : (stage.rstopper ?? 0);
}
