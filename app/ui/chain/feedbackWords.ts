import { dB, ohms, plain } from '../../format';
import type { AmplifierView } from '../../store/amplifierChain';

/**
 * Global feedback in words, for the strip and the card: how much, the
 * closed loop's gain and the input the clean limit then needs, the output
 * impedance and damping factor, and the THD at the working level as the
 * open loop's over 1 + T (a first-order estimate, common practice). Null
 * without feedback; the model's message when it cannot be had.
 */
export function feedbackWords(view: AmplifierView): string | null {
  const f = view.feedback;
  if (!f) return null;
  if (!f.ok) return f.message;
  const inRms = f.inputPeak / Math.SQRT2;
  const at = f.thdEstimate !== null ? `; THD at 1 W about ${plain(f.thdEstimate * 100, 2)} %` : '';
  return `${dB(f.feedbackDb)} of feedback (loop gain ${plain(f.loopGain)}): gain ${dB(20 * Math.log10(f.closedGain))} (${plain(f.closedGain)}×), clean limit from ${plain(inRms)} V rms in; output impedance ${f.zoutClosed < 1 ? `${plain(f.zoutClosed)} Ω` : ohms(f.zoutClosed)} (damping factor ${plain(f.dampingFactor)})${at}`;
}

/** What the feedback figures leave out, said beside them once. */
export const FEEDBACK_CAVEAT = 'Midband, the secondary phased for negative feedback; the THD is the open loop\'s over 1 + loop gain (common practice; within 15 % of ngspice here, a little low). Rf also carries stage 1\'s cathode current to the grounded secondary: the loop\'s figures take Rk ∥ Rf, stage 1\'s own chart keeps Rk. The band\'s edges and stability with a real transformer are not modelled: check with a square wave and a scope before use (common practice).';

/** The loop in a few words, for comparing two amplifiers side by side: null without feedback, the model's message when it cannot be had. */
export function feedbackBrief(view: AmplifierView): string | null {
  const f = view.feedback;
  if (!f) return null;
  if (!f.ok) return f.message;
  return `${dB(f.feedbackDb)}: gain ${plain(f.closedGain)}×, damping factor ${plain(f.dampingFactor)}${f.thdEstimate !== null ? `, THD at 1 W about ${plain(f.thdEstimate * 100, 2)} %` : ''}`;
}
