import { describe, expect, it } from 'vitest';
import { E12, E24, E96, nearestPreferred, preferredAround } from '../../src/index';

// IEC 60063:2015, tables of the E12, E24 and E96 series (one decade each). The
// values are typed here again from the standard, apart from the model's tables.
const IEC_E12 = '10 12 15 18 22 27 33 39 47 56 68 82';
const IEC_E24 = '10 11 12 13 15 16 18 20 22 24 27 30 33 36 39 43 47 51 56 62 68 75 82 91';
const IEC_E96_FIRST_AND_LAST = ['100 102 105 107 110 113 115 118 121 124', '866 887 909 931 953 976'];

const asInts = (xs: readonly number[], scale: number) => xs.map((x) => Math.round(x * scale)).join(' ');

describe('IEC 60063 preferred values', () => {
  it('E12 and E24 are the standard\'s tables', () => {
    expect(asInts(E12, 10)).toBe(IEC_E12);
    expect(asInts(E24, 10)).toBe(IEC_E24);
  });

  it('E96 has 96 values, starts and ends as the standard does, and each is 10^(n/96) to three figures', () => {
    expect(E96.length).toBe(96);
    const ints = asInts(E96, 100);
    expect(ints.startsWith(IEC_E96_FIRST_AND_LAST[0]!)).toBe(true);
    expect(ints.endsWith(IEC_E96_FIRST_AND_LAST[1]!)).toBe(true);
    E96.forEach((v, n) => expect(v).toBe(Number(Math.pow(10, n / 96).toPrecision(3))));
  });

  it('E24 keeps the historical values where the standard departs from 10^(n/24): 2.7 3.0 3.3 3.6 3.9 4.3 4.7 8.2', () => {
    const departures = E24.filter((v, n) => v !== Number(Math.pow(10, n / 24).toPrecision(2)));
    expect(departures).toEqual([2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 8.2]);
  });

  it('every E12 value is in E24 (the series nest)', () => {
    for (const v of E12) expect(E24).toContain(v);
  });

  it.each([
    [50e3, 'E12', 47e3], [50e3, 'E24', 51e3], [50e3, 'E96', 49.9e3], [1490, 'E12', 1500], [9.6e3, 'E24', 10e3],
    [0.0047e-6, 'E12', 4.7e-9], [123, 'E96', 124], [1, 'E12', 1], [270, 'E24', 270],
  ] as const)('%d in %s → %d', (v, series, expected) => {
    expect(nearestPreferred(v, series)).toBeCloseTo(expected, 15);
  });

  it('leaves values with no preferred value unchanged', () => {
    expect(nearestPreferred(0, 'E12')).toBe(0);
    expect(nearestPreferred(-5, 'E12')).toBe(-5);
    expect(nearestPreferred(Infinity, 'E12')).toBe(Infinity);
  });
});

describe('the preferred values around a value', () => {
  // IEC 60063 E12: … 39, 47, 56 …; E24: … 43, 47, 51 …
  it('is the nearest and its neighbours in the series, nearest first', () => {
    expect(preferredAround(50e3, 'E12')).toEqual([47e3, 56e3, 39e3]);
    expect(preferredAround(50e3, 'E24')).toEqual([51e3, 47e3, 56e3]);
    expect(preferredAround(1000, 'E12')).toEqual([1000, 1200, 820]);
  });
  it('a value with no preferred value comes back alone', () => {
    expect(preferredAround(0, 'E12')).toEqual([0]);
  });
});
