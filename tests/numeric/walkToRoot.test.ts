import { describe, expect, it } from 'vitest';
import { walkToRoot } from '../../src/numeric/walkToRoot';

// Hand algebra: the roots of straight lines and of a resistor's drop against a current that saturates.
describe('a root found by walking from a start, then Brent\'s method', () => {
  it('walks up where the function is positive and down where it is negative', () => {
    expect(walkToRoot((x) => 3 - x, 0, 0.5, -10, 10, 1e-12)).toBeCloseTo(3, 10);
    expect(walkToRoot((x) => 3 - x, 8, 0.5, -10, 10, 1e-12)).toBeCloseTo(3, 10);
  });

  it('finds the root nearest the start on its side, not a farther one', () => {
    // (x − 1)(x − 4): positive at 0.5 would walk up; negative at 2 walks down, so from 2 the root at 1.
    const f = (x: number) => -(x - 1) * (x - 4);
    expect(walkToRoot(f, 2, 0.25, 0, 10, 1e-12)).toBeCloseTo(4, 10);
    expect(walkToRoot((x) => (x - 1) * (x - 4), 2, 0.25, 0, 10, 1e-12)).toBeCloseTo(1, 10);
  });

  it('settles a bias: V = R·I(V) for a current falling with the bias (Ohm\'s law on 1 kΩ and 10 mA·e^(−V/5))', () => {
    const v = walkToRoot((x) => 1000 * 0.01 * Math.exp(-x / 5) - x, 1, 0.5, 0, 100, 1e-9);
    if (v === null) throw new Error("no root found");
    expect(Math.abs(1000 * 0.01 * Math.exp(-v / 5) - v)).toBeLessThan(1e-8);
  });

  it('returns the start where it is the root, and null where the walk meets a bound without a change of sign', () => {
    expect(walkToRoot((x) => x - 2, 2, 1, 0, 10, 1e-9)).toBe(2);
    expect(walkToRoot((x) => x - 3, 5, 1, 0, 10, 1e-9)).toBeNull();
    expect(walkToRoot(() => 1, 0, 1e-3, 0, 1e9, 1e-9)).toBeNull();
  });
});
