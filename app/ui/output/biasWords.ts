import { milliamps, ohms, smallVolts, volts } from '../../format';
import { SENSE_OHMS, type BiasAdjustment, type Result } from '../../../src/index';

/**
 * A fixed-bias stage's adjustment in words, for the parts list and the card:
 * the range each tube's own adjustment must cover for the type's spread, the
 * idle to set, how to read it, and how to wire the adjustment so that it
 * fails safe. Empty under cathode bias.
 */
export function biasLines(adjustment: Result<BiasAdjustment> | null, tubes: 1 | 2): string[] {
  if (adjustment === null) return [];
  if (!adjustment.ok) return [`Bias adjustment: ${adjustment.message}`];
  const a = adjustment;
  const each = tubes === 2 ? 'one for each tube' : 'for the tube';
  const spread = Math.round(a.spread * 100);
  return [
    `Bias adjustment, ${each}: the grid from ${volts(a.weakest)} to ${volts(a.strongest)} sets ${milliamps(a.idlePlate)} idle plate current in tubes passing ${spread} % less to ${spread} % more current than the law (that spread from memory, common practice); ${volts(a.nominal)} for the law's own tube.`,
    `Set it by a ${ohms(SENSE_OHMS)} 1 % resistor from ${tubes === 2 ? 'each' : 'the'} cathode to ground: ${smallVolts(a.senseVolts)} across it is ${milliamps(a.idleCathode)} of cathode current, plate and screen (Ohm's law).`,
    'Wire the adjustment so that a lifted wiper leaves the grid at the negative end of its range: a failed control then cools the tube instead of running it away (common practice).',
  ];
}
