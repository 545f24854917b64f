import { korenPlateCurrent } from '../tube/koren';
import { korenPentodeInto } from '../tube/pentode';
import type { Connection, OutputTube } from './outputTube';

/**
 * How the screen voltage (to the cathode) follows the plate voltage Vpk:
 * - pentode: fixed at the screen supply;
 * - triode: equal to Vpk (screen tied to plate);
 * - ultralinear: the tap sits a fraction of the primary's turns below its
 *   B+ end, so Vg2k = supply − fraction·w, where supply is B+ to the cathode
 *   and w the winding's signal voltage. The primary's DC resistance is taken
 *   to sit between the winding and the plate, so the tap carries B+ at DC.
 */
export type ScreenFeed =
  | { readonly kind: 'fixed'; readonly vg2k: number }
  | { readonly kind: 'tied' }
  | { readonly kind: 'tap'; readonly fraction: number; readonly supply: number };

export function screenFeedOf(connection: Connection, screenVolts: number, tapFraction: number, supply: number): ScreenFeed {
  if (connection === 'triode') return { kind: 'tied' };
  if (connection === 'ultralinear') return { kind: 'tap', fraction: tapFraction, supply };
  return { kind: 'fixed', vg2k: screenVolts };
}

/**
 * Screen voltage at plate voltage vpk. For a tap, `winding` is the winding's
 * signal voltage when known; on the chart and at DC it is taken as
 * supply − vpk (the winding's DC drop is zero; the small drop in the primary
 * resistance is left to the solvers, which pass the winding voltage).
 */
export function screenVoltage(feed: ScreenFeed, vpk: number, winding?: number): number {
  if (feed.kind === 'fixed') return feed.vg2k;
  if (feed.kind === 'tied') return vpk;
  return feed.supply - feed.fraction * (winding ?? feed.supply - vpk);
}

/**
 * Currents at one instant. `ip` is the current drawn on the plate chart and
 * carried by the primary's DC resistance (which sits between the winding and
 * the plate): the plate current, plus the screen current when the screen is
 * tied to the plate (one anode then; triode-connected curve sheets plot the
 * sum). `mmf` is the current the transformer couples to the speaker: `ip`,
 * except that an ultralinear screen's current flows through the tap's share
 * of the turns and adds that share. `ik` is the cathode current.
 */
export interface StageCurrents {
  ip: number;
  mmf: number;
  ia: number;
  ig2: number;
  ik: number;
}

export function emptyCurrents(): StageCurrents {
  return { ip: 0, mmf: 0, ia: 0, ig2: 0, ik: 0 };
}

const scratch = { ia: 0, ig2: 0 };

export function stageCurrentsInto(tube: OutputTube, feed: ScreenFeed, vpk: number, vgk: number, out: StageCurrents, winding?: number): void {
  if (tube.law.kind === 'triode') {
    const ia = korenPlateCurrent(tube.law.tube.model.params, vpk, vgk);
    out.ip = ia;
    out.mmf = ia;
    out.ia = ia;
    out.ig2 = 0;
    out.ik = ia;
    return;
  }
  korenPentodeInto(tube.law.params, vpk, vgk, screenVoltage(feed, vpk, winding), scratch);
  out.ia = scratch.ia;
  out.ig2 = scratch.ig2;
  out.ik = scratch.ia + scratch.ig2;
  out.ip = feed.kind === 'tied' ? out.ik : scratch.ia;
  out.mmf = feed.kind === 'tap' ? scratch.ia + feed.fraction * scratch.ig2 : out.ip;
}

/** The charted current alone, for curve drawing and root finding. */
export function primaryCurrent(tube: OutputTube, feed: ScreenFeed, vpk: number, vgk: number): number {
  const out = emptyCurrents();
  stageCurrentsInto(tube, feed, vpk, vgk, out);
  return out.ip;
}
