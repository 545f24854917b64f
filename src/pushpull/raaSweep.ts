import { fail, type Result } from '../result';
import type { OutputTube } from '../output/outputTube';
import { pushPullFigures } from './pushPullFigures';
import type { PushPullDesign } from './pushPullDesign';
import { solvePushPull } from './solvePushPull';

export interface RaaRow {
  readonly raa: number;
  /** The most power within the design's distortion limit, W (0 where no level is within it). */
  readonly power: number;
  readonly thd: number;
  /** What ends it: the distortion limit, or the grids reaching 0 V first. */
  readonly limitedBy: 'thd-limit' | 'grid-current' | 'never-within';
}

/** The most points a sweep may ask for (each is a full level sweep). */
export const MAX_RAA_POINTS = 25;

/**
 * The pair's power within its distortion limit against the plate-to-plate
 * load, from a third of the design's Raa to three times it (log-spaced), at
 * the design's bias: the table a builder reads to choose a transformer, and
 * the row with the most power.
 */
export function pushPullRaaSweep(tube: OutputTube, design: PushPullDesign, points = 9): Result<{ readonly rows: readonly RaaRow[]; readonly best: number }> {
  if (!Number.isInteger(points) || points < 2 || points > MAX_RAA_POINTS) return fail('invalid-input', `Give 2 to ${MAX_RAA_POINTS} points`, 'points');
  const first = solvePushPull(tube, design);
  if (!first.ok) return first;
  const rows: RaaRow[] = [];
  for (let k = 0; k < points; k++) {
    const raa = design.raa * 3 ** ((2 * k) / (points - 1) - 1);
    const s = solvePushPull(tube, { ...design, raa });
    if (!s.ok) return s;
    const f = pushPullFigures(s);
    if (!f.ok) return f;
    const at = f.atThdLimit ?? f.atZeroGrid;
    rows.push(f.overThdEverywhere ? { raa, power: 0, thd: f.atZeroGrid.thd, limitedBy: 'never-within' } : { raa, power: at.power, thd: at.thd, limitedBy: f.atThdLimit ? 'thd-limit' : 'grid-current' });
  }
  const best = rows.reduce((b, r, i) => (r.power > rows[b]!.power ? i : b), 0);
  return { ok: true, rows, best };
}
