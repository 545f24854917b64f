import { describe, expect, it } from 'vitest';
import { parseCurveCsv, parseTypicalCsv } from '../../src/index';

describe('parseCurveCsv', () => {
  it('reads Va, Vg, Ia (mA) in any common separator, skipping a header and comments, into SI units', () => {
    const r = parseCurveCsv('Va,Vg,Ia\n100, -1, 0.5\n# a comment\n250;-2;1.2\n300\t-4\t0.3\n\n');
    expect(r.errors).toEqual([]);
    expect(r.points).toEqual([
      { va: 100, vg: -1, ia: 0.0005 },
      { va: 250, vg: -2, ia: 0.0012 },
      { va: 300, vg: -4, ia: 0.0003 },
    ]);
  });

  it('reports each bad line by number with its reason, and keeps the good ones', () => {
    const r = parseCurveCsv('100,-1,0.5\n100,-1\nabc,-1,2\n-5,0,1\n150,-2,-1\n200,1,3\n180,-2,0.9');
    expect(r.points).toHaveLength(2);
    expect(r.errors).toEqual([
      { line: 2, message: 'expected 3 numbers (Va V, Vg V, Ia mA), found 2' },
      { line: 3, message: '“abc” is not a number' },
      { line: 4, message: 'plate voltage must be above 0 V (got -5)' },
      { line: 5, message: 'plate current cannot be negative (got -1 mA)' },
      { line: 6, message: 'grid voltage above 0 V (1) is outside what the model fits' },
    ]);
  });
});

describe('parseTypicalCsv', () => {
  it('reads Va, Vg, Ia (mA), mu, rp (Ω), gm (mA/V) into SI units, with "-" for a figure not given', () => {
    const r = parseTypicalCsv('Va Vg Ia mu rp gm\n250, -8.5, 10.5, 17, 7700, 2.2\n100, 0, 11.8, -, 6500, 3.1');
    expect(r.errors).toEqual([]);
    expect(r.typical).toEqual([
      { va: 250, vg: -8.5, ia: 0.0105, mu: 17, rp: 7700, gm: 0.0022, source: 'entered by the user' },
      { va: 100, vg: 0, ia: 0.0118, rp: 6500, gm: 0.0031, source: 'entered by the user' },
    ]);
  });

  it('reports bad lines by number', () => {
    const r = parseTypicalCsv('250, -8.5\n250, -8.5, 0, 17\n250, x, 10, 17');
    expect(r.errors).toEqual([
      { line: 1, message: 'expected 3 to 6 values (Va, Vg, Ia mA, mu, rp Ω, gm mA/V), found 2' },
      { line: 2, message: 'plate current must be above 0 mA (got 0)' },
      { line: 3, message: '“x” is not a number' },
    ]);
  });
});
