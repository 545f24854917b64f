import { stopperOf } from './stopperOf';
import { volumeOf } from './volumeOf';
import { wiperImpedance } from '../stage/volumeControl';
import { fail, type Failure, type Result } from '../result';
import { checkNumber, LIMITS } from '../stage/checkInput';
import { ChainSignal } from './chainSwing';
import { gainInto, gridConductance, loadedInput } from './gridConductance';
import { harmonicAmplitudes } from '../signal/fft';
import { OUTPUT_KINDS, SPLITTER_KINDS, type ChainInput, type ChainStage, type ClipCause } from './chainTypes';
import { kindOf, STAGE_KINDS } from './stageKinds';
import type { SolvedLink } from './stageKind';

export const MAX_CHAIN_STAGES = 8;

/** A stage's failure, its message and field placed in the chain ("Stage 2: …", field "stages.1.ra"). */
export function inStage(f: Failure, i: number): Failure {
  return fail(f.reason, `Stage ${i + 1}: ${f.message}`, `stages.${i}.${f.field ?? 'kind'}`);
}

/** The chain's shape and every stage's design, checked before anything is solved. */
export function checkChain(input: unknown): Failure | null {
  if (typeof input !== 'object' || input === null) return fail('invalid-input', 'No amplifier given');
  const c = input as ChainInput;
  if (typeof c.source !== 'object' || c.source === null) return fail('invalid-input', 'Give the source as { rsource } (0 for an ideal source)', 'source');
  const rs = c.source.rsource;
  const sourceProblem = rs === 0 ? null : checkNumber('rsource', 'Source impedance (0 for an ideal source)', rs, 'Ω', LIMITS.minOhms, LIMITS.maxOhms);
  if (sourceProblem) return { ...sourceProblem, field: 'source.rsource' };
  if (!Array.isArray(c.stages) || c.stages.length < 1 || c.stages.length > MAX_CHAIN_STAGES) {
    return fail('invalid-input', `An amplifier has 1 to ${MAX_CHAIN_STAGES} stages (got ${Array.isArray(c.stages) ? c.stages.length : 'none'})`, 'stages');
  }
  for (const [i, s] of c.stages.entries()) {
    const kind = typeof s === 'object' && s !== null ? kindOf(s) : null;
    if (!kind) return fail('invalid-input', `Stage ${i + 1}: choose a kind of stage (${Object.keys(STAGE_KINDS).join(', ')})`, `stages.${i}.kind`);
    const problem = kind.check(s);
    if (problem) return inStage(problem, i);
    if (OUTPUT_KINDS.includes(s.kind) && i !== c.stages.length - 1) {
      return fail('invalid-input', `Stage ${i + 1}: an output stage drives the speaker, so it comes last`, `stages.${i}.kind`);
    }
    // A splitter's two outputs drive a push-pull pair's two grids: the one needs the other.
    const before = i > 0 ? c.stages[i - 1] : undefined;
    if (s.kind === 'push-pull-output' && !(before && SPLITTER_KINDS.includes(before.kind))) {
      return fail('invalid-input', `Stage ${i + 1}: a push-pull stage's grids are driven in antiphase: put a phase splitter just before it`, `stages.${i}.kind`);
    }
    const next = c.stages[i + 1];
    if (SPLITTER_KINDS.includes(s.kind) && next?.kind !== 'push-pull-output') {
      return fail('invalid-input', `Stage ${i + 1}: a phase splitter drives a push-pull stage: put one just after it`, `stages.${i}.kind`);
    }
  }
  if (c.load !== undefined) {
    if (typeof c.load !== 'object' || c.load === null) return fail('invalid-input', 'Give the load as { rl, cc? }', 'load');
    const loadProblem = checkNumber('rl', 'Load', c.load.rl, 'Ω', LIMITS.minOhms, LIMITS.maxOhms, { allowInfinity: true });
    if (loadProblem) return { ...loadProblem, field: 'load.rl' };
    const ccProblem = c.load.cc === undefined ? null : checkNumber('cc', "The load's coupling capacitor", c.load.cc, 'F', LIMITS.minFarads, LIMITS.maxFarads);
    if (ccProblem) return { ...ccProblem, field: 'load.cc' };
  }
  return null;
}

/** The chain solved stage by stage, with its composed transfer and each stage's clean limit: what every figure of the amplifier starts from. */
export interface PreparedAmplifier {
  readonly links: readonly SolvedLink[];
  readonly signal: ChainSignal;
  readonly clips: readonly ({ readonly inputPeak: number; readonly by: ClipCause } | null)[];
  /** The stage that clips first, and the source peak where it does. */
  readonly first: number;
  readonly inputPeak: number;
  /**
   * The amplifier's small-signal gain at midband: the source divider and each
   * stage's gain into the input it really drives (see `gains`).
   */
  readonly gain: number;
  /** Each stage's small-signal gain into the next grid's leak with that grid's current's slope (or the load), midband. */
  readonly gains: readonly number[];
  /** Each stage's input impedance at midband, Ω: its leak with its grid current's slope (Infinity: none). */
  readonly inputs: readonly number[];
  /** Each signal grid's small-signal conductance to its cathode, S (see gridConductance). */
  readonly gridConductances: readonly number[];
  /** The output's fundamental (peak) at the clean limit, at CYCLE_SAMPLES points a cycle; its cycle computed once, on first asking. */
  readonly cleanFundamental: () => number;
  /** Half the output's peak-to-peak at the clean limit's source extremes. */
  readonly cleanOutputPeak: () => number;
}

/** Points a cycle for the figures: below clipping the transfers are smooth, and harmonics to H10 need far fewer. */
export const CYCLE_SAMPLES = 128;

