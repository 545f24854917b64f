/**
 * Signal levels. dBV is relative to 1 V rms; dBu to 0.7746 V rms, the voltage
 * that dissipates 1 mW in 600 Ω (√0.6 V; common practice in audio, from the old 600 Ω telephone lines).
 */
export const DBU_REFERENCE_VOLTS = Math.sqrt(0.6);

/**
 * A ratio below this reads as DB_FLOOR: an exactly-zero harmonic or level
 * would otherwise be −∞ dB. −200 dB is far below anything the model or a
 * bench meter resolves (the coherent FFT's own floor is near −300 dB).
 */
export const DB_FLOOR = -200;

/** 20·log10(ratio), never below DB_FLOOR and never NaN for a non-negative finite ratio. */
export function decibelsOf(ratio: number): number {
  if (!(ratio > 0)) return DB_FLOOR;
  const db = 20 * Math.log10(ratio);
  return Number.isFinite(db) ? Math.max(DB_FLOOR, db) : DB_FLOOR;
}

export interface Level {
  /** Peak voltage, V. */
  readonly peak: number;
  readonly rms: number;
  /** dB re 1 V rms; null when there is no signal (a zero level is −∞ dB). */
  readonly dBV: number | null;
  /** dB re 0.7746 V rms; null when there is no signal. */
  readonly dBu: number | null;
}

/**
 * A sine's level from its peak. A peak below 1 nV (a swing of nothing, as
 * when the grid has no bias) reads as exactly 0 V with dB null: never
 * −Infinity, NaN or a figure like 6e−25 V.
 */
export function sineLevel(peak: number): Level {
  const p = Number.isFinite(peak) ? Math.abs(peak) : 0;
  if (p < NO_SIGNAL_VOLTS) return { peak: 0, rms: 0, dBV: null, dBu: null };
  const rms = p / Math.SQRT2;
  return { peak: p, rms, dBV: 20 * Math.log10(rms), dBu: 20 * Math.log10(rms / DBU_REFERENCE_VOLTS) };
}

/** Below this peak, V, a level is no signal at all. */
export const NO_SIGNAL_VOLTS = 1e-9;
