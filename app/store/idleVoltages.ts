import { pushPullPins, singleEndedPins, type StagePins } from '../../src/index';
import type { WorkbenchState } from './workbenchStore';

/** One stage's row of DC voltages to check at first switch-on, as the solved amplifier gives them. */
export interface IdleVoltageRow {
  /** The stage as its card names it, with its tube ("Stage 2 · 12AU7"). */
  readonly name: string;
  readonly bplus: number;
  readonly pins: StagePins;
  /** Plate current, A (a push-pull pair's first tube's; a long-tailed pair's first triode's, its second's in `pins`). */
  readonly ia: number;
  /** A push-pull pair: the figures are each tube's. */
  readonly eachTube: boolean;
}

export interface IdleVoltages {
  /** The amplifier's stages in chain order: the voltage stages, and the output stage when they drive it. */
  readonly rows: readonly IdleVoltageRow[];
  /** The output stage apart from the voltage stages (not driven): its own bench's design, listed with its own parts; null when driven. */
  readonly apartOutput: IdleVoltageRow | null;
}

const memo = new WeakMap<object, { outputBench: WorkbenchState['outputBench']; drives: boolean; idle: IdleVoltages }>();

/** The output stage on its own bench, apart from the voltage stages: its row from its own analysis. */
function apartOutputRow(s: WorkbenchState): IdleVoltageRow {
  const b = s.outputBench;
  const name = `Output · ${s.design.output.tubeId}`;
  if (b.pair === 'push-pull') {
    return { name, bplus: s.design.output.bplus, pins: pushPullPins(b.settled.solution), ia: b.settled.solution.idle[0].ip, eachTube: true };
  }
  return { name, bplus: s.design.output.bplus, pins: singleEndedPins(b.settled.solution.op), ia: b.settled.solution.op.ip, eachTube: false };
}

/**
 * Every stage's electrode voltages at idle, chassis to each, in chain
 * order: what a builder's meter should read at first switch-on, with the
 * B+ the stage was designed for. Null when the amplifier does not solve.
 * Like the parts lists, an output stage apart from the voltage stages is
 * listed on its own bench (`apartOutput`), not with them.
 */
export function idleVoltagesOf(s: WorkbenchState): IdleVoltages | null {
  const view = s.amplifier;
  if (!view?.result.ok) return null;
  const drives = s.design.drivesOutput;
  const cached = memo.get(view);
  if (cached && cached.drives === drives && (drives || cached.outputBench === s.outputBench)) return cached.idle;
  const r = view.result;
  const rows = r.stages.map((st, i) => ({
    name: `${view.names[i]!.title} · ${view.names[i]!.tube}`,
    bplus: view.input.stages[i]!.bplus,
    pins: st.pins,
    ia: st.op.ia,
    eachTube: st.kind === 'push-pull-output',
  }));
  const out = { rows, apartOutput: drives ? null : apartOutputRow(s) };
  memo.set(view, { outputBench: s.outputBench, drives, idle: out });
  return out;
}

/** The rows a bench lists: the output bench with the stages apart lists its own stage alone; every other, the amplifier's. */
export function idleRowsFor(idle: IdleVoltages, outputBench: boolean): readonly IdleVoltageRow[] {
  return outputBench && idle.apartOutput ? [idle.apartOutput] : idle.rows;
}

/** The rule of thumb beside the figures (common practice), on the page and on the card. */
export const IDLE_VOLTAGES_WORDS =
  'No signal, the meter from chassis to each electrode. Within about 10 % (the mains\' own tolerance; a cathode\'s, with a tube\'s spread, up to 20 %) is usual, common practice; far outside, switch off and look for a wrong value or a wiring fault. Clip the leads on with the power off and the capacitors discharged.';
