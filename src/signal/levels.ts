/**
 * Signal levels. dBV is relative to 1 V rms; dBu to 0.7746 V rms, the voltage
 * that dissipates 1 mW in 600 Ω (√0.6 V; ITU-T and audio practice).
 */
export const DBU_REFERENCE_VOLTS = Math.sqrt(0.6);

export interface Level {
  /** Peak voltage, V. */
  readonly peak: number;
  readonly rms: number;
  readonly dBV: number;
  readonly dBu: number;
}

/** A sine's level from its peak. A zero peak reads −Infinity dB, never NaN. */
export function sineLevel(peak: number): Level {
  const rms = Math.abs(peak) / Math.SQRT2;
  return { peak: Math.abs(peak), rms, dBV: 20 * Math.log10(rms), dBu: 20 * Math.log10(rms / DBU_REFERENCE_VOLTS) };
}
