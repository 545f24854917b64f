import { fail, type Result } from '../result';
import { korenParamsProblem, korenPlateCurrent } from '../tube/koren';
import { smallSignalAt, triode } from '../tube/triode';
import type { KorenTriodeParams, TypicalPoint } from '../tube/types';
import { levenbergMarquardt } from './levenbergMarquardt';
import { shown } from '../shown';

/** One point of a plate curve, read off a datasheet or measured: SI units (V, V, A). */
export interface CurvePoint {
  readonly va: number;
  readonly vg: number;
  readonly ia: number;
}

export interface FitOptions {
  /** Called after each of the fit's starts with how many are done of how many: for a progress bar. */
  readonly onProgress?: (done: number, of: number) => void;
  /** Datasheet typical operating figures to fit as well (Ia, mu, rp, gm at each). */
  readonly typical?: readonly TypicalPoint[];
  /** Starting mu; default from the points' spread, else 20. */
  readonly muGuess?: number;
  readonly maxIterations?: number;
}

export interface FitPointError {
  /** Index into the given points, or −1 for a typical figure. */
  readonly index: number;
  readonly label: string;
  readonly errorPercent: number;
}

export interface TriodeFit {
  readonly params: KorenTriodeParams;
  /** RMS of the relative errors over every fitted value, %. */
  readonly rmsPercent: number;
  /** The worst-fitting value. */
  readonly worst: FitPointError;
  /** All values by error, worst first. */
  readonly errors: readonly FitPointError[];
  readonly converged: boolean;
  /** Set when the fit did not converge: the best result found is returned with this warning. */
  readonly warning?: string;
}

/** Currents below this are treated as cut off and fitted in absolute terms (relative error means nothing at 0 A). */
const FLOOR_A = 1e-6;
const MIN_POINTS = 5;
const MAX_POINTS = 10_000;
/** Above this many points the multi-start search runs on an even subsample (a plate family's shape is set by far fewer). */
const START_SAMPLE = 500;

const REFINE_REL_TOL = 1e-7;

/** Every k-th point so that at most `n` remain, spread over the whole list (the list's order is the user's: curve by curve). */
function evenSample<T>(all: readonly T[], n: number): readonly T[] {
  if (all.length <= n) return all;
  const step = all.length / n;
  return Array.from({ length: n }, (_, k) => all[Math.floor(k * step)]!);
}

/**
 * Fits Koren's five triode parameters to plate-curve points and/or typical
 * operating figures by Levenberg–Marquardt (bounded; see levenbergMarquardt).
 * Residuals are relative (ln of model over measured) so the small currents
 * near cutoff count as much as the large ones; parameters stay physical
 * (ex 1.1–1.9, mu 1–300, kp 5–5000, kvb 1–20 000 V², kg1 10–10⁵). Several
 * starts; the best is kept. Never NaN: a fit that does not converge returns
 * its best result with a warning.
 */
