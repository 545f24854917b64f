import { TUBE_CURRENT_SPREAD } from '../build/partsList';
import { fail, type Result } from '../result';
import { scaledTube } from '../pushpull/solvePushPull';
import { biasForPoint } from './outputBias';
import { spreadProblem } from './outputSpread';
import type { OutputDesign } from './outputDesign';
import type { OutputTube } from './outputTube';


/** A resistor from each cathode to ground to read the idle current by, Ω: 1 Ω makes millivolts read as milliamps (common practice). */
export const SENSE_OHMS = 1;

/** A fixed-bias tube's adjustment: where its grid must be set for the designed idle current, whichever tube of the type is in the socket. */
export interface BiasAdjustment {
  /** Grid to cathode for the law's own tube, V. */
  readonly nominal: number;
  /** For a tube passing (1 − spread) times the law's current: the least negative the adjustment must reach, V. */
  readonly weakest: number;
  /** For a tube passing (1 + spread) times: the most negative it must reach, V. */
  readonly strongest: number;
  readonly spread: number;
  /** The idle plate current to set, A. */
  readonly idlePlate: number;
  /** The cathode current there (plate and screen), A: what the sense resistor carries. */
  readonly idleCathode: number;
  /** What to read across SENSE_OHMS at that idle, V. */
  readonly senseVolts: number;
}

/**
 * The range a fixed-bias tube's grid adjustment must cover (one adjustment
 * per tube: each finds its own voltage): the grid voltage that gives the
 * designed idle plate current `ip` at the idle plate voltage `vpk`, for the
 * law's tube and for tubes passing (1 ± spread) times its current (Koren's
 * laws scale as 1/kg, src/pushpull/solvePushPull.ts's scaledTube), each by
 * biasForPoint. With a fixed grid the plate's idle voltage follows the
 * current alone (B+ less the primary's drop), so each tube set to `ip` idles
 * at `vpk`. A cathode-biased stage sets its own bias: a failure naming the field.
 */
export function biasAdjustment(tube: OutputTube, design: OutputDesign, vpk: number, ip: number, spread = TUBE_CURRENT_SPREAD): Result<BiasAdjustment> {
  if (typeof design !== 'object' || design === null || design.bias !== 'fixed') return fail('invalid-input', 'A cathode-biased stage sets its own bias: only fixed bias is adjusted', 'bias');
  const problem = spreadProblem(spread);
  if (problem) return problem;
  const nominal = biasForPoint(tube, design, vpk, ip);
  if (!nominal.ok) return nominal;
  const weakest = biasForPoint(scaledTube(tube, -spread), design, vpk, ip);
  if (!weakest.ok) return fail(weakest.reason, `A tube passing ${Math.round(spread * 100)} % less current cannot be set to this idle: ${weakest.message}`, 'bias');
  const strongest = biasForPoint(scaledTube(tube, spread), design, vpk, ip);
  if (!strongest.ok) return fail(strongest.reason, `A tube passing ${Math.round(spread * 100)} % more current cannot be set to this idle: ${strongest.message}`, 'bias');
  return { ok: true, nominal: nominal.vgk, weakest: weakest.vgk, strongest: strongest.vgk, spread, idlePlate: ip, idleCathode: nominal.ik, senseVolts: nominal.ik * SENSE_OHMS };
}
