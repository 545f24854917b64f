import { farads, hertz, ohms } from '../../format';
import { STOPPER_CORNER_CLEAR_HZ, type GridStopper } from '../../../src/index';

/**
 * The output grid's stopper in words, for the parts list and the card: why it
 * is there and what it costs the band. Its corner with the grid's Miller
 * capacitance is stated; the figures leave it out where it clears the band by
 * a decade, and say so where it does not.
 */
export function stopperLine(g: GridStopper, tubes: 1 | 2): string {
  const where = tubes === 2 ? 'at each output grid pin' : 'at the output grid pin';
  const corner = `with the grid's ${farads(g.inputCapacitance)} (Miller) its corner is ${hertz(g.cornerHz)}`;
  const verdict = g.cornerHz >= STOPPER_CORNER_CLEAR_HZ ? 'far above the band, so the figures leave it out' : 'near enough to the band to trim its top, which the figures do not show';
  return `Grid stopper ${ohms(g.ohms)} ${where}, against parasitic oscillation (common practice): ${corner}, ${verdict}.`;
}
