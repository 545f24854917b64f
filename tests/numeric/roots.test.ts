import { describe, expect, it } from 'vitest';
import { bracketedRoot } from '../../src/numeric/bracketedRoot';
import { illinois } from '../../src/numeric/illinois';

describe('bracketed root finders', () => {
  it('Brent finds the cube root of 2 and reports convergence', () => {
    const r = bracketedRoot((x) => x * x * x - 2, 0, 2, 1e-14);
    expect(r.converged).toBe(true);
    expect(r.x).toBeCloseTo(Math.cbrt(2), 13);
  });

  it('Brent reports no sign change instead of guessing', () => {
    expect(bracketedRoot((x) => x * x + 1, -1, 1, 1e-12).converged).toBe(false);
  });

  it('Illinois finds ln 3 from eˣ = 3 in a few evaluations, staying in its bracket', () => {
    let calls = 0;
    const x = illinois((v) => {
      calls++;
      expect(v).toBeGreaterThanOrEqual(0);
      expect(v).toBeLessThanOrEqual(3);
      return Math.exp(v) - 3;
    }, 0, 3, 1e-13);
    expect(x).toBeCloseTo(Math.log(3), 12);
    expect(calls).toBeLessThan(20);
  });
});
