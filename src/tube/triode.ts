import { korenPlateCurrent, korenSlopes, type PlateSlopes } from './koren';
import { modelOf, type KorenTriodeParams, type TriodeModel, type TubeLike } from './types';

/** Koren's table gives 2 kΩ grid resistance for small-signal triodes; used when none is given. */
export const DEFAULT_GRID_RESISTANCE = 2000;

/**
 * A triode model from Koren parameters, usable wherever a library tube is.
 * Parameters are not judged here; solvers check them and answer with an
 * 'invalid-tube' failure when they are not physical.
 */
export function triode(params: KorenTriodeParams, gridResistance = DEFAULT_GRID_RESISTANCE): TriodeModel {
  const { mu, ex, kg1, kp, kvb } = params;
  return { kind: 'triode-model', params: { mu, ex, kg1, kp, kvb }, gridResistance };
}

/** Plate current in amperes for plate–cathode voltage vpk and grid–cathode voltage vgk, in volts. */
export function plateCurrent(tube: TubeLike, vpk: number, vgk: number): number {
  // Not a tube, or not numbers: no current, never a throw or NaN (hot path: a cheap guard, not the full check).
  const model = typeof tube === 'object' && tube !== null ? modelOf(tube) : null;
  if (typeof model !== 'object' || model === null || typeof model.params !== 'object' || model.params === null) return 0;
  const i = korenPlateCurrent(model.params, vpk, vgk);
  return Number.isFinite(i) ? i : 0;
}

/** Small-signal figures of the tube itself at a point: mu, rp (Ω), gm (S). */
export interface TubeSmallSignal {
  readonly ia: number;
  readonly mu: number;
  readonly rp: number;
  readonly gm: number;
}

/**
 * mu = gm·rp, rp = 1/(∂Ia/∂Vpk), gm = ∂Ia/∂Vgk, from Koren's law's analytic
 * derivatives. Where the tube is cut off (no slope), rp is Infinity and mu is
 * the model's mu parameter, its limit value.
 */
export function smallSignalAt(tube: TubeLike, vpk: number, vgk: number): TubeSmallSignal {
  const p = modelOf(tube).params;
  const s: PlateSlopes = korenSlopes(p, vpk, vgk);
  if (!(s.ga > 0) || !(s.gm > 0)) return { ia: s.ia, mu: p.mu, rp: Infinity, gm: 0 };
  return { ia: s.ia, mu: s.gm / s.ga, rp: 1 / s.ga, gm: s.gm };
}
