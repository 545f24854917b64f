import { bracketedRoot } from '../numeric/bracketedRoot';
import { fail, type Result } from '../result';
import { checkOutputSolution } from './checkOutput';
import { emptyCurrents, stageCurrentsInto } from './electrodes';
import { atDrive, OUTPUT_SAMPLES, SWEEP_SAMPLES, waveform, type DriveResult } from './outputSignal';
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

/** The cathode current (plate and screen) averaged over the steady cycle with the grid driven to 0 V, A. */
function averageCathodeCurrent(s: OutputSolution): number {
  const drive = Math.max(0, -s.op.vgk);
  const w = waveform(s, drive, s.design.zPrimary, SWEEP_SAMPLES);
  const c = emptyCurrents();
  let sum = 0;
  for (let k = 0; k < SWEEP_SAMPLES; k++) {
    stageCurrentsInto(s.tube, s.op.feed, w.vpk[k]!, s.op.vgk + drive * Math.sin((2 * Math.PI * k) / SWEEP_SAMPLES), c, w.winding[k]!);
    sum += c.ik;
  }
  return sum / SWEEP_SAMPLES;
}

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
    return d.rk * (r.ok ? averageCathodeCurrent(r) : 0) - vk;
  };
  const idleVk = idle.op.vk;
  const step = Math.max(0.05 * idleVk, 0.01);
  const e0 = excess(idleVk);
  if (e0 === 0) return settledAt(idleVk);
  const dir = e0 > 0 ? 1 : -1;
  let prev = idleVk;
  let bracket: readonly [number, number] | null = null;
  for (let k = 1; k <= 60 && bracket === null; k++) {
    const next = Math.min(Math.max(idleVk + dir * step * k, 1e-6), d.bplus);
    if (Math.sign(excess(next)) !== Math.sign(e0)) bracket = [Math.min(prev, next), Math.max(prev, next)];
    else if (next === 1e-6 || next === d.bplus) break;
    prev = next;
  }
  if (bracket === null) return fail('no-convergence', 'The cathode resistor\'s bias under full drive did not settle; try another Rk', 'rk');
  return settledAt(bracketedRoot(excess, bracket[0], bracket[1], VOLT_TOL).x);

  function settledAt(vk: number): Result<SettledCathode> {
    const r = at(vk);
    if (!r.ok) return fail('cutoff', `The ${s.tube.id} cuts off with the bias this Rk settles at under full drive`, 'rk');
    return { ok: true, idleVk, vk, full: atDrive(r, Math.max(0, -r.op.vgk), d.zPrimary, OUTPUT_SAMPLES) };
  }
}
