import { korenParamsProblem, korenPlateCurrent } from '../tube/koren';
import { smallSignalAt, triode } from '../tube/triode';
import type { KorenTriodeParams, TypicalPoint } from '../tube/types';
import { levenbergMarquardt } from './levenbergMarquardt';

/**
 * Fits Koren's five parameters to a datasheet's typical operating points,
 * using every published figure there (Ia, mu, rp, gm at each point).
 *
 * Residuals are log ratios, ln(model/published), so a 10 % miss weighs the
 * same on 0.5 mA as on 60 mA. Unknowns are searched in log space for the
 * positive scale factors, inside bounds that keep the model physical: ex
 * 1.2–1.6 (Child–Langmuir's 1.5 give or take the spread of Koren's own
 * table), the mu parameter within ±30 % of the published mu, kp 10–2000 and
 * kvb 10–10 000 V². Weak priors pull ex toward 1.4, kvb toward 300 V² and kp
 * toward 8·mu, the middle of Koren's published sets (common practice for
 * this model, not a law). They decide only what the data leave open: one
 * typical point gives four figures for five unknowns, and even two points can
 * be hit exactly by a curve family that is wrong everywhere else.
 */
export interface FigureFit {
  readonly params: KorenTriodeParams;
  readonly rmsPercent: number;
  readonly worst: { readonly label: string; readonly errorPercent: number };
  readonly errors: readonly { readonly label: string; readonly errorPercent: number }[];
}

const PRIOR_WEIGHT = 0.02;
const MU_SPAN = 1.3;
const bounds = (mu: number) => ({
  lower: [Math.log(mu / MU_SPAN), 1.2, Math.log(10), Math.log(10), Math.log(10)],
  upper: [Math.log(mu * MU_SPAN), 1.6, Math.log(1e5), Math.log(2000), Math.log(10000)],
});

function toParams(x: readonly number[]): KorenTriodeParams {
  return { mu: Math.exp(x[0]!), ex: x[1]!, kg1: Math.exp(x[2]!), kp: Math.exp(x[3]!), kvb: Math.exp(x[4]!) };
}

/** Relative errors of a parameter set against every published figure, labelled for people. */
export function figureErrors(params: KorenTriodeParams, points: readonly TypicalPoint[]) {
  const model = triode(params);
  const out: { label: string; errorPercent: number }[] = [];
  for (const pt of points) {
    const at = `${pt.va} V/${pt.vg} V`;
    const s = smallSignalAt(model, pt.va, pt.vg);
    out.push({ label: `Ia at ${at}`, errorPercent: (s.ia / pt.ia - 1) * 100 });
    if (pt.mu !== undefined) out.push({ label: `mu at ${at}`, errorPercent: (s.mu / pt.mu - 1) * 100 });
    if (pt.rp !== undefined) out.push({ label: `rp at ${at}`, errorPercent: (s.rp / pt.rp - 1) * 100 });
    if (pt.gm !== undefined) out.push({ label: `gm at ${at}`, errorPercent: (s.gm / pt.gm - 1) * 100 });
  }
  return out;
}

export function summarizeErrors(errors: readonly { label: string; errorPercent: number }[]) {
  let ss = 0;
  let worst = errors[0] ?? { label: 'none', errorPercent: 0 };
  for (const e of errors) {
    ss += e.errorPercent * e.errorPercent;
    if (Math.abs(e.errorPercent) > Math.abs(worst.errorPercent)) worst = e;
  }
  return { rmsPercent: Math.sqrt(ss / Math.max(errors.length, 1)), worst };
}

/** A point read from a published plate-curve family: plate volts, grid volts, plate current (A). */
export interface CurveReadingPoint {
  readonly va: number;
  readonly vg: number;
  readonly ia: number;
}

/** Relative errors of a parameter set against points read from plate curves, labelled for people. */
export function curveErrors(params: KorenTriodeParams, points: readonly CurveReadingPoint[]) {
  return points.map((pt) => ({ label: `Ia at ${pt.va} V/${pt.vg} V on the curves`, errorPercent: (korenPlateCurrent(params, pt.va, pt.vg) / pt.ia - 1) * 100 }));
}

/**
 * The same fit with points read from the tube's published plate-curve family
 * as well: each point's current is one more log-ratio residual, beside the
 * typical points' figures, within the same physical bounds.
 */
export function fitToTypicalPoints(points: readonly TypicalPoint[], muGuess: number, curves: readonly CurveReadingPoint[] = []): FigureFit {
  const residuals = (x: readonly number[]): number[] => {
    const p = toParams(x);
    const model = triode(p);
    const r: number[] = curves.map((c) => {
      const ia = korenPlateCurrent(p, c.va, c.vg);
      return ia > 0 && Number.isFinite(ia) ? Math.log(ia / c.ia) : 10;
    });
    for (const pt of points) {
      const s = smallSignalAt(model, pt.va, pt.vg);
      const logRatio = (m: number, ref: number) => (m > 0 && Number.isFinite(m) ? Math.log(m / ref) : 10);
      r.push(logRatio(s.ia, pt.ia));
      if (pt.mu !== undefined) r.push(logRatio(s.mu, pt.mu));
      if (pt.rp !== undefined) r.push(logRatio(s.rp, pt.rp));
      if (pt.gm !== undefined) r.push(logRatio(s.gm, pt.gm));
    }
    r.push((PRIOR_WEIGHT * (x[1]! - 1.4)) / 0.1);
    r.push(PRIOR_WEIGHT * (x[4]! - Math.log(300)));
    r.push(PRIOR_WEIGHT * (x[3]! - Math.log(8 * muGuess)));
    return r;
  };
  let best: number[] | null = null;
  let bestCost = Infinity;
  // A few starts across kg1 and kp: the cost surface has shallow valleys.
  for (const kg1 of [300, 1000, 3000]) {
    for (const kp of [2 * muGuess, 8 * muGuess, 30 * muGuess]) {
      const start = [Math.log(muGuess), 1.4, Math.log(kg1), Math.log(kp), Math.log(300)];
      const res = levenbergMarquardt(residuals, start, { ...bounds(muGuess), maxIterations: 300 });
      if (res.cost < bestCost && korenParamsProblem(toParams(res.x)) === null) {
        bestCost = res.cost;
        best = res.x;
      }
    }
  }
  const params = toParams(best ?? [Math.log(muGuess), 1.4, Math.log(1000), Math.log(300), Math.log(300)]);
  const errors = figureErrors(params, points);
  const { rmsPercent, worst } = summarizeErrors(errors);
  return { params, rmsPercent, worst, errors };
}
