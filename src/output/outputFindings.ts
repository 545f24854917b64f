import { bySeverity, dissipationFinding, finding, heaterCathodeFinding, heaterCathodeRating, type Finding, type FindingKind, type Severity } from '../stage/ratingBands';
import { screenSupplyFinding } from './screenFeed';
import type { OutputSolution } from './solveOutput';

const v0 = (x: number) => x.toFixed(Math.abs(x) < 10 ? 1 : 0);

/**
 * The output stage against the tube's ratings, most severe first: plate and
 * screen dissipation at idle (the class A worst case: signal takes power out
 * of the plate), DC plate and screen voltage, cathode current, heater to
 * cathode (the heaters at the design's potential, ground by default), grid resistor for the bias kind, and the peak
 * plate swing, which a transformer load carries well above B+.
 */
export function outputFindings(s: OutputSolution, peakPlateVolts: number | null): Finding[] {
  const out: Finding[] = [];
  const push = (kind: FindingKind, severity: Severity, message: string, value: number, limit: number) => out.push(finding(kind, severity, message, value, limit));
  const r = s.tube.ratings;
  const { op, design } = s;

  const dissipation = (kind: FindingKind, what: string, watts: number, rating: number, extra: string) => out.push(dissipationFinding(kind, what, watts, rating, extra));
  dissipation('plate-dissipation', op.connection === 'triode' && s.tube.law.kind === 'pentode' ? 'Plate (with screen)' : 'Plate', op.pa, r.maxPlateDissipation, '');
  if (r.maxScreenDissipation !== null && op.connection !== 'triode') {
    dissipation('screen-dissipation', 'Screen', op.pg2, r.maxScreenDissipation, ' at idle (it rises under drive as the plate swings low)');
  }

  if (op.feed.kind === 'fixed') {
    const screenNode = screenSupplyFinding(design.bplus, design.screenVolts, design.screenFromNode);
    if (screenNode) out.push(screenNode);
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
  // The cathode against its heaters: at ground unless the design holds their winding above it. None to report with both at 0 V.
  const hk = heaterCathodeRating(r);
  const vhk = op.vk - (design.heaterVolts ?? 0);
  if (hk && vhk !== 0) out.push(heaterCathodeFinding(vhk, hk));
  const rgMax = design.bias === 'fixed' ? r.maxGridResistanceFixedBias : r.maxGridResistanceCathodeBias;
  if (rgMax !== undefined && design.rg > rgMax) {
    push('grid-resistor', 'warning', `Grid resistor ${(design.rg / 1e3).toFixed(0)} kΩ is above the ${(rgMax / 1e3).toFixed(0)} kΩ the data sheet allows with ${design.bias} bias: risk of thermal runaway from grid current.`, design.rg, rgMax);
  }
  if (peakPlateVolts !== null) {
    push('plate-swing', 'note', `At full drive the plate swings to ${v0(peakPlateVolts)} V peak, about ${(peakPlateVolts / Math.max(op.supply, 1)).toFixed(1)} × B+: the transformer's insulation and the coupling parts must stand it.`, peakPlateVolts, r.maxPlateVoltage);
  }
  return bySeverity(out);
}
