import type { TubeLike } from '../tube/types';
import { recordOf } from '../tube/types';

export type Severity = 'danger' | 'warning' | 'note';

export type FindingKind =
  | 'plate-dissipation'
  | 'plate-voltage'
  | 'cold-plate-voltage'
  | 'heater-cathode'
  | 'grid-current'
  | 'grid-resistor'
  | 'cathode-current'
  | 'screen-dissipation'
  | 'screen-voltage'
  | 'plate-swing';

/** One check of the design against the tube's ratings, worded to be shown as is. */
export interface Finding {
  readonly kind: FindingKind;
  readonly severity: Severity;
  readonly message: string;
  /** The value checked and its limit, in SI units; percent = 100·value/limit. */
  readonly value: number;
  readonly limit: number;
  readonly percent: number;
}

/**
 * Above this share of the rated dissipation a design gets a warning. Designers
 * keep a margin for mains swings and tube spread (common practice; no source).
 */
export const DISSIPATION_WARN_FRACTION = 0.85;

const SEVERITY_ORDER: Record<Severity, number> = { danger: 0, warning: 1, note: 2 };

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

const v1 = (x: number) => x.toFixed(Math.abs(x) < 10 ? 1 : 0);

/**
 * Ratings findings, most severe first. A bare model (no record) has no
 * ratings, so only the grid-current check applies.
 */
export function ratingsFindings(x: FindingInput): Finding[] {
  const out: Finding[] = [];
  const push = (kind: FindingKind, severity: Severity, message: string, value: number, limit: number) =>
    out.push({ kind, severity, message, value, limit, percent: limit > 0 ? (100 * value) / limit : Infinity });

  if (x.vgk > 0) {
    push('grid-current', 'danger', `The grid is ${v1(x.vgk)} V positive to the cathode and draws current: the stage will distort and load its driver.`, x.vgk, 0);
  }
  const rec = recordOf(x.tube);
  if (rec) {
    const r = rec.ratings;
    const share = x.pa / r.maxPlateDissipation;
    const paText = `Plate dissipation ${x.pa.toFixed(2)} W is ${Math.round(share * 100)} % of the ${r.maxPlateDissipation} W rating`;
    if (share > 1) push('plate-dissipation', 'danger', `${paText}: the plate will overheat.`, x.pa, r.maxPlateDissipation);
    else if (share > DISSIPATION_WARN_FRACTION) push('plate-dissipation', 'warning', `${paText}: little margin for mains swings and tube spread.`, x.pa, r.maxPlateDissipation);
    else push('plate-dissipation', 'note', `${paText}.`, x.pa, r.maxPlateDissipation);

    if (x.vpk > r.maxPlateVoltage) {
      push('plate-voltage', 'danger', `Plate voltage ${v1(x.vpk)} V exceeds the ${r.maxPlateVoltage} V rating.`, x.vpk, r.maxPlateVoltage);
    } else if (x.bplus > r.maxPlateVoltage) {
      // A cold tube draws no current, so at switch-on the plate sees all of B+ (common practice).
      push('cold-plate-voltage', 'warning', `At switch-on, before the heater warms, the plate sees the full B+ of ${v1(x.bplus)} V, above the ${r.maxPlateVoltage} V rating.`, x.bplus, r.maxPlateVoltage);
    }

    if (!rec.directlyHeated && r.maxHeaterCathodeVoltage !== null) {
      const vhk = x.vk - x.heaterVolts;
      if (Math.abs(vhk) > r.maxHeaterCathodeVoltage) {
        push('heater-cathode', 'danger', `Heater-to-cathode voltage ${v1(vhk)} V exceeds the ${r.maxHeaterCathodeVoltage} V rating: elevate the heater supply.`, Math.abs(vhk), r.maxHeaterCathodeVoltage);
      }
    }

    if (r.maxCathodeCurrent !== undefined && x.ia > r.maxCathodeCurrent) {
      push('cathode-current', 'danger', `Cathode current ${(x.ia * 1e3).toFixed(1)} mA exceeds the ${(r.maxCathodeCurrent * 1e3).toFixed(0)} mA rating.`, x.ia, r.maxCathodeCurrent);
    }

    const rgMax = x.fixedBias ? r.maxGridResistanceFixedBias : r.maxGridResistanceCathodeBias;
    if (x.rg !== null && rgMax !== undefined && x.rg > rgMax) {
      push('grid-resistor', 'warning', `Grid resistor ${(x.rg / 1e3).toFixed(0)} kΩ is above the ${(rgMax / 1e3).toFixed(0)} kΩ the datasheet allows with ${x.fixedBias ? 'fixed' : 'cathode'} bias: risk of thermal runaway from grid current.`, x.rg, rgMax);
    }
  }
  return out.sort((a, b) => SEVERITY_ORDER[a.severity] - SEVERITY_ORDER[b.severity]);
}
