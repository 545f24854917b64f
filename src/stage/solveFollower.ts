import { smallSignalAt } from '../tube/triode';
import { modelOf, type TubeLike } from '../tube/types';
import { fail, type Result } from '../result';
import { checkNumber, checkTube, LIMITS } from './checkInput';
import { ratingsFindings, type Finding } from './findings';
import { followerGain, followerZout } from './gainFormulas';
import { solveLoop } from './operatingPoint';
import { parallel } from './parallel';
import { CUTOFF_CURRENT_A, type OperatingPoint } from './solveStage';

/** How far past 0 V a follower's grid may solve, V, and still be at its cathode: the loop's own rounding (its tolerance is 1e-12 of Ia). */
const GRID_AT_CATHODE_ROUNDING = 1e-9;

/** A direct-coupled cathode follower: plate at B+, grid at vgrid (the previous plate), Rk to ground. */
export interface FollowerDesign {
  readonly tube: TubeLike;
  /** Supply at the plate, V. */
  readonly bplus: number;
  /** Grid voltage to ground, V (the driving stage's plate voltage when direct-coupled). */
  readonly vgrid: number;
  /** Cathode resistor to ground, Ω (> 0). */
  readonly rk: number;
  /** Load on the cathode through a coupling capacitor, Ω; Infinity (default) when none. */
  readonly rl?: number;
  /** Heater potential to ground, V; default 0. */
  readonly heaterVolts?: number;
}

export interface FollowerSolution {
  readonly op: OperatingPoint;
  readonly mu: number;
  readonly rp: number;
  readonly gm: number;
  /** Cathode over grid voltage, below 1 and positive (the follower does not invert). */
  readonly gain: number;
  /** Output impedance at the cathode, Ω. */
  readonly zout: number;
  /** Heater-to-cathode voltage, V (cathode minus heater). */
  readonly vhk: number;
  readonly findings: readonly Finding[];
}

export function solveFollower(design: FollowerDesign): Result<FollowerSolution> {
  if (typeof design !== 'object' || design === null) return fail('invalid-input', 'No design given');
  const problem =
    checkTube(design.tube) ??
    (typeof design.bplus === 'number' && Number.isFinite(design.bplus) && design.bplus <= 0
      ? fail('supply-too-low', `B+ must be above 0 V (got ${design.bplus} V)`, 'bplus')
      : null) ??
    checkNumber('bplus', 'B+', design.bplus, 'V', 0, LIMITS.maxVolts, { minExclusive: true }) ??
    checkNumber('vgrid', 'Grid voltage', design.vgrid, 'V', -LIMITS.maxVolts, LIMITS.maxVolts) ??
    checkNumber('rk', 'Rk', design.rk, 'Ω', 0, LIMITS.maxOhms, { minExclusive: true }) ??
    (design.rl === undefined ? null : checkNumber('rl', 'RL', design.rl, 'Ω', 0, LIMITS.maxOhms, { minExclusive: true, allowInfinity: true })) ??
    (design.heaterVolts === undefined ? null : checkNumber('heaterVolts', 'Heater potential', design.heaterVolts, 'V', -LIMITS.maxVolts, LIMITS.maxVolts));
  if (problem) return problem;
  const heaterVolts = design.heaterVolts ?? 0;
  const model = modelOf(design.tube);
  const loop = solveLoop(model, design.bplus, 0, design.rk, design.vgrid);
  if (!loop.converged) return fail('no-convergence', 'The follower operating point could not be found to full accuracy; check the values.');
  // A follower held where its grid meets its cathode (a drag's limit) solves to within rounding of 0 V either side.
  if (loop.vgk > GRID_AT_CATHODE_ROUNDING) {
    return fail('grid-current', `The follower's grid would sit ${loop.vgk.toFixed(2)} V positive to its cathode and draw current: raise its Rk.`, 'rk');
  }
  if (loop.ia < CUTOFF_CURRENT_A) {
    return fail('cutoff', `The follower is cut off: its grid at ${design.vgrid.toFixed(1)} V is too low for B+ ${design.bplus.toFixed(0)} V.`, 'vgrid');
  }
  const ss = smallSignalAt(model, loop.vpk, loop.vgk);
  const op: OperatingPoint = { va: loop.va, vk: loop.vk, ia: loop.ia, vgk: loop.vgk, vpk: loop.vpk, pa: loop.pa };
  return {
    ok: true,
    op,
    mu: ss.mu,
    rp: ss.rp,
    gm: ss.gm,
    gain: followerGain(ss.mu, ss.rp, parallel(design.rk, design.rl ?? Infinity)),
    zout: followerZout(ss.mu, ss.rp, design.rk),
    vhk: loop.vk - heaterVolts,
    findings: ratingsFindings({ tube: design.tube, bplus: design.bplus, ...op, heaterVolts, rg: null, fixedBias: false }),
  };
}
