import { bracketedRoot } from '../numeric/bracketedRoot';
import { fail, type Result } from '../result';
import { checkNumber, checkTube, LIMITS } from '../stage/checkInput';
import { ratingsFindings, type Finding } from '../stage/findings';
import { parallel } from '../stage/parallel';
import { CUTOFF_CURRENT_A, type OperatingPoint } from '../stage/solveStage';
import { gridVoltageForCurrent, korenPlateCurrent } from '../tube/koren';
import { smallSignalAt } from '../tube/triode';
import { modelOf, type TubeLike } from '../tube/types';
import { balancePoint, BALANCE_HZ, checkSplitterLoads, type BalancePoint, type SplitterLoads } from './splitterOutputs';

/**
 * The split-load phase splitter (cathodyne): one triode with equal plate and
 * cathode loads, so the plate gives the signal inverted and the cathode in
 * phase. The cathode load is Rk to ground, with an optional bias resistor
 * Rb between the cathode and Rk; the grid is held at a fixed DC voltage
 * (direct-coupled from the stage before, or a divider) or returned through
 * its leak to the Rb–Rk junction ("tap", self-biased by Rb). Each output
 * drives the next grid's resistor `rl` and its capacitance `cl` (the output
 * tube's input capacitance with its Miller effect), through coupling
 * capacitors taken as short at signal frequencies.
 */
export interface CathodyneDesign extends SplitterLoads {
  readonly tube: TubeLike;
  readonly bplus: number;
  readonly ra: number;
  readonly rk: number;
  /** Bias resistor from the cathode to the top of Rk, Ω; 0 for none. */
  readonly rb: number;
  readonly grid: { readonly kind: 'fixed'; readonly volts: number } | { readonly kind: 'tap' };
}

export interface CathodyneResult {
  readonly op: OperatingPoint;
  readonly mu: number;
  readonly rp: number;
  readonly gm: number;
  /** Gain from the grid to each output with both loaded, signed (the plate's negative). */
  readonly gainPlate: number;
  readonly gainCathode: number;
  /** The cathode's output over the plate's, in magnitude, at midband (1 when Ra equals Rk + Rb and the loads match). */
  readonly balance: number;
  /** Each output's impedance with the other output loaded by its own load, Ω: they differ greatly (the plate's is near Ra, the cathode's a follower's). */
  readonly zPlate: number;
  readonly zCathode: number;
  /** The balance against frequency with the loads' capacitance: |vk/va| and its phase error from 180°, at each frequency asked. */
  readonly balanceAt: readonly BalancePoint[];
  /** The clean swing of a sine: peak at the grid, at each output, and what ends it. */
  readonly swing: { readonly inputPeak: number; readonly platePeak: number; readonly cathodePeak: number; readonly limitedBy: 'grid-current' | 'cutoff' };
  /** Heater to cathode, V (cathode minus heater). */
  readonly vhk: number;
  readonly findings: readonly Finding[];
}


/** Complex numbers as pairs, for the two-node solve. */
type C = readonly [number, number];
const div = (a: C, b: C): C => {
  const d = b[0] * b[0] + b[1] * b[1];
  return [(a[0] * b[0] + a[1] * b[1]) / d, (a[1] * b[0] - a[0] * b[1]) / d];
};
const mul = (a: C, b: C): C => [a[0] * b[0] - a[1] * b[1], a[0] * b[1] + a[1] * b[0]];
const sub = (a: C, b: C): C => [a[0] - b[0], a[1] - b[1]];
const add = (a: C, b: C): C => [a[0] + b[0], a[1] + b[1]];

/**
 * The split-load stage's two outputs at one frequency, by nodal analysis of
 * the small-signal circuit (the tube as gm·vgk with rp, plate to cathode):
 * plate node: −va·Ya − i = 0; cathode node: i − vk·Yk = 0, with
 * i = gm·(vg − vk) + (va − vk)/rp and each Y its resistor, load and load
 * capacitance. Answers va and vk for vg = 1.
 */
function outputs(gm: number, rp: number, ra: number, rc: number, rl: number, cl: number, hz: number): { va: C; vk: C } {
  const w = 2 * Math.PI * hz;
  const yLoad: C = [Number.isFinite(rl) ? 1 / rl : 0, w * cl];
  const ya = add([1 / ra, 0], yLoad);
  const yk = add([1 / rc, 0], yLoad);
  const gp = 1 / rp;
  // Plate: va·(ya + gp) − vk·(gm + gp) = −gm·vg;  cathode: −va·gp + vk·(yk + gm + gp) = gm·vg.
  const a11 = add(ya, [gp, 0]);
  const a12: C = [-(gm + gp), 0];
  const a21: C = [-gp, 0];
  const a22 = add(yk, [gm + gp, 0]);
  const b1: C = [-gm, 0];
  const b2: C = [gm, 0];
  const det = sub(mul(a11, a22), mul(a12, a21));
  return { va: div(sub(mul(b1, a22), mul(a12, b2)), det), vk: div(sub(mul(a11, b2), mul(a21, b1)), det) };
}

