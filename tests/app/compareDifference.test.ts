import { describe, expect, it } from 'vitest';
import { difference } from '../../app/ui/panels/ComparePanel';

describe('comparison differences read right', () => {
  it('two shares differ in percentage points, not percent: 20 % → 9 % is −11 points', () => {
    const share = { show: (v: number) => `${v.toFixed(0)} %`, diff: 'points' as const };
    expect(difference(share, 20, 9)).toBe('−11 points');
    expect(difference(share, 9, 20)).toBe('+11 points');
  });

  it('quantities that scale differ by a ratio in percent', () => {
    expect(difference({ show: String, diff: 'ratio' }, 2, 3)).toBe('+50 %');
  });

  it('a change too small to show reads 0, without a sign (the EL34 against a 6L6GC at 21 % and 20.8 % of their screen ratings read "−0 points")', () => {
    const share = { show: (v: number) => `${v.toFixed(0)} %`, diff: 'points' as const };
    expect(difference(share, 21.1, 20.8)).toBe('0 points');
    expect(difference({ show: String, diff: 'ratio' }, 100, 99.8)).toBe('0 %');
    expect(difference({ show: String, diff: 'ratio' }, 100, 99.4)).toBe('−1 %');
  });
});
