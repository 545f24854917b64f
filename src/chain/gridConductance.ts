import { gridSlope, MIN_GRID_CONDUCTANCE } from '../tube/gridCurrent';
import type { LinearStage, SolvedLink } from './stageKind';
import { trackLoad } from '../stage/volumeControl';

/**
 * A grid's small-signal input conductance at its operating point, S: the
 * slope of its grid current (the retarding-field tail below the onset; see
 * gridCurrent). A high-mu stage biased near a volt draws a fraction of a
 * microamp there, and its slope loads whatever drives the grid: a few
 * hundred kilohms at −1 V for a 12AX7, far below its grid leak. 0 for a
 * stage whose grid current the chain does not follow.
 */
export function gridConductance(link: SolvedLink): number {
  return link.gridLaw ? gridSlope(link.gridLaw, link.op.vgk) : 0;
}

/**
 * How far the cathode follows the grid at midband, vk/vg, with `load` on the
 * stage's output: 0 with the cathode bypassed; a follower's gain; an
 * unbypassed stage's degeneration. The grid's current depends on Vgk alone,
 * so a cathode that follows shrinks the conductance the driver sees by
 * (1 − vk/vg): the bootstrap. Kirchhoff's current law at plate and cathode
 * with the tube as gm·vgk from plate to cathode beside rp.
 */
export function cathodeShare(s: LinearStage, load: number): number {
  if (s.cathodeGrounded || s.ck !== null || !(s.rk > 0)) return 0;
  const gLoad = Number.isFinite(load) && load > 0 ? 1 / load : 0;
  const gk = 1 / s.rk + (s.output === 'cathode' || s.output2 === 'cathode' ? gLoad : 0);
  const gr = 1 / s.rp;
  if (!(s.plateLoad > 0)) return s.gm / (gk + gr + s.gm);
  const gp = 1 / s.plateLoad + (s.output === 'plate' ? gLoad : 0);
  // [gp + gr, −(gr + gm)] [vp]   [−gm]
  // [−gr, gk + gr + gm  ] [vk] = [ gm]
  const a = gp + gr;
  const b = -(gr + s.gm);
  const c = -gr;
  const d = gk + gr + s.gm;
  const det = a * d - b * c;
  const share = det !== 0 ? (a * s.gm + c * s.gm) / det : 0;
  return Number.isFinite(share) ? share : 0;
}

/**
 * The input impedance the stage before really drives at midband, Ω: the
 * grid's leak (`zin`) in parallel with its current's slope as the
 * bootstrapped cathode leaves it, fed through the grid stopper (`stopper`, Ω);
 * behind a volume control (`volume` below 1) the grid hangs from the wiper,
 * the leak being the pot's track.
 */
export function loadedInput(zin: number, link: SolvedLink, load: number, stopper = 0, volume = 1): number {
  const g = gridConductance(link) * (1 - cathodeShare(link.linear, load));
  if (!(g > MIN_GRID_CONDUCTANCE)) return zin;
  const r = 1 / g + stopper;
  return Number.isFinite(zin) ? trackLoad(zin, volume, r) : r;
}

/** A stage's gain into load `to` from its gain into load `from`, through its output impedance (Thévenin): L/(L + Zout) each. */
export function gainInto(gain: number, zout: number, from: number, to: number): number {
  const share = (l: number) => (Number.isFinite(l) ? l / (l + zout) : 1);
  const f = share(from);
  return f > 0 ? (gain * share(to)) / f : gain;
}