export function fitTriode(points: readonly CurvePoint[], options: FitOptions | null = {}): Result<TriodeFit> {
  if (!Array.isArray(points)) return fail('invalid-input', 'Give the points as a list of { va, vg, ia }');
  if (points.length > MAX_POINTS) return fail('invalid-input', `At most ${MAX_POINTS} points can be fitted (got ${points.length})`);
  for (const [k, p] of points.entries()) {
    if (!p || ![p.va, p.vg, p.ia].every((v) => typeof v === 'number' && Number.isFinite(v))) return fail('invalid-input', `Point ${k + 1} must have finite va, vg and ia`);
    if (!(p.va > 0)) return fail('invalid-input', `Point ${k + 1}: plate voltage must be above 0 V (got ${shown(p.va)} V)`);
    if (p.ia < 0) return fail('invalid-input', `Point ${k + 1}: plate current cannot be negative (got ${shown(p.ia)} A)`);
  }
  if (options !== null && options !== undefined && typeof options !== 'object') return fail('invalid-input', 'Fit options must be an object or left out');
  const typical = options?.typical ?? [];
  if (!Array.isArray(typical)) return fail('invalid-input', 'Typical figures must be a list of { va, vg, ia }');
  const figureCount = typical.reduce((n, t) => n + 1 + (t.mu !== undefined ? 1 : 0) + (t.rp !== undefined ? 1 : 0) + (t.gm !== undefined ? 1 : 0), 0);
  if (points.length + figureCount < MIN_POINTS) {
    return fail('invalid-input', `Too few values to fit five parameters: give at least ${MIN_POINTS} points or figures (got ${points.length + figureCount})`);
  }
  if (points.length > 0 && typical.length === 0) {
    const grids = new Set(points.map((p) => p.vg));
    const plates = new Set(points.map((p) => p.va));
    if (grids.size < 2) return fail('invalid-input', `All the points are on one grid voltage (${[...grids][0]} V): give points from at least two plate curves so mu can be found`);
    if (plates.size < 2) return fail('invalid-input', 'All the points are at one plate voltage: give points along the curves (several plate voltages)');
  }
  const muGuess = options?.muGuess ?? guessMu(points) ?? typical.find((t) => t.mu !== undefined)?.mu ?? 20;

  const toParams = (x: readonly number[]): KorenTriodeParams => ({ mu: Math.exp(x[0]!), ex: x[1]!, kg1: Math.exp(x[2]!), kp: Math.exp(x[3]!), kvb: Math.exp(x[4]!) });
  const residualsOver = (sample: readonly CurvePoint[]) => (x: readonly number[]): number[] => {
    const p = toParams(x);
    const r: number[] = [];
    for (const pt of sample) {
      const ia = korenPlateCurrent(p, pt.va, pt.vg);
      r.push(pt.ia >= FLOOR_A ? Math.log(Math.max(ia, 1e-15) / pt.ia) : (ia - pt.ia) / FLOOR_A);
    }
    if (typical.length > 0) {
      const m = triode(p);
      for (const t of typical) {
        const s = smallSignalAt(m, t.va, t.vg);
        const lr = (v: number, ref: number) => (v > 0 && Number.isFinite(v) ? Math.log(v / ref) : 10);
        r.push(lr(s.ia, t.ia));
        if (t.mu !== undefined) r.push(lr(s.mu, t.mu));
        if (t.rp !== undefined) r.push(lr(s.rp, t.rp));
        if (t.gm !== undefined) r.push(lr(s.gm, t.gm));
      }
    }
    // Weak pulls toward ordinary values decide only what the data leave open.
    r.push(0.02 * ((x[1]! - 1.4) / 0.1), 0.02 * (x[4]! - Math.log(300)));
    return r;
  };
  const lower = [Math.log(1), 1.1, Math.log(10), Math.log(5), Math.log(1)];
  const upper = [Math.log(300), 1.9, Math.log(1e5), Math.log(5000), Math.log(20000)];
  let best: { x: number[]; cost: number; converged: boolean } | null = null;
  const scale = scaleGuess(points, muGuess);
  let started = 0;
  const progress = typeof options?.onProgress === 'function' ? options.onProgress : null;
  const maxIterations = options?.maxIterations ?? 200;
  // The nine starts only choose a basin: on a large set they run on an even
  // subsample, and the best is then refined on every point.
  const sample = evenSample(points, START_SAMPLE);
  const startResiduals = residualsOver(sample);
  const refine = sample.length < points.length;
  const steps = refine ? 10 : 9;
  for (const kg1 of [scale / 3, scale, scale * 3]) {
    for (const kpFactor of [3, 10, 30]) {
      progress?.(started++, steps);
      const start = [Math.log(muGuess), 1.4, Math.log(Math.min(Math.max(kg1, 11), 9e4)), Math.log(Math.min(kpFactor * muGuess, 4000)), Math.log(300)];
      const res = levenbergMarquardt(startResiduals, start, { lower, upper, maxIterations });
      if (Number.isFinite(res.cost) && korenParamsProblem(toParams(res.x)) === null && (!best || res.cost < best.cost)) best = res;
    }
  }
  if (refine && best) {
    progress?.(started++, steps);
    // From a good start, a drop below a part in 10⁷ of the sum of squares no longer moves a curve visibly.
    const res = levenbergMarquardt(residualsOver(points), best.x, { lower, upper, maxIterations, relTol: REFINE_REL_TOL });
    if (Number.isFinite(res.cost) && korenParamsProblem(toParams(res.x)) === null) best = res;
  }
  progress?.(steps, steps);
  if (!best) return fail('no-convergence', 'No set of Koren parameters could be fitted to these values; check the units (V, V, A)');
  const params = toParams(best.x);
  const errors = fitErrors(params, points, typical).sort((a, b) => Math.abs(b.errorPercent) - Math.abs(a.errorPercent));
  const rmsPercent = Math.sqrt(errors.reduce((s, e) => s + e.errorPercent * e.errorPercent, 0) / Math.max(errors.length, 1));
  return {
    ok: true,
    params,
    rmsPercent,
    worst: errors[0] ?? { index: -1, label: 'none', errorPercent: 0 },
    errors,
    converged: best.converged,
    ...(best.converged ? {} : { warning: 'The fit stopped before converging: this is the best result found. Check the points for typing slips.' }),
  };
}

