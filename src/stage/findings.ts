import type { TubeLike } from '../tube/types';
import { recordOf } from '../tube/types';
import { GRID_CURRENT_ONSET } from '../tube/gridCurrent';
import { bySeverity, dissipationFinding, finding, heaterCathodeFinding, heaterCathodeRating, type Finding, type FindingKind, type Severity } from './ratingBands';

export { DISSIPATION_WARN_FRACTION, HEATER_CATHODE_WARN_FRACTION, type Finding, type FindingKind, type Severity } from './ratingBands';

export interface FindingInput {
  readonly tube: TubeLike;
  readonly bplus: number;
  readonly va: number;
  readonly vk: number;
  readonly vpk: number;
  readonly ia: number;
  readonly vgk: number;
  readonly pa: number;
  readonly heaterVolts: number;
  /** Grid-circuit resistance, Ω, when known. */
  readonly rg: number | null;
  /** True when the grid is fixed-biased (a bias supply rather than Rk alone sets Vgk). */
  readonly fixedBias: boolean;
}

/**
 * A grid within this many volts of its cathode has no bias to speak of: with
 * Rk = 0 and no fixed bias the solver puts it at 0 V exactly.
 */
export const NO_BIAS_VOLTS = 1e-3;

const v1 = (x: number) => x.toFixed(Math.abs(x) < 10 ? 1 : 0);

/**
 * Ratings findings, most severe first. A bare model (no record) has no
 * ratings, so only the grid-current check applies.
 */
export function ratingsFindings(x: FindingInput): Finding[] {
  const out: Finding[] = [];
  const push = (kind: FindingKind, severity: Severity, message: string, value: number, limit: number) => out.push(finding(kind, severity, message, value, limit));

  if (x.vgk > 0) {
    push('grid-current', 'danger', `The grid is ${v1(x.vgk)} V positive to the cathode and draws current: the stage will distort and load its driver.`, x.vgk, 0);
  } else if (x.vgk > -NO_BIAS_VOLTS && !x.fixedBias) {
    push('no-grid-bias', 'warning', 'No grid bias: the grid sits at the cathode\'s voltage and draws current on every positive half-cycle, so the stage distorts at any level. Give it a cathode resistor or a fixed bias.', x.vgk, 0);
  } else if (x.vgk >= GRID_CURRENT_ONSET) {
    push('grid-current-onset', 'warning', `The grid sits only ${Math.abs(x.vgk).toFixed(2)} V below its cathode, past the onset of grid current (about ${Math.abs(GRID_CURRENT_ONSET)} V): it draws current at rest and has no clean swing, so any source impedance distorts the signal. Bias it further negative.`, x.vgk, GRID_CURRENT_ONSET);
  }
  const rec = recordOf(x.tube);
  if (rec) {
    const r = rec.ratings;
    out.push(dissipationFinding('plate-dissipation', 'Plate', x.pa, r.maxPlateDissipation));

    if (x.vpk > r.maxPlateVoltage) {
      push('plate-voltage', 'danger', `Plate voltage ${v1(x.vpk)} V exceeds the ${r.maxPlateVoltage} V rating.`, x.vpk, r.maxPlateVoltage);
    } else if (x.bplus > r.maxPlateVoltage) {
      // A cold tube draws no current, so at switch-on the plate sees all of B+ (common practice).
      // The record holds the working rating; many sheets rate a cold plate higher (Va0, from memory), which it does not hold.
      push('cold-plate-voltage', 'warning', `At switch-on, before the heater warms, the plate sees the full B+ of ${v1(x.bplus)} V, above the ${r.maxPlateVoltage} V rating for a working tube. Many data sheets rate a cold plate higher (Va0): check the sheet, or bring B+ up after the heaters (a rectifier tube or a slow start, common practice).`, x.bplus, r.maxPlateVoltage);
    }

    const hk = rec.directlyHeated ? null : heaterCathodeRating(r);
    if (hk) out.push(heaterCathodeFinding(x.vk - x.heaterVolts, hk));

    if (r.maxCathodeCurrent !== undefined && x.ia > r.maxCathodeCurrent) {
      push('cathode-current', 'danger', `Cathode current ${(x.ia * 1e3).toFixed(1)} mA exceeds the ${(r.maxCathodeCurrent * 1e3).toFixed(0)} mA rating.`, x.ia, r.maxCathodeCurrent);
    }

    const rgMax = x.fixedBias ? r.maxGridResistanceFixedBias : r.maxGridResistanceCathodeBias;
    if (x.rg !== null && rgMax !== undefined && x.rg > rgMax) {
      push('grid-resistor', 'warning', `Grid resistor ${(x.rg / 1e3).toFixed(0)} kΩ is above the ${(rgMax / 1e3).toFixed(0)} kΩ the datasheet allows with ${x.fixedBias ? 'fixed' : 'cathode'} bias: risk of thermal runaway from grid current.`, x.rg, rgMax);
    }
  }
  return bySeverity(out);
}
