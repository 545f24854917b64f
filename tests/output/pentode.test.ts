import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { korenPentode } from '../../src/index';
import { expectClose } from '../helpers/expectClose';

// Koren's published pentode constants (errata Table 1, shared reference § 15).
const KOREN_EL34 = { mu: 11, ex: 1.35, kg1: 650, kp: 60, kvb: 24, kg2: 4200 };
const KOREN_6L6GC = { mu: 8.7, ex: 1.35, kg1: 1460, kp: 48, kvb: 12, kg2: 4500 };

describe("Koren's pentode law", () => {
  // Expected values: the published formula evaluated by hand (a Python one-liner outside
  // this code base) with the Table 1 constants; D in the reference file's terms.
  it('gives the hand-evaluated EL34 currents at 250 V / 250 V / -13.5 V', () => {
    const c = korenPentode(KOREN_EL34, 250, -13.5, 250);
    expectClose(c.ia, 0.0969617, { rel: 1e-5 }, 'Ia');
    expectClose(c.ig2, 0.00478189, { rel: 1e-5 }, 'Ig2');
  });

  it('gives the hand-evaluated 6L6GC currents at 250 V / 250 V / -14 V', () => {
    const c = korenPentode(KOREN_6L6GC, 250, -14, 250);
    expectClose(c.ia, 0.0809840, { rel: 1e-5 }, 'Ia');
    expectClose(c.ig2, 0.00839625, { rel: 1e-5 }, 'Ig2');
  });

  it('puts the knee where the arctangent says: half the far current at Va = kvb', () => {
    const far = korenPentode(KOREN_EL34, 1e7, -10, 250).ia;
    expectClose(korenPentode(KOREN_EL34, KOREN_EL34.kvb, -10, 250).ia, far / 2, { rel: 1e-5 }, 'Ia at the knee');
  });

  it('draws no current with no screen voltage, none in the plate at 0 V, and no screen current past cutoff', () => {
    expect(korenPentode(KOREN_EL34, 250, -5, 0)).toEqual({ ia: 0, ig2: 0 });
    expect(korenPentode(KOREN_EL34, 0, -5, 250).ia).toBe(0);
    expect(korenPentode(KOREN_EL34, 250, -30, 250).ig2).toBe(0);
  });

  it('is finite, non-negative and rises with grid and screen for any finite input (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: -1e4, max: 1e4, noNaN: true }), fc.double({ min: -500, max: 50, noNaN: true }), fc.double({ min: -1e4, max: 1e4, noNaN: true }), (va, vg1, vg2) => {
        const a = korenPentode(KOREN_EL34, va, vg1, vg2);
        const b = korenPentode(KOREN_EL34, va, vg1 + 1, vg2 + 1);
        for (const x of [a.ia, a.ig2, b.ia, b.ig2]) expect(Number.isFinite(x) && x >= 0).toBe(true);
        expect(b.ia).toBeGreaterThanOrEqual(a.ia);
        expect(b.ig2).toBeGreaterThanOrEqual(a.ig2);
      }),
    );
  });
});
