import { fail, type Failure, type Result } from '../result';
import { shown } from '../shown';
import { formatValue } from '../parts/formatValue';
import { smallSignalAt } from '../tube/triode';
import { volumeOf } from './volumeOf';
import { amplifierOf, networkOf, prepareAmplifier } from './solveAmplifier';
import { amplifierAtLevel, type AmplifierLevel } from './amplifierAtLevel';
import { feedbackBand, type FeedbackBand } from './feedbackBand';
import type { ChainInput, ChainResult, CommonCathodeLink } from './chainTypes';

/** The feedback resistor's range, Ω: below it the loop would swamp the first stage's cathode; above it there is no loop to speak of. */
export const FEEDBACK_RF_LIMITS = { min: 100, max: 10e6 } as const;
/** A capacitor across Rf, F: from a few picofarads (the usual phase lead) to well past any that would help. */
export const FEEDBACK_CF_LIMITS = { min: 1e-12, max: 1e-6 } as const;
/** The lowest corner a phase-lead capacitor may make with Rf, Hz: above the band, so the midband figures stand (common practice). */
const MIN_LEAD_HZ = 10e3;

export interface GlobalFeedback {
  /** The open loop: the amplifier solved with the first stage's cathode resistor as Rk ∥ Rf (the feedback resistor's DC and AC path to the grounded secondary). */
  readonly open: ChainResult;
  /** Share of the speaker's voltage the divider puts on the first cathode, Rk/(Rk + Rf). */
  readonly beta: number;
  /** The loop gain at midband (positive: the secondary phased for negative feedback), and the feedback it makes, 20·log10(1 + T), dB. */
  readonly loopGain: number;
  readonly feedbackDb: number;
  /** Midband gain from the source's open-circuit voltage to the speaker, open and closed loop (magnitudes). */
  readonly openGain: number;
  readonly closedGain: number;
  /** The input for the same clean limit, V peak: the output stage still ends the swing; the loop asks 1 + T times the open loop's input. */
  readonly inputPeak: number;
  /** Output impedance at the speaker, Ω, open and closed loop, and the damping factor into the speaker (its ohms over the closed loop's). */
  readonly zoutOpen: number;
  readonly zoutClosed: number;
  readonly dampingFactor: number;
  /**
   * Given a level: the open loop's THD there over 1 + T, a first-order
   * estimate (common practice); against ngspice on three amplifiers at 1 W
   * it reads 4 to 11 % low (the loop makes a little of the higher harmonics
   * it does not count). Null without a level, or when the open loop cannot
   * reach it cleanly.
   */
  readonly thdEstimate: number | null;
  /** The closed loop across the band, with the output transformer's inductances where the output stage gives them, and its margins from oscillation. */
  readonly band: FeedbackBand;
}

/**
 * The capacitor across Rf, if any, against its limits and against Rf: a
 * phase-lead capacitor acts above the band (its corner with Rf above 10 kHz,
 * common practice); one that acts within it would change the midband
 * figures, which take Rf alone. Null when usable.
 */
export function feedbackPartsProblem(rf: number, cf: number | null): Failure | null {
  if (cf === null) return null;
  if (!(typeof cf === 'number' && cf >= FEEDBACK_CF_LIMITS.min && cf <= FEEDBACK_CF_LIMITS.max)) {
    return fail('invalid-input', `The capacitor across Rf must be from 1 pF to 1 µF, or none (got ${shown(cf)} F)`, 'cf');
  }
  if (!(typeof rf === 'number' && rf > 0 && Number.isFinite(rf))) return null; // Rf's own check speaks for it
  const leadHz = 1 / (2 * Math.PI * rf * cf);
  if (leadHz < MIN_LEAD_HZ) {
    return fail('invalid-input', `The capacitor across Rf turns the feedback at ${formatValue(leadHz, 'Hz')} with Rf, inside the audio band: a phase-lead capacitor is chosen to act above ${formatValue(MIN_LEAD_HZ, 'Hz')} (common practice), so smaller than ${formatValue(1 / (2 * Math.PI * rf * MIN_LEAD_HZ), 'F')} here`, 'cf');
  }
  return null;
}

