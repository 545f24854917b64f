import { bracketedRoot } from '../numeric/bracketedRoot';
import { fail, type Result } from '../result';
import { checkNumber, LIMITS } from '../stage/checkInput';
import { verdictOf, type MeterReadout } from '../stage/meterReading';
import { dissipationFinding } from '../stage/ratingBands';
import { checkOutputTube } from './checkOutput';
import { emptyCurrents, stageCurrentsInto, type ScreenFeed } from './electrodes';
import type { OutputTube } from './outputTube';

/**
 * What a meter read on one output tube at idle, V to chassis. The cathode
 * is the drop across `rk`: the cathode resistor of a cathode-biased tube, or
 * the sense resistor of a fixed-bias one (SENSE_OHMS, 1 Ω: millivolts read
 * as milliamps). `screen` is null where the screen is tied to the plate
 * (triode-connected) or there is none (a power triode).
 */
export interface OutputMeterReading {
  readonly plate: number;
  readonly screen: number | null;
  readonly grid: number;
  readonly cathode: number;
  /** The resistor the cathode reading is taken across, Ω. */
  readonly rk: number;
}

/** Where the output tube sits, against the typical tube there; plate and screen split by the typical tube's own share. */
export interface OutputMeterReadout extends MeterReadout {
  /** The cathode current read (plate and screen), A; `ia` is the plate's share of it. */
  readonly ik: number;
  /** The typical tube's cathode current at the reading, A: what `ratio` is against (`typicalIa` is its plate's). */
  readonly typicalIk: number;
  readonly vg2k: number | null;
  /** The screen's share of the cathode current, A, and its dissipation against the rating (null without a separate screen). */
  readonly ig2: number | null;
  readonly pg2: number | null;
  readonly pg2Fraction: number | null;
}

/** The smallest resistor a cathode current is read across, Ω: a 0.1 Ω sense resistor and smaller are unusual (our bound), and below it the current would overflow. */
const MIN_SENSE_OHMS = 0.01;
/** Below this the typical tube is taken as cut off at the reading (10 µA, our threshold for a power tube). */
const CUT_OFF_AMPS = 1e-5;
/** How far either side of the measured vgk the grid shift is looked for, V (our bound). */
const SHIFT_SEARCH_VOLTS = 100;

/**
 * Reads an output tube's idle voltages: the cathode current from the drop
 * across its cathode (or sense) resistor by Ohm's law, the tube's own vpk,
 * vg2k and vgk, and what the model's typical tube passes there (plate and
 * screen, which a cathode resistor carries together). The plate's share of
 * the measured current is taken as the typical tube's share (a meter on the
 * cathode cannot tell them apart; measure the primary's drop for the plate's
 * alone): the typical tube's share where it passes the measured current,
 * which gives the plate's and screen's dissipation.
 */
export function readOutputMeter(tube: OutputTube, reading: OutputMeterReading): Result<OutputMeterReadout> {
  const problem =
    checkOutputTube(tube) ??
    (typeof reading !== 'object' || reading === null ? fail('invalid-input', 'Give the plate, grid and cathode readings.') : null) ??
    checkNumber('plate', 'The plate reading', reading.plate, 'V', -LIMITS.maxVolts, LIMITS.maxVolts) ??
    (reading.screen === null ? null : checkNumber('screen', 'The screen reading', reading.screen, 'V', -LIMITS.maxVolts, LIMITS.maxVolts)) ??
    checkNumber('grid', 'The grid reading', reading.grid, 'V', -LIMITS.maxVolts, LIMITS.maxVolts) ??
    checkNumber('cathode', 'The cathode reading', reading.cathode, 'V', -LIMITS.maxVolts, LIMITS.maxVolts) ??
    checkNumber('rk', 'The cathode resistor', reading.rk, 'Ω', MIN_SENSE_OHMS, LIMITS.maxOhms);
  if (problem) return problem;
  const { plate, screen, grid, cathode, rk } = reading;
  if (!(cathode > 0)) return fail('invalid-input', 'A cathode at 0 V or below passes no current through its resistor: check the meter’s leads and that the heater is lit.', 'cathode');
  if (!(plate > cathode)) return fail('invalid-input', 'The plate must read above the cathode: check the meter’s leads and the output transformer’s primary.', 'plate');
  const separateScreen = tube.law.kind === 'pentode' && screen !== null;
  if (separateScreen && !(screen > cathode)) return fail('invalid-input', 'The screen must read above the cathode: check the meter’s leads and the screen’s resistor.', 'screen');
  const ik = cathode / rk;
  const vpk = plate - cathode;
  const vgk = grid - cathode;
  const vg2k = separateScreen ? screen - cathode : null;
  const feed: ScreenFeed = vg2k === null ? { kind: 'tied' } : { kind: 'fixed', vg2k };
  const at = emptyCurrents();
  const cathodeCurrent = (vg: number) => {
    stageCurrentsInto(tube, feed, vpk, vg, at);
    return Number.isFinite(at.ik) ? at.ik : 0;
  };
  const typicalIk = cathodeCurrent(vgk);
  if (!(typicalIk > CUT_OFF_AMPS)) {
    return fail('cutoff', `The model's ${tube.id} is cut off at these voltages (the grid ${Math.abs(vgk).toFixed(1)} V below the cathode): check the grid's voltage and the readings.`, 'grid');
  }
  const typicalIa = vg2k === null ? at.ik : at.ia;
  const shift = bracketedRoot((vg) => cathodeCurrent(vg) - ik, vgk - SHIFT_SEARCH_VOLTS, vgk + SHIFT_SEARCH_VOLTS, 1e-4);
  // The plate's share as the typical tube splits the same cathode current (at its shifted grid): a weak or strong
  // tube's screen takes the share its current does, not the typical tube's at the measured grid (where Koren's
  // screen law may have run out).
  if (shift.converged) cathodeCurrent(shift.x);
  else cathodeCurrent(vgk);
  const plateShare = vg2k === null || !(at.ik > 0) ? 1 : at.ia / at.ik;
  const ratio = ik / typicalIk;
  const ia = ik * plateShare;
  const ig2 = vg2k === null ? null : ik - ia;
  const pa = vpk * ia;
  const pg2 = ig2 === null || vg2k === null ? null : vg2k * ig2;
  const screenRating = tube.ratings.maxScreenDissipation;
  return {
    ok: true,
    ia,
    ik,
    vpk,
    vgk,
    vg2k,
    typicalIa,
    typicalIk,
    ratio,
    gridShift: shift.converged ? vgk - shift.x : null,
    pa,
    paFraction: pa / tube.ratings.maxPlateDissipation,
    ig2,
    pg2,
    pg2Fraction: pg2 === null || !(screenRating !== null && screenRating > 0) ? null : pg2 / screenRating,
    verdict: verdictOf(ratio),
    findings: [
      dissipationFinding('plate-dissipation', 'Plate', pa, tube.ratings.maxPlateDissipation, ' as read'),
      ...(pg2 !== null && screenRating !== null && screenRating > 0 ? [dissipationFinding('screen-dissipation', 'Screen', pg2, screenRating, ' as read')] : []),
    ],
  };
}
