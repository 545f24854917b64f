import { gridTransfer, TRANSFER_NODES, type GridTransfer } from '../output/gridTransfer';
import { pushPullInstant } from './pushPullDrive';
import type { PushPullSolution } from './solvePushPull';

/**
 * A push-pull pair's transfer (grids at Vgk + x and Vgk2 − x), over the
 * drives that keep both grids at or below 0 V. The current at each node is
 * the lower of the two tubes'; a pair's limit is grid current, a tube cutting
 * off being class AB at work.
 */
export function pairTransfer(s: PushPullSolution, nodes = TRANSFER_NODES): GridTransfer {
  const instant = pushPullInstant(s);
  const span = Math.max(0, Math.min(-s.vgk, -s.vgk2));
  // A matched pair at one bias is the same circuit with its halves swapped when the drive changes sign.
  const matched = s.tube2 === s.tube && s.vgk2 === s.vgk && s.idle[0].mmf === s.idle[1].mmf;
  return gridTransfer(span, s.design.raa / 4, (x, out) => {
    const w = instant.solve(s.vgk + x, s.vgk2 - x);
    out.current = Math.min(instant.c1.ip, instant.c2.ip);
    return w;
  }, nodes, matched);
}
