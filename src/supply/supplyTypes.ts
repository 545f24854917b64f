import type { Finding } from '../stage/ratingBands';

/**
 * A B+ supply: a mains transformer's secondary, a rectifier, a first filter
 * element and a ladder of filter sections, each node with the DC current
 * drawn from it. SI units.
 */
export interface SupplyDesign {
  /** Mains frequency, Hz (50 or 60). */
  readonly mainsHz: number;
  /** Secondary rms voltage at its rated current (each half of a centre-tapped winding), V. */
  readonly secondaryRms: number;
  /** The winding's resistance as the rectifier sees it (each half for a centre-tapped winding), Ω. */
  readonly windingOhms: number;
  /**
   * The current `secondaryRms` is stated at (the winding's rated current), A:
   * its open-circuit voltage is then higher by the drop in the winding
   * (openCircuitWinding). Left out, `secondaryRms` is the open-circuit voltage.
   */
  readonly ratedAmps?: number;
  /** The winding's regulation (no-load rise over the rated-load voltage, a fraction); with `ratedAmps`, it sets the winding's resistance in place of `windingOhms`. */
  readonly regulation?: number;
  readonly rectifier: Rectifier;
  /** The reservoir: a capacitor straight after the rectifier, or a choke (L, DCR) then a capacitor. */
  readonly input: { readonly kind: 'capacitor'; readonly c: number } | { readonly kind: 'choke'; readonly l: number; readonly rdc: number; readonly c: number };
  /** Further sections, each a series R (or L with its DCR) and a capacitor to ground. */
  readonly sections: readonly FilterSection[];
  /** DC current drawn at each node, A: index 0 the reservoir, then one per section. */
  readonly loads: readonly number[];
  /** What the parts are rated for, where the builder knows it; each check runs only when its rating is given. */
  readonly ratings?: SupplyRatings;
}

export interface SupplyRatings {
  /** The secondary's rated rms current (each half of a centre-tapped winding), A. */
  readonly secondaryAmps?: number;
  /** Each node's capacitor: rated DC volts and rated ripple current (rms, at 100/120 Hz), A. */
  readonly capacitorVolts?: readonly (number | null)[];
  readonly capacitorRippleAmps?: readonly (number | null)[];
  /** The most ripple (rms) the first stage's node may carry, V, and which node feeds the first stage. */
  readonly hum?: { readonly node: number; readonly maxRippleRms: number };
}

export type Rectifier =
  | { readonly kind: 'silicon-bridge' }
  | { readonly kind: 'silicon-full-wave' }
  /** One diode on one winding: a pulse a mains cycle, the ripple at the mains frequency, and the load's DC through the winding. */
  | { readonly kind: 'silicon-half-wave' }
  | { readonly kind: 'tube'; readonly tubeId: string };

export type FilterSection = { readonly kind: 'rc'; readonly r: number; readonly c: number } | { readonly kind: 'lc'; readonly l: number; readonly rdc: number; readonly c: number };

export interface SupplyNode {
  /** Mean voltage, V. */
  readonly dc: number;
  /** Ripple peak to peak and rms (the AC part), V. */
  readonly ripplePp: number;
  readonly rippleRms: number;
  /** The capacitor's ripple current (rms), A. */
  readonly capacitorRippleRms: number;
}

export interface SupplySolution {
  readonly nodes: readonly SupplyNode[];
  /** Rectifier current: peak and rms of all its pulses, A; how long each pulse lasts, electrical degrees (of 180 a half-cycle; of 360 behind a half-wave rectifier, one pulse a cycle). */
  readonly rectifierPeak: number;
  readonly rectifierRms: number;
  readonly conductionDegrees: number;
  /** Secondary rms current (each half of a centre-tapped winding), A, and the secondary's volt-amperes (both halves). */
  readonly secondaryRmsCurrent: number;
  readonly secondaryVa: number;
  /** What every capacitor sees with no current drawn (the tubes cold): the secondary's peak less the rectifier's drop at no current, V. */
  readonly noLoadVolts: number;
  /** For a choke input, the least inductance that keeps it conducting at this load (common practice: R/(3πf) for full wave); null otherwise. */
  readonly criticalInductance: number | null;
  /** Mains cycles integrated before the supply settled. */
  readonly cycles: number;
  /**
   * One period of the rectified source (half a mains cycle) at the steady
   * state, from the start of a half-cycle: time, s; the rectifier's current
   * into the filter, A; the reservoir's voltage, V.
   */
  readonly wave: { readonly t: readonly number[]; readonly rectifierAmps: readonly number[]; readonly reservoirVolts: readonly number[] };
  /** The supply against its parts' ratings (supplyFindings), most severe first. */
  readonly findings: readonly Finding[];
}
