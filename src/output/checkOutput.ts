import { fail, type Failure } from '../result';
import { checkCount, checkNumber, checkTube } from '../stage/checkInput';
import { pentodeParamsProblem, type KorenPentodeParams } from '../tube/pentode';
import { isPowerOfTwo } from '../signal/fft';
import { outputDesignProblem, type OutputDesign } from './outputDesign';
import type { OutputTube } from './outputTube';
import type { OutputSolution } from './solveOutput';

const PENTODE_KEYS: readonly (keyof KorenPentodeParams)[] = ['mu', 'ex', 'kg1', 'kg2', 'kp', 'kvb'];
const positive = (v: unknown) => typeof v === 'number' && Number.isFinite(v) && v > 0;

/**
 * An output-tube record as the solvers read it: its law (a pentode's six
 * constants, or a usable triode record) and its plate ratings. A malformed
 * record is a typed failure, never a TypeError deep in a solve.
 */
export function checkOutputTube(tube: unknown): Failure | null {
  if (typeof tube !== 'object' || tube === null || (tube as { kind?: unknown }).kind !== 'output-tube') return fail('invalid-tube', 'Choose an output tube', 'tube');
  const t = tube as Partial<OutputTube>;
  const law = t.law as OutputTube['law'] | undefined;
  if (typeof law !== 'object' || law === null) return fail('invalid-tube', 'The output tube has no characteristic law', 'tube');
  if (law.kind === 'pentode') {
    const p = law.params as Partial<KorenPentodeParams> | undefined;
    if (typeof p !== 'object' || p === null || !PENTODE_KEYS.every((k) => positive(p[k]))) return fail('invalid-tube', 'The output tube\'s pentode constants are not usable', 'tube');
    const problem = pentodeParamsProblem(p as KorenPentodeParams);
    if (problem) return fail('invalid-tube', `The output tube's law is not usable: ${problem}`, 'tube');
  } else if (law.kind === 'triode') {
    const problem = checkTube(law.tube);
    if (problem) return problem;
  } else return fail('invalid-tube', 'The output tube\'s law is neither pentode nor triode', 'tube');
  const r = t.ratings as Partial<OutputTube['ratings']> | undefined;
  if (typeof r !== 'object' || r === null || !positive(r.maxPlateVoltage) || !positive(r.maxPlateDissipation)) return fail('invalid-tube', 'The output tube record has no usable ratings', 'tube');
  if (typeof t.id !== 'string') return fail('invalid-tube', 'The output tube has no name', 'tube');
  return null;
}

/** The tube and the design together, as solveOutput takes them. */
export function checkOutputInput(tube: unknown, design: unknown): Failure | null {
  const t = checkOutputTube(tube);
  if (t) return t;
  if (typeof design !== 'object' || design === null) return fail('invalid-input', 'No output design given');
  return outputDesignProblem(design as OutputDesign, tube as OutputTube);
}

/**
 * A solution from solveOutput, as the functions that analyse one take it:
 * its tube and design still pass their checks and its operating point is finite.
 */
export function checkOutputSolution(s: unknown): Failure | null {
  if (typeof s !== 'object' || s === null || (s as { ok?: unknown }).ok !== true) return fail('invalid-input', 'Give a solution from solveOutput', 'solution');
  const x = s as OutputSolution;
  const problem = checkOutputInput(x.tube, x.design);
  if (problem) return problem;
  const op = x.op as Partial<OutputSolution['op']> | undefined;
  const finite = (v: unknown) => typeof v === 'number' && Number.isFinite(v);
  if (typeof op !== 'object' || op === null || !finite(op.vgk) || !finite(op.vpk) || !positive(op.ip) || typeof op.feed !== 'object' || op.feed === null) {
    return fail('invalid-input', 'The solution has no usable operating point: solve the stage again', 'solution');
  }
  return null;
}

/** Limits on what a caller may ask of the swing: counts stay small enough for a call to end within 100 ms. */
export const OUTPUT_CALL_LIMITS = { maxSamples: 4096, maxLevels: 200, maxZPoints: 32, maxDrive: 1000 } as const;

/** A cycle's points: a power of two, which the radix-2 Fourier transform of its harmonics needs. */
export const checkSamples = (n: unknown) =>
  checkCount('samples', 'Samples per cycle', n, 8, OUTPUT_CALL_LIMITS.maxSamples) ??
  (isPowerOfTwo(n as number) ? null : fail('invalid-input', `Samples per cycle must be a power of two (its harmonics are read by a radix-2 Fourier transform), from 8 to ${OUTPUT_CALL_LIMITS.maxSamples}`, 'samples'));
export const checkDrive = (v: unknown) => checkNumber('drive', 'Drive', v, 'V', 0, OUTPUT_CALL_LIMITS.maxDrive);
export const checkZ = (v: unknown) => checkNumber('zPrimary', 'Primary impedance', v, 'Ω', 100, 100_000);
export const checkThdLimit = (v: unknown) => checkNumber('thdLimit', 'Distortion limit', v, '', 0.001, 0.5);
