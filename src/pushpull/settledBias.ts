import { walkToRoot } from '../numeric/walkToRoot';
import { fail, type Result } from '../result';
import { OUTPUT_SAMPLES, SWEEP_SAMPLES } from '../output/outputSignal';
import { checkPushPullSolution, pushPullDriveOf, type PushPullDrive } from './pushPullDrive';
import { pairWithCathodeAt, solvePushPull, type PushPullSolution } from './solvePushPull';

/** A cathode-biased pair under full drive once its bypass capacitor has settled. */
export interface SettledBias {
  /** The shared cathode at idle, V. */
  readonly idleVk: number;
  /** The shared cathode under full drive, V: Rk times the cycle's average cathode current (Ohm's law on the DC the bypass leaves). */
  readonly vk: number;
  /** The pair at that bias, the grids driven to 0 V peak (the first grid to reach its cathode): power, THD, dissipations, current. */
  readonly full: PushPullDrive;
}

/** The search for the settled cathode stops within this many volts (a tenth of a millivolt reads the same on any figure). */
const VOLT_TOL = 1e-4;

/**
 * A shared cathode resistor under full drive. Its bypass capacitor holds the
 * cathode steady over a cycle but not over seconds: the cathode settles
 * where the resistor drops the cycle's average current, and in class AB that
 * average rises with the drive (a tube's current grows on its positive half
 * more than it can fall on its negative one), so the bias grows more
 * negative, the grids need more drive to reach 0 V, and the power there is
 * less than at the idle bias. Solved as the root of Rk·Ī(Vk) − Vk, Ī the
 * cycle's average cathode current with the pair rebuilt at that cathode and
 * the grids driven to it, bracketed by walking from the idle bias. Fixed
 * bias has no such shift: a failure naming the bias.
 */
export function settledCathodeBias(s: PushPullSolution): Result<SettledBias> {
  const problem = checkPushPullSolution(s);
  if (problem) return problem;
  const d = s.design;
  if (d.bias !== 'cathode') return fail('invalid-input', 'A fixed-bias pair\'s grids stay at their supply under drive: only a shared cathode resistor\'s bias moves', 'bias');
  // The idle bias from the design itself, not from the solution's own field (a solution is only checked for its idle point).
  const idle = solvePushPull(s.tube, d);
  if (!idle.ok) return idle;
  const at = (vk: number, samples: number): PushPullDrive | null => {
    const pair = pairWithCathodeAt(idle, vk);
    if (!pair.ok) return null;
    const drive = Math.min(-pair.vgk, -pair.vgk2);
    return drive > 0 ? pushPullDriveOf(pair, drive, samples) : null;
  };
  // A pair cut off at a deeper bias draws nothing: the resistor drops nothing there.
  const excess = (vk: number) => d.rk * (at(vk, SWEEP_SAMPLES)?.supplyCurrent ?? 0) - vk;
  const idleVk = idle.vk;
  // Walk from the idle bias the way the excess points until it changes sign, then close in by Brent's method.
  const vk = walkToRoot(excess, idleVk, Math.max(0.05 * idleVk, 0.01), 1e-6, d.bplus, VOLT_TOL);
  if (vk === null) return fail('no-convergence', 'The shared cathode resistor\'s bias under full drive did not settle; try another Rk', 'rk');
  return settledAt(vk);

  function settledAt(vk: number): Result<SettledBias> {
    const full = at(vk, OUTPUT_SAMPLES);
    if (full === null) return fail('cutoff', `The ${s.tube.id}s cut off with the bias this Rk settles at under full drive`, 'rk');
    return { ok: true, idleVk, vk, full };
  }
}
