import { NOISE_BAND_HZ, type ChainResult } from '../../../src/index';
import { hertz, smallVolts } from '../../format';

/** The band the noise is read over, in words. */
export const NOISE_BAND_WORDS = `${hertz(NOISE_BAND_HZ[0])} to ${hertz(NOISE_BAND_HZ[1])}`;

/**
 * The amplifier's own noise in words: at the speaker, plain and A-weighted,
 * each against 1 W into it (at the output in dBV when the chain ends in a
 * voltage stage), then referred to the input. Null when the model could not
 * find it.
 */
export function noiseWords(r: { readonly noise: ChainResult['noise'] }, speakerOhms: number | null): string | null {
  const n = r.noise;
  if (!n) return null;
  const below = (v: number) => (20 * Math.log10(Math.sqrt(speakerOhms ?? 1) / Math.max(v, 1e-15))).toFixed(0);
  const dbv = (v: number) => (20 * Math.log10(Math.max(v, 1e-15))).toFixed(0).replace('-', '−');
  const against = speakerOhms !== null ? `${below(n.outputRms)} dB and ${below(n.weightedRms)} dB(A) below 1 W into ${speakerOhms} Ω` : `${dbv(n.outputRms)} dBV and ${dbv(n.weightedRms)} dBV(A)`;
  return `${smallVolts(n.outputRms)} rms at the ${speakerOhms !== null ? 'speaker' : 'output'}, ${smallVolts(n.weightedRms)} A-weighted (${against}); ${smallVolts(n.inputRms)} at the input`;
}
