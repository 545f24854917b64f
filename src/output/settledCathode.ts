import { walkToRoot } from '../numeric/walkToRoot';
import { fail, type Result } from '../result';
import { checkOutputSolution } from './checkOutput';
import { atDrive, averageCurrents, OUTPUT_SAMPLES, type DriveResult } from './outputSignal';
import { outputWithCathodeAt, solveOutput, type OutputSolution } from './solveOutput';

/** A cathode-biased single-ended stage under full drive once its bypass capacitor has settled. */
export interface SettledCathode {
  /** The cathode at idle, V. */
  readonly idleVk: number;
  /** The cathode under full drive, V: Rk times the cycle's average cathode current (Ohm's law on the DC the bypass leaves). */
  readonly vk: number;
  /** The stage at that bias with its grid driven to 0 V peak: power, THD and the cycle's extremes. */
  readonly full: DriveResult;
}

/** The search stops within this many volts (a tenth of a millivolt reads the same on any figure). */
const VOLT_TOL = 1e-4;

/**
 * A single-ended stage's cathode resistor under full drive. Its bypass holds
 * the cathode over a cycle but not over seconds: the cathode settles where
 * Rk drops the cycle's average cathode current, which moves with the drive
 * (the law's curvature raises the plate's average; a pentode's screen takes
 * more as the plate swings low), so the bias and the power with the grid
 * driven to 0 V move too. Solved as the root of Rk·Īk(Vk) − Vk, the stage
 * rebuilt at each trial cathode and its cycle solved to its steady state
 * there, bracketed by walking from the idle bias (as settledCathodeBias does
 * for a pair). Fixed bias has no such shift: a failure naming the bias.
 */
export function settledCathode(s: OutputSolution): Result<SettledCathode> {
  const problem = checkOutputSolution(s);
  if (problem) return problem;
  const d = s.design;
  if (d.bias !== 'cathode') return fail('invalid-input', 'A fixed-bias grid stays at its supply under drive: only a cathode resistor\'s bias moves', 'bias');
  // The idle bias from the design itself, not from the solution's own field.
  const idle = solveOutput(s.tube, d);
  if (!idle.ok) return idle;
  const at = (vk: number) => outputWithCathodeAt(idle, vk);
  // A stage cut off at a deeper bias draws nothing: the resistor drops nothing there.
  const excess = (vk: number) => {
    const r = at(vk);
    return d.rk * (r.ok ? averageCurrents(r, Math.max(0, -r.op.vgk)).ik : 0) - vk;
  };
  const idleVk = idle.op.vk;
  // Walk from the idle bias the way the excess points until it changes sign, then close in by Brent's method.
  const vk = walkToRoot(excess, idleVk, Math.max(0.05 * idleVk, 0.01), 1e-6, d.bplus, VOLT_TOL);
  if (vk === null) return fail('no-convergence', 'The cathode resistor\'s bias under full drive did not settle; try another Rk', 'rk');
  return settledAt(vk);

  function settledAt(vk: number): Result<SettledCathode> {
    const r = at(vk);
    if (!r.ok) return fail('cutoff', `The ${s.tube.id} cuts off with the bias this Rk settles at under full drive`, 'rk');
    return { ok: true, idleVk, vk, full: atDrive(r, Math.max(0, -r.op.vgk), d.zPrimary, OUTPUT_SAMPLES) };
  }
}
