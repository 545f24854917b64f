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
});