export function solveCathodyne(design: CathodyneDesign): Result<CathodyneResult> {
  if (typeof design !== 'object' || design === null) return fail('invalid-input', 'No phase-splitter design given');
  const d = design;
  const grid = d.grid as { kind?: unknown; volts?: unknown } | undefined;
  const problem =
    checkTube(d.tube) ??
    checkNumber('bplus', 'B+', d.bplus, 'V', 1, LIMITS.maxVolts) ??
    checkNumber('ra', 'Ra', d.ra, 'Ω', 1, LIMITS.maxOhms) ??
    checkNumber('rk', 'Rk', d.rk, 'Ω', 1, LIMITS.maxOhms) ??
    checkNumber('rb', 'Rb', d.rb, 'Ω', 0, LIMITS.maxOhms) ??
    (typeof grid !== 'object' || grid === null || (grid.kind !== 'tap' && grid.kind !== 'fixed') ? fail('invalid-input', 'Give the grid a fixed voltage or return it to the bias tap', 'grid') : null) ??
    (grid?.kind === 'fixed' ? checkNumber('grid.volts', 'Grid voltage', grid.volts, 'V', 0, LIMITS.maxVolts) : null) ??
    checkSplitterLoads(d);
  if (problem) return problem;
  const p = modelOf(d.tube).params;
  const rc = d.rk + d.rb;
  const rl = d.rl ?? Infinity;
  const cl = d.cl ?? 0;
  const heaterVolts = d.heaterVolts ?? 0;
  const fixed = d.grid.kind === 'fixed' ? d.grid.volts : null;
  // DC: Ia through Ra, the tube, Rb and Rk; the grid at its fixed voltage or at the tap (Ia·Rk).
  const gridOf = (ia: number) => (fixed ?? ia * d.rk);
  const excess = (ia: number) => ia - korenPlateCurrent(p, d.bplus - ia * (d.ra + rc), gridOf(ia) - ia * rc);
  const top = d.bplus / (d.ra + rc);
  const root = bracketedRoot(excess, 0, top, 1e-12 * top);
  const ia = root.x;
  const vk = ia * rc;
  const va = d.bplus - ia * d.ra;
  const vgk = gridOf(ia) - vk;
  if (vgk > 0) return fail('grid-current', `The grid would sit ${vgk.toFixed(2)} V positive to its cathode and draw current: ${fixed === null ? 'raise Rb' : 'lower the grid voltage or raise Rk'}.`, fixed === null ? 'rb' : 'grid.volts');
  if (ia < CUTOFF_CURRENT_A) return fail('cutoff', 'The splitter is cut off: raise its grid voltage or lower Rk.', fixed === null ? 'rb' : 'grid.volts');
  const vpk = va - vk;
  const op: OperatingPoint = { va, vk, ia, vgk, vpk, pa: vpk * ia };
  const ss = smallSignalAt(d.tube, vpk, vgk);
  const mid = outputs(ss.gm, ss.rp, d.ra, rc, rl, 0, 1e3);
  const gainPlate = mid.va[0];
  const gainCathode = mid.vk[0];
  // Each output's impedance with the other loaded (Langford-Smith's split-load results): the plate's Ra ∥ (rp + (μ+1)·Rc'),
  // the cathode's Rc ∥ (rp + Ra')/(μ+1), Ra' and Rc' each with its load.
  const raL = parallel(d.ra, rl);
  const rcL = parallel(rc, rl);
  const zPlate = parallel(d.ra, ss.rp + (ss.mu + 1) * rcL);
  const zCathode = parallel(rc, (ss.rp + raL) / (ss.mu + 1));
  const balanceAt = BALANCE_HZ.map((hz) => {
    const o = outputs(ss.gm, ss.rp, d.ra, rc, rl, cl, hz);
    return balancePoint(hz, o.va, o.vk);
  });
  return {
    ok: true,
    op,
    mu: ss.mu,
    rp: ss.rp,
    gm: ss.gm,
    gainPlate,
    gainCathode,
    balance: Math.abs(gainCathode / gainPlate),
    zPlate,
    zCathode,
    balanceAt,
    swing: cleanSwing(p, op, raL, rcL),
    vhk: vk - heaterVolts,
    findings: ratingsFindings({ tube: d.tube, bplus: d.bplus, ...op, heaterVolts, rg: null, fixedBias: false }),
  };
}

/**
 * The clean swing along the loads (Ra′ at the plate, Rc′ at the cathode,
 * each with its load): the signal current δi moves the plate by −δi·Ra′ and
 * the cathode by +δi·Rc′. Upwards it ends where the grid reaches its cathode
 * (grid current): δi is the root of Ia(Vpk − δi·(Ra′+Rc′), 0) = Ia + δi.
 * Downwards where the current stops (cutoff): δi = −Ia, and the grid voltage
 * for 1 µA at that plate voltage. A sine's clean peak is the smaller input.
 */
function cleanSwing(p: Parameters<typeof korenPlateCurrent>[0], op: OperatingPoint, raL: number, rcL: number): CathodyneResult['swing'] {
  const both = raL + rcL;
  const up = bracketedRoot((di) => korenPlateCurrent(p, op.vpk - di * both, 0) - (op.ia + di), 0, op.vpk / both, 1e-12).x;
  const inUp = -op.vgk + up * rcL;
  const vgCut = gridVoltageForCurrent(p, op.vpk + op.ia * both, CUTOFF_CURRENT_A);
  const inDown = op.vgk - vgCut + op.ia * rcL;
  const limitedBy = inUp <= inDown ? 'grid-current' : 'cutoff';
  const inputPeak = Math.min(inUp, inDown);
  // Each output's peak in the half-cycle that reaches the limit.
  const di = limitedBy === 'grid-current' ? up : op.ia;
  return { inputPeak, platePeak: di * raL, cathodePeak: di * rcL, limitedBy };
}
