/**
 * The one way a figure is banded against its rating, shared by every stage
 * kind: a note well inside it, a warning near or at it, danger only over it.
 */
export type Severity = 'danger' | 'warning' | 'note';

export type FindingKind =
  | 'plate-dissipation'
  | 'plate-voltage'
  | 'cold-plate-voltage'
  | 'heater-cathode'
  | 'grid-current'
  | 'no-grid-bias'
  | 'grid-current-onset'
  | 'grid-leak-bias'
  | 'grid-resistor'
  | 'grid-stopper'
  | 'volume-control'
  | 'cathode-current'
  | 'screen-dissipation'
  | 'screen-voltage'
  | 'screen-supply'
  | 'plate-swing'
  | 'capacitor-voltage'
  | 'capacitor-ripple-current'
  | 'rectifier-current'
  | 'rectifier-peak-current'
  | 'reservoir-capacitance'
  | 'transformer-current'
  | 'winding-dc'
  | 'hum'
  | 'supply-bplus'
  | 'supply-coupling'
  | 'loop-stability'
  | 'primary-imbalance'
  | 'tube-spread'
  /** A fixed-bias adjustment turned to its hot end. */
  | 'bias-range'
  | 'distortion';

/** One check of the design against the tube's ratings, worded to be shown as is. */
export interface Finding {
  readonly kind: FindingKind;
  readonly severity: Severity;
  readonly message: string;
  /** The value checked and its limit, in SI units; percent = 100·value/limit (0 when the limit is 0). */
  readonly value: number;
  readonly limit: number;
  readonly percent: number;
}

/**
 * Above this share of the rated dissipation a design gets a warning. Designers
 * keep a margin for mains swings and tube spread (common practice).
 */
export const DISSIPATION_WARN_FRACTION = 0.85;

/**
 * Above this share of the heater–cathode rating a design gets a warning: the
 * cathode's DC voltage moves with the mains and the signal rides on it
 * (common practice).
 */
export const HEATER_CATHODE_WARN_FRACTION = 0.8;

/**
 * A figure within this share above its rating still counts as "at" it. The
 * model reproduces a data sheet's own typical points to about 0.5 %, so a
 * sheet's rated operating point (a 2A3 at 15 W) must not read as over.
 */
export const AT_RATING_TOLERANCE = 0.005;

/** Where a figure sits against its rating. */
export type Band = 'over' | 'at' | 'near' | 'within';

export function bandOf(value: number, limit: number, warnFraction: number): Band {
  const share = limit > 0 ? value / limit : value > 0 ? Infinity : 0;
  if (share > 1 + AT_RATING_TOLERANCE) return 'over';
  if (share >= 1 - AT_RATING_TOLERANCE) return 'at';
  if (share > warnFraction) return 'near';
  return 'within';
}

export const BAND_SEVERITY: Record<Band, Severity> = { over: 'danger', at: 'warning', near: 'warning', within: 'note' };

export function percentOf(value: number, limit: number): number {
  return limit > 0 ? (100 * value) / limit : 0;
}

export function finding(kind: FindingKind, severity: Severity, message: string, value: number, limit: number): Finding {
  return { kind, severity, message, value, limit, percent: percentOf(value, limit) };
}

const SEVERITY_ORDER: Record<Severity, number> = { danger: 0, warning: 1, note: 2 };

/** Most severe first; the order within one severity is kept. */
export function bySeverity(findings: Finding[]): Finding[] {
  return findings.sort((a, b) => SEVERITY_ORDER[a.severity] - SEVERITY_ORDER[b.severity]);
}

/**
 * A dissipation (plate or screen) banded against its rating, with the wording
 * for each band.
 */
export function dissipationFinding(kind: FindingKind, what: string, watts: number, rating: number, extra = ''): Finding {
  const band = bandOf(watts, rating, DISSIPATION_WARN_FRACTION);
  const text = `${what} dissipation ${watts.toFixed(2)} W is ${Math.round((100 * watts) / rating)} % of the ${rating} W rating${extra}`;
  const tail = { over: `: ${what === 'Plate' ? 'the plate' : 'it'} will overheat.`, at: ': at its maximum rating, with no margin for mains swings and tube spread.', near: ': little margin for mains swings and tube spread.', within: '.' }[band];
  return finding(kind, BAND_SEVERITY[band], `${text}${tail}`, watts, rating);
}

/** A tube's heater–cathode ratings by polarity, as its record gives them. */
export interface HeaterCathodeRating {
  /** Cathode positive to the heater (the usual case: heater near ground, cathode above it), V. */
  readonly cathodePositive: number;
  /** Cathode negative to the heater (an elevated heater above a low cathode), V. */
  readonly cathodeNegative: number;
  /** True where the record has one figure for both polarities. */
  readonly onePolarity: boolean;
}

const v1 = (x: number) => x.toFixed(Math.abs(x) < 10 ? 1 : 0);

/**
 * Heater-to-cathode voltage against the rating for its polarity: a note with
 * the margin, a warning from HEATER_CATHODE_WARN_FRACTION, danger over it.
 * `vhk` is the cathode's voltage less the heater's.
 */
export function heaterCathodeFinding(vhk: number, rating: HeaterCathodeRating): Finding {
  const positive = vhk >= 0;
  const limit = positive ? rating.cathodePositive : rating.cathodeNegative;
  const magnitude = Math.abs(vhk);
  const band = bandOf(magnitude, limit, HEATER_CATHODE_WARN_FRACTION);
  const polarity = positive ? 'cathode positive to the heater' : 'cathode negative to the heater';
  const which = rating.onePolarity ? 'the record gives one figure for both polarities' : `the rating for this polarity; the other is ${positive ? rating.cathodeNegative : rating.cathodePositive} V`;
  const text = `Heater-to-cathode voltage ${v1(magnitude)} V (${polarity}) is ${Math.round(percentOf(magnitude, limit))} % of the ${limit} V rating (${which})`;
  // A cathode above its heater asks for the heaters to be raised; one below (heaters held too high) for them to come down.
  const remedy = positive ? 'elevate the heater supply' : 'hold the heaters lower';
  const tail = {
    over: `: the insulation may break down; ${remedy}.`,
    at: `: at its maximum rating; ${remedy} for margin.`,
    near: `: little margin; consider ${positive ? 'elevating the heater supply' : 'holding the heaters lower'}.`,
    within: '.',
  }[band];
  return finding('heater-cathode', BAND_SEVERITY[band], `${text}${tail}`, magnitude, limit);
}

/** The heater–cathode rating by polarity from a record's ratings; null where there is none (directly heated). */
export function heaterCathodeRating(r: { readonly maxHeaterCathodeVoltage: number | null; readonly maxHeaterCathodeVoltageCathodeNegative?: number }): HeaterCathodeRating | null {
  const usable = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v) && v > 0;
  if (!usable(r.maxHeaterCathodeVoltage)) return null;
  const negative = usable(r.maxHeaterCathodeVoltageCathodeNegative) ? r.maxHeaterCathodeVoltageCathodeNegative : undefined;
  return { cathodePositive: r.maxHeaterCathodeVoltage, cathodeNegative: negative ?? r.maxHeaterCathodeVoltage, onePolarity: negative === undefined };
}
