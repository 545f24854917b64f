import type { PlanePoint } from '../stage/planeSeries';
import type { SolvedStage } from './analysisInput';
import { stageTransfer, type StageTransfer, type TransferSample } from './stageTransfer';

/**
 * The transfer curve sampled for drawing: output against input over
 * ±span volts of grid swing, n + 1 samples.
 */
export function transferCurve(s: SolvedStage, span: number, n = 64, transfer: StageTransfer = stageTransfer(s.checked, s.solution.op)): TransferSample[] {
  const out: TransferSample[] = [];
  for (let k = 0; k <= n; k++) out.push(transfer.at(-span + (2 * span * k) / n));
  return out;
}

/**
 * The path the operating point sweeps on the plate curves when the grid
 * swings ±peak: the stretch of the AC load line a signal of that size covers.
 */
export function swingPath(s: SolvedStage, peak: number, n = 24, transfer: StageTransfer = stageTransfer(s.checked, s.solution.op)): PlanePoint[] {
  const out: PlanePoint[] = [];
  for (let k = 0; k <= n; k++) {
    const t = transfer.at(-peak + (2 * peak * k) / n);
    out.push({ v: t.vpk, i: t.ia });
  }
  return out;
}
