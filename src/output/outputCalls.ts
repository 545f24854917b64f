import { fail, type Result } from '../result';
import { checkCount } from '../stage/checkInput';
import { checkDrive, checkOutputSolution, checkSamples, checkThdLimit, checkZ, OUTPUT_CALL_LIMITS } from './checkOutput';
import type { OutputDesign } from './outputDesign';
import { switchBias as switchBiasOf } from './outputBias';
import { atDrive as driveOf, cleanLimit as cleanLimitOf, OUTPUT_SAMPLES, waveform as waveformOf, type CleanLimit, type DriveResult, type Waveform } from './outputSignal';
import { powerAtDistortion as limitedOf, powerSweep as sweepOf, SWEEP_LEVELS, zPrimarySweep as zSweepOf, Z_SWEEP_POINTS, type LimitedPower, type ZSweep } from './powerSweep';
import type { OutputSolution } from './solveOutput';

/**
 * The public face of the output stage's swing: each call checks its solution
 * and every option at the edge and answers a typed failure, so a malformed
 * solution, a null option or a count of 2^30 never throws, hangs or returns
 * NaN. Inside the model the unchecked functions run on checked input.
 */

const zOf = (s: OutputSolution, z: number | undefined) => z ?? s.design.zPrimary;

/** The stage at a peak grid drive: power, THD and harmonics along the AC load (see outputSignal.atDrive). */
export function atDrive(s: OutputSolution, drive: number, zPrimary?: number, samples: number = OUTPUT_SAMPLES): Result<DriveResult> {
  const problem = checkOutputSolution(s) ?? checkDrive(drive) ?? checkZ(zOf(s, zPrimary)) ?? checkSamples(samples);
  return problem ?? { ok: true, ...driveOf(s, drive, zOf(s, zPrimary), samples) };
}

/** One cycle's plate voltage, current and winding voltage at a drive. */
export function waveform(s: OutputSolution, drive: number, zPrimary?: number, samples: number = OUTPUT_SAMPLES): Result<Waveform> {
  const problem = checkOutputSolution(s) ?? checkDrive(drive) ?? checkZ(zOf(s, zPrimary)) ?? checkSamples(samples);
  return problem ?? { ok: true, ...waveformOf(s, drive, zOf(s, zPrimary), samples) };
}

/** Power at the onset of grid current or cutoff, whichever comes first. */
export function cleanLimit(s: OutputSolution, zPrimary?: number, samples: number = OUTPUT_SAMPLES): Result<CleanLimit> {
  const problem = checkOutputSolution(s) ?? checkZ(zOf(s, zPrimary)) ?? checkSamples(samples);
  return problem ?? { ok: true, ...cleanLimitOf(s, zOf(s, zPrimary), samples) };
}

/** Power, THD, H2 and H3 at `levels` drives up to the onset of grid current. */
export function powerSweep(s: OutputSolution, levels: number = SWEEP_LEVELS, zPrimary?: number): Result<{ points: DriveResult[] }> {
  const problem = checkOutputSolution(s) ?? checkCount('levels', 'Levels', levels, 1, OUTPUT_CALL_LIMITS.maxLevels) ?? checkZ(zOf(s, zPrimary));
  return problem ?? { ok: true, points: sweepOf(s, levels, zOf(s, zPrimary)) };
}

/** The most power with THD at or under `limit` (a fraction, 0.001 to 0.5). */
export function powerAtDistortion(s: OutputSolution, limit: number, zPrimary?: number): Result<LimitedPower> {
  const problem = checkOutputSolution(s) ?? checkThdLimit(limit) ?? checkZ(zOf(s, zPrimary));
  return problem ?? { ok: true, ...limitedOf(s, limit, zOf(s, zPrimary)) };
}

/** The most power within `limit` for `points` primary impedances around Vq/Iq. */
export function zPrimarySweep(s: OutputSolution, limit?: number, points: number = Z_SWEEP_POINTS): Result<ZSweep> {
  const l = limit ?? s?.design?.thdLimit;
  const problem = checkOutputSolution(s) ?? checkThdLimit(l) ?? checkCount('points', 'Impedances', points, 2, OUTPUT_CALL_LIMITS.maxZPoints);
  return problem ?? { ok: true, ...zSweepOf(s, l!, points) };
}

/** The bias parts that keep the idle current when the bias kind changes. */
export function switchBias(s: OutputSolution, to: 'cathode' | 'fixed'): Result<Pick<OutputDesign, 'bias' | 'rk' | 'vg'>> {
  const problem = checkOutputSolution(s) ?? (to === 'cathode' || to === 'fixed' ? null : fail('invalid-input', 'Bias must be cathode or fixed', 'bias'));
  if (problem) return problem;
  return { ok: true, ...switchBiasOf(s, to) };
}
