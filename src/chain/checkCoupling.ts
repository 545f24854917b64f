import { fail, type Failure } from '../result';
import { checkNumber, LIMITS } from '../stage/checkInput';
import type { Coupling } from './chainTypes';

/** A coupling is a capacitor into a grid leak, or a direct connection. */
export function checkCoupling(c: unknown, allowDirect: boolean): Failure | null {
  if (typeof c !== 'object' || c === null) return fail('invalid-input', 'Say how the grid is fed: a coupling capacitor with its grid leak, or direct', 'coupling');
  const coupling = c as Coupling;
  if (coupling.kind === 'direct') {
    return allowDirect ? null : fail('invalid-input', 'An output stage is fed through a coupling capacitor and grid leak here (a direct-coupled output grid is not modelled)', 'coupling');
  }
  if (coupling.kind !== 'capacitor') return fail('invalid-input', 'Coupling must be "capacitor" or "direct"', 'coupling');
  return checkNumber('cc', 'Coupling capacitor', coupling.cc, 'F', LIMITS.minFarads, LIMITS.maxFarads) ?? checkNumber('rg', 'Grid leak', coupling.rg, 'Ω', LIMITS.minOhms, LIMITS.maxOhms);
}

/** Midband input impedance at a grid: its leak with a capacitor, none for a direct-coupled grid below 0 V. */
export function couplingImpedance(c: Coupling): number {
  return c.kind === 'capacitor' ? c.rg : Infinity;
}
