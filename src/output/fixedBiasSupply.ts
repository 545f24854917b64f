import { fail, type Result } from '../result';
import { formatValue } from '../parts/formatValue';
import { MAX_CHANNELS } from '../chain/solveOnSupply';
import { finding, type Finding } from '../stage/ratingBands';
import type { PushPullAnalysis } from '../pushpull/analyzePushPull';
import { solveBiasSupply, type BiasSupplyDesign, type BiasSupplySolution } from '../supply/biasSupply';
import { biasAdjustment, type BiasAdjustment } from './biasAdjustment';
import { hotEnd, type HotEnd } from './hotEnd';
import { biasPartsList, type BiasParts } from '../build/biasParts';
import type { OutputAnalysis } from './analyzeOutput';
import type { OutputDesign } from './outputDesign';
import type { OutputTube } from './outputTube';
import { slopesAt } from './solveOutput';

/** A fixed-bias stage's tubes as its bias supply sees them: each as a single-ended stage at its idle, and how many there are. */
export interface FixedBiasTubes {
  readonly tube: OutputTube;
  readonly design: OutputDesign;
  readonly vpk: number;
  readonly ip: number;
  readonly count: number;
  /** A single tube's small-signal gain from its grid to the speaker (its ripple's way out); null for a pair, whose grids' ripple goes the same way and cancels as far as its tubes match. */
  readonly speakerGain: number | null;
}

/** A single-ended stage's one tube; null under cathode bias. */
export function singleEndedBiasTubes(a: OutputAnalysis): FixedBiasTubes | null {
  const s = a.solution;
  if (s.design.bias !== 'fixed') return null;
  // The linear stage: the tube's slopes at idle into the primary (its DC resistance in series), then the turns.
  const d = s.design;
  const { rp, gm } = slopesAt(s.tube, s.op.feed, s.op.vpk, s.op.vgk, d.rPrimary);
  const series = d.zPrimary + d.rPrimary;
  const rLoad = Number.isFinite(rp) ? (rp * series) / (rp + series) : series;
  const speakerGain = gm * rLoad * (d.zPrimary / series) * Math.sqrt(d.speakerOhms / d.zPrimary);
  return { tube: s.tube, design: d, vpk: s.op.vpk, ip: s.op.ip, count: 1, speakerGain: Number.isFinite(speakerGain) ? speakerGain : null };
}

/** A pair's two tubes, each as a single-ended stage on its own half of the primary (its DC resistance and a quarter of Raa, the load one tube sees in class A); null under cathode bias. */
export function pairBiasTubes(a: PushPullAnalysis): FixedBiasTubes | null {
  const s = a.solution;
  const d = s.design;
  if (d.bias !== 'fixed') return null;
  return { tube: s.tube, design: { ...d, zPrimary: d.raa / 4, rPrimary: d.rPrimary / 2 }, vpk: s.idle[0].vpk, ip: s.idle[0].ip, count: 2, speakerGain: null };
}

export interface FixedBiasSupply extends BiasSupplySolution {
  readonly adjustment: BiasAdjustment;
  /** What to order: the diode, capacitors, filter resistor and each tube's string. */
  readonly parts: BiasParts;
  /** The law's own tube with its adjustment at the hot end. */
  readonly hotEnd: HotEnd;
  /** A single tube's hum at the speaker from the rail's ripple at its grid, V rms; null for a pair (common to both grids). */
  readonly humAtSpeaker: number | null;
  /** The hot end, and the grid circuit's resistance (the leak and the string behind the wiper) against the fixed-bias maximum. */
  readonly findings: readonly Finding[];
}

/**
 * A fixed-bias stage's grid supply: the range each tube's adjustment must
 * cover (biasAdjustment), the rail and a string per tube to cover it
 * (solveBiasSupply), the hot end's dissipation (hotEnd), and for one tube
 * the hum its grid's ripple gives at the speaker through the stage's gain.
 */
function fixedBiasSupply(t: FixedBiasTubes | null, bias: BiasSupplyDesign, channels: number): Result<FixedBiasSupply> {
  if (t === null) return fail('invalid-input', 'A cathode-biased stage sets its own bias: it needs no bias supply', 'bias');
  if (!Number.isInteger(channels) || channels < 1 || channels > MAX_BIAS_CHANNELS) return fail('invalid-input', `Give 1 to ${MAX_BIAS_CHANNELS} channels on the bias supply`, 'channels');
  const adjustment = biasAdjustment(t.tube, t.design, t.vpk, t.ip);
  if (!adjustment.ok) return adjustment;
  const reach = { weakest: -adjustment.weakest, nominal: -adjustment.nominal, strongest: -adjustment.strongest };
  const solved = solveBiasSupply(bias, Array.from({ length: t.count * channels }, () => reach));
  if (!solved.ok) return solved;
  const tap = solved.taps[0]!;
  const hot = hotEnd(t.tube, t.design, t.vpk, t.ip, -tap.string.least);
  if (!hot.ok) return hot;
  const findings: Finding[] = [hot.finding];
  const most = t.tube.ratings.maxGridResistanceFixedBias;
  if (most !== undefined) {
    // The grid's return is the leak and, behind the wiper, the string: the data sheet's limit is on the whole path.
    const path = t.design.rg + Math.max(...solved.taps.map((x) => x.sourceOhms));
    if (path > most) findings.push(finding('grid-resistor', 'warning', `The grid leak (${formatValue(t.design.rg, 'Ω')}) and the bias string behind the wiper come to ${formatValue(path, 'Ω')}, past the ${formatValue(most, 'Ω')} the data sheet allows under fixed bias: lower the grid leak.`, path, most));
  }
  return { ...solved, adjustment, parts: biasPartsList(bias, solved), hotEnd: hot, humAtSpeaker: t.speakerGain === null ? null : tap.gridRippleRms * Math.abs(t.speakerGain), findings };
}

/** Channels one bias supply may feed: as many as one B+ supply does (solveBiasSupply takes a pair's two strings for each). */
const MAX_BIAS_CHANNELS = MAX_CHANNELS;

/** A fixed-bias single-ended stage's bias supply (every channel's tube on the one rail), from its analysis, with the hum its grid's ripple makes at the speaker. */
export function outputBiasSupply(a: OutputAnalysis, bias: BiasSupplyDesign, channels = 1): Result<FixedBiasSupply> {
  if (typeof a !== 'object' || a === null || typeof a.solution !== 'object' || a.solution === null) return fail('invalid-input', 'Give the output stage\'s analysis');
  return fixedBiasSupply(singleEndedBiasTubes(a), bias, channels);
}

/** A fixed-bias pair's bias supply (every channel's pair on the one rail), from its analysis: a string per tube, their ripple common to both grids. */
export function pairBiasSupply(a: PushPullAnalysis, bias: BiasSupplyDesign, channels = 1): Result<FixedBiasSupply> {
  if (typeof a !== 'object' || a === null || typeof a.solution !== 'object' || a.solution === null) return fail('invalid-input', 'Give the pair\'s analysis');
  return fixedBiasSupply(pairBiasTubes(a), bias, channels);
}

