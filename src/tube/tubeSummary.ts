import { korenPlateCurrent } from './koren';
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
  /** What the model was fitted to, in words, and so how far its curves can be trusted away from those points. */
  readonly fitBasis: string;
}

const count = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

/**
 * What the tube's curves rest on: points read from its published plate
 * curves, or typical points only (then the curves between and beyond them
 * are the law's reach, and large-signal figures far from them extrapolate).
 */
export function fitBasisOf(tube: TubeRecord): string {
  const typical = tube.typical.length;
  const fromMemory = typical > 0 && tube.typical.every((t) => /from memory/i.test(t.source));
  const points = count(typical, 'typical point', 'typical points') + (fromMemory ? ' (from memory)' : '');
  if (tube.userMade) return `Yours: ${tube.fit.method}, RMS error ${tube.fit.rmsPercent.toFixed(1)} %.`;
  const curves = tube.curves?.points ?? [];
  if (curves.length > 0) {
    const grids = new Set(curves.map((p) => p.vg)).size;
    const rms = tube.fit.curveRmsPercent;
    // The worst reading, worked out here rather than parsed from the record's words.
    let worst = { error: 0, va: 0, vg: 0 };
    for (const p of curves) {
      const error = (korenPlateCurrent(tube.model.params, p.va, p.vg) / p.ia - 1) * 100;
      if (Math.abs(error) > Math.abs(worst.error)) worst = { error, va: p.va, vg: p.vg };
    }
    const signed = `${worst.error >= 0 ? '+' : '−'}${Math.abs(worst.error).toFixed(1)} %`;
    return `Fitted to ${curves.length} points read from its published plate curves (${grids} grid voltages) and ${points}: ${rms !== undefined ? `${rms.toFixed(1)} % RMS over the curves, ` : ''}worst ${signed} at ${worst.va} V with the grid at ${worst.vg} V.`;
  }
  return `Fitted to ${points} only, ${tube.fit.rmsPercent.toFixed(1)} % RMS there: away from ${typical === 1 ? 'it' : 'them'} the curves are Koren's law extrapolated, not the sheet's curves, so large-signal figures (swing, distortion, power) are estimates.`;
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
    fitBasis: fitBasisOf(tube),
  };
}
