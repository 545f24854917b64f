import { describe, expect, it } from 'vitest';
import { aWeighting } from '../../src/chain/aWeighting';

// IEC 61672-1:2013, table 3: the A-weighting's design goals at the nominal one-third-octave frequencies, dB (from memory;
// the standard is not in the project's reference folder), given at the exact base-ten frequencies behind the nominal ones,
// 1 kHz · 10^(n/10) (IEC 61260-1). The analytic curve meets them to the table's 0.1 dB.
const TABLE: [string, number, number][] = [
  ['20', -17, -50.5], ['31.5', -15, -39.4], ['63', -12, -26.2], ['100', -10, -19.1], ['125', -9, -16.1], ['250', -6, -8.6], ['500', -3, -3.2],
  ['1000', 0, 0], ['2000', 3, 1.2], ['4000', 6, 1.0], ['8000', 9, -1.1], ['10000', 10, -2.5], ['16000', 12, -6.6], ['20000', 13, -9.3],
];

describe('the A-weighting curve (IEC 61672-1)', () => {
  it.each(TABLE)('at %s Hz (nominal) reads the table\'s dB', (_nominal, n, db) => {
    const f = 1000 * Math.pow(10, n / 10);
    expect(Math.abs(20 * Math.log10(aWeighting(f)) - db)).toBeLessThanOrEqual(0.1);
  });
});
