import { formatValue } from '../parts/formatValue';
import type { Finding } from './ratingBands';

/** The top of the audio band, Hz (20 Hz to 20 kHz, common practice). */
export const AUDIO_BAND_TOP_HZ = 20e3;

/**
 * What a gain stage's grid stopper does to its band: with the grid's input
 * capacitance (the Miller effect, `cin`, F) it is a first-order low-pass,
 * f = 1/(2π·R·C). That corner is the stopper's own; what drives the grid
 * adds its resistance and lowers it further, and the response figures count
 * both. A note above the audio band; a warning inside it, where the top of
 * the band rolls off audibly (a guitar stage may want that; a hi-fi one
 * does not). Null without a stopper or a capacitance to work against.
 */
export function stopperFinding(rstopper: number, cin: number): Finding | null {
  if (!(rstopper > 0) || !(cin > 0)) return null;
  const cornerHz = 1 / (2 * Math.PI * rstopper * cin);
  if (!Number.isFinite(cornerHz)) return null;
  const inside = cornerHz < AUDIO_BAND_TOP_HZ;
  const start = `Grid stopper ${formatValue(rstopper, 'Ω')} with the grid's ${formatValue(cin, 'F')} (Miller effect): its own corner is ${formatValue(cornerHz, 'Hz')}`;
  return {
    kind: 'grid-stopper',
    severity: inside ? 'warning' : 'note',
    message: inside
      ? `${start}, inside the audio band (to ${formatValue(AUDIO_BAND_TOP_HZ, 'Hz')}, common practice): the top of the band rolls off. A smaller stopper keeps it, unless the roll-off is wanted.`
      : `${start}, above the audio band; what drives the grid lowers it further (the response figures count both).`,
    value: cornerHz,
    limit: AUDIO_BAND_TOP_HZ,
    percent: (100 * cornerHz) / AUDIO_BAND_TOP_HZ,
  };
}
