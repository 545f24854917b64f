import type { StagePins } from '../chain/chainTypes';
import type { PushPullSolution } from '../pushpull/solvePushPull';
import { screenVoltage } from './electrodes';
import type { OutputPoint } from './solveOutput';

/**
 * A single-ended output tube's electrodes at idle, chassis to each, V: what
 * a meter reads at first switch-on. At DC the winding drops nothing, so an
 * ultralinear tap sits at the primary's B+ end and a tied screen at the plate.
 */
export function singleEndedPins(op: OutputPoint): StagePins {
  return { plate: op.vpk + op.vk, cathode: op.vk, grid: op.vk + op.vgk, screen: op.vk + screenVoltage(op.feed, op.vpk, 0), plate2: null, plate2Current: null };
}

/** A push-pull pair's, its first tube's (the second's differs only by a mismatch): the cathodes shared, the screens on the taps or their feed. */
export function pushPullPins(s: PushPullSolution): StagePins {
  const one = s.idle[0];
  return { plate: one.vpk + s.vk, cathode: s.vk, grid: s.vk + s.vgk, screen: s.vk + screenVoltage(s.feed, one.vpk, 0), plate2: null, plate2Current: null };
}