function fitErrors(params: KorenTriodeParams, points: readonly CurvePoint[], typical: readonly TypicalPoint[]): FitPointError[] {
  const out: FitPointError[] = points.map((p, index) => {
    const ia = korenPlateCurrent(params, p.va, p.vg);
    const errorPercent = p.ia >= FLOOR_A ? (ia / p.ia - 1) * 100 : ((ia - p.ia) / FLOOR_A) * 100;
    return { index, label: `${p.va} V, ${p.vg} V, ${(p.ia * 1e3).toPrecision(3)} mA`, errorPercent };
  });
  const m = triode(params);
  for (const t of typical) {
    const s = smallSignalAt(m, t.va, t.vg);
    const at = `at ${t.va} V/${t.vg} V`;
    out.push({ index: -1, label: `Ia ${at}`, errorPercent: (s.ia / t.ia - 1) * 100 });
    if (t.mu !== undefined) out.push({ index: -1, label: `mu ${at}`, errorPercent: (s.mu / t.mu - 1) * 100 });
    if (t.rp !== undefined) out.push({ index: -1, label: `rp ${at}`, errorPercent: (s.rp / t.rp - 1) * 100 });
    if (t.gm !== undefined) out.push({ index: -1, label: `gm ${at}`, errorPercent: (s.gm / t.gm - 1) * 100 });
  }
  return out;
}

/** mu from two curves: the plate-voltage shift between grid steps at equal current (the classic graphical estimate). */
function guessMu(points: readonly CurvePoint[]): number | null {
  const byGrid = new Map<number, CurvePoint[]>();
  for (const p of points) if (p.ia > FLOOR_A) byGrid.set(p.vg, [...(byGrid.get(p.vg) ?? []), p]);
  const grids = [...byGrid.keys()].sort((a, b) => b - a);
  if (grids.length < 2) return null;
  const at = (vg: number) => byGrid.get(vg)!.sort((a, b) => a.ia - b.ia);
  const a = at(grids[0]!);
  const b = at(grids[1]!);
  const target = Math.sqrt(a[0]!.ia * a[a.length - 1]!.ia);
  const vAt = (c: CurvePoint[]) => {
    for (let k = 1; k < c.length; k++) if (c[k]!.ia >= target) return c[k - 1]!.va + ((target - c[k - 1]!.ia) / (c[k]!.ia - c[k - 1]!.ia)) * (c[k]!.va - c[k - 1]!.va);
    return null;
  };
  const va = vAt(a);
  const vb = vAt(b);
  if (va === null || vb === null || grids[0] === grids[1]) return null;
  const mu = Math.abs((vb - va) / (grids[0]! - grids[1]!));
  return mu > 1 && mu < 300 ? mu : null;
}

/** A starting kg1 that puts the model's current at the largest point near the measured one (with ex = 1.4, kp large). */
function scaleGuess(points: readonly CurvePoint[], mu: number): number {
  const top = [...points].sort((a, b) => b.ia - a.ia)[0];
  if (!top || !(top.ia > 0)) return 1000;
  const e1 = Math.max(top.va / mu + top.vg, 0.5);
  return (2 * Math.pow(e1, 1.4)) / top.ia;
}
