import { capacitorLine, nearestPreferred, resistorLine, type CapacitorLine, type ChainResult, type FollowerCoupling, type PreferredSeries, type ResistorLine, type StageResult } from '../../src/index';
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
      const resistors = [resistorLine(`Rk${n}`, `stage ${n} follower cathode load`, p.rk, st.op.ia, series)];
      const capacitors: CapacitorLine[] = [];
      if (p.coupling) {
        const c = followerCouplingParts(p.coupling, n, amp.stages[i - 1]?.outputDc ?? 0, bplusOfStage(list, i), series);
        resistors.push(...c.resistors);
        capacitors.push(...c.capacitors);
      }
      out.push({ index: i, title: `Stage ${n}, ${p.tubeId} cathode follower${p.coupling ? ', capacitor-coupled' : ''}`, resistors, capacitors });
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

/**
 * A capacitor-coupled follower's own parts: the capacitor from the plate
 * before it (across that plate's DC less the grid's running, its B+ less the
 * grid's cold), the grid leak to the divider, and the divider with its
 * decoupling. Numbered by the follower's place.
 */
export function followerCouplingParts(c: FollowerCoupling, n: number, plateDc: number, bplus: number, series: PreferredSeries): { resistors: ResistorLine[]; capacitors: CapacitorLine[] } {
  const divider = gridDivider({ upper: `Rd${n}a`, lower: `Rd${n}b`, cap: `Cd${n}` }, bplus, c.vbias, series);
  return {
    resistors: [resistorLine(`Rg${n}`, `stage ${n} follower grid leak (to the divider)`, c.rg, 0, series), ...divider.resistors],
    capacitors: [capacitorLine(`Cc${n}`, `coupling into the stage ${n} follower`, c.cc, plateDc - c.vbias, bplus - c.vbias, `+ to stage ${n - 1}'s plate`), divider.capacitor],
  };
}

/** The lower resistor of the divider that sets a splitter's grid, Ω (common practice: a few hundred kΩ, so it wastes little current). */
const DIVIDER_LOWER = 220e3;
/** The divider's decoupling sets its corner this low, Hz (common practice: well under the band, so no signal rides on the grid return). */
const DIVIDER_CORNER_HZ = 2;

/**
 * The divider that holds a capacitor-coupled grid at `vgrid` from its B+,
 * decoupled so no signal rides on the grid's return: the lower resistor a
 * few hundred kΩ, the upper the nearest preferred value for the voltage.
 * `refs` names its parts (the splitter's Rd1, Rd2, Cd; stage 3's Rd3a, Rd3b, Cd3).
 */
export function gridDivider(refs: { readonly upper: string; readonly lower: string; readonly cap: string }, bplus: number, vgrid: number, series: PreferredSeries): { resistors: ResistorLine[]; capacitor: CapacitorLine } {
  const upper = nearestPreferred((DIVIDER_LOWER * (bplus - vgrid)) / Math.max(vgrid, 1e-3), series);
  const lower = nearestPreferred(DIVIDER_LOWER, series);
  const dividerAmps = bplus / (upper + lower);
  const shunt = (upper * lower) / (upper + lower);
  return {
    resistors: [
      resistorLine(refs.upper, `divider upper (with ${refs.lower} sets the grid near ${vgrid} V)`, upper, dividerAmps, series),
      resistorLine(refs.lower, 'divider lower', lower, dividerAmps, series),
    ],
    capacitor: capacitorLine(refs.cap, 'divider decoupling', 1 / (2 * Math.PI * DIVIDER_CORNER_HZ * shunt), vgrid, (bplus * lower) / (upper + lower), '+ to the divider'),
  };
}

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
    const divider = gridDivider({ upper: 'Rd1', lower: 'Rd2', cap: 'Cd' }, sp.bplus, sp.vgrid, series);
    resistors.push(...divider.resistors);
    capacitors.push(divider.capacitor);
  }
  // Each output's coupling: the split-load's plate and cathode, or the pair's two plates.
  const second = both ? sp.bplus - (tail - st.op.ia) * sp.ra2 : st.op.vk;
  capacitors.push(
    capacitorLine('Ccs1', 'splitter to the first output grid', sp.cc, st.op.va, sp.bplus, '+ to the splitter'),
    capacitorLine('Ccs2', 'splitter to the second output grid', sp.cc, second, sp.bplus, '+ to the splitter'),
  );
  return { index, title: `Phase splitter, ${sp.tubeId} ${both ? 'long-tailed pair' : 'split-load'}`, resistors, capacitors };
}
