import {
  analyzeOutput, findOutputTube, type OutputDesign,
  cornersOf, curveSheet, distortionOf, findTube, fitTriode, korenPublishedSets, logFrequencies, plateCurrent,
  responseOf, solveStage, solvedStage, stageTransfer, swingOf, triode, type CurvePoint,
} from '../src/index';
import { stats, timeIt, type Stats } from './stats.mts';

/** The demo line stage with its signal parts: what the workbench analyses on every change. */
const STAGE = { tube: findTube('12AU7')!, bplus: 275, ra: 27e3, rk: 1200, rl: 220e3, rg: 1e6, rsource: 1e3, cin: 470e-9, ck: 100e-6, cout: 1e-6 };
const FREQS = logFrequencies(1, 1e6, 15);

/** The whole one-stage analysis: operating point, small signal, swing, distortion at 2 V rms, response and corners. */
export function fullAnalysis(samples = 1024): void {
  const s = solvedStage(STAGE);
  if ('ok' in s) throw new Error(s.message);
  const transfer = stageTransfer(s.checked, s.solution.op);
  const swing = swingOf(s, transfer);
  const d = distortionOf(s, { outputRms: 2 }, { samples }, { transfer, swing });
  if (!d.ok) throw new Error(d.message);
  responseOf(s, FREQS);
  cornersOf(s);
}

function fitPoints(n: number): CurvePoint[] {
  const m = triode(korenPublishedSets['12AU7']!);
  const pts: CurvePoint[] = [];
  const grids = [0, -2, -4, -6, -8, -10, -12, -14];
  for (let k = 0; pts.length < n; k++) {
    const vg = grids[k % grids.length]!;
    const va = 30 + ((k * 37) % 370);
    const ia = plateCurrent(m, va, vg);
    if (ia > 2e-5) pts.push({ va, vg, ia: ia * (1 + 0.01 * Math.sin(k)) });
  }
  return pts;
}

/** The bench's default output stage: an EL34 on a 43 % ultralinear tap (the same as the workbench offers first). */
const OUTPUT: OutputDesign = {
  tubeId: 'EL34', connection: 'ultralinear', bplus: 330, screenVolts: 300, ulTap: 0.43, zPrimary: 3500, rPrimary: 130,
  bias: 'cathode', rk: 330, vg: -22, rg: 220e3, speakerOhms: 8, thdLimit: 0.05,
};
const EL34 = findOutputTube('EL34')!;

export interface ModelResults {
  readonly solveStage: Stats;
  readonly fullAnalysis: Stats;
  readonly plateFamily: Stats;
  readonly fit200: Stats;
  readonly fftScaling: Record<string, Stats>;
  /** Output stage: what runs per drag frame (point, lines, clean limit, full-drive figures). */
  readonly outputLight: Stats;
  /** Output stage: everything, with the power sweep and the primary-impedance sweep (after a drag). */
  readonly outputFull: Stats;
}

export function benchModel(): ModelResults {
  const pts = fitPoints(200);
  const fftScaling: Record<string, Stats> = {};
  for (const n of [1024, 2048, 4096, 8192, 16384]) fftScaling[n] = stats(timeIt(() => fullAnalysis(n), 60, 5));
  return {
    solveStage: stats(timeIt(() => solveStage(STAGE), 2000)),
    fullAnalysis: stats(timeIt(() => fullAnalysis(), 400)),
    plateFamily: stats(timeIt(() => curveSheet(STAGE.tube, 275), 300)),
    fit200: stats(timeIt(() => fitTriode(pts), 15, 2)),
    fftScaling,
    outputLight: stats(timeIt(() => analyzeOutput(EL34, OUTPUT, { light: true }), 200)),
    outputFull: stats(timeIt(() => analyzeOutput(EL34, OUTPUT), 20, 3)),
  };
}
