/**
 * A volume control's setting as typed, dB below full, as the model takes
 * it: the share of the track's signal the wiper passes (a unit conversion,
 * 20·log10 of a voltage ratio).
 */
export const volumeShare = (db: number): number => Math.pow(10, db / 20);
