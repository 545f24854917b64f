import { analyzeOutput, findOutputTube, outputExtent, type Connection,
  type Result, type OutputAnalysis, type OutputDesign, type PlateExtent } from '../../src/index';

/**
 * The output stage as the bench shows it: the model's analysis plus whether
 * it is the light pass (during a drag or while typing; the distortion-limited
 * power and the sweeps then wait for the full pass).
 */
export interface OutputBench {
  readonly analysis: OutputAnalysis;
  readonly light: boolean;
  /**
   * The last full pass's analysis: what the power and distortion charts
   * draw, so a drag does not redraw them sixty times a second with figures
   * that are stale anyway.
   */
  readonly settled: OutputAnalysis;
}

/** A second output tube in the same socket: same B+, primary, bias parts; its own screen connection. */
export interface OutputRival {
  readonly on: boolean;
  readonly tubeId: string;
  readonly connection: Connection;
}

/** The model's field names for the output design, as the bench's input boxes are named. */
const OUTPUT_FIELD_OF: Record<string, string> = {
  bplus: 'oBplus',
  screenVolts: 'oScreen',
  ulTap: 'oTap',
  zPrimary: 'oZ',
  rPrimary: 'oRpri',
  rk: 'oRk',
  vg: 'oVg',
  rg: 'oRg',
  speakerOhms: 'oSpeaker',
  thdLimit: 'oThd',
  connection: 'outputTube',
};

export function analyzeOutputBench(d: OutputDesign, prev: OutputBench | null, opts: { light?: boolean; maxCurves?: number; extent?: PlateExtent } = {}): Result<OutputBench> {
  const tube = findOutputTube(d.tubeId);
  if (!tube) return { ok: false, reason: 'invalid-tube', message: `No output tube called “${d.tubeId}”`, field: 'outputTube' };
  const a = analyzeOutput(tube, d, {
    light: opts.light ?? false,
    previous: prev?.analysis ?? null,
    ...(opts.maxCurves !== undefined ? { maxCurves: opts.maxCurves } : {}),
    ...(opts.extent ? { extent: opts.extent } : {}),
  });
  if (!a.ok) return a.field !== undefined && a.field in OUTPUT_FIELD_OF ? { ...a, field: OUTPUT_FIELD_OF[a.field]! } : a;
  const light = opts.light ?? false;
  return { ok: true, analysis: a, light, settled: light && prev ? prev.settled : a };
}

export function rivalOutputDesign(d: OutputDesign, r: OutputRival): OutputDesign {
  return { ...d, tubeId: r.tubeId, connection: r.connection };
}

/** One chart window for both output tubes at this B+. */
export function sharedOutputWindow(d: OutputDesign, r: OutputRival): PlateExtent | undefined {
  const a = findOutputTube(d.tubeId);
  const b = findOutputTube(r.tubeId);
  if (!a) return undefined;
  const ea = outputExtent(a, d.bplus);
  if (!r.on || !b) return ea;
  const eb = outputExtent(b, d.bplus);
  return { vmax: Math.max(ea.vmax, eb.vmax), iaMax: Math.max(ea.iaMax, eb.iaMax) };
}
