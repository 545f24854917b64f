import { amplifierNetlist, type Result } from '../../src/index';
import type { WorkbenchState } from '../store/workbenchStore';

/** The input peak for a netlist whose working level does not solve: 10 mV, small enough for any chain's clean limit (our choice). */
const FALLBACK_PEAK = 0.01;

/**
 * The amplifier as the chain strip shows it, as a netlist for ngspice: its
 * transient driven at the working level's input (1 W into the speaker, or
 * the bench's output level), and the design's global feedback when the
 * stages drive the output stage.
 */
export function amplifierNetlistOf(s: WorkbenchState): Result<{ readonly text: string }> {
  const view = s.amplifier;
  if (!view) return { ok: false, reason: 'invalid-input', message: 'The amplifier does not solve: a stage’s tube is unknown.' };
  const d = s.design;
  const inputPeak = view.atLevel?.ok ? view.atLevel.inputPeak : FALLBACK_PEAK;
  const feedback = d.drivesOutput && d.feedbackRf !== null ? { rf: d.feedbackRf, cf: d.feedbackCf } : null;
  return amplifierNetlist(view.input, { title: s.title, inputPeak, feedback });
}
