import { expect } from 'vitest';

/**
 * Float comparison with an explicit tolerance: passes when
 * |actual − expected| ≤ max(abs, rel·|expected|). Say which one you mean;
 * the default is exact to 1e-12 relative, so a missing tolerance fails loudly.
 */
export function expectClose(actual: number, expected: number, tol: { rel?: number; abs?: number } = {}, label = ''): void {
  const rel = tol.rel ?? 1e-12;
  const abs = tol.abs ?? 0;
  const allowed = Math.max(abs, rel * Math.abs(expected));
  const diff = Math.abs(actual - expected);
  expect(Number.isFinite(actual), `${label} is not finite: ${actual}`).toBe(true);
  expect(diff, `${label} ${actual} vs ${expected}: off by ${diff.toPrecision(3)}, allowed ${allowed.toPrecision(3)}`).toBeLessThanOrEqual(allowed);
}

/** Relative error in percent, for messages. */
export const relErr = (actual: number, expected: number) => ((actual - expected) / expected) * 100;