/**
 * Global negative feedback from the speaker to the first stage's
 * unbypassed cathode resistor through Rf, at midband. The first stage sees
 * the divider's Thévenin source, β·v_out behind Rk ∥ Rf, at its cathode: its
 * plate then moves by −μ·v_g + (μ + 1)·β·v_out over the same denominator
 * (the triode's small-signal law), so with A the open loop's gain from the
 * first grid to the speaker (Rk ∥ Rf in the cathode) the loop gain is
 * T = |A|·β·(μ + 1)/μ and the closed gain |A|/(1 + T), the secondary phased
 * for negative feedback (a builder swaps its leads to make it so). The
 * output impedance falls by 1 + T·(R_L + Z_o)/R_L, the loop's gain with the
 * speaker off (Blackman's formula: the loop senses voltage). Across the
 * band (feedbackBand) the loop is solved in the amplifier's own network,
 * with a capacitor across Rf where given (phase lead, kept above the band
 * by feedbackPartsProblem) and the output transformer's primary and leakage
 * inductances where given; its winding capacitances are not modelled.
 * Checked against ngspice (tests/spice/globalFeedback.spice.test.ts,
 * feedbackBand.spice.test.ts).
 */
export function globalFeedback(input: ChainInput, rf: number, level?: AmplifierLevel, cf: number | null = null): Result<GlobalFeedback> {
  if (!(typeof rf === 'number' && rf >= FEEDBACK_RF_LIMITS.min && rf <= FEEDBACK_RF_LIMITS.max)) {
    return fail('invalid-input', `The feedback resistor must be from ${FEEDBACK_RF_LIMITS.min} Ω to ${FEEDBACK_RF_LIMITS.max / 1e6} MΩ (got ${shown(rf)} Ω)`, 'rf');
  }
  const parts = feedbackPartsProblem(rf, cf);
  if (parts) return parts;
  const stages = typeof input === 'object' && input !== null && Array.isArray(input.stages) ? input.stages : null;
  if (!stages || stages.length < 2) return fail('invalid-input', 'Global feedback needs an amplifier of at least two stages, from a first gain stage to an output stage', 'stages');
  const first = stages[0] as CommonCathodeLink | undefined;
  const last = stages[stages.length - 1];
  if (!first || first.kind !== 'common-cathode') return fail('invalid-input', 'Global feedback here returns to the first stage\'s cathode: the first stage must be a common-cathode gain stage', 'stages');
  if (first.bypassed || !(typeof first.rk === 'number' && first.rk > 0)) return fail('invalid-input', 'The feedback needs an unbypassed cathode resistor in the first stage to return to (bypassed, Ck would short it)', 'stages');
  if (!last || (last.kind !== 'single-ended-output' && last.kind !== 'push-pull-output')) return fail('invalid-input', 'Global feedback is taken from the speaker: the amplifier must end in an output stage', 'stages');
  const rk = first.rk;
  const openInput: ChainInput = { ...input, stages: [{ ...first, rk: (rk * rf) / (rk + rf) }, ...stages.slice(1)] };
  const prepared = prepareAmplifier(openInput);
  if (!prepared.ok) return prepared;
  const open = amplifierOf(openInput, prepared);
  if (!open.ok) return open;
  const s0 = open.stages[0]!;
  const mu = smallSignalAt(first.tube, s0.op.va - s0.op.vk, s0.op.vgk).mu;
  // The source's divider into the first grid (its leak, and a volume control's wiper) stays outside the loop.
  const zin = s0.zin;
  const divider = (zin === null ? 1 : zin / (zin + input.source.rsource)) * volumeOf(first);
  const gridGain = Math.abs(open.gain) / divider;
  const beta = rk / (rk + rf);
  const loopGain = gridGain * beta * ((mu + 1) / mu);
  if (!(Number.isFinite(loopGain) && loopGain >= 0)) return fail('unreachable', 'The loop gain could not be worked out at this operating point', 'rf');
  const zoutOpen = open.stages[open.stages.length - 1]!.zout;
  const speaker = last.speakerOhms;
  const zoutClosed = zoutOpen / (1 + (loopGain * (speaker + zoutOpen)) / speaker);
  const banded = feedbackBand(networkOf(openInput, prepared), loopGain, { rk, rf, cf });
  if (!banded.ok) return banded;
  const { ok: _ok, ...band } = banded;
  const at = level === undefined ? null : amplifierAtLevel(openInput, level);
  const thdEstimate = at?.ok && !at.pastClean ? at.thd / (1 + loopGain) : null;
  return {
    ok: true,
    open,
    beta,
    loopGain,
    feedbackDb: 20 * Math.log10(1 + loopGain),
    openGain: Math.abs(open.gain),
    closedGain: Math.abs(open.gain) / (1 + loopGain),
    inputPeak: open.inputPeak * (1 + loopGain),
    zoutOpen,
    zoutClosed,
    dampingFactor: speaker / zoutClosed,
    thdEstimate,
    band,
  };
}
