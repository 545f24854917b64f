import type { SolvedStage } from './analysisInput';
import { distortionOf } from './distortion';
import { stageTransfer } from './stageTransfer';
import { swingOf } from './swing';

export interface LevelThd {
  readonly outputRms: number;
  readonly thdPercent: number;
}

/**
 * THD against output level, from 1 % of the clean output swing up to the
 * clipping point, log-spaced. One transfer and one swing serve every level.
 */
export function distortionSweep(s: SolvedStage, points = 16, samples = 256): LevelThd[] {
  const transfer = stageTransfer(s.checked, s.solution.op);
  const swing = swingOf(s, transfer);
  const top = swing.output.rms * 0.999;
  const out: LevelThd[] = [];
  for (let k = 0; k < points; k++) {
    const outputRms = top * Math.pow(100, k / (points - 1) - 1);
    const r = distortionOf(s, { outputRms }, { samples }, { transfer, swing });
    if (r.ok) out.push({ outputRms, thdPercent: r.thdPercent });
  }
  return out;
}
