import type { StagePins } from '../../src/index';
import type { WorkbenchState } from './workbenchStore';

/** One stage's row of DC voltages to check at first switch-on, as the solved amplifier gives them. */
export interface IdleVoltageRow {
  /** The stage as its card names it, with its tube ("Stage 2 · 12AU7"). */
  readonly name: string;
  readonly bplus: number;
  readonly pins: StagePins;
  /** Plate current, A (a pair's and a long-tailed pair's first tube's). */
  readonly ia: number;
  /** A push-pull pair: the figures are each tube's. */
  readonly eachTube: boolean;
}

export interface IdleVoltages {
  readonly rows: readonly IdleVoltageRow[];
  /** The output stage is apart from the voltage stages (not driven): its figures are on its own bench, not here. */
  readonly outputApart: boolean;
}

const memo = new WeakMap<object, IdleVoltages>();

/**
 * Every stage's electrode voltages at idle, chassis to each, in chain
 * order: what a builder's meter should read at first switch-on, with the
 * B+ the stage was designed for. Null when the amplifier does not solve.
 */
export function idleVoltagesOf(s: WorkbenchState): IdleVoltages | null {
  const view = s.amplifier;
  if (!view?.result.ok) return null;
  const cached = memo.get(view);
  if (cached) return cached;
  const r = view.result;
  const rows = r.stages.map((st, i) => ({
    name: `${view.names[i]!.title} · ${view.names[i]!.tube}`,
    bplus: view.input.stages[i]!.bplus,
    pins: st.pins,
    ia: st.op.ia,
    eachTube: st.kind === 'push-pull-output',
  }));
  const out = { rows, outputApart: !s.design.drivesOutput };
  memo.set(view, out);
  return out;
}

/** The rule of thumb beside the figures (common practice), on the page and on the card. */
export const IDLE_VOLTAGES_WORDS =
  'No signal, the meter from chassis to each electrode. Within about 10 % (the mains\' own tolerance; a cathode\'s, with a tube\'s spread, up to 20 %) is usual, common practice; far outside, switch off and look for a wrong value or a wiring fault. Clip the leads on with the power off and the capacitors discharged.';
