import { formatValue } from '../parts/formatValue';
import { fail, type Failure, type Result } from '../result';
import { checkNumber } from '../stage/checkInput';
import { harmonicAmplitudes } from '../signal/fft';
import { sineLevel, type Level } from '../signal/levels';
import { illinois } from '../numeric/illinois';
import { MAX_OVERDRIVE } from '../signal/distortion';
import type { ChainInput, ClipCause } from './chainTypes';
import { CYCLE_SAMPLES, prepareAmplifier, type PreparedAmplifier } from './prepareAmplifier';

/** An output level to reach: volts rms at the output, or watts into the speaker of a chain ending in an output stage. */
export type AmplifierLevel = { readonly outputRms: number } | { readonly power: number };

export interface StageLevel {
  /** Peak swing at the stage's output there, V (at the speaker for an output stage). */
  readonly outputPeak: number;
  /** dB from this level to the stage's own clean limit; null when it never clips. */
  readonly headroomDb: number | null;
}

export interface AmplifierAtLevel {
  /** The source voltage the level needs (the sensitivity), peak and rms. */
  readonly inputPeak: number;
  readonly input: Level;
  readonly output: Level;
  readonly stages: readonly StageLevel[];
  /** THD of the output from the composed transfers (H2–H10), a fraction, and each harmonic over the fundamental (index 2 is H2). */
  readonly thd: number;
  readonly harmonics: readonly number[];
  /**
   * Past the chain's clean limit: the stage that reached its limit first and
   * by what (the figures are then of a stage in grid current or cut off, as a
   * real one would be driven); null inside it.
   */
  readonly pastClean: { readonly stage: number; readonly by: ClipCause } | null;
}

/** Points a cycle for the figures (CYCLE_SAMPLES). */
export const SAMPLES = CYCLE_SAMPLES;
/** Points a cycle while the secant search finds the level: only the fundamental is read, and below clipping the harmonics that alias onto it (the 31st and 33rd) are negligible. */
const SEARCH_SAMPLES = 32;

/**
 * The amplifier at an output level: the source level it needs (found on the
 * fundamental of the composed waveform), each stage's swing and headroom
 * there, and the distortion of the whole chain. Past the clean limit the
 * figures go on, the stage that clips first named in `pastClean`, its grid
 * current drawn through the impedance driving it (see ChainSignal).
 */
export function amplifierAtLevel(input: ChainInput, level: AmplifierLevel): Result<AmplifierAtLevel> {
  const a = prepareAmplifier(input);
  return a.ok ? atLevelOf(a, input, level) : a;
}

/** The same, on an amplifier already prepared (solveAmplifier asks for both at once). */
export function atLevelOf(a: PreparedAmplifier, input: ChainInput, level: AmplifierLevel): Result<AmplifierAtLevel> {
  const last = input.stages[input.stages.length - 1]!;
  let targetRms: number;
  if (typeof level === 'object' && level !== null && 'power' in level) {
    if (last.kind !== 'single-ended-output' && last.kind !== 'push-pull-output') return fail('invalid-input', 'A level in watts needs an output stage at the end of the chain', 'power');
    const p = checkNumber('power', 'Power', level.power, 'W', 1e-9, 10_000);
    if (p) return p;
    targetRms = Math.sqrt(level.power * last.speakerOhms);
  } else {
    const v = checkNumber('outputRms', 'Output level', (level as { outputRms?: unknown })?.outputRms, 'V', 1e-9, 100_000);
    if (v) return v;
    targetRms = (level as { outputRms: number }).outputRms;
  }
  const { signal, clips, first } = a;
  const target = targetRms * Math.SQRT2;
  const cleanMax = a.cleanFundamental();
  // Within a part per million of the clean limit counts as at it.
  const past = target > cleanMax * (1 + 1e-6);
  const peak = past ? peakPastClean(a, target) : peakWithinClean(a, target);
  if (typeof peak !== 'number') return peak;
  // The final cycle at full resolution, every stage's output kept from the same pass.
  const n = a.links.length;
  const lows = new Float64Array(n).fill(Infinity);
  const highs = new Float64Array(n).fill(-Infinity);
  const wave = signal.cycle(SAMPLES, peak, new Float64Array(SAMPLES), { lows, highs });
  const h = harmonicAmplitudes(wave, 10);
  const v1 = h[1]!;
  const harmonics = h.map((x, k) => (k < 2 || v1 === 0 ? 0 : x / v1));
  const thd = Math.sqrt(harmonics.reduce((s, x) => s + x * x, 0));
  const stages = a.links.map((_, i) => {
    const c = clips[i];
    return { outputPeak: (highs[i]! - lows[i]!) / 2, headroomDb: c ? 20 * Math.log10(c.inputPeak / peak) : null };
  });
  return { ok: true, inputPeak: peak, input: sineLevel(peak), output: sineLevel(v1), stages, thd, harmonics, pastClean: past ? { stage: first, by: clips[first]!.by } : null };
}

