import type { PreferredSeries } from '../parts/preferredValues';
import type { ChainInput, ChainResult, ChainStage, FollowerLink, LongTailedPairLink, SplitLoadLink, StageResult } from '../chain/chainTypes';
import { capacitorLine, resistorLine, volumeLine, type CapacitorLine, type ResistorLine } from './partsList';
import { gridDivider } from './gridDivider';
import { recordOf, type TubeLike } from '../tube/types';

/** One stage's parts to order, with its own currents and voltages. */
export interface StageParts {
  /** The stage's place in the chain. */
  readonly index: number;
  readonly title: string;
  readonly resistors: readonly ResistorLine[];
  readonly capacitors: readonly CapacitorLine[];
}

/** What a stage's parts are rated from: its place, its solution, the stage before it and the stage after. */
interface PartsContext {
  /** The stage's number as a builder counts (1 for the first), which numbers its parts (Ra3, Cc3). */
  readonly n: number;
  readonly solved: StageResult;
  /** The stage before, solved, and its B+ (where its output sits cold, before its tube warms); null for the first stage. */
  readonly before: { readonly solved: StageResult; readonly bplus: number } | null;
  /** The stage after it, as designed (a splitter's outputs are coupled by the pair's capacitors). */
  readonly next: ChainStage | undefined;
  readonly series: PreferredSeries;
}

/** A tube's name for a title: its record's id, or "triode" for a bare model. */
const nameOf = (t: TubeLike) => recordOf(t)?.id ?? 'triode';

type Parts = { resistors: ResistorLine[]; capacitors: CapacitorLine[] };

/**
 * The parts of stage `i` of a solved amplifier, each rated from the stage's
 * own operating point (resistor dissipation from its current; a capacitor's
 * voltage running and at switch-on, when a cold tube draws nothing and the
 * plate before it sits at its B+). Output stages are null: their parts come
 * with their own analysis (outputPartsList, pushPullPartsList), which knows
 * the transformer and the power.
 */
export function chainStageParts(input: ChainInput, result: ChainResult, i: number, series: PreferredSeries): StageParts | null {
  const stage = input.stages[i];
  const solved = result.stages[i];
  if (!stage || !solved) return null;
  const prev = i > 0 ? input.stages[i - 1] : undefined;
  const before = prev && result.stages[i - 1] ? { solved: result.stages[i - 1]!, bplus: prev.bplus } : null;
  const at: PartsContext = { n: i + 1, solved, before, next: input.stages[i + 1], series };
  switch (stage.kind) {
    case 'common-cathode':
      return { index: i, title: `Stage ${at.n}, ${nameOf(stage.tube)} gain stage`, ...gainStageParts(stage, at) };
    case 'follower':
      return { index: i, title: `Stage ${at.n}, ${nameOf(stage.tube)} cathode follower${stage.coupling.kind === 'capacitor' ? ', capacitor-coupled' : ''}`, ...followerParts(stage, at) };
    case 'split-load':
    case 'long-tailed-pair':
      return { index: i, title: `Phase splitter, ${nameOf(stage.tube)} ${stage.kind === 'long-tailed-pair' ? 'long-tailed pair' : 'split-load'}`, ...splitterParts(stage, at) };
    default:
      return null;
  }
}

/** A gain stage: Ra, Rk, and from its coupling the grid leak and the capacitor from the output before it; its grid stopper; its bypass. */
function gainStageParts(s: Extract<ChainStage, { kind: 'common-cathode' }>, at: PartsContext): Parts {
  const { n, solved, before, series } = at;
  const resistors = [resistorLine(`Ra${n}`, `stage ${n} plate load`, s.ra, solved.op.ia, series)];
  if (s.rk > 0) resistors.push(resistorLine(`Rk${n}`, `stage ${n} cathode bias`, s.rk, solved.op.ia, series));
  const capacitors: CapacitorLine[] = [];
  if (s.coupling.kind === 'capacitor') {
    resistors.push(s.volume !== undefined ? volumeLine(`VR${n}`, `stage ${n} volume control, audio taper, in the grid leak's place: wiper to the grid`, s.coupling.rg, series) : resistorLine(`Rg${n}`, `stage ${n} grid leak`, s.coupling.rg, 0, series));
    capacitors.push(capacitorLine(`Cc${n}`, before ? `coupling from stage ${n - 1} into stage ${n}` : `input coupling into stage ${n}`, s.coupling.cc, before?.solved.outputDc ?? 0, before?.bplus ?? 0, before ? `+ to stage ${n - 1}'s output` : '+ to the grid'));
  }
  resistors.push(...stopperLines(s.rstopper, `Rst${n}`, `stage ${n} grid stopper, at the socket`, series));
  if (s.bypassed && s.rk > 0) capacitors.push(capacitorLine(`Ck${n}`, `stage ${n} cathode bypass`, s.ck ?? null, solved.op.vk, 0, '+ to the cathode'));
  return { resistors, capacitors };
}

