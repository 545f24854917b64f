import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { cdetPolar } from '../../src/signal/complex';

/** A square complex matrix stored row by row with stride `w` (as the chain's network stores its equations), from rows of [re, im]. */
function stored(rows: [number, number][][], w = rows.length + 1) {
  const n = rows.length;
  const re = new Float64Array(n * w);
  const im = new Float64Array(n * w);
  rows.forEach((row, r) => row.forEach(([a, b], c) => {
    re[r * w + c] = a;
    im[r * w + c] = b;
  }));
  return { re, im, w };
}

const angle = (a: number) => Math.atan2(Math.sin(a), Math.cos(a));

/** Hadamard's bound over |det| (≥ 1 by Hadamard's inequality): how far the matrix is from orthogonal rows. */
function hadamardExcess(rows: [number, number][][], logAbsDet: number): number {
  const logBound = rows.reduce((sum, row) => sum + Math.log(Math.hypot(...row.flat())), 0);
  return Math.exp(logBound - logAbsDet);
}

describe('cdetPolar: a complex determinant in polar form', () => {
  it('a 2 × 2 worked by hand: det [[1+j, 2], [3, 4−j]] = (1+j)(4−j) − 6 = −1 + 3j', () => {
    const { re, im, w } = stored([[[1, 1], [2, 0]], [[3, 0], [4, -1]]]);
    const d = cdetPolar(re, im, w, [0, 1])!;
    expect(Math.exp(d.logAbs)).toBeCloseTo(Math.sqrt(10), 12);
    expect(angle(d.arg)).toBeCloseTo(Math.atan2(3, -1), 12);
  });

  it('a submatrix by its rows and columns, a row swap counted (det [[0, 1], [1, 0]] = −1), a singular one null, the matrix left as it was', () => {
    const { re, im, w } = stored([[[0, 0], [1, 0], [9, 9]], [[1, 0], [0, 0], [9, 9]], [[9, 9], [9, 9], [2, 0]]]);
    const before = Array.from(re);
    const d = cdetPolar(re, im, w, [0, 1])!;
    expect(Math.exp(d.logAbs)).toBeCloseTo(1, 12);
    expect(Math.abs(angle(d.arg))).toBeCloseTo(Math.PI, 12);
    expect(cdetPolar(re, im, w, [2])).toEqual({ logAbs: Math.log(2), arg: 0 });
    expect(Array.from(re)).toEqual(before);
    const singular = stored([[[1, 1], [2, 2]], [[2, 2], [4, 4]]]);
    expect(cdetPolar(singular.re, singular.im, singular.w, [0, 1])).toBeNull();
  });

  it('is multiplicative: det(AB) = det A · det B for random 3 × 3 complex matrices (property)', () => {
    const entry = fc.tuple(fc.double({ min: -5, max: 5, noNaN: true }), fc.double({ min: -5, max: 5, noNaN: true }));
    const matrix = fc.array(fc.array(entry, { minLength: 3, maxLength: 3 }), { minLength: 3, maxLength: 3 }) as fc.Arbitrary<[number, number][][]>;
    fc.assert(
      fc.property(matrix, matrix, (a, b) => {
        const ab = a.map((row, r) => b[0]!.map((_, c) => {
          let x = 0;
          let y = 0;
          for (let k = 0; k < 3; k++) {
            const [p, q] = a[r]![k]!;
            const [s, t] = b[k]![c]!;
            x += p * s - q * t;
            y += p * t + q * s;
          }
          return [x, y] as [number, number];
        }));
        const det = (m: [number, number][][]) => {
          const s = stored(m);
          return cdetPolar(s.re, s.im, s.w, [0, 1, 2]);
        };
        const [da, db, dab] = [det(a), det(b), det(ab)];
        if (!da || !db || !dab || da.logAbs < -20 || db.logAbs < -20) return; // far below this, forming AB underflows
        // Rounding in forming AB and in the elimination is about eps relative to the entries, so the
        // determinant's relative error grows as |det| falls below Hadamard's bound (the product of the
        // rows' lengths, which |det| never exceeds): a nearly singular pair is held only as far as
        // double precision can hold it, and a well-made pair far tighter than before.
        const tolerance = 1e-12 * (hadamardExcess(a, da.logAbs) + hadamardExcess(b, db.logAbs) + hadamardExcess(ab, dab.logAbs));
        expect(Math.abs(dab.logAbs - da.logAbs - db.logAbs)).toBeLessThan(tolerance);
        expect(Math.abs(angle(dab.arg - da.arg - db.arg))).toBeLessThan(tolerance);
      }),
      { numRuns: 300 },
    );
  });
});