/** The source peak for an output peak inside the clean limit: the secant on the fundamental from the small-signal guess, bracketed by [0, the clean limit]. */
function peakWithinClean(a: PreparedAmplifier, target: number): number {
  const cleanPeak = a.inputPeak;
  const searchWave = new Float64Array(SEARCH_SAMPLES);
  const fundamentalAt = (peak: number) => harmonicAmplitudes(a.signal.cycle(SEARCH_SAMPLES, peak, searchWave), 1)[1]!;
  let p0 = Math.min(target / Math.max(Math.abs(a.gain), 1e-12), cleanPeak);
  let f0 = fundamentalAt(p0) - target;
  // The second point from the small-signal slope (a Newton step on the gain), which the curvature alone keeps from the root.
  const slope = Math.abs(a.gain);
  let p1 = slope > 0 ? Math.min(Math.max(p0 - f0 / slope, 0), cleanPeak) : p0 * (f0 > 0 ? 0.99 : 1.01);
  if (p1 === p0) p1 = p0 * (f0 > 0 ? 0.99 : 1.01);
  for (let k = 0; k < 40 && Math.abs(f0) > 1e-9 * target; k++) {
    const f1 = fundamentalAt(Math.min(p1, cleanPeak)) - target;
    const next = f1 === f0 ? p1 : p1 - (f1 * (p1 - p0)) / (f1 - f0);
    [p0, f0] = [p1, f1];
    p1 = Math.min(Math.max(next, 0), cleanPeak);
  }
  return p0;
}

/**
 * The source peak for an output peak past the clean limit, where the stage
 * that clips first is in grid current (held back by the impedance driving
 * it) or cut off: the fundamental still rises with drive, so Illinois on a
 * bracket grown by doubling from the clean limit, up to MAX_OVERDRIVE times
 * it. Each cycle at full resolution: a clipped wave's high harmonics would
 * fold onto the fundamental at fewer points. A typed failure when the level
 * cannot be had, or when a stage whose grid current the chain does not
 * follow (a push-pull pair) would be driven past its limit.
 */
function peakPastClean(a: PreparedAmplifier, target: number): number | Failure {
  const { clips, first, signal, inputPeak: cleanPeak } = a;
  const limitWords = `stage ${first + 1} reaches ${clips[first]!.by === 'grid-current' ? 'grid current' : 'cutoff'}`;
  const unfollowed = a.links.findIndex((l) => !l.gridLaw);
  if (unfollowed >= 0) {
    return fail('clipping', `${formatValue(target / Math.SQRT2, 'V')} rms is past the clean limit of ${formatValue(a.cleanFundamental() / Math.SQRT2, 'V')} rms, where ${limitWords}; past it stage ${unfollowed + 1}'s grid current is not followed, so no figure is given there`, 'outputRms');
  }
  const wave = new Float64Array(SAMPLES);
  const fundamentalAt = (peak: number) => harmonicAmplitudes(signal.cycle(SAMPLES, peak, wave), 1)[1]!;
  const most = MAX_OVERDRIVE * cleanPeak;
  let lo = cleanPeak;
  let hi = Math.min(2 * cleanPeak, most);
  let top = fundamentalAt(hi);
  while (top < target) {
    if (hi >= most) {
      return fail('clipping', `${formatValue(target / Math.SQRT2, 'V')} rms cannot be had: past the clean limit (where ${limitWords}) the output reaches ${formatValue(top / Math.SQRT2, 'V')} rms at ${MAX_OVERDRIVE} times the clean input`, 'outputRms');
    }
    lo = hi;
    hi = Math.min(2 * hi, most);
    top = fundamentalAt(hi);
  }
  return illinois((p) => fundamentalAt(p) - target, lo, hi, 1e-9 * target, { fb: top - target });
}
