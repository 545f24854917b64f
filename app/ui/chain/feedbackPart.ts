import { ohms, watts } from '../../format';
import type { WorkbenchState } from '../../store/workbenchStore';

/**
 * The feedback resistor as a part to order: its value and what it
 * dissipates at the clean limit (the speaker's voltage across it, Joule's
 * law), with the rating rule every resistor here follows: twice that, at
 * least 0.25 W (common practice). Null without feedback.
 */
export function feedbackPartLine(s: WorkbenchState): string | null {
  const rf = s.design.feedbackRf;
  const view = s.amplifier;
  if (rf === null || !s.design.drivesOutput || !view?.feedback?.ok || !view.result.ok) return null;
  const v = view.result.speakerRms ?? 0;
  const p = (v * v) / rf;
  return `Rf (global feedback, speaker to stage 1's cathode): ${ohms(rf)}, ${Math.max(0.25, 2 * p) <= 0.25 ? '0.25 W' : watts(2 * p)} (runs at ${watts(p)} at the clean limit)`;
}