/**
 * Every stage solved in its place (operating point, small-signal figures,
 * its current from the supply), without the composed transfer: what the
 * supply needs from the amplifier, a fraction of the whole solve.
 */
export interface PlacedStages {
  readonly links: readonly SolvedLink[];
  /** Each stage's input impedance (the load on the stage before it), Ω. */
  readonly zins: readonly number[];
}

/**
 * Why the amplifier's stages cannot all be solved in their places (the first
 * that cannot, by field: a splitter whose grid gets no usable DC from the
 * plate before it, a stage its B+ cannot feed), or null when they can. What a
 * caller asks before it places a stage; the solve itself stays inside.
 */
export function stagesInPlaceProblem(input: ChainInput): Failure | null {
  const placed = solveStagesInPlace(input);
  return placed.ok ? null : placed;
}

export function solveStagesInPlace(input: ChainInput): Result<PlacedStages> {
  const problem = checkChain(input);
  if (problem) return problem;
  const { stages } = input;
  const chainLoad = input.load?.rl ?? Infinity;
  const zins = stages.map((s) => kindOf(s)!.inputImpedance(s));
  const links: SolvedLink[] = [];
  for (const [i, s] of stages.entries()) {
    const load = i + 1 < stages.length ? zins[i + 1]! : chainLoad;
    const gridDc = s.coupling.kind === 'direct' ? (i === 0 ? 0 : links[i - 1]!.outputDc) : null;
    const antiphase = i > 0 ? links[i - 1]!.antiphase : undefined;
    const solved = (kindOf(s) as ReturnType<typeof kindOf<ChainStage>>)!.solve(s, { gridDc, load, ...(antiphase !== undefined ? { antiphase } : {}) });
    if (!solved.ok) return inStage(solved, i);
    links.push(solved);
  }
  return { ok: true, links, zins };
}

/** `placed`: the stages already solved in place for this very input (as solveOnSupply's last round has them). */
export function prepareAmplifier(input: ChainInput, placed?: Result<PlacedStages>): Result<PreparedAmplifier> {
  const solvedLinks = placed ?? solveStagesInPlace(input);
  if (!solvedLinks.ok) return solvedLinks;
  const { links, zins } = solvedLinks;
  const rsource = input.source.rsource;
  // Each grid's share of what drives its leak: a volume control's wiper setting (1 for none).
  const volumes = input.stages.map(volumeOf);
  const sourceShare = (Number.isFinite(zins[0]!) ? zins[0]! / (zins[0]! + rsource) : 1) * volumes[0]!;
  // Small signal: each grid's current has a slope at its bias (the retarding-field tail) that loads what drives it, less
  // as its cathode follows; each stage's gain is taken into that input, through its output impedance.
  const chainLoad = input.load?.rl ?? Infinity;
  const loads = links.map((_, i) => (i + 1 < links.length ? zins[i + 1]! : chainLoad));
  const stoppers = input.stages.map(stopperOf);
  const inputs = links.map((l, i) => loadedInput(zins[i]!, l, loads[i]!, stoppers[i]!, volumes[i]!));
  const gains = links.map((l, i) => gainInto(l.gain, l.zout, loads[i]!, i + 1 < links.length ? inputs[i + 1]! : chainLoad));
  const firstIn = inputs[0]!;
  const gain = gains.reduce((g, x, i) => g * x * volumes[i]!, Number.isFinite(firstIn) ? firstIn / (firstIn + rsource) : 1);
  // What drives each grid, looking back from it: the stage before's output impedance (the source's for the first) in
  // parallel with the leak (behind a volume control, the wiper's: the track below it against the track above and what
  // drives it), then the grid stopper in series.
  const gridDrives = links.map((_, i) => {
    const before = i === 0 ? rsource : links[i - 1]!.zout;
    const zin = zins[i]!;
    return (Number.isFinite(zin) ? wiperImpedance(zin, volumes[i]!, before) : before) + stoppers[i]!;
  });
  const signal = new ChainSignal(links, sourceShare, gridDrives, volumes);
  // Each search starts from the small-signal estimate: the grid swing to 0 V over the gain up to that grid.
  let upstream = sourceShare;
  const clips = links.map((l, i) => {
    const guess = Math.abs(l.op.vgk) / Math.max(Math.abs(upstream), 1e-12);
    upstream *= l.gain * (volumes[i + 1] ?? 1);
    return signal.clipOf(i, guess);
  });
  let first = -1;
  clips.forEach((c, i) => {
    if (c && (first < 0 || c.inputPeak < clips[first]!.inputPeak)) first = i;
  });
  if (first < 0) return fail('unreachable', 'No stage reaches grid current or cutoff below 10 kV at the input: check the values', 'stages');
  const inputPeak = clips[first]!.inputPeak;
  // The clean limit's power, the check that a level is below it and a settling output's swing all read this: one cycle, shared.
  let clean: Float64Array | null = null;
  const cleanCycle = () => (clean ??= signal.cycle(CYCLE_SAMPLES, inputPeak));
  const cleanFundamental = () => harmonicAmplitudes(cleanCycle(), 1)[1] ?? 0;
  // At the source's extremes: on the settled cycle (its quarter points) when the output stage settles, else at those instants.
  const cleanOutputPeak = () => (signal.settles ? Math.abs(cleanCycle()[CYCLE_SAMPLES / 4]! - cleanCycle()[(3 * CYCLE_SAMPLES) / 4]!) / 2 : signal.outputPeak(inputPeak));
  return { ok: true, links, signal, clips, first, inputPeak, gain, gains, inputs, gridConductances: links.map(gridConductance), cleanFundamental, cleanOutputPeak };
}

