import { TUBE_CURRENT_SPREAD } from '../build/partsList';
import { scaledTube } from '../pushpull/solvePushPull';
import { fail, type Failure, type Result } from '../result';
import { finding, type Finding } from '../stage/ratingBands';
import type { OutputTube } from './outputTube';
import { solveOutput, type OutputSolution } from './solveOutput';

/** One end of the spread: the stage's idle with a tube passing (1 + m) times the law's current. */
export interface SpreadEnd {
  /** The tube's current share over the law's (−0.2 for a tube 20 % weak). */
  readonly m: number;
  readonly ip: number;
  readonly ig2: number;
  readonly vk: number;
  readonly pa: number;
  readonly pg2: number;
}

/** A cathode-biased stage's idle over the type's spread of tubes: what the socket sees with the weakest and the strongest. */
export interface OutputSpread {
  readonly spread: number;
  readonly weakest: SpreadEnd;
  readonly strongest: SpreadEnd;
}

/**
 * The idle of a cathode-biased stage with the weakest and strongest tube of
 * the type in its socket (passing TUBE_CURRENT_SPREAD less and more current
 * than the law at the same voltages, common practice), every part at its
 * value: the cathode resistor takes back part of the difference (its voltage
 * rises with the current), so the plate current moves by less than the tube's
 * spread. A stronger tube is the hotter one: its dissipation is the one to
 * hold against the rating. Fixed bias is set tube by tube (biasAdjustment),
 * so it has no spread here: a failure naming the field.
 */
export function outputSpread(s: OutputSolution, spread = TUBE_CURRENT_SPREAD): Result<OutputSpread> {
  if (typeof s !== 'object' || s === null || typeof s.design !== 'object' || s.design === null || s.design.bias !== 'cathode') {
    return fail('invalid-input', 'Only a cathode-biased stage spreads with its tubes: a fixed bias is set for each tube', 'bias');
  }
  return spreadOf(spread, (m) => {
    const r = solveOutput(scaledTube(s.tube, m), s.design);
    return r.ok ? { ok: true, m, ip: r.op.ip, ig2: r.op.ig2, vk: r.op.vk, pa: r.op.pa, pg2: r.op.pg2 } : r;
  });
}

/** A spread of tubes' current the model can take: a share from 0 to 0.9 (a tube at 1 − spread must still conduct). */
export function spreadProblem(spread: unknown): Failure | null {
  return typeof spread === 'number' && spread >= 0 && spread < 0.9 ? null : fail('invalid-input', 'Give the tubes\' spread as a share of their current from 0 to 0.9', 'spread');
}

/** The two ends of a spread, each solved by `end` at (1 ∓ spread) times the law's current; a failure from either is passed on. */
export function spreadOf(spread: number, end: (m: number) => Result<SpreadEnd>): Result<OutputSpread> {
  const problem = spreadProblem(spread);
  if (problem) return problem;
  const weakest = end(-spread);
  if (!weakest.ok) return weakest;
  const strongest = end(spread);
  if (!strongest.ok) return strongest;
  return { ok: true, spread, weakest: strip(weakest), strongest: strip(strongest) };
}

const strip = ({ ok: _ok, ...rest }: SpreadEnd & { ok: true }): SpreadEnd => rest;

/** The strongest tube's plate dissipation against the rating: a warning past it (the law's own tube may sit within it). */
export function spreadFinding(tube: OutputTube, r: OutputSpread): Finding | null {
  const rating = tube.ratings.maxPlateDissipation;
  const pa = r.strongest.pa;
  if (!(rating > 0) || !(pa > rating)) return null;
  return finding(
    'tube-spread',
    'warning',
    `A tube passing ${Math.round(r.spread * 100)} % more current than the law would dissipate ${pa.toFixed(1)} W at idle, ${((pa / rating) * 100).toFixed(0)} % of the ${rating} W rating: raise Rk or lower B+ so the type's strong tubes fit too.`,
    pa,
    rating,
  );
}
