import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { findTube, fitTriode, korenPublishedSets, plateCurrent, triode, type CurvePoint } from '../../src/index';
import { expectClose, relErr } from '../helpers/expectClose';
import { smallSignalAt } from '../../src/tube/triode';

/** A deterministic pseudo-random sequence (Park–Miller), so the noisy case repeats exactly. */
function seeded(seed: number) {
  let s = seed;
  return () => (s = (s * 16807) % 2147483647) / 2147483647;
}

function curvePoints(params = korenPublishedSets['12AU7']!): CurvePoint[] {
  const m = triode(params);
  const pts: CurvePoint[] = [];
  for (const vg of [0, -2, -4, -6, -8, -10, -12]) for (let k = 1; k <= 20; k++) {
    const ia = plateCurrent(m, 20 * k, vg);
    if (ia > 1e-5) pts.push({ va: 20 * k, vg, ia });
  }
  return pts;
}

describe('fitTriode', () => {
  it('gives back the parameters its points were made from, within 1 % (no noise)', () => {
    const truth = korenPublishedSets['12AU7']!;
    const r = fitTriode(curvePoints(truth));
    if (!r.ok) throw new Error(r.message);
    for (const k of ['mu', 'ex', 'kg1', 'kp', 'kvb'] as const) expectClose(r.params[k], truth[k], { rel: 0.01 }, k);
    expect(r.rmsPercent).toBeLessThan(0.1);
    expect(r.converged).toBe(true);
  });

  it('a dense set (6,000 noisy points) gives back its parameters as closely as a sparse one, and reports on every point', () => {
    const truth = korenPublishedSets['12AU7']!;
    const m = triode(truth);
    const rnd = seeded(7);
    const dense: CurvePoint[] = [];
    for (let k = 0; dense.length < 6000; k++) {
      const vg = -((k % 13) * 1);
      const va = 20 + ((k * 37) % 400);
      const ia = plateCurrent(m, va, vg);
      if (ia > 1e-5) dense.push({ va, vg, ia: ia * (1 + 0.01 * (2 * rnd() - 1)) });
    }
    let reports = 0;
    const r = fitTriode(dense, { onProgress: () => reports++ });
    if (!r.ok) throw new Error(r.message);
    for (const k of ['mu', 'ex'] as const) expectClose(r.params[k], truth[k], { rel: 0.01 }, k);
    expect(r.errors).toHaveLength(6000);
    expect(r.rmsPercent).toBeLessThan(1);
    expect(reports).toBe(11); // the nine starts on a subsample, the refinement on every point, the end
  });

  it('with 2 % noise on every current, the fitted curves stay within 3 % of the true ones', () => {
    const truth = korenPublishedSets['12AU7']!;
    const rnd = seeded(42);
    const noisy = curvePoints(truth).map((p) => ({ ...p, ia: p.ia * (1 + 0.02 * (2 * rnd() - 1)) }));
    const r = fitTriode(noisy);
    if (!r.ok) throw new Error(r.message);
    const fitted = triode(r.params);
    for (const p of curvePoints(truth)) {
      if (p.ia < 0.5e-3) continue; // the last fraction of a milliamp is where 2 % noise dominates
      expect(Math.abs(relErr(plateCurrent(fitted, p.va, p.vg), p.ia))).toBeLessThan(3);
    }
  });

  // Handbook: fitting only the published typical figures reproduces them within 10 %.
  it.each([
    ['12AX7', 'Tung-Sol 12AX7 (1947) p.1 (P)'],
    ['12AU7', 'Tung-Sol 12AU7 (1962) p.2 (P)'],
    ['6SN7', 'RCA data quoted in a secondary source (S); 90 V point from memory'],
  ])('%s: the figures of its data sheet (%s) come back within 10 %', (id) => {
    const tube = findTube(id)!;
    const r = fitTriode([], { typical: tube.typical });
    if (!r.ok) throw new Error(r.message);
    const m = triode(r.params);
    for (const t of tube.typical) {
      const s = smallSignalAt(m, t.va, t.vg);
      expect(Math.abs(relErr(s.ia, t.ia))).toBeLessThan(10);
      if (t.mu) expect(Math.abs(relErr(s.mu, t.mu))).toBeLessThan(10);
      if (t.rp) expect(Math.abs(relErr(s.rp, t.rp))).toBeLessThan(10);
      if (t.gm) expect(Math.abs(relErr(s.gm, t.gm))).toBeLessThan(10);
    }
  });

  it('names the worst-fitting point', () => {
    const pts = curvePoints();
    pts[7] = { ...pts[7]!, ia: pts[7]!.ia * 1.5 }; // a misread point
    const r = fitTriode(pts);
    if (!r.ok) throw new Error(r.message);
    expect(r.worst.index).toBe(7);
  });

  it.each([
    [[{ va: 100, vg: -1, ia: 1e-3 }], 'Too few values to fit five parameters: give at least 5 points or figures (got 1)'],
    [[100, 150, 200, 250, 300].map((va) => ({ va, vg: -2, ia: va * 1e-5 })), 'All the points are on one grid voltage (-2 V): give points from at least two plate curves so mu can be found'],
    [[0, -1, -2, -3, -4].map((vg) => ({ va: 200, vg, ia: (5 + vg) * 1e-3 })), 'All the points are at one plate voltage: give points along the curves (several plate voltages)'],
    [[{ va: -5, vg: 0, ia: 1e-3 }, ...Array(5).fill({ va: 100, vg: -1, ia: 1e-3 })], 'Point 1: plate voltage must be above 0 V (got -5 V)'],
  ] as const)('refuses degenerate input with a specific message: %#', (pts, message) => {
    expect(fitTriode(pts as CurvePoint[])).toEqual({ ok: false, reason: 'invalid-input', message });
  });

  it('never returns NaN or throws, whatever the points (property)', () => {
    fc.assert(
      fc.property(fc.array(fc.record({ va: fc.double({ min: 0.1, max: 1000, noNaN: true }), vg: fc.double({ min: -100, max: 0, noNaN: true }), ia: fc.double({ min: 0, max: 0.5, noNaN: true }) }), { minLength: 5, maxLength: 30 }), (pts) => {
        const r = fitTriode(pts, { maxIterations: 30 });
        if (r.ok) expect(Object.values(r.params).every(Number.isFinite) && Number.isFinite(r.rmsPercent)).toBe(true);
        else expect(r.message.length).toBeGreaterThan(10);
      }),
      { numRuns: 60 },
    );
  });
});
