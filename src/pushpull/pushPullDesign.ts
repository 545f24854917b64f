import { fail, type Failure } from '../result';
import { checkNumber } from '../stage/checkInput';
import { checkOutputTube } from '../output/checkOutput';
import { outputDesignProblem, type OutputDesign } from '../output/outputDesign';
import type { OutputTube } from '../output/outputTube';

/**
 * A push-pull output stage: two tubes of one type on a centre-tapped
 * transformer, B+ at the centre tap. SI units. The transformer is ideal
 * apart from the primary's DC resistance (half of it in each half) and
 * reflects the speaker as `raa` plate to plate. The grids are driven in
 * antiphase about the bias; a shared cathode resistor is taken as fully
 * bypassed. The single-ended stage's other fields mean what they mean there.
 */
export interface PushPullDesign extends Omit<OutputDesign, 'zPrimary'> {
  /** Plate-to-plate load the transformer reflects, Ω. */
  readonly raa: number;
  /** The whole primary's DC resistance, plate to plate, Ω (each half carries its tube's current through half of it). */
  readonly rPrimary: number;
  /** Cathode resistor shared by both tubes, Ω (cathode bias). */
  readonly rk: number;
  /**
   * How the second tube differs from the first. A number: its current at
   * every voltage, as a fraction above the first's (0.05: 5 % more current
   * and 5 % more gm at the same bias, as two tubes of one type differ); 0 for
   * a matched pair. `{ idle, gm }`: its gm (its current at every voltage,
   * scaled) and, separately, its idle current after the bias, as when each
   * side's bias is trimmed (idle 0: trimmed to equal idle currents, only the
   * gm left to differ).
   */
  readonly mismatch?: number | { readonly idle: number; readonly gm: number };
}

/** The plate-to-plate loads a pair may be given, Ω: each half then reflects a quarter, inside the single-ended range. */
export const RAA_LIMITS = { min: 400, max: 200_000 } as const;

/** The most mismatch asked about: beyond ±30 % the two are not a pair. */
export const MAX_MISMATCH = 0.3;

/** The first field that cannot be used, or null. */
export function checkPushPull(tube: unknown, design: unknown): Failure | null {
  const t = checkOutputTube(tube);
  if (t) return t;
  if (typeof design !== 'object' || design === null) return fail('invalid-input', 'No push-pull design given');
  const d = design as PushPullDesign;
  const raa = checkNumber('raa', 'Plate-to-plate load', d.raa, 'Ω', RAA_LIMITS.min, RAA_LIMITS.max);
  if (raa) return raa;
  // Each tube's half of the primary is a quarter of the plate-to-plate impedance: the single-ended checks apply to it.
  const asSingle = outputDesignProblem({ ...d, zPrimary: d.raa / 4 } as OutputDesign, tube as OutputTube);
  if (asSingle) return asSingle.field === 'zPrimary' ? { ...asSingle, field: 'raa' } : asSingle;
  const m = d.mismatch as unknown;
  if (m === undefined || typeof m === 'number') return m === undefined ? null : checkNumber('mismatch', 'Mismatch', m, '', -MAX_MISMATCH, MAX_MISMATCH);
  if (typeof m !== 'object' || m === null) return fail('invalid-input', 'Give the mismatch as a fraction or as { idle, gm }', 'mismatch');
  const parts = m as { idle?: unknown; gm?: unknown };
  return checkNumber('mismatch.gm', 'gm mismatch', parts.gm, '', -MAX_MISMATCH, MAX_MISMATCH) ?? checkNumber('mismatch.idle', 'Idle mismatch', parts.idle, '', -MAX_MISMATCH, MAX_MISMATCH);
}

/** The mismatch as its two parts: the second tube's gm (current at every voltage) and its idle current, fractions; null idle: as the gm leaves it. */
export function mismatchParts(m: PushPullDesign['mismatch']): { readonly gm: number; readonly idle: number | null } {
  if (m === undefined) return { gm: 0, idle: null };
  return typeof m === 'number' ? { gm: m, idle: null } : { gm: m.gm, idle: m.idle };
}
