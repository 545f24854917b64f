import { korenParamsProblem } from '../tube/koren';
import { modelOf, type TubeLike } from '../tube/types';
import { fail, type Failure } from '../result';

/**
 * Field checks shared by every solver's edge validation. Each returns null when
 * the value is usable, or a failure naming the field and the value, worded to
 * be shown next to that field.
 */
const fmt = (v: number) => (Number.isFinite(v) ? String(Number(v.toPrecision(6))) : String(v));

import { shown } from '../shown';

export { shown };

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
  if (!m || typeof m !== 'object' || typeof m.params !== 'object' || m.params === null) return fail('invalid-tube', 'The tube has no model parameters', 'tube');
  if (t.kind === 'tube') {
    // A record's ratings and capacitances are read by the findings and the Miller figure: check them here, once.
    const r = (t as { ratings?: unknown }).ratings as Record<string, unknown> | undefined;
    const positive = (v: unknown) => typeof v === 'number' && Number.isFinite(v) && v > 0;
    if (typeof r !== 'object' || r === null || !positive(r.maxPlateVoltage) || !positive(r.maxPlateDissipation)) return fail('invalid-tube', 'The tube record has no usable ratings (plate voltage and dissipation)', 'tube');
    const c = (t as { capacitances?: unknown }).capacitances as Record<string, unknown> | undefined;
    const cap = (v: unknown) => typeof v === 'number' && Number.isFinite(v) && v >= 0;
    if (typeof c !== 'object' || c === null || !cap(c.cgk) || !cap(c.cgp) || !cap(c.cpk)) return fail('invalid-tube', 'The tube record has no usable capacitances', 'tube');
  }
  const problem = korenParamsProblem(m.params);
  return problem === null ? null : fail('invalid-tube', `The tube model is not usable: ${problem}`, 'tube');
}

/**
 * The range of values this workbench models; beyond them a value is a typing
 * slip. The floors keep denormal values (5e-324 Ω) out of the arithmetic,
 * where they would divide to infinity.
 */
export const LIMITS = {
  maxVolts: 10_000,
  minOhms: 1,
  maxOhms: 1e9,
  maxBiasVolts: 1_000,
  minFarads: 1e-15,
  maxFarads: 10,
} as const;

/** A count (samples, points, levels) that must be a whole number in [min, max]. */
export function checkCount(field: string, label: string, value: unknown, min: number, max: number): Failure | null {
  if (typeof value !== 'number' || !Number.isInteger(value) || value < min || value > max) {
    return fail('invalid-input', `${label} must be a whole number from ${min} to ${max} (got ${shown(value)})`, field);
  }
  return null;
}
