import { wiperImpedance } from '../stage/volumeControl';
import { korenSlopesInto } from '../tube/koren';
import { gridCurrent } from '../tube/gridCurrent';
import { illinois } from '../numeric/illinois';
import { modelOf } from '../tube/types';
import type { CheckedStage } from '../stage/stageDesign';
import type { OperatingPoint } from '../stage/solveStage';

/**
 * The common-cathode stage at midband, large signal: the grid swings by vin
 * about its bias while the coupling capacitor holds the quiescent plate
 * voltage Va0 across RL and, when bypassed, the bypass capacitor holds Vk0.
 * At each instant Kirchhoff's current law at the plate gives
 *   va = (B+/Ra + Va0/RL − ia) · (Ra ∥ RL),   vk = Vk0 or ia·Rk,
 * and the tube closes it: ia = Ip(va − vk, vbias + vin − vk). The residual
 * Ip − ia falls strictly with ia, so each sample has exactly one solution.
 * This is the circuit a simulator sees with large capacitors, solved without
 * any small-signal approximation.
 *
 * `vin` is the grid's swing as the source would make it with no grid current
 * (its open-circuit voltage on the grid leak). Near and past the onset of
 * grid current the grid draws Ig (see gridCurrent) through the source and
 * leak in parallel and its grid stopper, Rs ∥ Rg + Rst, and sits lower by
 * Ig · (Rs ∥ Rg + Rst): that loop is
 * solved with the plate's at every such instant, so a stage driven from a
 * real source goes on past the onset, compressing, as a real one does. (The
 * grid current's own share of an unbypassed Rk's drop is left out: below a
 * hundredth of the plate current at the onset.)
 *
 * The grid swings about where it really sits (op.vgk + op.vk: the bias less
 * the grid's own quiescent current through its leak, as solveStage finds
 * it). That quiescent current flows through the leak alone, the coupling
 * capacitor holding its drop; only the current above it (or below it, on the
 * swing down) flows through Rs ∥ Rg + Rst. So the grid's retarding-field
 * current loads the source even at small signals, as its input conductance.
 * (The quiescent current's own drop on a stopper, a tenth or less of the
 * leak's on a bias shift of millivolts, is left out.)
 */
export interface TransferSample {
  readonly vin: number;
  /** AC output: plate (and RL) voltage less its quiescent value, V. */
  readonly vout: number;
  readonly ia: number;
  readonly vgk: number;
  readonly vpk: number;
  /** Grid current, A (through the source and grid leak). */
  readonly ig: number;
  /** How far the grid current pulls the grid below its open-circuit swing, V: Ig · (Rs ∥ Rg + Rst). */
  readonly gridDrop: number;
}

export interface StageTransfer {
  /** The stage's response to one input voltage (grid swing from bias), V. */
  at: (vin: number) => TransferSample;
  /** Faster path for a whole waveform: outputs only, each solve warm-started from the last. */
  outputs: (vins: Float64Array) => Float64Array;
}

const REL_TOL = 1e-12;
/** Bisection alone would need about 45 steps to reach REL_TOL; Newton needs 2 to 4 from a warm start. */
const MAX_STEPS = 80;
/** A grid-current drop on the source below this, V, is left out (it moves the output by microvolts at most). */
const GRID_DROP_FLOOR = 1e-7;