/** A follower: its cathode load, and when capacitor-coupled its capacitor, leak and the divider holding its grid. */
function followerParts(s: FollowerLink, at: PartsContext): Parts {
  const { n, solved, before, series } = at;
  const resistors = [resistorLine(`Rk${n}`, `stage ${n} follower cathode load`, s.rk, solved.op.ia, series)];
  const capacitors: CapacitorLine[] = [];
  if (s.coupling.kind === 'capacitor') {
    const own = followerCouplingParts({ cc: s.coupling.cc, rg: s.coupling.rg, vbias: s.vbias ?? 0 }, n, before?.solved.outputDc ?? 0, s.bplus, series);
    resistors.push(...own.resistors);
    capacitors.push(...own.capacitors);
  }
  resistors.push(...stopperLines(s.rstopper, `Rst${n}`, `stage ${n} follower grid stopper, at the socket`, series));
  return { resistors, capacitors };
}

/** A grid stopper's line, if there is one: it carries no current below the grid's onset; at the socket, so the wire to the grid is short. */
function stopperLines(rstopper: number | undefined, ref: string, role: string, series: PreferredSeries): ResistorLine[] {
  return rstopper !== undefined && rstopper > 0 ? [resistorLine(ref, role, rstopper, 0, series)] : [];
}

/**
 * A capacitor-coupled follower's own parts: the capacitor from the plate
 * before it (across that plate's DC less the grid's running, its B+ less the
 * grid's cold), the grid leak to the divider, and the divider with its
 * decoupling. Numbered by the follower's place.
 */
function followerCouplingParts(c: { readonly cc: number; readonly rg: number; readonly vbias: number }, n: number, plateDc: number, bplus: number, series: PreferredSeries): Parts {
  const divider = gridDivider({ upper: `Rd${n}a`, lower: `Rd${n}b`, cap: `Cd${n}` }, bplus, c.vbias, series);
  return {
    resistors: [resistorLine(`Rg${n}`, `stage ${n} follower grid leak, to the divider`, c.rg, 0, series), ...divider.resistors],
    capacitors: [capacitorLine(`Cc${n}`, `coupling into the stage ${n} follower`, c.cc, plateDc - c.vbias, bplus - c.vbias, `+ to stage ${n - 1}'s plate`), divider.capacitor],
  };
}

/**
 * The phase splitter's parts, rated from its operating point: its plate and
 * cathode (or tail) resistors, its grid leak and the divider that holds its
 * grid (with the capacitor that decouples it), and the two capacitors
 * coupling its outputs into the pair's grids (the pair's coupling), each
 * across its output's DC running and the splitter's B+ cold.
 */
function splitterParts(s: SplitLoadLink | LongTailedPairLink, at: PartsContext): Parts {
  const { solved: st, series, next } = at;
  const both = s.kind === 'long-tailed-pair';
  const tail = st.supplyCurrent;
  const ra2 = both ? (s.ra2 ?? s.ra) : s.ra;
  const resistors = both
    ? [
        resistorLine('Ras1', 'splitter first plate load', s.ra, st.op.ia, series),
        resistorLine('Ras2', 'splitter second plate load', ra2, tail - st.op.ia, series),
        resistorLine('Rks', 'splitter shared cathode bias', s.rk, tail, series),
        resistorLine('Rtail', 'splitter tail', s.rtail, tail, series),
      ]
    : [resistorLine('Ras', 'splitter plate load', s.ra, st.op.ia, series), resistorLine('Rks', 'splitter cathode load', s.rk, st.op.ia, series)];
  const capacitors: CapacitorLine[] = [];
  // Direct-coupled, the grid sits at the plate before it: no leak, no divider. A long-tailed pair's second grid still
  // needs its leak to that voltage, held at signal ground by its capacitor.
  const leak = s.coupling.kind === 'capacitor' ? s.coupling.rg : both ? s.heldGridLeak : undefined;
  if (leak !== undefined) resistors.push(resistorLine('Rgs', both ? 'splitter grid leaks, one per grid, to the divider' : 'splitter grid leak, to the divider', leak, 0, series));
  resistors.push(...stopperLines(s.rstopper, 'Rsts', both ? 'splitter grid stopper, at the first grid\'s socket' : 'splitter grid stopper, at the socket', series));
  if (s.coupling.kind === 'capacitor') {
    const divider = gridDivider({ upper: 'Rd1', lower: 'Rd2', cap: 'Cd' }, s.bplus, s.vbias ?? 0, series);
    resistors.push(...divider.resistors);
    capacitors.push(divider.capacitor);
  }
  // Each output's coupling (the pair's capacitors): the split-load's plate and cathode, or the pair's two plates.
  if (next?.coupling.kind === 'capacitor') {
    const second = both ? s.bplus - (tail - st.op.ia) * ra2 : st.op.vk;
    capacitors.push(
      capacitorLine('Ccs1', 'splitter to the first output grid', next.coupling.cc, st.op.va, s.bplus, '+ to the splitter'),
      capacitorLine('Ccs2', 'splitter to the second output grid', next.coupling.cc, second, s.bplus, '+ to the splitter'),
    );
  }
  return { resistors, capacitors };
}
