import { checkNumber } from '../stage/checkInput';
import { fail, type Failure, type Result } from '../result';
import { checkBiasSupply } from '../supply/biasSupply';
import { fixedBiasStage, type NetlistBias } from './biasCircuit';
import { solveAmplifier } from '../chain/solveAmplifier';
import type { ChainInput, ChainResult } from '../chain/chainTypes';
import { globalFeedback } from '../chain/globalFeedback';
import { placedOnSupply, solveOnSupply, type AmplifierOnSupply } from '../chain/solveOnSupply';
import { chainNetlist } from './chainNetlist';
import { benchSupply, type BenchSupply } from './benchSupply';

/** What the netlist is for: its title, the sine its transient is driven with, and any global feedback. */
export interface NetlistOptions {
  /** The design's name, for the netlist's first line. */
  readonly title: string;
  /** The source's peak for the transient, V (say, the input a working level asks for). */
  readonly inputPeak: number;
  /** A resistor from the speaker to the first stage's cathode (and a capacitor across it), Ω and F; null or absent for none. */
  readonly feedback?: { readonly rf: number; readonly cf: number | null } | null;
}

const volts = (x: number) => `${x.toPrecision(4)} V`;
const hz = (x: number | null) => (x === null ? 'none' : `${x.toPrecision(3)} Hz`);

/**
 * The amplifier as a netlist for ngspice, to take the design further in a
 * general-purpose simulator: every stage with its tube by Koren's laws as
 * behavioural sources (with grid current and the interelectrode
 * capacitances), every part as designed, each stage's B+ as a DC source,
 * an output transformer as coupled inductors, and ngspice's control block
 * for the analyses (operating point, AC response, a transient at
 * `inputPeak` with a Fourier analysis of the output). The model's own figures head it as
 * comments, to compare. With feedback, the secondary is wound the way that
 * makes it negative: in phase with the input at the first cathode.
 */
export function amplifierNetlist(input: ChainInput, options: NetlistOptions): Result<{ readonly text: string }> {
  return netlistOf(input, options, null);
}

/**
 * The amplifier on its own supply as a netlist for ngspice: as
 * amplifierNetlist, with the stages at the voltages their nodes give
 * (solveOnSupply) and drawing from them, and the supply's secondary,
 * rectifier and filter in the circuit (benchSupply), so the transient
 * (ten mains cycles) carries its ripple and hum, and its last cycle's mean
 * and ripple at every node are measured against the model's, at its head.
 */
export function amplifierOnSupplyNetlist(on: AmplifierOnSupply, options: NetlistOptions, bias?: NetlistBias | null): Result<{ readonly text: string }> {
  const solved = solveOnSupply(on);
  if (!solved.ok) return solved;
  const problem = bias ? biasProblem(bias, on) : null;
  if (problem) return problem;
  const placed = placedOnSupply(on.amplifier, solved.bplus, solved.screenVolts);
  return netlistOf(placed, options, benchSupply(on, solved, bias));
}

/** A bias supply the netlist cannot use: one for no fixed-bias output stage, or a solution without a string for each of its tubes. */
function biasProblem(bias: NetlistBias, on: AmplifierOnSupply): Failure | null {
  const stage = fixedBiasStage(on.amplifier.stages);
  if (!stage) return fail('invalid-input', 'Only a fixed-bias output stage takes a bias supply', 'bias');
  const design = checkBiasSupply(bias.design);
  if (design) return { ...design, field: `bias.${design.field}` };
  const s = bias.solved;
  const atLeast = (min: number, ...xs: unknown[]) => xs.every((x) => typeof x === 'number' && Number.isFinite(x) && x >= min);
  const positive = (...xs: unknown[]) => xs.every((x) => atLeast(Number.MIN_VALUE, x));
  const taps = s?.taps;
  const whole = Array.isArray(taps) && taps.length >= stage.tubes && positive(s.rail, s.reservoir, s.noLoadVolts) && atLeast(0, s.railRipplePp, s.load);
  if (!whole || !taps.every((t) => t && t.string && positive(t.string.top, t.string.pot, t.string.bottom, t.nominal) && atLeast(0, t.travel))) {
    return fail('invalid-input', 'The bias supply is not solved for this output stage: solve it again', 'bias');
  }
  return null;
}

