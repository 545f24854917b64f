import { bracketedRoot } from '../numeric/bracketedRoot';
import { fail, type Result } from '../result';
import { emptyCurrents, screenFeedOf, stageCurrentsInto } from './electrodes';
import { effectiveConnection, type OutputDesign } from './outputDesign';
import type { OutputTube } from './outputTube';
import type { OutputSolution } from './solveOutput';
import { checkOutputInput } from './checkOutput';

/** The smallest cathode resistor the output design accepts, Ω (as outputDesignProblem checks). */
export const MIN_RK = 1;

export interface BiasAnswer {
  /** Grid to cathode, V. */
  readonly vgk: number;
  /** Cathode current at the point, A. */
  readonly ik: number;
  /** Cathode resistor that sets the point (cathode bias), Ω; for fixed bias the grid supply is vgk. */
  readonly rk: number;
  /** B+ that puts the plate at the wanted voltage through the primary's DC resistance, V. */
  readonly bplus: number;
}

/** The least idle current a bias is designed for, A: below it Rk = Vk/Ik runs off to infinity (a robustness run found 1e-307 A). */
const MIN_POINT_AMPS = 1e-6;

/**
 * Inverse design of the bias: for a wanted plate voltage and primary current,
 * the grid voltage that gives them (Brent's method; the current rises with
 * the grid, and with cathode bias the screen-to-cathode voltage rises with it
 * too), then Rk = −Vgk/Ik and B+ = Vpk + Ip·Rpri + Vk.
 */
export function biasForPoint(tube: OutputTube, d: OutputDesign, vpk: number, ip: number): Result<BiasAnswer> {
  const problem = checkOutputInput(tube, d);
  if (problem) return problem;
  if (!(vpk > 0) || !(ip >= MIN_POINT_AMPS) || !Number.isFinite(vpk) || !Number.isFinite(ip)) return fail('invalid-input', `The wanted point needs a positive plate voltage and a current of at least ${MIN_POINT_AMPS * 1e6} µA`);
  const connection = effectiveConnection(d, tube);
  const cathode = d.bias === 'cathode';
  const c = emptyCurrents();
  const currentAt = (vgk: number) => {
    const vk = cathode ? -vgk : 0;
    const feed = screenFeedOf(connection, d.screenVolts - vk, d.ulTap, vpk + ip * d.rPrimary);
    stageCurrentsInto(tube, feed, vpk, vgk, c, 0);
    return c.ip;
  };
  if (currentAt(0) < ip) return fail('grid-current', 'That much current needs the grid above the cathode (class A1 stops at 0 V grid)');
  const floor = -Math.max(vpk, d.screenVolts, 10) * 2;
  if (currentAt(floor) > ip) return fail('unreachable', 'The tube cannot be biased that far toward cutoff here');
  const r = bracketedRoot((g) => currentAt(g) - ip, floor, 0, 1e-9);
  const vgk = r.x;
  currentAt(vgk);
  const ik = c.ik;
  const vk = cathode ? -vgk : 0;
  const rk = cathode && ik > 0 ? vk / ik : 0;
  if (cathode && rk < MIN_RK) return fail('grid-current', `That point needs the grid within ${(-vgk).toFixed(2)} V of the cathode: Rk would be under ${MIN_RK} Ω, at the edge of grid current`);
  return { ok: true, vgk, ik, rk, bplus: vpk + ip * d.rPrimary + vk };
}

/**
 * The other kind of bias for the same stage. To fixed bias: the grid supply
 * that keeps the idle plate current with B+ unchanged (the plate gains the
 * cathode's voltage, as when an amplifier is converted; found by
 * biasForPoint). To cathode bias: Rk = −Vgk/Ik, the resistor that holds the
 * grid where it was (the plate then loses Vk, so the current falls a
 * little: the safe direction). Rounded as a part would be: the supply to a
 * tenth of a volt, Rk to the ohm.
 */
export function switchBias(s: OutputSolution, to: 'cathode' | 'fixed'): Pick<OutputDesign, 'bias' | 'rk' | 'vg'> {
  const { op, design, tube } = s;
  if (to === design.bias) return { bias: design.bias, rk: design.rk, vg: design.vg };
  if (to === 'fixed') {
    const fixed: OutputDesign = { ...design, bias: 'fixed' };
    const b = biasForPoint(tube, fixed, design.bplus - op.ip * design.rPrimary, op.ip);
    return { bias: 'fixed', rk: design.rk, vg: Math.round((b.ok ? b.vgk : op.vgk) * 10) / 10 };
  }
  return { bias: 'cathode', vg: design.vg, rk: op.ik > 0 ? Math.max(MIN_RK, Math.round(-op.vgk / op.ik)) : design.rk };
}
