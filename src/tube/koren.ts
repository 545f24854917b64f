import type { KorenTriodeParams } from './types';
import { shown } from '../shown';

/**
 * Koren's triode law (N. Koren, Glass Audio vol. 8, 1996; form as in his
 * errata file, Table 1 constants):
 *
 *   E1 = (Vpk/kp) · ln(1 + exp(kp · (1/mu + Vgk/√(kvb + Vpk²))))
 *   Ia = 2 · E1^ex / kg1          for E1 > 0, else 0
 *
 * The factor 2 matters: Koren's kg1 values assume it (a worked textbook
 * example, 1.07 mA at 221 V / -1.61 V for his 12AX7 set, confirms this form).
 */

/** ln(1 + eˣ) without overflow for large x or lost precision for very negative x. */
function softplus(x: number): number {
  return x > 30 ? x + Math.log1p(Math.exp(-x)) : Math.log1p(Math.exp(x));
}


/** Plate current in A at plate–cathode voltage vpk and grid–cathode voltage vgk (V). Never negative, never NaN. */
export function korenPlateCurrent(p: KorenTriodeParams, vpk: number, vgk: number): number {
  if (!(vpk > 0) || !Number.isFinite(vgk)) return 0;
  const s = Math.sqrt(p.kvb + vpk * vpk);
  const e1 = (vpk / p.kp) * softplus(p.kp * (1 / p.mu + vgk / s));
  if (!(e1 > 0)) return 0;
  const ia = (2 * Math.pow(e1, p.ex)) / p.kg1;
  return Number.isFinite(ia) ? ia : 0;
}

/** Plate current and its two partial derivatives at one point. */
export interface PlateSlopes {
  /** Plate current, A. */
  readonly ia: number;
  /** Transconductance ∂Ia/∂Vgk, A/V (siemens). */
  readonly gm: number;
  /** Plate conductance ∂Ia/∂Vpk, A/V; rp = 1/ga. */
  readonly ga: number;
}

/**
 * Analytic partial derivatives of Koren's law (chain rule through E1), so that
 * mu, rp and gm are exact for the model and cost one exp/log each; numeric
 * differences would lose digits deep in cutoff where the current is tiny.
 *
 *   ∂E1/∂Vgk = Vpk · σ(x) / s
 *   ∂E1/∂Vpk = softplus(x)/kp − σ(x) · Vgk · Vpk² / s³
 *   ∂Ia/∂E1  = 2 · ex · E1^(ex−1) / kg1
 * with s = √(kvb + Vpk²), x = kp·(1/mu + Vgk/s), σ the logistic function.
 */
export function korenSlopes(p: KorenTriodeParams, vpk: number, vgk: number): PlateSlopes {
  const out = { ia: 0, gm: 0, ga: 0 };
  korenSlopesInto(p, vpk, vgk, out);
  return out;
}

/**
 * korenSlopes writing into a caller's object, for the inner loops that solve
 * thousands of samples (a distortion cycle): no allocation per call.
 */
export function korenSlopesInto(p: KorenTriodeParams, vpk: number, vgk: number, out: { ia: number; gm: number; ga: number }): void {
  out.ia = 0;
  out.gm = 0;
  out.ga = 0;
  if (!(vpk > 0) || !Number.isFinite(vgk)) return;
  const s = Math.sqrt(p.kvb + vpk * vpk);
  const x = p.kp * (1 / p.mu + vgk / s);
  // softplus and the logistic σ(x) from one exponential, e^−|x| (no overflow either side):
  // ln(1 + eˣ) = max(x, 0) + ln(1 + e^−|x|), and σ(x) = 1/(1 + e^−x) or e^x/(1 + e^x).
  const t = Math.exp(-Math.abs(x));
  const sp = Math.max(x, 0) + Math.log1p(t);
  const sig = x >= 0 ? 1 / (1 + t) : t / (1 + t);
  const e1 = (vpk / p.kp) * sp;
  if (!(e1 > 0)) return;
  const powEx1 = Math.pow(e1, p.ex - 1);
  const ia = (2 * powEx1 * e1) / p.kg1;
  const dIdE = (2 * p.ex * powEx1) / p.kg1;
  const gm = (dIdE * vpk * sig) / s;
  const ga = dIdE * (sp / p.kp - (sig * vgk * vpk * vpk) / (s * s * s));
  if (!Number.isFinite(ia) || !Number.isFinite(gm) || !Number.isFinite(ga)) return;
  out.ia = ia;
  out.gm = gm;
  out.ga = ga;
}

/**
 * The grid voltage at which Koren's law puts the tube at cutoff for a given
 * plate voltage: where 1/mu + Vgk/√(kvb + Vpk²) = 0. Below it the current
 * falls off exponentially.
 */
export function cutoffGridVoltage(p: KorenTriodeParams, vpk: number): number {
  // √(kvb + Vpk²) as a hypotenuse: squaring a plate voltage past 1.3e154 V overflows to Infinity.
  return -Math.hypot(Math.sqrt(p.kvb), vpk) / p.mu;
}

/** A plate current this small a share of the operating current counts as cut off (this project's convention). */
export const CUTOFF_FRACTION = 0.01;

/**
 * The grid voltage at which the plate current, at fixed Vpk, equals
 * `targetIa`: Newton steps on the analytic gm, kept inside a bracket from 0 V
 * down to a grid far enough negative that softplus's argument is −30 (the
 * current there is below e⁻³⁰ of the knee value); a step that leaves the
 * bracket bisects instead. Runs on every drag move, so it must be quick:
 * a handful of evaluations where plain bisection took eighty.
 */
export function gridVoltageForCurrent(p: KorenTriodeParams, vpk: number, targetIa: number): number {
  const s = Math.sqrt(p.kvb + vpk * vpk);
  let lo = -s * (1 / p.mu + 30 / p.kp);
  let hi = 0;
  if (!(targetIa > 0) || korenPlateCurrent(p, vpk, hi) <= targetIa) return hi;
  const k = { ia: 0, gm: 0, ga: 0 };
  let x = 0.5 * (lo + hi);
  for (let i = 0; i < 100; i++) {
    korenSlopesInto(p, vpk, x, k);
    const f = k.ia - targetIa;
    if (f > 0) hi = x;
    else lo = x;
    let next = k.gm > 0 ? x - f / k.gm : 0.5 * (lo + hi);
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
    const step = Math.abs(next - x);
    x = next;
    if (step < 1e-12 * Math.max(1, Math.abs(x)) || hi - lo < 1e-12) break;
  }
  return x;
}

/** True when the parameters describe a physical tube (the checks solvers run before using a model). */
export function korenParamsProblem(p: KorenTriodeParams): string | null {
  const { mu, ex, kg1, kp, kvb } = p;
  if (![mu, ex, kg1, kp, kvb].every(Number.isFinite)) return 'tube parameters must all be finite numbers';
  if (!(mu > 0)) return `mu must be above 0 (got ${shown(mu)})`;
  if (!(ex > 0.5 && ex < 3)) return `ex must be between 0.5 and 3 (got ${shown(ex)})`;
  if (!(kg1 > 0)) return `kg1 must be above 0 (got ${shown(kg1)})`;
  if (!(kp > 0)) return `kp must be above 0 (got ${shown(kp)})`;
  if (!(kvb >= 0)) return `kvb must be 0 or more (got ${shown(kvb)})`;
  return null;
}
