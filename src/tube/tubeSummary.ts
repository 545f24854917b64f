import { smallSignalAt } from './triode';
import type { TubeRecord } from './types';

/** A tube's key figures for choosing it: the model's mu, rp, gm at its first datasheet typical point. */
export interface TubeSummary {
  readonly id: string;
  readonly description: string;
  readonly mu: number;
  /** Ω */
  readonly rp: number;
  /** S */
  readonly gm: number;
  /** W */
  readonly maxPlateDissipation: number;
  readonly userMade: boolean;
}

export function tubeSummary(tube: TubeRecord): TubeSummary {
  const t = tube.typical[0];
  const s = t ? smallSignalAt(tube, t.va, t.vg) : { mu: tube.model.params.mu, rp: NaN, gm: NaN };
  return {
    id: tube.id,
    description: tube.description,
    mu: s.mu,
    rp: Number.isFinite(s.rp) ? s.rp : 0,
    gm: Number.isFinite(s.gm) ? s.gm : 0,
    maxPlateDissipation: tube.ratings.maxPlateDissipation,
    userMade: tube.userMade === true,
  };
}
