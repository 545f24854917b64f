/**
 * Koren's pentode law (N. Koren, "Improved vacuum tube models for SPICE
 * simulations", Glass Audio vol. 8, 1996; constants from his errata file,
 * Table 1). Voltages are to the cathode:
 *
 *   E1  = (Vg2/kp) · ln(1 + exp(kp · (1/mu + Vg1/Vg2)))
 *   Ia  = 2 · E1^ex / kg1 · atan(Va/kvb)            for E1 > 0
 *   Ig2 = (Vg1 + Vg2/mu)^ex / kg2                    for Vg1 + Vg2/mu > 0
 *
 * mu is the grid-1-to-screen amplification factor. The plate voltage enters
 * only through the arctangent, which makes the knee and the (high) plate
 * resistance above it. The screen current does not rise as the plate swings
 * below the knee, as a real screen's does: screen figures are the quiescent
 * ones and read low near full drive (said on screen and in DEVELOPERS.md).
 */
export interface KorenPentodeParams {
  readonly mu: number;
  readonly ex: number;
  readonly kg1: number;
  /** Screen-current scale (A⁻¹·V^ex). */
  readonly kg2: number;
  readonly kp: number;
  /** Knee voltage scale of the arctangent, V (not V² as in the triode law). */
  readonly kvb: number;
}

export interface ElectrodeCurrents {
  /** Plate current, A. */
  ia: number;
  /** Screen-grid current, A. */
  ig2: number;
}

function softplus(x: number): number {
  return x > 30 ? x + Math.log1p(Math.exp(-x)) : Math.log1p(Math.exp(x));
}

/** Plate and screen currents in A; zero where the law gives none, never NaN. */
export function korenPentodeInto(p: KorenPentodeParams, va: number, vg1: number, vg2: number, out: ElectrodeCurrents): void {
  out.ia = 0;
  out.ig2 = 0;
  if (!(vg2 > 0) || !Number.isFinite(vg1) || !Number.isFinite(va)) return;
  const e1 = (vg2 / p.kp) * softplus(p.kp * (1 / p.mu + vg1 / vg2));
  if (e1 > 0 && va > 0) {
    const ia = ((2 * Math.pow(e1, p.ex)) / p.kg1) * Math.atan(va / p.kvb);
    if (Number.isFinite(ia)) out.ia = ia;
  }
  const drive = vg1 + vg2 / p.mu;
  if (drive > 0) {
    const ig2 = Math.pow(drive, p.ex) / p.kg2;
    if (Number.isFinite(ig2)) out.ig2 = ig2;
  }
}

export function korenPentode(p: KorenPentodeParams, va: number, vg1: number, vg2: number): ElectrodeCurrents {
  const out = { ia: 0, ig2: 0 };
  if (typeof p !== 'object' || p === null || pentodeParamsProblem(p) !== null) return out;
  korenPentodeInto(p, va, vg1, vg2, out);
  if (!Number.isFinite(out.ia) || !Number.isFinite(out.ig2)) return { ia: 0, ig2: 0 };
  return out;
}

/** Why a parameter set cannot be used, or null when it can. */
export function pentodeParamsProblem(p: KorenPentodeParams): string | null {
  const entries = Object.entries(p) as [string, number][];
  for (const [k, v] of entries) if (!Number.isFinite(v) || !(v > 0)) return `Koren pentode parameter ${k} must be a positive number`;
  return null;
}
