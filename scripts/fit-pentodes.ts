/**
 * Fits Koren's pentode law to a datasheet's static figures (plate and screen
 * current, gm and plate resistance at one typical point, with the
 * grid-1-to-screen mu held at its published value) for the power tubes that
 * have no published Koren set. Run: npx tsx scripts/fit-pentodes.ts
 * Only static figures go in; the single-ended power and distortion the
 * tests compare against are predictions, not fitted.
 */
import { levenbergMarquardt } from '../src/fit/levenbergMarquardt';
import { korenPentode, type KorenPentodeParams } from '../src/tube/pentode';

interface StaticFigures {
  readonly id: string;
  readonly va: number;
  readonly vg2: number;
  readonly vg1: number;
  readonly ia: number;
  readonly ig2: number;
  readonly gm: number;
  readonly rp: number;
  readonly mu: number;
}

// From memory: Philips EL84 and EL34, RCA 6V6GT and 6L6GC data sheets, class A1
// characteristics. mu for EL34 and 6L6GC is Koren's (errata Table 1).
const TARGETS: StaticFigures[] = [
  { id: 'EL34', va: 250, vg2: 250, vg1: -13.5, ia: 100e-3, ig2: 14.9e-3, gm: 11e-3, rp: 15e3, mu: 11 },
  { id: '6L6GC', va: 250, vg2: 250, vg1: -14, ia: 72e-3, ig2: 5e-3, gm: 6e-3, rp: 22.5e3, mu: 8.7 },
  { id: 'EL84', va: 250, vg2: 250, vg1: -7.3, ia: 48e-3, ig2: 5.5e-3, gm: 11.3e-3, rp: 38e3, mu: 19 },
  { id: '6V6', va: 250, vg2: 250, vg1: -12.5, ia: 45e-3, ig2: 4.5e-3, gm: 4.1e-3, rp: 50e3, mu: 9.8 },
];

/** Koren's published sets (errata Table 1), weighed against the fit on the same figures. */
const KOREN: Record<string, KorenPentodeParams> = {
  EL34: { mu: 11, ex: 1.35, kg1: 650, kp: 60, kvb: 24, kg2: 4200 },
  '6L6GC': { mu: 8.7, ex: 1.35, kg1: 1460, kp: 48, kvb: 12, kg2: 4500 },
};

function paramsOf(x: readonly number[], mu: number): KorenPentodeParams {
  return { mu, ex: x[0]!, kg1: x[1]!, kp: x[2]!, kvb: x[3]!, kg2: x[4]! };
}

for (const t of TARGETS) {
  const residuals = (x: readonly number[]) => {
    const p = paramsOf(x, t.mu);
    const at = korenPentode(p, t.va, t.vg1, t.vg2);
    const h = 1e-3;
    const gm = (korenPentode(p, t.va, t.vg1 + h, t.vg2).ia - korenPentode(p, t.va, t.vg1 - h, t.vg2).ia) / (2 * h);
    const ga = (korenPentode(p, t.va + h, t.vg1, t.vg2).ia - korenPentode(p, t.va - h, t.vg1, t.vg2).ia) / (2 * h);
    return [at.ia / t.ia - 1, at.ig2 / t.ig2 - 1, gm / t.gm - 1, ga * t.rp - 1, 0.05 * (x[0]! / 1.35 - 1)];
  };
  const fit = levenbergMarquardt(residuals, [1.35, 1000, 60, 20, 4000], { lower: [1.2, 50, 5, 1, 100], upper: [1.6, 1e5, 1000, 500, 1e6] });
  const p = paramsOf(fit.x, t.mu);
  const r = residuals(fit.x).slice(0, 4).map((v) => `${(v * 100).toFixed(1)} %`);
  const koren = KOREN[t.id];
  const korenErrors = koren ? ` (Koren's set: ${residuals([koren.ex, koren.kg1, koren.kp, koren.kvb, koren.kg2]).slice(0, 4).map((v) => `${(v * 100).toFixed(1)} %`).join(', ')})` : '';
  console.log(t.id, JSON.stringify(Object.fromEntries(Object.entries(p).map(([k, v]) => [k, Number(v.toPrecision(6))]))), 'errors Ia, Ig2, gm, rp:', r.join(', '), korenErrors);
}
