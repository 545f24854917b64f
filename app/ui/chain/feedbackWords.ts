import { dB, henries, hertz, ohms, plain, voltsRms } from '../../format';
import type { WindingInductance } from '../../../src/index';
import type { AmplifierView } from '../../store/amplifierChain';
import { noiseWords } from './noiseWords';

/**
 * Global feedback in words, for the strip and the card: how much, the
 * closed loop's gain and the input the clean limit then needs, the output
 * impedance and damping factor, and the THD at the working level as the
 * open loop's over 1 + T (a first-order estimate, common practice). Null
 * without feedback; the model's message when it cannot be had.
 */
export function feedbackWords(view: AmplifierView, speakerOhms: number): string | null {
  const f = view.feedback;
  if (!f) return null;
  if (!f.ok) return f.message;
  const inRms = f.inputPeak / Math.SQRT2;
  const at = f.thdEstimate !== null ? `; THD at 1 W about ${plain(f.thdEstimate * 100, 2)} %` : '';
  // The loop lowers the noise at the speaker with the gain; referred to the input it stays about the open loop's.
  const noise = noiseWords(f.band, speakerOhms);
  return `${dB(f.feedbackDb)} of feedback (loop gain ${plain(f.loopGain)}): gain ${dB(20 * Math.log10(f.closedGain))} (${plain(f.closedGain)}×), clean limit from ${voltsRms(inRms)} in; output impedance ${f.zoutClosed < 1 ? `${plain(f.zoutClosed)} Ω` : ohms(f.zoutClosed)} (damping factor ${plain(f.dampingFactor)})${at}${noise ? `; noise ${noise}` : ''}`;
}

/** What the feedback figures leave out, said beside them once. */
export const FEEDBACK_CAVEAT = 'Gain, impedance and THD at midband, the secondary phased for negative feedback; the THD is the open loop\'s over 1 + loop gain (common practice; within 15 % of ngspice here, a little low). Rf also carries stage 1\'s cathode current to the grounded secondary: the loop\'s figures take Rk ∥ Rf, stage 1\'s own chart keeps Rk. The band and margins follow the output transformer\'s primary and leakage inductances as given; its winding capacitances and the speaker\'s rising impedance are not modelled: check with a square wave and a scope before use (common practice).';

const VERDICT = { stable: 'stable', marginal: 'thin margins', oscillates: 'unstable: it will oscillate' } as const;

/**
 * The closed loop across the band in words: its −3 dB points against 1 kHz,
 * any rise above midband, the phase and gain margins at each end and the
 * verdict; then what of the transformer was taken as ideal. Null without
 * feedback or when the loop cannot be had.
 */
export function feedbackBandWords(view: AmplifierView, winding: WindingInductance): string | null {
  const f = view.feedback;
  if (!f?.ok) return null;
  const b = f.band;
  const edge = (x: number | null, none: string) => (x === null ? none : hertz(x));
  const rise = b.peakDb >= 0.1 && b.peakHz !== null ? `, rising ${dB(b.peakDb)} at ${hertz(b.peakHz)}` : '';
  const end = (name: string, m: typeof b.low) =>
    m === null ? `${name} end: loop gain above one throughout` : `${name} end ${plain(m.phaseMarginDeg, 2)}°${m.gainMarginDb === null ? '' : ` and ${dB(m.gainMarginDb)}`} (at ${hertz(m.crossoverHz)})`;
  const lp = winding.primaryInductance ?? null;
  const ll = winding.leakageInductance ?? null;
  const ideal =
    lp === null && ll === null
      ? ' The output transformer is taken as ideal (give its primary and leakage inductances on the output stage): the band\'s ends and the margins come from the coupling networks and the tubes alone.'
      : lp === null
        ? ` With leakage ${henries(ll!)}; no primary inductance given, so nothing of the transformer turns the low end.`
        : ll === null
          ? ` With primary ${henries(lp)}; no leakage inductance given, so nothing of the transformer turns the high end.`
          : ` With primary ${henries(lp)} and leakage ${henries(ll)}.`;
  const margins = `Phase and gain margins: ${end('low', b.low)}; ${end('high', b.high)}`;
  // An unstable loop has no closed-loop response to speak of: its margins say how far from stable it is.
  if (b.verdict === 'oscillates') return `Unstable: the loop will oscillate. ${margins} (common practice asks 45° and 10 dB).${ideal}`;
  return `Closed loop −3 dB at ${edge(b.lowHz, 'DC')} and ${edge(b.highHz, 'beyond 100 MHz')} (against 1 kHz)${rise}. ${margins}: ${VERDICT[b.verdict]} (common practice asks 45° and 10 dB).${ideal}`;
}

/** The loop in a few words, for comparing two amplifiers side by side: null without feedback, the model's message when it cannot be had. */
export function feedbackBrief(view: AmplifierView): string | null {
  const f = view.feedback;
  if (!f) return null;
  if (!f.ok) return f.message;
  return `${dB(f.feedbackDb)}: gain ${plain(f.closedGain)}×, damping factor ${plain(f.dampingFactor)}${f.thdEstimate !== null ? `, THD at 1 W about ${plain(f.thdEstimate * 100, 2)} %` : ''}; ${VERDICT[f.band.verdict]}`;
}
