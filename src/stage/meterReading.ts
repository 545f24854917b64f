import { TUBE_CURRENT_SPREAD } from '../build/partsList';
import { bracketedRoot } from '../numeric/bracketedRoot';
import { fail, type Failure, type Result } from '../result';
import { checkNumber, checkTube, LIMITS } from './checkInput';
import { plateCurrent } from '../tube/triode';
import type { TubeRecord } from '../tube/types';
import { dissipationFinding, type Finding } from './ratingBands';

/** What a builder's meter read from chassis to a triode stage's plate and cathode at idle, V. */
export interface MeterReading {
  readonly plate: number;
  readonly cathode: number;
}

/** The stage the reading was taken on: its tube, its cathode resistor (to chassis) and where its grid sits. */
export interface ReadStage {
  readonly tube: TubeRecord;
  /** Cathode resistor to chassis, Ω. */
  readonly rk: number;
  /** The grid's DC voltage to chassis as designed (0 for a grid leak to chassis), V. */
  readonly grid: number;
}

/** Where the tube really sits, and how it compares with the model's typical tube there. */
export interface MeterReadout {
  /** Cathode current by Ohm's law across Rk, A: the plate current while the grid draws none. */
  readonly ia: number;
  readonly vpk: number;
  readonly vgk: number;
  /** The model's typical tube's plate current at the same vpk and vgk, A. */
  readonly typicalIa: number;
  /** ia / typicalIa. */
  readonly ratio: number;
  /**
   * The grid voltage the typical tube would need, at the same vpk, to pass the measured current, less
   * the measured vgk, V: positive for a weak tube (it passes as if biased this much colder). Null when
   * the typical tube cannot pass that current within 50 V either side.
   */
  readonly gridShift: number | null;
  /** Plate dissipation at the reading, W, and as a fraction of the rating. */
  readonly pa: number;
  readonly paFraction: number;
  /**
   * Against the production spread the parts list allows (TUBE_CURRENT_SPREAD, ±20 %, common practice):
   * within it, under it (a weak or tired tube, or a Rk off its value), or over it.
   */
  readonly verdict: 'within-spread' | 'low' | 'high';
  /** The dissipation as read against its rating, banded as the design's own checks are (a note within it, a warning near or at it, a danger past it). */
  readonly findings: readonly Finding[];
}

/** Below this the model's tube is taken as cut off at the reading (1 µA, our threshold). */
const CUT_OFF_AMPS = 1e-6;
/** How far either side of the measured vgk the grid shift is looked for, V (our bound). */
const SHIFT_SEARCH_VOLTS = 50;

/**
 * Reads a triode stage's idle voltages the way a technician does: the
 * cathode current from the drop across Rk (Ohm's law), the tube's own vpk and
 * vgk from the plate, cathode and grid, and the current the model's typical
 * tube passes there, so a weak or strong tube shows as a ratio and as the
 * grid voltage the typical tube would need (its bias shift).
 */
export function readMeter(stage: ReadStage, reading: MeterReading): Result<MeterReadout> {
  const problem =
    (typeof stage !== 'object' || stage === null ? fail('invalid-input', 'Give the stage the reading was taken on.') : null) ??
    (typeof reading !== 'object' || reading === null ? fail('invalid-input', 'Give the plate and cathode readings.') : null) ??
    checkReadTube(stage.tube) ??
    checkNumber('rk', 'Rk', stage.rk, 'Ω', LIMITS.minOhms, LIMITS.maxOhms) ??
    checkNumber('grid', 'The grid voltage', stage.grid, 'V', -LIMITS.maxVolts, LIMITS.maxVolts) ??
    checkNumber('plate', 'The plate reading', reading.plate, 'V', -LIMITS.maxVolts, LIMITS.maxVolts) ??
    checkNumber('cathode', 'The cathode reading', reading.cathode, 'V', -LIMITS.maxVolts, LIMITS.maxVolts);
  if (problem) return problem;
  const { plate, cathode } = reading;
  if (!(cathode > 0)) return fail('invalid-input', 'A cathode at 0 V or below passes no current through Rk: check the meter’s leads and that the heater is lit.', 'cathode');
  if (!(plate > cathode)) return fail('invalid-input', 'The plate must read above the cathode: check the meter’s leads and the plate resistor.', 'plate');
  return readoutAt(stage.tube, plate - cathode, stage.grid - cathode, cathode / stage.rk, 'cathode');
}

/** A checked tube record: the reading needs its plate rating. */
export function checkReadTube(tube: unknown): Failure | null {
  return checkTube(tube) ?? ((tube as { kind?: unknown }).kind !== 'tube' ? fail('invalid-tube', 'The reading needs a tube record, for its plate rating.', 'tube') : null);
}

/**
 * Where a tube passing `ia` at `vpk` and `vgk` sits against the model's
 * typical tube there: the ratio, the grid shift, the verdict on the spread
 * and the plate dissipation. `field` names the box a cut-off is blamed on.
 * The tube must be checked, and the voltages finite.
 */
export function readoutAt(tube: TubeRecord, vpk: number, vgk: number, ia: number, field: string): Result<MeterReadout> {
  const typicalIa = plateCurrent(tube, vpk, vgk);
  if (!(typicalIa > CUT_OFF_AMPS)) {
    return fail('cutoff', `The model's ${tube.id} is cut off at these voltages (the grid ${Math.abs(vgk).toFixed(1)} V below the cathode): check the grid's voltage and the readings.`, field);
  }
  const shift = bracketedRoot((vg) => plateCurrent(tube, vpk, vg) - ia, vgk - SHIFT_SEARCH_VOLTS, vgk + SHIFT_SEARCH_VOLTS, 1e-4);
  const ratio = ia / typicalIa;
  const pa = vpk * ia;
  return {
    ok: true,
    ia,
    vpk,
    vgk,
    typicalIa,
    ratio,
    gridShift: shift.converged ? vgk - shift.x : null,
    pa,
    paFraction: pa / tube.ratings.maxPlateDissipation,
    verdict: verdictOf(ratio),
    findings: [dissipationFinding('plate-dissipation', 'Plate', pa, tube.ratings.maxPlateDissipation, ' as read')],
  };
}

/** A measured current against the typical tube's, as a verdict on the production spread (TUBE_CURRENT_SPREAD, common practice). */
export function verdictOf(ratio: number): MeterReadout['verdict'] {
  return ratio < 1 - TUBE_CURRENT_SPREAD ? 'low' : ratio > 1 + TUBE_CURRENT_SPREAD ? 'high' : 'within-spread';
}
