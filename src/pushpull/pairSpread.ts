import { TUBE_CURRENT_SPREAD } from '../build/partsList';
import { spreadOf, type OutputSpread } from '../output/outputSpread';
import { fail, type Result } from '../result';
import { scaledTube, solvePushPull, type PushPullSolution } from './solvePushPull';

/**
 * A cathode-biased pair's idle with a matched pair of the type's weakest and
 * of its strongest tubes (both passing TUBE_CURRENT_SPREAD less or more than
 * the law, common practice; a mismatch between the two is the design's own
 * `mismatch`): the shared cathode resistor takes back part of it, as for one
 * tube. Each end is tube 1's idle. Fixed bias is set tube by tube: a failure
 * naming the field.
 */
export function pairSpread(s: PushPullSolution, spread = TUBE_CURRENT_SPREAD): Result<OutputSpread> {
  if (typeof s !== 'object' || s === null || typeof s.design !== 'object' || s.design === null || s.design.bias !== 'cathode') {
    return fail('invalid-input', 'Only a cathode-biased pair spreads with its tubes: a fixed bias is set for each tube', 'bias');
  }
  return spreadOf(spread, (m) => {
    const r = solvePushPull(scaledTube(s.tube, m), s.design);
    if (!r.ok) return r;
    const t = r.idle[0];
    return { ok: true, m, ip: t.ip, ig2: t.ig2, vk: r.vk, pa: t.pa, pg2: t.pg2 };
  });
}
