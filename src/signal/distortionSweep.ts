import type { SolvedStage } from './analysisInput';
import { distortionOf } from './distortion';
import { stageTransfer } from './stageTransfer';
import { swingOf } from './swing';

export interface LevelThd {
  readonly outputRms: number;
  readonly thdPercent: number;
  /** True past the clean swing (grid current through the real source, or cutoff). */
  readonly pastClean: boolean;
}

/** How far past the clean input the sweep goes: 3 times (+9.5 dB), far enough to see how a stage clips. */
export const SWEEP_OVERDRIVE = 3;

/**
 * THD against output level, driven from 1 % of the clean input swing to
 * SWEEP_OVERDRIVE times it, log-spaced: below the clean limit, across it and
 * past it. One transfer and one swing serve every level. A grid with no clean
 * swing (biased at the onset of grid current) has no sweep.
 */
export function distortionSweep(s: SolvedStage, points = 16, samples = 256): LevelThd[] {
  const transfer = stageTransfer(s.checked, s.solution.op);
  const swing = swingOf(s, transfer);
  const out: LevelThd[] = [];
  if (!(swing.inputPeak > 0)) return out;
  const lo = Math.log(0.01);
  const hi = Math.log(SWEEP_OVERDRIVE);
  for (let k = 0; k < points; k++) {
    const peak = swing.inputPeak * Math.exp(lo + ((hi - lo) * k) / (points - 1));
    const r = distortionOf(s, { inputRms: peak / Math.SQRT2 }, { samples }, { transfer, swing });
    if (r.ok) out.push({ outputRms: r.outputRms, thdPercent: r.thdPercent, pastClean: r.pastClean !== null });
  }
  return out;
}
