import { korenParamsProblem } from '../tube/koren';
import { modelOf, type TubeLike } from '../tube/types';
import { fail, type Failure } from '../result';

/**
 * Field checks shared by every solver's edge validation. Each returns null when
 * the value is usable, or a failure naming the field and the value, worded to
 * be shown next to that field.
 */
const fmt = (v: number) => (Number.isFinite(v) ? String(Number(v.toPrecision(6))) : String(v));

export function checkNumber(field: string, label: string, value: unknown, unit: string, min: number, max: number, opts: { minExclusive?: boolean; allowInfinity?: boolean } = {}): Failure | null {
  if (typeof value !== 'number' || Number.isNaN(value)) return fail('invalid-input', `${label} must be a number`, field);
  if (value === Infinity && opts.allowInfinity) return null;
  if (!Number.isFinite(value)) return fail('invalid-input', `${label} must be finite (got ${fmt(value)})`, field);
  const tooLow = opts.minExclusive ? value <= min : value < min;
  if (tooLow) return fail('invalid-input', `${label} must be ${opts.minExclusive ? 'above' : 'at least'} ${fmt(min)} ${unit} (got ${fmt(value)} ${unit})`, field);
  if (value > max) return fail('invalid-input', `${label} must be at most ${fmt(max)} ${unit} (got ${fmt(value)} ${unit})`, field);
  return null;
}

export function checkTube(tube: unknown): Failure | null {
  if (typeof tube !== 'object' || tube === null) return fail('invalid-tube', 'Choose a tube', 'tube');
  const t = tube as Partial<TubeLike>;
  if (t.kind !== 'tube' && t.kind !== 'triode-model') return fail('invalid-tube', 'Choose a tube', 'tube');
  const m = modelOf(t as TubeLike);
  if (!m || typeof m.params !== 'object' || m.params === null) return fail('invalid-tube', 'The tube has no model parameters', 'tube');
  const problem = korenParamsProblem(m.params);
  return problem === null ? null : fail('invalid-tube', `The tube model is not usable: ${problem}`, 'tube');
}

/** Highest voltage and resistance this workbench models; beyond them a value is a typing slip. */
export const LIMITS = {
  maxVolts: 10_000,
  maxOhms: 1e9,
  maxBiasVolts: 1_000,
  maxFarads: 10,
} as const;
