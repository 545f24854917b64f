import { formatValue, SUPPLY_GAIN_MARGIN_DB } from '../../../src/index';
import type { SupplyView } from '../../store/supplySlice';

const hz = (f: number | null) => (f === null ? 'DC' : formatValue(f, 'Hz'));

/**
 * The amplifier's low end on its supply in one sentence, as the supply's
 * panel and the card print it: the −3 dB point on this supply against an
 * ideal one, any rise above midband below the band, and whether the loop
 * through the supply is stable. Null until it has been worked out.
 */
export function lowEndWords(view: SupplyView): string | null {
  const le = view.lowEnd;
  if (!le) return null;
  if (!le.ok) return `Low end on this supply: ${le.message}`;
  // An unstable loop's response on the axis is no figure to read: only a stable one's rise is given.
  const stable = le.unstablePoles === 0;
  const rise = stable && le.peakDb >= 0.1 && le.peakHz !== null && le.peakHz < 1000 ? `, rising ${le.peakDb.toFixed(1)} dB above midband at ${hz(le.peakHz)}` : '';
  const loop =
    le.unstablePoles === null ? 'whether the loop through the supply is stable could not be told'
      : le.unstablePoles > 0 ? 'the loop through the supply OSCILLATES (motorboating)'
        : le.thinLoop ? `the loop through the supply is stable but thin (under ${SUPPLY_GAIN_MARGIN_DB} dB of gain margin)` : 'the loop through the supply is stable';
  const ideal = le.idealTransformer ? ' (output transformer taken as ideal: give its primary inductance)' : '';
  return `Low end on this supply: −3 dB at ${hz(le.lowHz)} (${hz(le.idealLowHz)} on an ideal supply)${rise}; ${loop}${ideal}`;
}
