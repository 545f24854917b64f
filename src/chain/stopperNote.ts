import { millerInputCapacitance } from '../stage/gainFormulas';
import type { Finding } from '../stage/ratingBands';
import { stopperFinding } from '../stage/stopperFinding';
import { recordOf, type TubeLike } from '../tube/types';

/**
 * What a follower's or a splitter's grid stopper does to its band, as a gain
 * stage's says (stopperFinding): its own corner with the grid's input
 * capacitance by the Miller effect, Cgp·(1 − Ap) + Cgk·(1 − Ak), from the
 * stage's grid-to-plate gain Ap and grid-to-cathode gain Ak. A follower's
 * plate sits at signal ground (Ap = 0) and its cathode follows the grid, so
 * its input capacitance is about Cgp alone. None without a stopper or a
 * record's capacitances.
 */
export function stopperNote(tube: TubeLike, rstopper: number | undefined, plateGain: number, cathodeGain: number): Finding | null {
  const caps = recordOf(tube)?.capacitances;
  if (!caps || !(rstopper !== undefined && rstopper > 0)) return null;
  return stopperFinding(rstopper, millerInputCapacitance(caps.cgk, caps.cgp, plateGain, cathodeGain));
}
