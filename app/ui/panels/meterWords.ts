import type { MeterReadout } from '../../../src/index';
import { meterVolts, milliamps, percentOf, plain, watts } from '../../format';

/** What a verdict says of the tube, and what else could give it (common practice in fault-finding). */
const VERDICT_WORDS: Record<MeterReadout['verdict'], string> = {
  'within-spread': 'within the ±20 % a tube of the type may differ from typical (common practice)',
  low: 'under the ±20 % spread: a weak or tired tube, or Rk above its value (measure it with the power off)',
  high: 'over the ±20 % spread: a strong tube, a leaky coupling capacitor lifting the grid, or Rk below its value',
};

/** A stage's reading in words: the current, where the tube sits, against the typical tube there, and its dissipation. */
export function meterWords(r: MeterReadout, tubeId: string, ratedWatts: number): string {
  const shift = r.gridShift === null || Math.abs(r.gridShift) < 0.05 ? '' : `; it passes what a typical one would ${plain(Math.abs(r.gridShift), 2)} V ${r.gridShift > 0 ? 'further below' : 'closer to'} the cathode`;
  return (
    `Ia ${milliamps(r.ia)} (the cathode’s drop across Rk), at Vpk ${meterVolts(r.vpk)} and Vgk ${meterVolts(r.vgk).replace('-', '−')}: ` +
    `${percentOf(r.ratio)} of a typical ${tubeId}’s current there, ${VERDICT_WORDS[r.verdict]}${shift}. ` +
    `Plate dissipation ${watts(r.pa)}, ${percentOf(r.paFraction)} of its ${watts(ratedWatts)} rating.`
  );
}
