import { fail, type Failure } from '../result';
import { checkNumber } from '../stage/checkInput';

/**
 * An output transformer's two inductances, as a builder measures them or
 * reads them from its sheet: the whole primary's inductance with the
 * secondary open (plate to plate for a push-pull primary), at the idle
 * current it will carry, and its leakage inductance, the primary's with the
 * secondary shorted. Either may be left out (null): that side of the band is
 * then the ideal transformer's.
 */
export interface WindingInductance {
  /** Primary inductance, H, or null (ideal: no low-frequency roll-off from the transformer). */
  readonly primaryInductance?: number | null;
  /** Leakage inductance referred to the primary, H, or null (ideal: no high-frequency roll-off from it). */
  readonly leakageInductance?: number | null;
}

/** From a small single-ended transformer's few henries to a large push-pull one's hundreds; leakage from a few µH to well past any real winding's (the ranges from memory, set wide). */
export const WINDING_LIMITS = { primaryInductance: { min: 0.1, max: 2000 }, leakageInductance: { min: 1e-6, max: 10 } } as const;

/** The first inductance that cannot be used, worded for showing next to it; null when both are usable or absent. */
export function windingProblem(d: WindingInductance): Failure | null {
  if (typeof d !== 'object' || d === null) return null; // no transformer given: the ideal one
  const lp = d.primaryInductance ?? null;
  const ll = d.leakageInductance ?? null;
  const L = WINDING_LIMITS;
  return (
    (lp === null ? null : checkNumber('primaryInductance', 'Primary inductance', lp, 'H', L.primaryInductance.min, L.primaryInductance.max)) ??
    (ll === null ? null : checkNumber('leakageInductance', 'Leakage inductance', ll, 'H', L.leakageInductance.min, L.leakageInductance.max)) ??
    (lp !== null && ll !== null && !(ll < lp / 10)
      ? // A working output transformer's leakage is a small fraction of a percent of its primary (from memory): a tenth is far past any.
        fail('invalid-input', 'The leakage inductance must be well below the primary inductance (under a tenth of it in any working transformer): check the units', 'leakageInductance')
      : null)
  );
}

/**
 * The transformer as the linear network places it behind one plate: the
 * primary's resistance, the leakage split either side of the magnetising
 * inductance (the coupled windings' T, its open-circuit inductance the
 * primary's), into the reflected load; `share` scales every primary value
 * (resistance, load, inductances) to what the plate sees (1 single-ended;
 * ½ for each tube of a push-pull pair's half circuit, as its load is half
 * the plate-to-plate one). Null when neither inductance is given: the ideal
 * transformer.
 */
export function linearWinding(d: WindingInductance, rPrimary: number, primaryLoad: number, share: number, scale: number) {
  const lp = d.primaryInductance ?? null;
  const ll = d.leakageInductance ?? null;
  if (lp === null && ll === null) return null;
  return {
    rSeries: rPrimary * share,
    reflected: primaryLoad * share,
    lm: lp === null ? null : (lp - (ll ?? 0) / 2) * share,
    ll: ll === null ? null : ll * share,
    scale,
  };
}
