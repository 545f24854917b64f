import { bracketedRoot } from '../numeric/bracketedRoot';
import { korenPlateCurrent } from '../tube/koren';
import { modelOf, type TubeLike } from '../tube/types';
import { fail, type Result } from '../result';
import { checkNumber, checkTube, LIMITS } from './checkInput';

/** Ask for a cathode-biased stage whose plate sits at va (to ground) with plate current ia. */
export interface DesignTarget {
  readonly tube: TubeLike;
  readonly bplus: number;
  /** Wanted plate voltage to ground, V. */
  readonly va: number;
  /** Wanted plate current, A. */
  readonly ia: number;
}

export interface DesignAnswer {
  /** Plate resistor, Ω. */
  readonly ra: number;
  /** Cathode resistor, Ω. */
  readonly rk: number;
  /** The grid–cathode voltage the tube needs there, V (= −Ia·Rk). */
  readonly vgk: number;
}

/**
 * Inverse design: Ra from Ohm's law, (B+ − Va)/Ia; Rk from the tube, by
 * finding the Vgk ≤ 0 at which the tube passes Ia with Vpk = Va + Vgk (the
 * cathode sits at −Vgk). Ip(Va + Vgk, Vgk) rises monotonically with Vgk,
 * from 0 at Vgk = −Va, so a bracket on [−Va, 0] holds exactly one answer
 * when Ip(Va, 0) ≥ Ia, and none otherwise (the grid would have to go positive).
 */
/**
 * The least plate current designed for, A: 1 µA, the solvers' own cutoff. Below
 * it Ra = (B+ − Va)/Ia runs off to infinity (1e-307 A gave Ra = Infinity).
 */
export const MIN_DESIGN_IA = 1e-6;

export function designFor(target: DesignTarget): Result<DesignAnswer> {
  if (typeof target !== 'object' || target === null) return fail('invalid-input', 'No target given');
  const problem =
    checkTube(target.tube) ??
    checkNumber('bplus', 'B+', target.bplus, 'V', 0, LIMITS.maxVolts, { minExclusive: true }) ??
    checkNumber('va', 'Plate voltage', target.va, 'V', 0, LIMITS.maxVolts, { minExclusive: true }) ??
    checkNumber('ia', 'Plate current', target.ia, 'A', MIN_DESIGN_IA, 100);
  if (problem) return problem;
  const { bplus, va, ia } = target;
  if (va >= bplus) {
    return fail('supply-too-low', `The plate cannot sit at ${va.toFixed(1)} V: that is not below B+ ${bplus.toFixed(1)} V.`, 'va');
  }
  const p = modelOf(target.tube).params;
  const g = (vgk: number) => korenPlateCurrent(p, va + vgk, vgk) - ia;
  if (g(0) < 0) {
    return fail('unreachable', `At ${va.toFixed(1)} V the tube passes at most ${(korenPlateCurrent(p, va, 0) * 1e3).toFixed(2)} mA with 0 V on the grid; more would need grid current.`, 'ia');
  }
  const root = bracketedRoot(g, -va, 0, 1e-12 * Math.max(1, va));
  if (!root.converged) return fail('no-convergence', 'No bias could be found for that point.');
  const vgk = root.x;
  const ra = (bplus - va) / ia;
  const rk = -vgk / ia;
  if (!(ra <= LIMITS.maxOhms && rk <= LIMITS.maxOhms)) return fail('unreachable', `That point needs more than ${LIMITS.maxOhms / 1e6} MΩ of plate or cathode resistance.`, 'ia');
  return { ok: true, ra, rk, vgk };
}
