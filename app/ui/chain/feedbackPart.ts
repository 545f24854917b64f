import { CAPACITOR_VOLTS, RATING_MARGIN, RESISTOR_WATTS, roundUpTo } from '../../../src/index';
import { farads, ohms, watts } from '../../format';
import type { WorkbenchState } from '../../store/workbenchStore';

/**
 * The feedback resistor as a part to order: its value and what it
 * dissipates at the clean limit (the speaker's voltage across it, Joule's
 * law), rated by the rule every resistor here follows: twice that, rounded
 * up to a stocked rating (src/build/ratings.ts, common practice); a
 * capacitor across it rated by the same rule for the speaker's peak
 * voltage. Null without feedback.
 */
export function feedbackPartLine(s: WorkbenchState): string | null {
  const rf = s.design.feedbackRf;
  const view = s.amplifier;
  if (rf === null || !s.design.drivesOutput || !view?.feedback?.ok || !view.result.ok) return null;
  const v = view.result.speakerRms ?? 0;
  const p = (v * v) / rf;
  const cf = s.design.feedbackCf;
  const across = cf === null ? '' : `; Cf across it ${farads(cf)}, ${roundUpTo(CAPACITOR_VOLTS, RATING_MARGIN * v * Math.SQRT2)} V`;
  return `Rf (global feedback, speaker to stage 1's cathode): ${ohms(rf)}, ${roundUpTo(RESISTOR_WATTS, RATING_MARGIN * p)} W (runs at ${watts(p)} at the clean limit)${across}`;
}
