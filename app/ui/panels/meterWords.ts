import type { MeterReadout, OutputMeterReadout } from '../../../src/index';
import { meterVolts, milliamps, percentOf, plain, smallVolts, watts } from '../../format';
import type { MeterRow, OutputMeterRow, TriodeReadout } from '../../store/meterRows';

/** What a verdict says of the tube, and what else could give it (common practice in fault-finding). */
const VERDICT_WORDS: Record<MeterReadout['verdict'], string> = {
  'within-spread': 'within the ±20 % a tube of the type may differ from typical (common practice)',
  low: 'under the ±20 % spread: a weak or tired tube, or Rk above its value (measure it with the power off)',
  high: 'over the ±20 % spread: a strong tube, a leaky coupling capacitor lifting the grid, or Rk below its value',
};

/** A tube read from its plate resistor's drop: the resistor that can be off its value is Ra (common practice in fault-finding). */
const PLATE_VERDICT_WORDS: Record<MeterReadout['verdict'], string> = {
  'within-spread': VERDICT_WORDS['within-spread'],
  low: 'under the ±20 % spread: a weak or tired tube, or Ra off its value (measure it with the power off)',
  high: 'over the ±20 % spread: a strong tube, a leaky coupling capacitor lifting the grid, or Ra off its value (carbon plate resistors drift up with age)',
};

/** A stage's reading in words: the current, where the tube sits, against the typical tube there, and its dissipation. */
export function meterWords(r: MeterReadout, tubeId: string, ratedWatts: number, fromPlate = false): string {
  const shift = r.gridShift === null || Math.abs(r.gridShift) < 0.05 ? '' : `; it passes what a typical one would ${plain(Math.abs(r.gridShift), 2)} V ${r.gridShift > 0 ? 'further below' : 'closer to'} the cathode`;
  return (
    `Ia ${milliamps(r.ia)} (${fromPlate ? 'the drop across Ra, supply to plate' : 'the cathode’s drop across Rk'}), at Vpk ${meterVolts(r.vpk)} and Vgk ${meterVolts(r.vgk)}: ` +
    `${percentOf(r.ratio)} of a typical ${tubeId}’s current there, ${(fromPlate ? PLATE_VERDICT_WORDS : VERDICT_WORDS)[r.verdict]}${shift}. ` +
    `Plate dissipation ${watts(r.pa)}, ${percentOf(r.paFraction)} of its ${watts(ratedWatts)} rating.`
  );
}

/** A triode stage's reading in words, a line per tube: its tube's, or a long-tailed pair's two and whether the tail agrees with their sum. */
export function triodeMeterLines(r: TriodeReadout, row: Pick<MeterRow, 'tubeId' | 'ratedWatts' | 'route' | 'gridRead'>): string[] {
  // A direct-coupled grid sits where the stage before's output was read, not where it was designed to.
  const g = row.gridRead;
  const grid = g ? [`Its grid is direct-coupled: taken at ${meterVolts(g.volts)}, where stage ${g.stage}’s ${g.pin} reads.`] : [];
  if (row.route !== 'pair' || r.tail === null) return [meterWords(r.tubes[0]!, row.tubeId, row.ratedWatts, row.route === 'plate'), ...grid];
  const [first, second] = r.tubes;
  const tail = r.tail;
  const agree = tail.agrees
    ? 'they agree'
    : 'they should agree within 10 %: a plate or tail resistor is off its value, a grid draws current, or a lead slipped (measure the resistors with the power off)';
  return [
    `First triode (inverting plate): ${meterWords(first!, row.tubeId, row.ratedWatts, true)}`,
    `Second triode: ${meterWords(second!, row.tubeId, row.ratedWatts, true)}`,
    `The tail carries ${milliamps(tail.tailCurrent)} (the cathodes’ drop across Rk and the tail), the plates ${milliamps(tail.plateSum)} together: ${agree}.`,
    ...grid,
  ];
}

/** A fixed-bias tube's verdict: no cathode resistor to be off its value, and the grid was read (common practice in fault-finding). */
const FIXED_VERDICT_WORDS: Record<MeterReadout['verdict'], string> = {
  'within-spread': VERDICT_WORDS['within-spread'],
  low: 'under the ±20 % spread: a weak or tired tube',
  high: 'over the ±20 % spread: a strong tube, or one drawing grid current (a gassy tube, whose current creeps up as it warms)',
};

/** A cathode-biased pair read across its shared Rk: the tubes' average, so the causes are the pair's. */
const PAIR_VERDICT_WORDS: Record<MeterReadout['verdict'], string> = {
  'within-spread': 'within the ±20 % tubes of the type may differ from typical (common practice)',
  low: 'under the ±20 % spread: weak or tired tubes, or Rk above its value (measure it with the power off)',
  high: 'over the ±20 % spread: strong tubes, a leaky coupling capacitor lifting the grids, or Rk below its value',
};

/** An output tube's reading in words: its cathode current, where it sits, against the typical tube, its plate's and screen's dissipation, and for a fixed bias the sense reading the design asks. */
export function outputMeterWords(r: OutputMeterReadout, row: Pick<OutputMeterRow, 'tubeId' | 'bias' | 'together' | 'ratedWatts' | 'ratedScreenWatts' | 'expected'>): string {
  const across = row.bias === 'fixed' ? 'the drop across its 1 Ω sense resistor' : row.together ? 'half the drop across the shared Rk' : 'the cathode’s drop across Rk';
  const screen = r.vg2k === null ? '' : `, Vg2k ${meterVolts(r.vg2k)}`;
  const passes = row.together ? 'on average they pass what typical ones would' : 'it passes what a typical one would';
  const shift = r.gridShift === null || Math.abs(r.gridShift) < 0.05 ? '' : `; ${passes} ${plain(Math.abs(r.gridShift), 2)} V ${r.gridShift > 0 ? 'further below' : 'closer to'} the cathode`;
  const verdicts = row.bias === 'fixed' ? FIXED_VERDICT_WORDS : row.together ? PAIR_VERDICT_WORDS : VERDICT_WORDS;
  const screenWatts = r.pg2 === null ? '' : `, the screen ${watts(r.pg2)}${r.pg2Fraction !== null && row.ratedScreenWatts !== null ? ` (${percentOf(r.pg2Fraction)} of ${watts(row.ratedScreenWatts)})` : ''}`;
  const split = r.ig2 === null ? '' : ' (the cathode current split between plate and screen as a typical tube splits it: the cathode cannot tell them apart)';
  const set = row.bias === 'fixed' ? ` The designed idle reads ${smallVolts(row.expected.cathode)} across the sense resistor: set the trimmer to it.` : '';
  return (
    `Ik ${milliamps(r.ik)} (${across}), at Vpk ${meterVolts(r.vpk)}${screen} and Vgk ${meterVolts(r.vgk)}: ` +
    `${percentOf(r.ratio)} of a typical ${row.tubeId}’s cathode current there, ${verdicts[r.verdict]}${shift}. ` +
    `Plate dissipation ${row.together ? 'each ' : ''}${watts(r.pa)}, ${percentOf(r.paFraction)} of its ${watts(row.ratedWatts)} rating${screenWatts}${split}.${set}`
  );
}
