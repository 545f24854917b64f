import { describe, expect, it } from 'vitest';
import { envelopesOf, findTube } from '../../src/index';

describe('envelopesOf', () => {
  it('two stages on one twin triode share an envelope and a heater; a third takes another (common practice)', () => {
    const ax7 = findTube('12AX7')!;
    expect(envelopesOf([ax7, ax7]).map((e) => [e.tube.id, e.sectionsUsed, e.envelopes])).toEqual([['12AX7', 2, 1]]);
    expect(envelopesOf([ax7, ax7, ax7])[0]!.envelopes).toBe(2);
  });

  it('single triodes take an envelope each; types are counted apart', () => {
    const t300b = findTube('300B')!;
    const au7 = findTube('12AU7')!;
    expect(envelopesOf([au7, t300b, t300b]).map((e) => [e.tube.id, e.envelopes])).toEqual([['12AU7', 1], ['300B', 2]]);
  });
});