function netlistOf(input: ChainInput, options: NetlistOptions, supply: BenchSupply | null): Result<{ readonly text: string }> {
  if (typeof options !== 'object' || options === null) return fail('invalid-input', 'Give the netlist its title and input level');
  const title = typeof options.title === 'string' ? options.title.replace(/[\r\n]+/g, ' ').trim() : '';
  const problem = checkNumber('inputPeak', 'The input peak', options.inputPeak, 'V', 0, 1000);
  if (problem) return problem;
  const fb = options.feedback ?? null;
  if (fb !== null && typeof fb !== 'object') return fail('invalid-input', 'Give the feedback as { rf, cf }', 'feedback');
  // With feedback, the model's loop checks Rf, Cf and the chain's shape as the bench does; Rf's DC path joins the first
  // cathode's resistor, so its open loop is the circuit's operating point.
  const loop = fb === null ? null : globalFeedback(input, fb.rf, undefined, fb.cf);
  if (loop && !loop.ok) return { ...loop, field: loop.field === 'rf' || loop.field === 'cf' ? `feedback.${loop.field}` : loop.field === 'stages' ? 'feedback' : loop.field };
  const solved = loop?.ok ? null : solveAmplifier(input);
  if (solved && !solved.ok) return solved;
  const figures: ChainResult = loop?.ok ? loop.open : solved!;
  // The secondary as drawn (its first node dotted like the primary's B+ end) carries the plate's swing inverted: a chain
  // whose model output (plate-phased) is in phase with the input needs it turned round for the feedback to be negative.
  const feedback = fb === null ? undefined : { rf: fb.rf, cf: fb.cf, reversed: !figures.inverting };
  const bench = { kind: 'bench' as const, peak: options.inputPeak, feedback, ...(supply ? { seconds: supply.seconds, after: supply.measures, ...(supply.spectrumHz !== undefined ? { spectrumHz: supply.spectrumHz } : {}) } : {}) };
  const text = chainNetlist(input, bench, supply?.supply);
  const model = figures.stages.map((st, i) => `* stage ${i + 1} (${st.kind}): plate ${volts(st.pins.plate)}, cathode ${volts(st.pins.cathode)}, grid ${volts(st.pins.grid)}${st.pins.screen !== null ? `, screen ${volts(st.pins.screen)}` : ''}${st.pins.plate2 !== null ? `, second plate ${volts(st.pins.plate2)}` : ''}`);
  const header = [
    `* ${title || 'Amplifier'}: a netlist for ngspice`,
    supply
      ? "* Units SI. Tubes by Koren's laws as behavioural sources; the input at node src, the output at node out."
      : "* Units SI. Tubes by Koren's laws as behavioural sources; each stage's B+ a DC source (node bp<n>); the input at node src, the output at node out.",
    "* The model's own figures, to compare with the operating point and the sweep:",
    ...model,
    loop?.ok
      ? `* with Rf's DC path in the first cathode, loop open: midband gain ${figures.gain.toPrecision(4)}; closed: ${loop.closedGain.toPrecision(4)} (${loop.feedbackDb.toFixed(1)} dB of feedback)`
      : `* midband gain ${figures.gain.toPrecision(4)}, -3 dB at ${hz(figures.lowHz)} and ${hz(figures.highHz)}`,
    ...(supply?.header ?? []),
  ];
  // The chain's own first line names it for the checks; the header takes its place.
  return { ok: true, text: [...header, ...text.split('\n').slice(1)].join('\n') };
}
