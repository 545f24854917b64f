import type { Result } from '../result';
import { biasForPoint, MIN_RK, type BiasAnswer } from '../output/outputBias';
import type { OutputDesign } from '../output/outputDesign';
import type { OutputTube } from '../output/outputTube';
import { checkPushPull, type PushPullDesign } from './pushPullDesign';
import type { PushPullSolution } from './solvePushPull';

/** The pair's design as one of its tubes sees it at DC: its half of the primary, its quarter of the load. */
function oneTube(d: PushPullDesign): OutputDesign {
  return { ...d, zPrimary: d.raa / 4, rPrimary: d.rPrimary / 2 };
}

/**
 * Inverse design for a matched pair: the bias and B+ that put each tube at
 * (vpk, ip). Each tube's half of the primary drops its own current; with
 * cathode bias the shared resistor carries both tubes' current, so it is half
 * the one a single tube would need (Ohm's law).
 */
export function pairBiasForPoint(tube: OutputTube, d: PushPullDesign, vpk: number, ip: number): Result<BiasAnswer> {
  const problem = checkPushPull(tube, d);
  if (problem) return problem;
  const b = biasForPoint(tube, oneTube(d), vpk, ip);
  if (!b.ok) return b;
  return { ...b, rk: b.rk / 2, ik: 2 * b.ik };
}

/**
 * The other kind of bias for the same pair, as switchBias does for one tube:
 * to fixed, the grid supply that keeps the idle current with B+ unchanged;
 * to cathode, Rk = −Vgk/(Ik1 + Ik2), holding the grids where they were.
 */
export function switchPairBias(s: PushPullSolution, to: 'cathode' | 'fixed'): Pick<PushPullDesign, 'bias' | 'rk' | 'vg'> {
  const d = s.design;
  if (to === d.bias) return { bias: d.bias, rk: d.rk, vg: d.vg };
  const ik = s.idle[0].ik + s.idle[1].ik;
  if (to === 'fixed') {
    const ip = s.idle[0].ip;
    const b = biasForPoint(s.tube, { ...oneTube(d), bias: 'fixed' }, d.bplus - ip * (d.rPrimary / 2), ip);
    return { bias: 'fixed', rk: d.rk, vg: Math.round((b.ok ? b.vgk : s.vgk) * 10) / 10 };
  }
  return { bias: 'cathode', vg: d.vg, rk: ik > 0 ? Math.max(MIN_RK, Math.round(-s.vgk / ik)) : d.rk };
}
