import { analyzeOutput, analyzePushPull, findOutputTube, outputExtent, type Connection,
  type Result, type OutputAnalysis, type PlateExtent, type PushPullAnalysis } from '../../src/index';
import { pushPullDesignOf, type OutputPlan } from './outputPlan';

/**
 * The output stage as the bench shows it: the model's analysis plus whether
 * it is the light pass (during a drag or while typing; the distortion-limited
 * power and the sweeps then wait for the full pass).
 */
export type OutputBench = SingleEndedBench | PushPullBench;

export interface SingleEndedBench {
  readonly pair: 'single-ended';
  readonly analysis: OutputAnalysis;
  readonly light: boolean;
  /**
   * The last full pass's analysis: what the power and distortion charts
   * draw, so a drag does not redraw them sixty times a second with figures
   * that are stale anyway.
   */
  readonly settled: OutputAnalysis;
}

/** The push-pull pair as the bench shows it, on the same terms. */
export interface PushPullBench {
  readonly pair: 'push-pull';
  readonly analysis: PushPullAnalysis;
  readonly light: boolean;
  readonly settled: PushPullAnalysis;
}

/** A second output tube in the same socket: same B+, primary, bias parts; wired as the first (a tube swap), or its own screen connection. */
export interface OutputRival {
  readonly on: boolean;
  readonly tubeId: string;
  readonly connection: Connection | 'as-wired';
}

/** The model's field names for the output design, as the bench's input boxes are named. */
const OUTPUT_FIELD_OF: Record<string, string> = {
  bplus: 'oBplus',
  screenVolts: 'oScreen',
  ulTap: 'oTap',
  zPrimary: 'oZ',
  rPrimary: 'oRpri',
  primaryInductance: 'oLp',
  leakageInductance: 'oLl',
  rk: 'oRk',
  vg: 'oVg',
  rg: 'oRg',
  speakerOhms: 'oSpeaker',
  thdLimit: 'oThd',
  connection: 'outputTube',
  raa: 'oRaa',
  mismatch: 'oMismatch',
  'mismatch.gm': 'oMismatch',
  'mismatch.idle': 'oIdleMismatch',
};

type Options = { light?: boolean; maxCurves?: number; extent?: PlateExtent };

const withBenchField = <T,>(a: Result<T>): Result<T> => (!a.ok && a.field !== undefined && a.field in OUTPUT_FIELD_OF ? { ...a, field: OUTPUT_FIELD_OF[a.field]! } : a);

export function analyzeOutputBench(d: OutputPlan, prev: OutputBench | null, opts: Options = {}): Result<OutputBench> {
  const tube = findOutputTube(d.tubeId);
  if (!tube) return { ok: false, reason: 'invalid-tube', message: `No output tube called “${d.tubeId}”`, field: 'outputTube' };
  const light = opts.light ?? false;
  const shared = { light, ...(opts.maxCurves !== undefined ? { maxCurves: opts.maxCurves } : {}), ...(opts.extent ? { extent: opts.extent } : {}) };
  if (d.pair === 'push-pull') {
    const before = prev?.pair === 'push-pull' ? prev : null;
    const a = withBenchField(analyzePushPull(tube, pushPullDesignOf(d), { ...shared, previous: before?.analysis ?? null }));
    if (!a.ok) return a;
    return { ok: true, pair: 'push-pull', analysis: a, light, settled: light && before ? before.settled : a };
  }
  const before = prev?.pair === 'single-ended' ? prev : null;
  const a = withBenchField(analyzeOutput(tube, d, { ...shared, previous: before?.analysis ?? null }));
  if (!a.ok) return a;
  return { ok: true, pair: 'single-ended', analysis: a, light, settled: light && before ? before.settled : a };
}

/**
 * How the rival is wired: as the design's own tube unless chosen otherwise
 * (an ultralinear socket keeps its tap when the tube is swapped); a triode
 * has no screen, so it is a triode whatever the socket.
 */
export function rivalConnection(d: Pick<OutputPlan, 'connection'>, r: OutputRival): Connection {
  if (findOutputTube(r.tubeId)?.law.kind === 'triode') return 'triode';
  return r.connection === 'as-wired' ? d.connection : r.connection;
}

export function rivalOutputDesign(d: OutputPlan, r: OutputRival): OutputPlan {
  return { ...d, tubeId: r.tubeId, connection: rivalConnection(d, r) };
}

/** One chart window for both output tubes at this B+. */
export function sharedOutputWindow(d: OutputPlan, r: OutputRival): PlateExtent | undefined {
  const a = findOutputTube(d.tubeId);
  const b = findOutputTube(r.tubeId);
  if (!a) return undefined;
  const ea = outputExtent(a, d.bplus);
  if (!r.on || !b) return ea;
  const eb = outputExtent(b, d.bplus);
  return { vmax: Math.max(ea.vmax, eb.vmax), iaMax: Math.max(ea.iaMax, eb.iaMax) };
}

/** The current the output stage draws from B+ at idle, A (both cathodes of a pair), from its last full pass. */
export function outputIdleAmps(b: OutputBench): number {
  return b.pair === 'push-pull' ? b.settled.supplyCurrent.idle : b.settled.solution.op.ik;
}

/** The point the chart's handle sits on: the tube's idle point (the first tube of a pair). */
export function benchPoint(b: OutputBench): { readonly vpk: number; readonly ip: number; readonly vgk: number } {
  if (b.pair === 'push-pull') {
    const s = b.analysis.solution;
    return { vpk: s.idle[0].vpk, ip: s.idle[0].ip, vgk: s.vgk };
  }
  return b.analysis.solution.op;
}
