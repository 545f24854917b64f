/**
 * The A-weighting curve of sound level meters, IEC 61672-1: the gain (as a
 * voltage ratio, 1 at 1 kHz) by which a noise at `f` Hz counts, from the
 * standard's analytic poles at 20.6 Hz, 107.7 Hz, 737.9 Hz and 12194 Hz,
 * normalised by +2.00 dB to read 0 dB at 1 kHz. An A-weighted noise figure
 * sums the noise power times its square: the weighting hi-fi makers quote.
 */
export function aWeighting(f: number): number {
  const f2 = f * f;
  const ra = (12194 ** 2 * f2 * f2) / ((f2 + 20.6 ** 2) * Math.sqrt((f2 + 107.7 ** 2) * (f2 + 737.9 ** 2)) * (f2 + 12194 ** 2));
  return ra * A_AT_1KHZ;
}

/** +2.00 dB as a voltage ratio: the standard's normalisation to 0 dB at 1 kHz. */
const A_AT_1KHZ = Math.pow(10, 2 / 20);
