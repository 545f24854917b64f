import { fail, type Result } from '../result';
import { checkNumber, LIMITS } from '../stage/checkInput';
import { checkReadTube, type MeterReadout } from '../stage/meterReading';
import { plateSideReadout } from '../stage/plateMeterReading';
import type { TubeRecord } from '../tube/types';
import type { Finding } from '../stage/findings';
import { byTriode } from './longTailedPair';

/** What a meter read on a long-tailed pair at idle, V to chassis: the supply at the plate resistors' top, each plate, and the joined cathodes. */
export interface PairMeterReading {
  readonly supply: number;
  readonly plate: number;
  readonly plate2: number;
  readonly cathode: number;
}

/** The pair as built: one tube type, each plate's resistor, the shared Rk over the tail resistor to chassis, and the grids' DC. */
export interface PairReadStage {
  readonly tube: TubeRecord;
  readonly ra: number;
  readonly ra2: number;
  readonly rk: number;
  readonly rtail: number;
  readonly grid: number;
}

export interface PairMeterReadout {
  /** Each triode read from its plate side (its plate resistor's drop), against the typical tube there. */
  readonly tubes: readonly [MeterReadout, MeterReadout];
  /** The two plate currents' sum, A, and the tail's current by Ohm's law across Rk and the tail, A. */
  readonly plateSum: number;
  readonly tailCurrent: number;
  /** Whether the two agree within TAIL_AGREEMENT: if not, a resistor is off its value, a grid draws current or a lead slipped. */
  readonly tailAgrees: boolean;
  /** Both triodes' dissipation checks as read, each named by its triode (two alike are still two tubes: both named). */
  readonly findings: readonly Finding[];
}

/**
 * How far the plates' sum and the tail's current may differ and still agree,
 * as a fraction: three resistors at 5 % and the meter's own error (our threshold).
 */
export const TAIL_AGREEMENT = 0.1;

/**
 * Reads a long-tailed pair: its shared cathode cannot tell the tubes apart,
 * so each tube's current is its plate resistor's drop (Ohm's law), and the
 * tail's drop is a check on their sum. Each tube is read against the
 * model's typical tube at its own vpk and the pair's vgk.
 */
export function readPairMeter(stage: PairReadStage, reading: PairMeterReading): Result<PairMeterReadout> {
  const problem =
    (typeof stage !== 'object' || stage === null ? fail('invalid-input', 'Give the pair the reading was taken on.') : null) ??
    (typeof reading !== 'object' || reading === null ? fail('invalid-input', 'Give the supply, both plates’ and the cathodes’ readings.') : null) ??
    checkReadTube(stage.tube) ??
    checkNumber('ra', 'Ra', stage.ra, 'Ω', LIMITS.minOhms, LIMITS.maxOhms) ??
    checkNumber('ra2', 'Ra (second plate)', stage.ra2, 'Ω', LIMITS.minOhms, LIMITS.maxOhms) ??
    checkNumber('rk', 'Rk', stage.rk, 'Ω', 0, LIMITS.maxOhms) ??
    checkNumber('rtail', 'Tail resistor', stage.rtail, 'Ω', LIMITS.minOhms, LIMITS.maxOhms) ??
    checkNumber('grid', 'The grid voltage', stage.grid, 'V', -LIMITS.maxVolts, LIMITS.maxVolts) ??
    checkNumber('supply', 'The supply reading', reading.supply, 'V', -LIMITS.maxVolts, LIMITS.maxVolts) ??
    checkNumber('plate', 'The first plate’s reading', reading.plate, 'V', -LIMITS.maxVolts, LIMITS.maxVolts) ??
    checkNumber('plate2', 'The second plate’s reading', reading.plate2, 'V', -LIMITS.maxVolts, LIMITS.maxVolts) ??
    checkNumber('cathode', 'The cathodes’ reading', reading.cathode, 'V', -LIMITS.maxVolts, LIMITS.maxVolts);
  if (problem) return problem;
  if (!(reading.cathode > 0)) return fail('invalid-input', 'Cathodes at 0 V or below pass no current through the tail: check the meter’s leads and that the heater is lit.', 'cathode');
  const first = plateSideReadout({ tube: stage.tube, ra: stage.ra, grid: stage.grid }, reading.supply, reading.plate, reading.cathode, 'plate');
  if (!first.ok) return first;
  const second = plateSideReadout({ tube: stage.tube, ra: stage.ra2, grid: stage.grid }, reading.supply, reading.plate2, reading.cathode, 'plate2');
  if (!second.ok) return second;
  const plateSum = first.ia + second.ia;
  const tailCurrent = reading.cathode / (stage.rk + stage.rtail);
  const tailAgrees = Math.abs(plateSum - tailCurrent) <= TAIL_AGREEMENT * tailCurrent;
  return { ok: true, tubes: [first, second], plateSum, tailCurrent, tailAgrees, findings: [...first.findings.map((f) => byTriode(f, 'First')), ...second.findings.map((f) => byTriode(f, 'Second'))] };
}
