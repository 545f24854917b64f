import { fail, type Failure } from '../result';
import { formatValue } from '../parts/formatValue';
import { checkNumber } from './checkInput';
import type { Finding } from './ratingBands';
import { AUDIO_BAND_TOP_HZ } from './stopperFinding';

/** The lowest wiper setting taken, a share of the track: −120 dB, far below any a builder turns to. */
export const MIN_VOLUME = 1e-6;

/** A volume setting (absent: none) against its range; it needs a grid leak to be the pot's track. */
export function volumeProblem(volume: unknown, hasLeak: boolean): Failure | null {
  if (volume === undefined) return null;
  if (!hasLeak) return fail('invalid-input', 'A volume control takes the place of the grid leak: the stage needs a capacitor-coupled grid and its leak', 'volume');
  return checkNumber('volume', 'Volume setting (the share of the track the wiper passes)', volume, '', MIN_VOLUME, 1);
}

/**
 * What a volume control does to the top of the band at its worst setting:
 * a wiper drives its grid through the track below it in parallel with the
 * track above it (Thévenin), at most a quarter of the track, at half of it
 * (−6 dB), with what drives the track's top taken as nothing; then the grid
 * stopper in series. With the grid's input capacitance (the Miller effect,
 * `cin`) that is a first-order low-pass, f = 1/(2π·R·C). A warning when that
 * corner falls inside the audio band, a note above it. Null without a pot
 * or a capacitance to work against.
 */
export function volumeFinding(track: number, volume: number | undefined, rstopper: number, cin: number): Finding | null {
  if (volume === undefined || !(track > 0) || !(cin > 0)) return null;
  const worst = track / 4 + Math.max(0, rstopper);
  const cornerHz = 1 / (2 * Math.PI * worst * cin);
  if (!Number.isFinite(cornerHz)) return null;
  const inside = cornerHz < AUDIO_BAND_TOP_HZ;
  const through = rstopper > 0 ? `${formatValue(track / 4, 'Ω')} and its stopper` : formatValue(track / 4, 'Ω');
  const start = `Volume control ${formatValue(track, 'Ω')}: at half its track (−6 dB) the wiper drives the grid through ${through}; with the grid's ${formatValue(cin, 'F')} (Miller effect) its corner is ${formatValue(cornerHz, 'Hz')}`;
  return {
    kind: 'volume-control',
    severity: inside ? 'warning' : 'note',
    message: inside
      ? `${start}, inside the audio band (to ${formatValue(AUDIO_BAND_TOP_HZ, 'Hz')}, common practice): turned down, the top of the band rolls off. A smaller pot, or a cathode follower after it, keeps it.`
      : `${start}, above the audio band; what drives the pot lowers it further (the response figures count it at the setting given).`,
    value: cornerHz,
    limit: AUDIO_BAND_TOP_HZ,
    percent: (100 * cornerHz) / AUDIO_BAND_TOP_HZ,
  };
}

/**
 * What drives a grid behind a volume control, looking back from the wiper
 * at midband (Thévenin, the coupling capacitor a short): the track below the
 * wiper against the track above it in series with what drives the track's
 * top, `before`. With the pot at full, the leak in parallel with `before`.
 */
export function wiperImpedance(track: number, volume: number, before: number): number {
  const below = volume * track;
  const above = (1 - volume) * track + before;
  return below + above > 0 ? (below * above) / (below + above) : 0;
}

/**
 * What the stage before drives at a volume control's top, Ω: the track
 * above the wiper in series with the track below it in parallel with the
 * grid's own input (`grid`, Ω; Infinity for none).
 */
export function trackLoad(track: number, volume: number, grid: number): number {
  const below = volume * track;
  const lower = Number.isFinite(grid) ? (below * grid) / (below + grid) : below;
  return (1 - volume) * track + lower;
}
