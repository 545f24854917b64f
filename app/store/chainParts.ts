import { capacitorLine, nearestPreferred, resistorLine, type CapacitorLine, type ChainResult, type PreferredSeries, type ResistorLine, type StageResult } from '../../src/index';
import type { SplitterPlan } from './outputPlan';
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

/** The lower resistor of the divider that sets a splitter's grid, Ω (common practice: a few hundred kΩ, so it wastes little current). */
const DIVIDER_LOWER = 220e3;
/** The divider's decoupling sets its corner this low, Hz (common practice: well under the band, so no signal rides on the grid return). */
const DIVIDER_CORNER_HZ = 2;

/**
 * The phase splitter's parts, rated from its operating point in the solved
 * amplifier: its plate and cathode (or tail) resistors, its grid leak and
 * the divider that holds its grid (with the capacitor that decouples it),
 * and the two capacitors coupling its outputs into the pair's grids, each
 * across its output's DC running and the splitter's B+ cold.
 */
export function splitterParts(sp: SplitterPlan, st: StageResult, index: number, series: PreferredSeries): OffBenchParts {
  const both = sp.kind === 'long-tailed-pair';
  const tail = st.supplyCurrent;
  const resistors = both
    ? [
        resistorLine('Ras1', 'splitter first plate load', sp.ra, st.op.ia, series),
        resistorLine('Ras2', 'splitter second plate load', sp.ra2, tail - st.op.ia, series),
        resistorLine('Rks', 'splitter shared cathode bias', sp.rk, tail, series),
        resistorLine('Rtail', 'splitter tail', sp.rtail, tail, series),
      ]
    : [resistorLine('Ras', 'splitter plate load', sp.ra, st.op.ia, series), resistorLine('Rks', 'splitter cathode load', sp.rk, st.op.ia, series)];
  const capacitors: CapacitorLine[] = [];
  // Direct-coupled, the grid sits at the plate before it: no leak, no divider. A long-tailed pair's second grid still
  // needs its leak to that voltage, held at signal ground by its capacitor.
  if (sp.coupling === 'capacitor' || both) {
    resistors.push(resistorLine('Rgs', both ? 'splitter grid leaks (one per grid, to the divider)' : 'splitter grid leak (to the divider)', sp.rg, 0, series));
  }
  if (sp.coupling === 'capacitor') {
    const upper = nearestPreferred((DIVIDER_LOWER * (sp.bplus - sp.vgrid)) / Math.max(sp.vgrid, 1e-3), series);
    const lower = nearestPreferred(DIVIDER_LOWER, series);
    const dividerAmps = sp.bplus / (upper + lower);
    resistors.push(resistorLine('Rd1', `divider upper (with Rd2 sets the grid near ${sp.vgrid} V)`, upper, dividerAmps, series), resistorLine('Rd2', 'divider lower', lower, dividerAmps, series));
    const shunt = (upper * lower) / (upper + lower);
    capacitors.push(capacitorLine('Cd', 'divider decoupling', 1 / (2 * Math.PI * DIVIDER_CORNER_HZ * shunt), sp.vgrid, (sp.bplus * lower) / (upper + lower), '+ to the divider'));
  }
  // Each output's coupling: the split-load's plate and cathode, or the pair's two plates.
  const second = both ? sp.bplus - (tail - st.op.ia) * sp.ra2 : st.op.vk;
  capacitors.push(
    capacitorLine('Ccs1', 'splitter to the first output grid', sp.cc, st.op.va, sp.bplus, '+ to the splitter'),
    capacitorLine('Ccs2', 'splitter to the second output grid', sp.cc, second, sp.bplus, '+ to the splitter'),
  );
  return { index, title: `Phase splitter, ${sp.tubeId} ${both ? 'long-tailed pair' : 'split-load'}`, resistors, capacitors };
}
