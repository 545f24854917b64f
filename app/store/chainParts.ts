import { capacitorLine, resistorLine, type CapacitorLine, type ChainResult, type PreferredSeries, type ResistorLine } from '../../src/index';
import { bplusOfStage, type StagePlan } from './stagePlans';

/** The parts of one voltage stage that is not on the bench, with its own currents and voltages. */
export interface OffBenchParts {
  /** The stage's place among the voltage stages. */
  readonly index: number;
  readonly title: string;
  readonly resistors: readonly ResistorLine[];
  readonly capacitors: readonly CapacitorLine[];
}

/**
 * Each stage off the bench, its parts rated by the model from the stage's own
 * operating point in the solved amplifier: a coupling capacitor sees the DC
 * of the output before it running, and that stage's B+ at switch-on (the
 * plate before its tube warms); a bypass sees its cathode's voltage.
 * Numbered by place, so stage 3's plate resistor is Ra3.
 */
export function offBenchParts(list: readonly StagePlan[], onBench: ReadonlySet<number>, amp: ChainResult, series: PreferredSeries): OffBenchParts[] {
  const out: OffBenchParts[] = [];
  for (const [i, p] of list.entries()) {
    const st = amp.stages[i];
    if (onBench.has(i) || !st) continue;
    const n = i + 1;
    if (p.kind === 'follower') {
      out.push({ index: i, title: `Stage ${n}, ${p.tubeId} cathode follower`, resistors: [resistorLine(`Rk${n}`, `stage ${n} follower cathode load`, p.rk, st.op.ia, series)], capacitors: [] });
      continue;
    }
    const resistors = [resistorLine(`Ra${n}`, `stage ${n} plate load`, p.ra, st.op.ia, series)];
    if (p.rk > 0) resistors.push(resistorLine(`Rk${n}`, `stage ${n} cathode bias`, p.rk, st.op.ia, series));
    const capacitors: CapacitorLine[] = [];
    if (p.cc !== null) {
      resistors.push(resistorLine(`Rg${n}`, `stage ${n} grid leak`, p.rg, 0, series));
      const before = i > 0 ? amp.stages[i - 1]! : null;
      const across = before ? before.outputDc : 0;
      const cold = before ? bplusOfStage(list, i - 1) : 0;
      capacitors.push(capacitorLine(`Cc${n}`, i > 0 ? `coupling from stage ${i} into stage ${n}` : `input coupling into stage ${n}`, p.cc, across, cold, i > 0 ? `+ to stage ${i}'s output` : '+ to the grid'));
    }
    if (p.bypassed && p.rk > 0) capacitors.push(capacitorLine(`Ck${n}`, `stage ${n} cathode bypass`, p.ck, st.op.vk, 0, '+ to the cathode'));
    out.push({ index: i, title: `Stage ${n}, ${p.tubeId} gain stage`, resistors, capacitors });
  }
  return out;
}
