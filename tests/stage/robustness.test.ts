import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { designFor, solveFollower, solveStage, triode, tubeLibrary, type TubeLike } from '../../src/index';

const REASONS = ['invalid-input', 'invalid-tube', 'cutoff', 'grid-current', 'supply-too-low', 'unreachable', 'clipping', 'no-convergence'];

// Any double at all, weighted toward the ranges people type and the values that break code.
const anyNumber = fc.oneof(
  fc.double({ noNaN: false }),
  fc.double({ min: -1e4, max: 1e6, noNaN: true }),
  fc.constantFrom(0, -0, 1e-300, -1e-300, 1e308, Infinity, -Infinity, Number.NaN),
);
const tube: fc.Arbitrary<TubeLike> = fc.oneof(
  fc.constantFrom(...tubeLibrary),
  fc.record({
    mu: fc.double({ min: -10, max: 500, noNaN: true }),
    ex: fc.double({ min: 0, max: 4, noNaN: true }),
    kg1: fc.double({ min: -10, max: 1e5, noNaN: true }),
    kp: fc.double({ min: -10, max: 5000, noNaN: true }),
    kvb: fc.double({ min: -10, max: 1e5, noNaN: true }),
  }).map((p) => triode(p)),
);

/** Every number reachable in a result is finite or an honest ±Infinity, never NaN. */
function expectNoNaN(value: unknown, path = 'result'): void {
  if (typeof value === 'number') expect(Number.isNaN(value), path).toBe(false);
  else if (Array.isArray(value)) value.forEach((v, i) => expectNoNaN(v, `${path}[${i}]`));
  else if (value && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) expectNoNaN(v, `${path}.${k}`);
  }
}

function expectResultOrFailure(r: { ok: boolean } & Record<string, unknown>): void {
  if (r.ok) {
    expectNoNaN(r);
  } else {
    expect(REASONS).toContain(r.reason);
    expect(typeof r.message === 'string' && (r.message as string).length > 5).toBe(true);
    expect(r.message).not.toMatch(/NaN|undefined/);
  }
}

describe('the model never throws and never returns NaN for any input', () => {
  it('solveStage over thousands of random designs, absurd ones included', () => {
    fc.assert(
      fc.property(tube, anyNumber, anyNumber, anyNumber, fc.boolean(), fc.oneof(anyNumber, fc.constant(undefined)), fc.oneof(anyNumber, fc.constant(undefined)), (t, bplus, ra, rk, bypassed, rl, vbias) => {
        const r = solveStage({ tube: t, bplus, ra, rk, bypassed, rl, vbias });
        expectResultOrFailure(r as never);
        if (r.ok) {
          expect(r.op.ia).toBeGreaterThan(0);
          expect(r.op.vgk).toBeLessThanOrEqual(0);
          expect(Number.isFinite(r.gain) && Number.isFinite(r.zout)).toBe(true);
        }
      }),
      { numRuns: 4000 },
    );
  });

  it('solveStage over thousands of plausible designs always solves or names a physical reason', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...tubeLibrary),
        fc.double({ min: 10, max: 600, noNaN: true }),
        fc.double({ min: 1e3, max: 1e6, noNaN: true }),
        fc.double({ min: 0, max: 2e4, noNaN: true }),
        (t, bplus, ra, rk) => {
          const r = solveStage({ tube: t, bplus, ra, rk });
          if (!r.ok) expect(['cutoff', 'grid-current']).toContain(r.reason);
          else expectNoNaN(r);
        },
      ),
      { numRuns: 3000 },
    );
  });

  it('solveFollower and designFor over random input', () => {
    fc.assert(
      fc.property(tube, anyNumber, anyNumber, anyNumber, anyNumber, (t, a, b, c, d) => {
        expectResultOrFailure(solveFollower({ tube: t, bplus: a, vgrid: b, rk: c, rl: d }) as never);
        expectResultOrFailure(designFor({ tube: t, bplus: a, va: b, ia: c }) as never);
      }),
      { numRuns: 3000 },
    );
  });

  it('garbage in place of a design is a failure, not a crash', () => {
    for (const junk of [null, undefined, 42, 'x', {}, { tube: null }, { tube: { kind: 'tube' } }, { tube: { kind: 'triode-model', params: null } }]) {
      const r = solveStage(junk as never);
      expect(r.ok).toBe(false);
      expect(solveFollower(junk as never).ok).toBe(false);
      expect(designFor(junk as never).ok).toBe(false);
    }
  });
});
