import { describe, expect, it } from 'vitest';
import { fileStem } from '../../../app/export/download';

describe('a file name from the design title', () => {
  it('is cut between words at 60 characters at most', () => {
    const stem = fileStem('4-stage amplifier: 12AX7 → 12AU7 → 12AU7 split-load phase splitter → EL34 push-pull output');
    expect(stem).toBe('4-stage-amplifier-12ax7-12au7-12au7-split-load-phase');
    expect(stem.length).toBeLessThanOrEqual(60);
  });

  it('keeps a short title whole, cuts a single long word at 60, and names a title with no letters', () => {
    expect(fileStem('12AU7 voltage stage, B+ 275 V')).toBe('12au7-voltage-stage-b-275-v');
    expect(fileStem('x'.repeat(80))).toBe('x'.repeat(60));
    expect(fileStem('→ → →')).toBe('quiescent-design');
  });
});
