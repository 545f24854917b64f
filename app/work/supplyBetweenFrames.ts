import { solveOnSupplyInRounds } from '../../src/index';
import type { SupplySolver } from '../store/supplySlice';

/**
 * Solves the amplifier on its supply on the page's own thread, one round of
 * stages and supply at a time (a few tens of milliseconds each), handing the
 * thread back between rounds so typing and drawing go on. Not in the worker:
 * that would carry a second copy of the whole amplifier model in the page's
 * download. A newer solve cancels an older one at its next round.
 */
export function supplyBetweenFrames(): SupplySolver {
  let latest = 0;
  return async (input) => {
    const mine = ++latest;
    const rounds = solveOnSupplyInRounds(input);
    for (;;) {
      const r = rounds.next();
      if (r.done) return r.value;
      await new Promise((resume) => setTimeout(resume, 0));
      if (mine !== latest) return 'cancelled';
    }
  };
}
