import { fail, type Result } from '../result';
import { checkNumber } from '../stage/checkInput';
import { harmonicAmplitudes } from '../signal/fft';
import { sineLevel, type Level } from '../signal/levels';
import type { ChainInput } from './chainTypes';
import { CYCLE_SAMPLES, prepareAmplifier, type PreparedAmplifier } from './prepareAmplifier';
import { sineCycle } from '../signal/sineCycle';

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
}

/** Points a cycle for the figures (CYCLE_SAMPLES). */
export const SAMPLES = CYCLE_SAMPLES;
/** Points a cycle while the secant search finds the level: only the fundamental is read, and below clipping the harmonics that alias onto it (the 31st and 33rd) are negligible. */
const SEARCH_SAMPLES = 32;

/**
 * The amplifier at an output level: the source level it needs (found by the
 * secant method on the fundamental of the composed waveform), each stage's
 * swing and headroom there, and the distortion of the whole chain. Above
 * the clean limit it answers a typed failure naming the stage that clips.
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
  const { signal, clips, first, inputPeak: cleanPeak } = a;
  const at = (v: number) => signal.at(v);
  const searchWave = new Float64Array(SEARCH_SAMPLES);
  const fundamentalAt = (peak: number) => harmonicAmplitudes(sineCycle(SEARCH_SAMPLES, peak, at, searchWave), 1)[1]!;
  const target = targetRms * Math.SQRT2;
  const cleanMax = a.cleanFundamental();
  // Within a part per million of the clean limit counts as at it.
  if (target > cleanMax * (1 + 1e-6)) {
    return fail('clipping', `${(target / Math.SQRT2).toPrecision(3)} V rms is past the clean limit of ${(cleanMax / Math.SQRT2).toPrecision(3)} V rms, where stage ${first + 1} reaches ${clips[first]!.by === 'grid-current' ? 'grid current' : 'cutoff'}`, 'outputRms');
  }
  // Secant on the fundamental, from the small-signal guess; bracketed by [0, the clean limit].
  let p0 = Math.min(target / Math.max(Math.abs(a.gain), 1e-12), cleanPeak);
  let f0 = fundamentalAt(p0) - target;
  let p1 = p0 * (f0 > 0 ? 0.99 : 1.01);
  for (let k = 0; k < 40 && Math.abs(f0) > 1e-9 * target; k++) {
    const f1 = fundamentalAt(Math.min(p1, cleanPeak)) - target;
    const next = f1 === f0 ? p1 : p1 - (f1 * (p1 - p0)) / (f1 - f0);
    [p0, f0] = [p1, f1];
    p1 = Math.min(Math.max(next, 0), cleanPeak);
  }
  const peak = p0;
  // The final cycle at full resolution, every stage's output kept from the same pass.
  const n = a.links.length;
  const lows = new Float64Array(n).fill(Infinity);
  const highs = new Float64Array(n).fill(-Infinity);
  const outs = new Float64Array(n);
  // Each distinct point once (sineCycle): a mirrored point repeats every stage's output, so the extremes stand.
  const wave = sineCycle(SAMPLES, peak, (v) => {
    signal.stageOutputs(v, outs);
    for (let i = 0; i < n; i++) {
      lows[i] = Math.min(lows[i]!, outs[i]!);
      highs[i] = Math.max(highs[i]!, outs[i]!);
    }
    return outs[n - 1]!;
  });
  const h = harmonicAmplitudes(wave, 10);
  const v1 = h[1]!;
  const harmonics = h.map((x, k) => (k < 2 || v1 === 0 ? 0 : x / v1));
  const thd = Math.sqrt(harmonics.reduce((s, x) => s + x * x, 0));
  const stages = a.links.map((_, i) => {
    const c = clips[i];
    return { outputPeak: (highs[i]! - lows[i]!) / 2, headroomDb: c ? 20 * Math.log10(c.inputPeak / peak) : null };
  });
  return { ok: true, inputPeak: peak, input: sineLevel(peak), output: sineLevel(v1), stages, thd, harmonics };
}
