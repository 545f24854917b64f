import { formatValue } from '../parts/formatValue';
import { fail, type Result } from '../result';
import type { StageDesign } from '../stage/stageDesign';
import { solvedStage, type SolvedStage } from './analysisInput';
import { harmonicAmplitudes, isPowerOfTwo } from './fft';
import { stageTransfer, type StageTransfer } from './stageTransfer';
import { illinois } from '../numeric/illinois';
import { swingOf, type SwingLimit, type SwingResult } from './swing';
import { DB_FLOOR, decibelsOf } from './levels';
import { shown } from '../shown';

/** Drive level: the output wanted (rms, across RL or at the plate), or the input given (rms, at the grid). */
export type DriveLevel = { readonly outputRms: number } | { readonly inputRms: number };

export interface DistortionOptions {
  /** Samples per cycle for the FFT, a power of two; default 1024. */
  readonly samples?: number;
  /**
   * How closely an asked output level is met, relative; default 1e-8. A
   * search over many designs (a target region) asks 1e-3: THD follows the
   * level about in proportion, so its figure moves by a thousandth at most,
   * for a third of the work.
   */
  readonly levelTolerance?: number;
}

export interface DistortionResult {
  readonly thdPercent: number;
  /** H2…H9 in dB relative to the fundamental; harmonicsDb[0] is H2. A harmonic of nothing reads DB_FLOOR. */
  readonly harmonicsDb: readonly number[];
  /** Input sine peak at the grid, V. */
  readonly inputPeak: number;
  /** Fundamental output peak, V. */
  readonly outputPeak: number;
  readonly inputRms: number;
  readonly outputRms: number;
  /** Quiescent shift of the output's average (DC) with this signal, V: a sign of even-order distortion. */
  readonly outputDcShift: number;
  /** The limit this level is driven past (grid current, through the real source, or cutoff), or null while the stage is clean. */
  readonly pastClean: SwingLimit | null;
}

export const DEFAULT_SAMPLES = 1024;
/** Samples per cycle while searching for the input that gives a wanted output: the fundamental only. */
const SEARCH_SAMPLES = 64;
const HIGHEST_HARMONIC = 9;
/** The asked output level is met to 1e-8 relative: far inside any display or test. */
const SEARCH_REL_TOL = 1e-8;

/**
 * The stage's output over one coherently sampled cycle of a sine of `peak`.
 * Over a cycle sin(2πk/n) takes each value twice (sin θ = sin(π − θ)), so
 * only the n/2 + 1 samples from −π/2 to π/2 are solved and the rest mirrored:
 * the same waveform for half the work. The solves run in order of rising
 * input, so each warm-starts from a close neighbour.
 */
export function cycleOutputs(t: StageTransfer, peak: number, n: number): Float64Array {
  const q = n / 4;
  const inputs = new Float64Array(n / 2 + 1);
  for (let j = -q; j <= q; j++) inputs[j + q] = peak * Math.sin((2 * Math.PI * j) / n);
  const solved = t.outputs(inputs);
  const y = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    // Sample k has phase 2πk/n; fold it onto −n/4…n/4, where sin has the same value.
    let j = k <= n / 2 ? k : k - n;
    if (j > q) j = n / 2 - j;
    else if (j < -q) j = -n / 2 - j;
    y[k] = solved[j + q]!;
  }
  return y;
}

/** Fundamental output amplitude for an input peak, from one coherently sampled cycle. */
function fundamental(t: StageTransfer, peak: number, n: number): number {
  const y = cycleOutputs(t, peak, n);
  let re = 0;
  let im = 0;
  for (let k = 0; k < n; k++) {
    re += y[k]! * Math.cos((2 * Math.PI * k) / n);
    im += y[k]! * Math.sin((2 * Math.PI * k) / n);
  }
  return (2 * Math.hypot(re, im)) / n;
}

/** Input peak giving a wanted fundamental output peak: Illinois regula falsi on [0, top], started from the small-signal estimate. */
function inputForOutput(t: StageTransfer, target: number, top: number, gain: number, relTol = SEARCH_REL_TOL, samples = SEARCH_SAMPLES): number {
  // The fundamental alone: fewer samples than SEARCH_SAMPLES (asked for a cheap THD) alias only harmonics near n − 1 onto it.
  const g = (peak: number) => fundamental(t, peak, samples) - target;
  return illinois(g, 0, top, relTol * target, { fa: -target, start: Math.min(target / Math.abs(gain), top) });
}

/**
 * How far past its clean limit a stage is driven at most, as a multiple of
 * the clean input peak (or of 1 V for a grid with no clean swing): ten
 * times (+20 dB) is far into hard clipping, where the output hardly grows.
 */
export const MAX_OVERDRIVE = 10;

/** The input peak past the clean limit that gives `target`, or null when no drive up to MAX_OVERDRIVE does; the search doubles up from the clean peak. */
function overdriveFor(t: StageTransfer, target: number, cleanPeak: number): { top: number } | null {
  const most = MAX_OVERDRIVE * Math.max(cleanPeak, 1);
  let top = Math.max(cleanPeak, 1e-3);
  while (top < most) {
    top = Math.min(2 * top, most);
    if (fundamental(t, top, SEARCH_SAMPLES) >= target) return { top };
  }
  return null;
}

