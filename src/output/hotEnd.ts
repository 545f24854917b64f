import { fail, type Result } from '../result';
import { finding, dissipationFinding, type Finding } from '../stage/ratingBands';
import { emptyCurrents, screenFeedOf, stageCurrentsInto } from './electrodes';
import { effectiveConnection, type OutputDesign } from './outputDesign';
import type { OutputTube } from './outputTube';
import { checkOutputInput } from './checkOutput';

export interface HotEnd {
  /** The grid's setting there, V (negative). */
  readonly vgk: number;
  /** The plate's voltage and current, V and A; its dissipation, W. */
  readonly vpk: number;
  readonly ip: number;
  readonly plateWatts: number;
  /** The plate's dissipation against its rating: a warning past it (a setting to avoid, not where the design runs). */
  readonly finding: Finding;
}

/**
 * A fixed-bias tube (the law's own) with its adjustment turned all the way
 * to the hot end, where a pot left at the wrong end on first switch-on
 * puts it: the grid at `vgk`, the plate at the idle B+ (`vpk` + `ip`·Rpri)
 * less the primary's drop at the new current (solved by substitution: the
 * drop is a few volts), its dissipation against the plate's rating.
 */
export function hotEnd(tube: OutputTube, d: OutputDesign, vpk: number, ip: number, vgk: number): Result<HotEnd> {
  const problem = checkOutputInput(tube, d);
  if (problem) return problem;
  if (d.bias !== 'fixed') return fail('invalid-input', 'Only a fixed-bias stage has an adjustment to turn', 'bias');
  if (![vpk, ip, vgk].every(Number.isFinite) || !(vpk > 0) || !(ip >= 0) || !(vgk <= 0)) return fail('invalid-input', 'Give the idle plate voltage and current, and a grid setting at or below 0 V');
  const bplus = vpk + ip * d.rPrimary;
  const connection = effectiveConnection(d, tube);
  const c = emptyCurrents();
  let plate = vpk;
  for (let k = 0; k < 20; k++) {
    stageCurrentsInto(tube, screenFeedOf(connection, d.screenVolts, d.ulTap, bplus), plate, vgk, c, 0);
    const next = Math.max(bplus - c.ip * d.rPrimary, 1);
    if (Math.abs(next - plate) < 1e-3) break;
    // Halfway each time: a primary's resistance large beside the tube's own could make plain substitution swing.
    plate = (plate + next) / 2;
  }
  const watts = plate * c.ia;
  const rating = tube.ratings.maxPlateDissipation;
  const base = dissipationFinding('bias-range', 'Plate', watts, rating);
  const where = `With its bias adjustment turned to the hot end (${vgk.toFixed(1).replace('-', '−')} V) a typical tube passes ${(c.ip * 1e3).toFixed(0)} mA: `;
  const message = `${where}${base.message.charAt(0).toLowerCase()}${base.message.slice(1)} Set every adjustment to its cold end (most negative) before switching on (common practice).`;
  // Past the rating this is a setting to avoid, not the design's own running state: a warning, with what to do.
  const severity = base.severity === 'danger' ? 'warning' : base.severity;
  return { ok: true, vgk, vpk: plate, ip: c.ip, plateWatts: watts, finding: finding('bias-range', severity, message, watts, rating) };
}
