import { amplifierNetlist, amplifierOnSupplyNetlist, type Result } from '../../src/index';
import { biasDesignOf, onSupplyInputOf } from '../store/supplyPlan';
import { biasSupplyOf } from '../store/biasSupply';
import type { WorkbenchState } from '../store/workbenchStore';

/** The input peak for a netlist whose working level does not solve: 10 mV, small enough for any chain's clean limit (our choice). */
const FALLBACK_PEAK = 0.01;

/**
 * The amplifier as the chain strip shows it, as a netlist for ngspice: its
 * transient driven at the working level's input (1 W into the speaker, or
 * the bench's output level), and the design's global feedback when the
 * stages drive the output stage. `withSupply`: on the design's supply (its
 * rectifier and filter in the circuit, each stage drawing from its node),
 * its solve started from the supply panel's last answer, and a fixed-bias
 * output stage's grids on its bias supply's wipers once that is solved.
 */
export function amplifierNetlistOf(s: WorkbenchState, withSupply = false): Result<{ readonly text: string }> {
  const view = s.amplifier;
  if (!view) return { ok: false, reason: 'invalid-input', message: 'The amplifier does not solve: a stage’s tube is unknown.' };
  const d = s.design;
  const inputPeak = view.atLevel?.ok ? view.atLevel.inputPeak : FALLBACK_PEAK;
  const feedback = d.drivesOutput && d.feedbackRf !== null ? { rf: d.feedbackRf, cf: d.feedbackCf } : null;
  const options = { title: s.title, inputPeak, feedback };
  if (!withSupply) return amplifierNetlist(view.input, options);
  if (!d.supply.on) return { ok: false, reason: 'invalid-input', message: 'The design has no supply to put in the netlist: turn the supply on first.' };
  const chain = onSupplyInputOf(d, s.registry);
  if (!chain) return { ok: false, reason: 'invalid-input', message: 'The amplifier does not solve: a stage’s tube is unknown.' };
  const last = s.supplyView?.result;
  const start = last?.ok ? { start: last.supply.nodes.map((n) => n.dc) } : {};
  // A fixed-bias output stage's grid supply, as the supply panel solved it for this design (a solve still on its way
  // leaves the grids on a DC source, as the file then says).
  const bias = s.biasView?.stale ? null : biasSupplyOf(s);
  return amplifierOnSupplyNetlist({ ...chain.input, ...start }, options, bias?.ok ? { design: biasDesignOf(d.supply), solved: bias } : null);
}
