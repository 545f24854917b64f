import { stopperFinding } from './stopperFinding';
import { trackLoad, volumeFinding } from './volumeControl';
import { GRID_CURRENT_ONSET, gridCurrent, gridSlope, MIN_GRID_CONDUCTANCE } from '../tube/gridCurrent';
import { CUTOFF_FRACTION, gridVoltageForCurrent } from '../tube/koren';
import { smallSignalAt } from '../tube/triode';
import { modelOf, recordOf } from '../tube/types';
import { fail, type Result } from '../result';
import { ratingsFindings, type Finding } from './findings';
import { commonCathodeGain, commonCathodeZout, cathodeFollowing, millerInputCapacitance } from './gainFormulas';
import { solveLoop, type LoopPoint } from './operatingPoint';
import { parallel } from './parallel';
import { normalizeStage, type StageDesign } from './stageDesign';

/** Below this plate current a stage is called cut off: it has no useful gain (this project's threshold). */
export const CUTOFF_CURRENT_A = 1e-6;

/** The DC operating point: plate and cathode to ground, Ia, Vgk, Vpk and plate dissipation (SI units). */
export type OperatingPoint = Omit<LoopPoint, 'converged'>;

export interface StageSolution {
  readonly op: OperatingPoint;
  readonly mu: number;
  /** Plate resistance, Ω. */
  readonly rp: number;
  /** Transconductance, S. */
  readonly gm: number;
  /** Voltage gain into RL, signed (negative: the plate inverts). */
  readonly gain: number;
  /** The gain with Rk bypassed and unbypassed, whichever the design uses, for comparison. */
  readonly gainBypassed: number;
  readonly gainUnbypassed: number;
  /**
   * Input resistance at midband, Ω: the grid leak in parallel with the grid
   * current's slope at the bias, as far as the cathode does not follow (a
   * high-mu stage near −1 V presents a few hundred kilohms whatever its
   * leak); null with no leak given and no slope to speak of.
   */
  readonly rin: number | null;
  /** Output impedance at the plate, Ω (RL excluded). */
  readonly zout: number;
  /** Input capacitance with the Miller effect, F (0 for a bare model with no capacitances). */
  readonly cin: number;
  /** Grid swing from the operating point to the onset of grid current (GRID_CURRENT_ONSET, about −0.7 V grid to cathode), V; 0 past it. */
  readonly toGridCurrent: number;
  /** Grid swing from the operating point down to where, at the same Vpk, the current falls to 1 % of its operating value, V. */
  readonly toCutoff: number;
  readonly findings: readonly Finding[];
}

/**
 * Solves a common-cathode triode stage: the DC operating point (cathode bias
 * through Rk, optionally with a fixed grid bias), the small-signal figures
 * there, and the ratings findings. Never throws; answers a typed failure when
 * the design is invalid, cut off or would run the grid positive.
 */
export function solveStage(design: StageDesign): Result<StageSolution> {
  const d = normalizeStage(design);
  if (!d.ok) return d;
  const model = modelOf(d.tube);
  // Behind a volume control the grid's DC path is the track below the wiper (the coupling capacitor blocks the rest).
  const loop = solveLoop(model, d.bplus, d.ra, d.rk, d.vbias, d.rg === null ? null : d.rg * d.volume);
  if (!loop.converged) return fail('no-convergence', 'The operating point could not be found to full accuracy; check the values.');
  if (loop.vgk > 0) {
    return fail('grid-current', `The grid would sit ${loop.vgk.toFixed(2)} V positive to the cathode and draw current: make the grid bias more negative or raise Rk.`, 'vbias');
  }
  if (loop.ia < CUTOFF_CURRENT_A) {
    return fail('cutoff', `The tube is cut off: plate current below ${CUTOFF_CURRENT_A * 1e6} µA. Lower Rk, make the grid bias less negative, or raise B+.`, d.rk > 0 ? 'rk' : 'vbias');
  }
  const ss = smallSignalAt(model, loop.vpk, loop.vgk);
  const rLoad = parallel(d.ra, d.rl);
  const gainBypassed = commonCathodeGain(ss.mu, ss.rp, rLoad, d.rk, true);
  const gainUnbypassed = commonCathodeGain(ss.mu, ss.rp, rLoad, d.rk, false);
  const gain = d.bypassed ? gainBypassed : gainUnbypassed;
  const caps = recordOf(d.tube)?.capacitances;
  const cathodeGain = d.bypassed ? 0 : cathodeFollowing(ss.mu, ss.rp, rLoad, d.rk);
  const cin = caps ? millerInputCapacitance(caps.cgk, caps.cgp, gain, cathodeGain) : 0;
  const op: OperatingPoint = { va: loop.va, vk: loop.vk, ia: loop.ia, vgk: loop.vgk, vpk: loop.vpk, pa: loop.pa };
  return {
    ok: true,
    op,
    mu: ss.mu,
    rp: ss.rp,
    gm: ss.gm,
    gain,
    gainBypassed,
    gainUnbypassed,
    zout: commonCathodeZout(ss.mu, ss.rp, d.ra, d.rk, d.bypassed),
    rin: inputResistance(d.rg, gridSlope((v) => gridCurrent(model, v), loop.vgk) * (1 - cathodeGain), d.rstopper, d.volume),
    cin,
    toGridCurrent: Math.max(0, GRID_CURRENT_ONSET - loop.vgk),
    toCutoff: loop.vgk - gridVoltageForCurrent(model.params, loop.vpk, CUTOFF_FRACTION * loop.ia),
    findings: [
      ...ratingsFindings({ tube: d.tube, bplus: d.bplus, ...op, heaterVolts: d.heaterVolts, rg: d.rg, fixedBias: d.vbias !== 0 }),
      ...[stopperFinding(d.rstopper, cin), d.rg !== null && d.volumeGiven ? volumeFinding(d.rg, d.volume, d.rstopper, cin) : null].filter((f) => f !== null),
    ],
  };
}

/**
 * A leak (null: none) in parallel with a grid's conductance fed through the
 * grid stopper, Ω; null for neither. Behind a volume control the grid hangs
 * from the wiper: the track above it in series with the track below it in
 * parallel with the grid.
 */
function inputResistance(rg: number | null, gGrid: number, stopper: number, volume: number): number | null {
  // The grid's slope behind its stopper: 1/(1/g + Rst).
  const g = gGrid / (1 + stopper * gGrid);
  if (!(g > MIN_GRID_CONDUCTANCE)) return rg;
  return rg !== null ? trackLoad(rg, volume, 1 / g) : 1 / g;
}
