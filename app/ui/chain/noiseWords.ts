import { NOISE_BAND_HZ, type ChainResult } from '../../../src/index';
import { hertz, smallVolts } from '../../format';

/** The band the noise is read over, in words. */
export const NOISE_BAND_WORDS = `${hertz(NOISE_BAND_HZ[0])} to ${hertz(NOISE_BAND_HZ[1])}, unweighted`;

/**
 * The amplifier's own noise in words: at the speaker against 1 W into it
 * (at the output in dBV when the chain ends in a voltage stage), and
 * referred to the input. Null when the model could not find it.
 */
export function noiseWords(r: { readonly noise: ChainResult['noise'] }, speakerOhms: number | null): string | null {
  const n = r.noise;
  if (!n) return null;
  const floor = Math.max(n.outputRms, 1e-15);
  const against = speakerOhms !== null ? `${(20 * Math.log10(Math.sqrt(speakerOhms) / floor)).toFixed(0)} dB below 1 W into ${speakerOhms} Ω` : `${(20 * Math.log10(floor)).toFixed(0).replace('-', '−')} dBV`;
  return `${smallVolts(n.outputRms)} rms at the ${speakerOhms !== null ? 'speaker' : 'output'} (${against}), ${smallVolts(n.inputRms)} at the input`;
}
