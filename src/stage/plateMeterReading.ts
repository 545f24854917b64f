import { fail, type Result } from '../result';
import { checkNumber, LIMITS } from './checkInput';
import { checkReadTube, readoutAt, type MeterReadout } from './meterReading';
import type { TubeRecord } from '../tube/types';

/** What a meter read on a triode whose current is taken from its plate resistor: the supply at the resistor's top, the plate and the cathode, V to chassis. */
export interface PlateMeterReading {
  readonly supply: number;
  readonly plate: number;
  readonly cathode: number;
}

/** The stage the reading was taken on: its tube, its plate resistor and where its grid sits. */
export interface PlateReadStage {
  readonly tube: TubeRecord;
  /** Plate resistor, from the supply to the plate, Ω. */
  readonly ra: number;
  /** The grid's DC voltage to chassis as designed (a fixed bias below 0), V. */
  readonly grid: number;
}

/**
 * Reads a triode from its plate side, for a stage with no cathode resistor
 * to read across (a fixed-bias gain stage) or whose cathode is shared (a
 * long-tailed pair): the plate current is the drop across Ra (Ohm's law),
 * from the supply read at its top to the plate. The rest is read as
 * `readMeter` reads it.
 */
export function readPlateMeter(stage: PlateReadStage, reading: PlateMeterReading): Result<MeterReadout> {
  const problem =
    (typeof stage !== 'object' || stage === null ? fail('invalid-input', 'Give the stage the reading was taken on.') : null) ??
    (typeof reading !== 'object' || reading === null ? fail('invalid-input', 'Give the supply, plate and cathode readings.') : null) ??
    checkReadTube(stage.tube) ??
    checkNumber('ra', 'Ra', stage.ra, 'Ω', LIMITS.minOhms, LIMITS.maxOhms) ??
    checkNumber('grid', 'The grid voltage', stage.grid, 'V', -LIMITS.maxVolts, LIMITS.maxVolts) ??
    checkNumber('supply', 'The supply reading', reading.supply, 'V', -LIMITS.maxVolts, LIMITS.maxVolts) ??
    checkNumber('plate', 'The plate reading', reading.plate, 'V', -LIMITS.maxVolts, LIMITS.maxVolts) ??
    checkNumber('cathode', 'The cathode reading', reading.cathode, 'V', -LIMITS.maxVolts, LIMITS.maxVolts);
  if (problem) return problem;
  return plateSideReadout(stage, reading.supply, reading.plate, reading.cathode, 'plate');
}

/** One triode read from its plate side, its inputs checked; `plateField` names its plate's box. */
export function plateSideReadout(stage: PlateReadStage, supply: number, plate: number, cathode: number, plateField: string): Result<MeterReadout> {
  if (!(cathode >= 0)) return fail('invalid-input', 'A cathode below 0 V: check the meter’s leads (its common on the chassis).', 'cathode');
  if (!(supply > plate)) return fail('invalid-input', 'The supply must read above the plate, or Ra carries no current: check the meter’s leads and that the heater is lit.', plateField === 'plate' ? 'supply' : plateField);
  if (!(plate > cathode)) return fail('invalid-input', 'The plate must read above the cathode: check the meter’s leads and the plate resistor.', plateField);
  return readoutAt(stage.tube, plate - cathode, stage.grid - cathode, (supply - plate) / stage.ra, plateField);
}
