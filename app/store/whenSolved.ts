import type { WorkbenchState, WorkbenchStore } from './workbenchStore';

/**
 * Whether a background solve for the current design is still to come: the
 * B+ supply's (in the model worker, after SUPPLY_SETTLE_MS) or the bias
 * supply's (after BIAS_SETTLE_MS). Their views keep the last solve, marked
 * stale, until then. A view never solved (none yet) is not waited for.
 */
export const solvesPending = (s: WorkbenchState): boolean => (s.design.supply.on && s.supplyView?.stale === true) || s.biasView?.stale === true;

/** How long an export waits for the supplies to catch up with the design, ms: longer than any solve of ours takes here. */
export const EXPORT_WAIT_MS = 20_000;

/**
 * Resolves true once no supply solve is pending for the design, false if
 * one still is after `timeoutMs`. An export waits on it, so a card made just
 * after a change prints the supply of the design it shows, not the last one.
 */
export function whenSolved(store: WorkbenchStore, timeoutMs = EXPORT_WAIT_MS): Promise<boolean> {
  if (!solvesPending(store.getState())) return Promise.resolve(true);
  return new Promise((resolve) => {
    const done = (settled: boolean) => {
      clearTimeout(timer);
      unsubscribe();
      resolve(settled);
    };
    const timer = setTimeout(() => done(false), timeoutMs);
    const unsubscribe = store.subscribe((s) => {
      if (!solvesPending(s)) done(true);
    });
  });
}
