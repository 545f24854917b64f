import { DISSIPATION_WARN_FRACTION, type Finding, type FindingKind, type Severity } from '../stage/findings';
import type { OutputSolution } from './solveOutput';

const SEVERITY_ORDER: Record<Severity, number> = { danger: 0, warning: 1, note: 2 };
const v0 = (x: number) => x.toFixed(Math.abs(x) < 10 ? 1 : 0);

/**
 * The output stage against the tube's ratings, most severe first: plate and
 * screen dissipation at idle (the class A worst case: signal takes power out
 * of the plate), DC plate and screen voltage, cathode current, heater to
 * cathode (heater at ground), grid resistor for the bias kind, and the peak
 * plate swing, which a transformer load carries well above B+.
 */
export function outputFindings(s: OutputSolution, peakPlateVolts: number | null): Finding[] {
  const out: Finding[] = [];
  const push = (kind: FindingKind, severity: Severity, message: string, value: number, limit: number) =>
    out.push({ kind, severity, message, value, limit, percent: limit > 0 ? (100 * value) / limit : Infinity });
  const r = s.tube.ratings;
  const { op, design } = s;

  const dissipation = (kind: FindingKind, what: string, watts: number, rating: number, extra: string) => {
    const share = watts / rating;
    const text = `${what} dissipation ${watts.toFixed(2)} W is ${Math.round(share * 100)} % of the ${rating} W rating${extra}`;
    if (share > 1) push(kind, 'danger', `${text}: it will overheat.`, watts, rating);
    else if (share > DISSIPATION_WARN_FRACTION) push(kind, 'warning', `${text}: little margin for mains swings and tube spread.`, watts, rating);
    else push(kind, 'note', `${text}.`, watts, rating);
  };
  dissipation('plate-dissipation', op.connection === 'triode' && s.tube.law.kind === 'pentode' ? 'Plate (with screen)' : 'Plate', op.pa, r.maxPlateDissipation, '');
  if (r.maxScreenDissipation !== null && op.connection !== 'triode') {
    dissipation('screen-dissipation', 'Screen', op.pg2, r.maxScreenDissipation, ' at idle (it rises under drive as the plate swings low)');
  }

  const dcPlate = op.supply;
  if (dcPlate > r.maxPlateVoltage) push('plate-voltage', 'danger', `DC plate voltage ${v0(dcPlate)} V exceeds the ${r.maxPlateVoltage} V rating.`, dcPlate, r.maxPlateVoltage);
  if (r.maxScreenVoltage !== null && s.tube.law.kind === 'pentode' && op.vg2k > r.maxScreenVoltage) {
    const how = op.connection === 'triode' ? ' (tied to the plate, the screen sees the plate voltage)' : '';
    push('screen-voltage', 'danger', `Screen voltage ${v0(op.vg2k)} V exceeds the ${r.maxScreenVoltage} V rating${how}.`, op.vg2k, r.maxScreenVoltage);
  }
  if (r.maxCathodeCurrent !== undefined && op.ik > r.maxCathodeCurrent) {
    push('cathode-current', 'danger', `Cathode current ${(op.ik * 1e3).toFixed(1)} mA exceeds the ${(r.maxCathodeCurrent * 1e3).toFixed(0)} mA rating.`, op.ik, r.maxCathodeCurrent);
  }
  if (r.maxHeaterCathodeVoltage !== null && op.vk > r.maxHeaterCathodeVoltage) {
    push('heater-cathode', 'danger', `Heater-to-cathode voltage ${v0(op.vk)} V exceeds the ${r.maxHeaterCathodeVoltage} V rating: elevate the heater supply.`, op.vk, r.maxHeaterCathodeVoltage);
  }
  const rgMax = design.bias === 'fixed' ? r.maxGridResistanceFixedBias : r.maxGridResistanceCathodeBias;
  if (rgMax !== undefined && design.rg > rgMax) {
    push('grid-resistor', 'warning', `Grid resistor ${(design.rg / 1e3).toFixed(0)} kΩ is above the ${(rgMax / 1e3).toFixed(0)} kΩ the data sheet allows with ${design.bias} bias: risk of thermal runaway from grid current.`, design.rg, rgMax);
  }
  if (peakPlateVolts !== null) {
    push('plate-swing', 'note', `At full drive the plate swings to ${v0(peakPlateVolts)} V peak, about ${(peakPlateVolts / Math.max(op.supply, 1)).toFixed(1)} × B+: the transformer's insulation and the coupling parts must stand it.`, peakPlateVolts, r.maxPlateVoltage);
  }
  return out.sort((a, b) => SEVERITY_ORDER[a.severity] - SEVERITY_ORDER[b.severity]);
}