export function stageTransfer(d: CheckedStage, op: OperatingPoint): StageTransfer {
  const p = modelOf(d.tube).params;
  const vgrid = op.vgk + op.vk;
  const rPar = Number.isFinite(d.rl) ? (d.ra * d.rl) / (d.ra + d.rl) : d.ra;
  const drive = d.bplus / d.ra + (Number.isFinite(d.rl) ? op.va / d.rl : 0); // amperes: Norton source at the plate
  const degenerate = !d.bypassed && d.rk > 0;
  const dVpk = -(rPar + (degenerate ? d.rk : 0)); // ∂vpk/∂ia
  const dVgk = degenerate ? -d.rk : 0; // ∂vgk/∂ia
  // Largest current at which vpk is still ≥ 0.
  const iaHi = degenerate ? (drive * rPar) / (rPar + d.rk) : drive - op.vk / rPar;
  let last = op.ia;
  const k = { ia: 0, gm: 0, ga: 0 }; // scratch for korenSlopesInto

  /**
   * One instant: Newton on f(ia) = Ip − ia from the previous sample's current,
   * inside the bracket [0, iaHi] where f(0) ≥ 0 > f(iaHi) holds by
   * construction (at iaHi the plate–cathode voltage is zero); a step that
   * leaves the bracket is replaced by bisection, as in rtsafe. Written without
   * allocation: it runs 1024 times per distortion waveform.
   */
  const solveIa = (vin: number): number => {
    if (!(iaHi > 0)) return 0;
    const vgk0 = vgrid + vin - (degenerate ? 0 : op.vk);
    const vpk0 = drive * rPar - (degenerate ? 0 : op.vk);
    let lo = 0;
    let hi = iaHi;
    let x = last > 0 && last < iaHi ? last : 0.5 * iaHi;
    const tol = iaHi * REL_TOL;
    for (let i = 0; i < MAX_STEPS; i++) {
      korenSlopesInto(p, vpk0 + dVpk * x, vgk0 + dVgk * x, k);
      const value = k.ia - x;
      if (value === 0) break;
      if (value > 0) lo = x;
      else hi = x;
      const slope = k.gm * dVgk + k.ga * dVpk - 1; // always < 0
      let next = x - value / slope;
      if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
      const step = Math.abs(next - x);
      x = next;
      if (step < tol || hi - lo < tol) break;
    }
    last = x;
    return x;
  };
  const vaOf = (ia: number) => (drive - ia) * rPar;
  const vkOf = (ia: number) => (degenerate ? ia * d.rk : op.vk);
  const model = modelOf(d.tube);
  // What the grid sees looking back: the source and the grid leak in parallel (the leak alone carries no drop without a
  // source), or behind a volume control its wiper (the track below it against the track above and the source), then
  // the grid stopper in series.
  const rGrid = (d.rg === null ? d.rsource : wiperImpedance(d.rg, d.volume, d.rsource)) + d.rstopper;

  // The grid's quiescent current, through the leak alone (the coupling capacitor holds its drop).
  const quiescentIg = gridCurrent(model, op.vgk);

  /**
   * The grid swing the tube really gets, from the open-circuit one: less by
   * the grid current above its quiescent value times Rs ∥ Rg (more, on the
   * swing down, where the current falls below it), found by Illinois on that
   * excess x (the residual x − (Ig(grid) − Ig0) rises with x, so one root
   * between 0 and its open-circuit value).
   */
  const gridSwing = (vin: number): number => {
    if (rGrid === 0) return vin;
    // With the cathode held (bypassed, or no Rk) the open-circuit grid needs no plate solve.
    const open = gridCurrent(model, vgrid + vin - (degenerate ? vkOf(solveIa(vin)) : op.vk)) - quiescentIg;
    if (Math.abs(open) * rGrid < GRID_DROP_FLOOR) return vin;
    // The cathode's voltage at a trial grid current: held (no plate solve needed), or Ia·Rk with the plate solved there.
    const vkAt = (x: number) => (degenerate ? vkOf(solveIa(vin - rGrid * x)) : op.vk);
    const residual = (x: number) => x - (gridCurrent(model, vgrid + vin - rGrid * x - vkAt(x)) - quiescentIg);
    const x = illinois(residual, 0, open, GRID_DROP_FLOOR / rGrid, { fa: -open });
    return vin - rGrid * x;
  };

  return {
    at: (vin) => {
      const v = gridSwing(vin);
      const ia = solveIa(v);
      const va = vaOf(ia);
      const vk = vkOf(ia);
      const vgk = vgrid + v - vk;
      return { vin, vout: va - op.va, ia, vgk, vpk: va - vk, ig: rGrid > 0 ? quiescentIg + (vin - v) / rGrid : gridCurrent(model, vgk), gridDrop: vin - v };
    },
    outputs: (vins) => {
      const out = new Float64Array(vins.length);
      for (let k = 0; k < vins.length; k++) out[k] = vaOf(solveIa(gridSwing(vins[k]!))) - op.va;
      return out;
    },
  };
}
