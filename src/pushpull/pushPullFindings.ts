import { bySeverity, dissipationFinding, finding, heaterCathodeFinding, heaterCathodeRating, type Finding } from '../stage/ratingBands';
import type { PushPullFigures } from './pushPullFigures';
import { screenSupplyFinding } from '../output/screenFeed';
import type { PushPullSolution } from './solvePushPull';

const v0 = (x: number) => x.toFixed(Math.abs(x) < 10 ? 1 : 0);
const mA = (x: number) => (x * 1e3).toFixed(Math.abs(x) < 0.01 ? 1 : 0);

/**
 * A push-pull pair against its tube's ratings, most severe first. Each
 * check takes the worse tube of the two (they differ when mismatched). Plate
 * and screen dissipation are checked at idle and, when the level sweep has
 * run, at their worst over the drive range: in class AB the plate runs
 * hottest below full power, not at idle as in class A.
 */
export function pushPullFindings(s: PushPullSolution, figures: PushPullFigures | null, peakPlateVolts: number | null): Finding[] {
  const out: Finding[] = [];
  const r = s.tube.ratings;
  const d = s.design;
  const tied = s.feed.kind === 'tied';
  const worseIdle = s.idle[0].pa >= s.idle[1].pa ? s.idle[0] : s.idle[1];
  const plateWhat = tied && s.tube.law.kind === 'pentode' ? 'Plate (with screen)' : 'Plate';
  out.push(dissipationFinding('plate-dissipation', plateWhat, worseIdle.pa, r.maxPlateDissipation, ' at idle, per tube'));
  if (figures && figures.worstPlate.watts > worseIdle.pa * 1.005) {
    out.push(dissipationFinding('plate-dissipation', plateWhat, figures.worstPlate.watts, r.maxPlateDissipation, ` at its worst under drive (${v0(figures.worstPlate.drive)} V peak on each grid), per tube`));
  }
  const screened = r.maxScreenDissipation !== null && !tied && s.tube.law.kind === 'pentode';
  if (screened) {
    const pg2 = Math.max(s.idle[0].pg2, s.idle[1].pg2);
    const worst = figures ? Math.max(figures.worstScreen.watts, pg2) : pg2;
    out.push(dissipationFinding('screen-dissipation', 'Screen', worst, r.maxScreenDissipation!, figures && worst > pg2 * 1.005 ? ` at its worst under drive (${v0(figures.worstScreen.drive)} V peak on each grid), per tube` : ' at idle, per tube'));
  }
  if (s.feed.kind === 'fixed') {
    const screenNode = screenSupplyFinding(d.bplus, d.screenVolts, d.screenFromNode);
    if (screenNode) out.push(screenNode);
  }
  if (s.supply > r.maxPlateVoltage) out.push(finding('plate-voltage', 'danger', `DC plate voltage ${v0(s.supply)} V exceeds the ${r.maxPlateVoltage} V rating.`, s.supply, r.maxPlateVoltage));
  if (screened && r.maxScreenVoltage !== null) {
    const vg2 = s.feed.kind === 'fixed' ? s.feed.vg2k : s.feed.kind === 'tap' ? s.feed.supply : s.supply;
    if (vg2 > r.maxScreenVoltage) out.push(finding('screen-voltage', 'danger', `Screen voltage ${v0(vg2)} V exceeds the ${r.maxScreenVoltage} V rating.`, vg2, r.maxScreenVoltage));
  }
  const ik = Math.max(s.idle[0].ik, s.idle[1].ik);
  if (r.maxCathodeCurrent !== undefined && ik > r.maxCathodeCurrent) {
    out.push(finding('cathode-current', 'danger', `Cathode current ${mA(ik)} mA per tube exceeds the ${mA(r.maxCathodeCurrent)} mA rating.`, ik, r.maxCathodeCurrent));
  }
  const hk = heaterCathodeRating(r);
  const vhk = s.vk - (d.heaterVolts ?? 0);
  if (hk && vhk !== 0) out.push(heaterCathodeFinding(vhk, hk));
  const rgMax = d.bias === 'fixed' ? r.maxGridResistanceFixedBias : r.maxGridResistanceCathodeBias;
  if (rgMax !== undefined && d.rg > rgMax) {
    out.push(finding('grid-resistor', 'warning', `Grid resistors ${(d.rg / 1e3).toFixed(0)} kΩ are above the ${(rgMax / 1e3).toFixed(0)} kΩ the data sheet allows with ${d.bias} bias: risk of thermal runaway from grid current.`, d.rg, rgMax));
  }
  // Common practice: a few mA of uncancelled DC is what a push-pull core tolerates; the note gives the figure to compare with the transformer's own.
  const imbalance = Math.abs(s.dcImbalance);
  if (imbalance > 1e-4) {
    out.push(finding('primary-imbalance', imbalance > 0.1 * ik ? 'warning' : 'note', `${mA(imbalance)} mA of DC is left uncancelled in the primary by the tubes' mismatch: it magnetises the core, lowering its bass; match the pair or balance the bias per side.`, imbalance, ik));
  }
  if (figures?.overThdEverywhere) {
    out.push(finding('distortion', 'warning', `THD is above the ${(d.thdLimit * 100).toFixed(1)} % limit at every level, the smallest included: crossover distortion from a bias too cold. Raise the idle current.`, figures.atZeroGrid.thd, d.thdLimit));
  }
  if (peakPlateVolts !== null) {
    out.push(finding('plate-swing', 'note', `At full drive each plate swings to ${v0(peakPlateVolts)} V peak, about ${(peakPlateVolts / Math.max(s.supply, 1)).toFixed(1)} × B+; plate to plate the primary sees twice the swing: the transformer's insulation must stand it.`, peakPlateVolts, r.maxPlateVoltage));
  }
  return bySeverity(out);
}
