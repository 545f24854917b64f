import type { TubeLike } from '../tube/types';
import { fail, type Result } from '../result';
import { volumeProblem } from './volumeControl';
import { checkNumber, checkTube, LIMITS } from './checkInput';

/** A common-cathode triode stage. SI units throughout. */
export interface StageDesign {
  readonly tube: TubeLike;
  /** Supply voltage at the top of the plate resistor, V (> 0). */
  readonly bplus: number;
  /** Plate resistor, Ω (> 0). */
  readonly ra: number;
  /** Cathode resistor, Ω (≥ 0; 0 with fixed bias). */
  readonly rk: number;
  /** Is Rk bypassed by a large capacitor? Default true. */
  readonly bypassed?: boolean;
  /** Next stage's load seen through the coupling capacitor, Ω; Infinity (the default) when none. */
  readonly rl?: number;
  /** Fixed grid bias to ground, V; default 0 (cathode bias only). */
  readonly vbias?: number;
  /** Grid-leak (grid-circuit) resistor, Ω, checked against the datasheet maximum when given. */
  readonly rg?: number;
  /** DC potential of the heater to ground, V; default 0 (heater winding grounded). */
  readonly heaterVolts?: number;
  /** Source impedance driving the stage, Ω (e.g. a level control's output impedance); default 0. */
  readonly rsource?: number;
  /** Input coupling capacitor, F; absent means direct coupling. */
  readonly cin?: number;
  /**
   * Grid stopper, Ω: in series with the grid, after the grid leak (at the
   * socket); default 0, none. It carries no DC below grid current, so it
   * moves no operating point; with the grid's Miller capacitance it rolls
   * off the top of the band.
   */
  readonly rstopper?: number;
  /**
   * A volume control in place of the grid leak: `rg` is its track, and the
   * grid (behind its stopper) hangs from the wiper, which passes this share
   * of the track's signal, above 0 up to 1 (full). Absent: Rg is a fixed
   * resistor. The grid's DC path is then the track below the wiper.
   */
  readonly volume?: number;
  /** Cathode bypass capacitor, F. When given it replaces the ideal `bypassed` in the frequency response; at midband the cathode counts as bypassed. */
  readonly ck?: number;
  /** Output coupling capacitor into RL, F; absent means an ideal (infinite) one. */
  readonly cout?: number;
}

export interface CheckedStage {
  readonly tube: TubeLike;
  readonly bplus: number;
  readonly ra: number;
  readonly rk: number;
  readonly bypassed: boolean;
  readonly rl: number;
  readonly vbias: number;
  readonly rg: number | null;
  readonly heaterVolts: number;
  readonly rsource: number;
  readonly cin: number | null;
  readonly rstopper: number;
  /** The wiper's share of the track (1: none, or a pot at full); `volumeGiven` says whether Rg is a pot at all. */
  readonly volume: number;
  readonly volumeGiven: boolean;
  readonly ck: number | null;
  readonly cout: number | null;
}

/** An Rk below this is a short to ground, Ω. */
export const RK_WIRE_OHMS = 1e-6;

export const STAGE_DEFAULTS = { bypassed: true, rl: Infinity, vbias: 0, heaterVolts: 0 } as const;

/** Validates a stage design once, at the edge; the solvers then compute on checked input. */
export function normalizeStage(raw: StageDesign): Result<CheckedStage> {
  if (typeof raw !== 'object' || raw === null) return fail('invalid-input', 'No design given');
  const tubeProblem = checkTube(raw.tube);
  if (tubeProblem) return tubeProblem;
  if (typeof raw.bplus === 'number' && Number.isFinite(raw.bplus) && raw.bplus <= 0) {
    return fail('supply-too-low', `B+ must be above 0 V (got ${raw.bplus} V)`, 'bplus');
  }
  const problem =
    checkNumber('bplus', 'B+', raw.bplus, 'V', 0, LIMITS.maxVolts, { minExclusive: true }) ??
    checkNumber('ra', 'Ra', raw.ra, 'Ω', LIMITS.minOhms, LIMITS.maxOhms) ??
    checkNumber('rk', 'Rk', raw.rk, 'Ω', 0, LIMITS.maxOhms) ??
    (raw.rl === undefined ? null : checkNumber('rl', 'RL', raw.rl, 'Ω', LIMITS.minOhms, LIMITS.maxOhms, { allowInfinity: true })) ??
    (raw.vbias === undefined ? null : checkNumber('vbias', 'Grid bias', raw.vbias, 'V', -LIMITS.maxBiasVolts, LIMITS.maxBiasVolts)) ??
    (raw.rg === undefined ? null : checkNumber('rg', 'Rg', raw.rg, 'Ω', LIMITS.minOhms, LIMITS.maxOhms)) ??
    (raw.heaterVolts === undefined ? null : checkNumber('heaterVolts', 'Heater potential', raw.heaterVolts, 'V', -LIMITS.maxVolts, LIMITS.maxVolts)) ??
    (raw.rsource === undefined || raw.rsource === 0 ? null : checkNumber('rsource', 'Source impedance (0 for an ideal source)', raw.rsource, 'Ω', LIMITS.minOhms, LIMITS.maxOhms)) ??
    (raw.cin === undefined ? null : checkNumber('cin', 'Cin', raw.cin, 'F', LIMITS.minFarads, LIMITS.maxFarads)) ??
    (raw.rstopper === undefined ? null : checkNumber('rstopper', 'Grid stopper (0 for none)', raw.rstopper, 'Ω', 0, LIMITS.maxOhms)) ??
    volumeProblem(raw.volume, raw.rg !== undefined) ??
    (raw.ck === undefined ? null : checkNumber('ck', 'Ck', raw.ck, 'F', LIMITS.minFarads, LIMITS.maxFarads)) ??
    (raw.cout === undefined ? null : checkNumber('cout', 'Cout', raw.cout, 'F', LIMITS.minFarads, LIMITS.maxFarads));
  if (problem) return problem;
  if (raw.bypassed !== undefined && typeof raw.bypassed !== 'boolean') return fail('invalid-input', 'Bypass must be on or off', 'bypassed');
  return {
    ok: true,
    tube: raw.tube,
    bplus: raw.bplus,
    ra: raw.ra,
    // Under a micro-ohm Rk is a wire: taken as 0, so a denormal never becomes an infinite conductance.
    rk: raw.rk < RK_WIRE_OHMS ? 0 : raw.rk,
    // A real bypass capacitor means the cathode is bypassed at midband; its corner shows in the response.
    bypassed: raw.ck !== undefined ? true : (raw.bypassed ?? STAGE_DEFAULTS.bypassed),
    rl: raw.rl ?? STAGE_DEFAULTS.rl,
    vbias: raw.vbias ?? STAGE_DEFAULTS.vbias,
    rg: raw.rg ?? null,
    heaterVolts: raw.heaterVolts ?? STAGE_DEFAULTS.heaterVolts,
    rsource: raw.rsource ?? 0,
    cin: raw.cin ?? null,
    rstopper: raw.rstopper ?? 0,
    volume: raw.volume ?? 1,
    volumeGiven: raw.volume !== undefined,
    ck: raw.ck ?? null,
    cout: raw.cout ?? null,
  };
}