/** Which limit an input peak is past, or null when it is within the clean swing. */
function limitPassed(clean: SwingResult, inputPeak: number): SwingLimit | null {
  const past = (edge: number) => inputPeak > edge * (1 + 1e-9);
  if (past(clean.toGridCurrent) && (!past(clean.toCutoff) || clean.toGridCurrent <= clean.toCutoff)) return 'grid-current';
  return past(clean.toCutoff) ? 'cutoff' : null;
}

/**
 * Most samples per cycle: 16,384 resolves harmonics far past H9 and keeps a
 * call near 15 ms (2^20 took up to 2 s).
 */
export const MAX_SAMPLES = 1 << 14;

export function distortionOf(s: SolvedStage, level: DriveLevel, options: DistortionOptions | null = {}, precomputed?: { transfer: StageTransfer; swing: SwingResult }): Result<DistortionResult> {
  if (typeof level !== 'object' || level === null) return fail('invalid-input', 'Give an output or input level', 'outputRms');
  const n = options?.samples ?? DEFAULT_SAMPLES;
  if (typeof n !== 'number' || !isPowerOfTwo(n) || n < 32 || n > MAX_SAMPLES) return fail('invalid-input', `Samples per cycle must be a power of two from 32 to ${MAX_SAMPLES} (got ${shown(n)})`, 'samples');
  const tolerance = options?.levelTolerance ?? SEARCH_REL_TOL;
  if (typeof tolerance !== 'number' || !(tolerance >= 1e-12 && tolerance <= 0.01)) return fail('invalid-input', `The level tolerance must be from 1e-12 to 0.01 (got ${shown(tolerance)})`, 'levelTolerance');
  const transfer = precomputed?.transfer ?? stageTransfer(s.checked, s.solution.op);
  const clean = precomputed?.swing ?? swingOf(s, transfer);
  let inputPeak: number;
  if ('inputRms' in level) {
    if (!(Number.isFinite(level.inputRms) && level.inputRms > 0)) return fail('invalid-input', `Input level must be above 0 V rms (got ${shown(level.inputRms)})`, 'inputRms');
    inputPeak = level.inputRms * Math.SQRT2;
    if (inputPeak > MAX_OVERDRIVE * Math.max(clean.inputPeak, 1) * (1 + 1e-9)) return fail('clipping', `${shown(level.inputRms)} V rms is more than ${MAX_OVERDRIVE} times this stage's clean input of ${formatValue(clean.input.rms, 'V')} rms: far into clipping.`, 'inputRms');
  } else {
    if (!(Number.isFinite(level.outputRms) && level.outputRms > 0)) return fail('invalid-input', `Output level must be above 0 V rms (got ${shown(level.outputRms)})`, 'outputRms');
    const target = level.outputRms * Math.SQRT2;
    if (target <= fundamental(transfer, clean.inputPeak, SEARCH_SAMPLES)) inputPeak = inputForOutput(transfer, target, clean.inputPeak, s.solution.gain, tolerance, Math.min(SEARCH_SAMPLES, n));
    else {
      const over = overdriveFor(transfer, target, clean.inputPeak);
      const limit = clean.limitedBy === 'grid-current' ? 'grid current' : 'cutoff';
      if (!over) return fail('clipping', `This stage cannot give ${shown(level.outputRms)} V rms: it is clean up to ${formatValue(clean.output.rms, 'V')} rms out (${formatValue(clean.input.rms, 'V')} rms in), where ${limit} sets in, and driven ${MAX_OVERDRIVE} times harder its output hardly grows.`, 'outputRms');
      inputPeak = inputForOutput(transfer, target, over.top, s.solution.gain, tolerance, Math.min(SEARCH_SAMPLES, n));
    }
  }
  const y = cycleOutputs(transfer, inputPeak, n);
  let sum = 0;
  for (const v of y) sum += v;
  const amps = harmonicAmplitudes(y, n / 2 - 1);
  const fund = amps[1]!;
  let ss = 0;
  for (let k = 2; k < amps.length; k++) ss += amps[k]! * amps[k]!;
  const db = (a: number) => (fund > 0 ? decibelsOf(a / fund) : DB_FLOOR);
  return {
    ok: true,
    thdPercent: fund > 0 ? (100 * Math.sqrt(ss)) / fund : 0,
    harmonicsDb: amps.slice(2, HIGHEST_HARMONIC + 1).map(db),
    inputPeak,
    outputPeak: fund,
    inputRms: inputPeak / Math.SQRT2,
    outputRms: fund / Math.SQRT2,
    outputDcShift: sum / n,
    pastClean: limitPassed(clean, inputPeak),
  };
}

/**
 * Harmonic distortion of a stage driven by a sine at a chosen output (or
 * input) level: one cycle sampled coherently, solved sample by sample on the
 * large-signal transfer, then an FFT. Past the clean swing it goes on (grid
 * current through the real source, or cutoff), and says which limit the
 * level is past; only a level no drive up to MAX_OVERDRIVE reaches is a
 * 'clipping' failure naming where clipping starts.
 */
export function distortion(design: StageDesign, level: DriveLevel, options?: DistortionOptions | null): Result<DistortionResult> {
  const s = solvedStage(design);
  if (!s.ok) return s;
  if (typeof level !== 'object' || level === null) return fail('invalid-input', 'Give an output or input level in V rms');
  return distortionOf(s, level, options);
}
