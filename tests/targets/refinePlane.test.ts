import { describe, expect, it } from 'vitest';
import { refinePlane, SAFE_MARGIN } from '../../src/targets/refinePlane';

/**
 * The costly part of a region is worked out along each target's edge and
 * read between neighbours elsewhere. On fields whose edges are known (a
 * straight edge, a circle, a field with a hole no corner sees), every cell's
 * side must be the field's own, and the work must be a fraction of the cells.
 */
function run(nx: number, ny: number, field: (i: number, j: number) => number | null) {
  let calls = 0;
  const out = refinePlane(nx, ny, ['minPower'], (i, j) => {
    calls++;
    const m = field(i, j);
    return m === null ? null : { margins: { minPower: m }, values: { minPower: m }, exact: true };
  });
  return { out, calls };
}

describe('a plane worked out along its edges', () => {
  it('a straight edge: every cell on its own side, the edge worked out, a third of the cells or fewer', () => {
    const f = (i: number) => (i - 23.4) / 20;
    const { out, calls } = run(60, 40, f);
    for (let i = 0; i < 60; i++) for (let j = 0; j < 40; j++) expect(out[i]![j]!.margins.minPower! >= 0, `${i},${j}`).toBe(f(i) >= 0);
    // The cells between lattice columns on either side of the edge are worked out, not read across it.
    for (let j = 0; j < 40; j++) expect(out[23]![j]!.exact).toBe(true);
    expect(calls).toBeLessThan((60 * 40) / 3);
  });

  it('a circle: every cell on its own side; a linear field read between its corners exactly', () => {
    const f = (i: number, j: number) => (Math.hypot(i - 30, j - 20) - 12.5) / 30;
    const { out } = run(60, 40, f);
    for (let i = 0; i < 60; i++) for (let j = 0; j < 40; j++) expect(out[i]![j]!.margins.minPower! >= 0).toBe(f(i, j) >= 0);
    const g = (i: number, j: number) => 1 + 0.01 * i + 0.02 * j;
    const lin = run(60, 40, g).out;
    for (let i = 0; i < 60; i++) for (let j = 0; j < 40; j++) expect(lin[i]![j]!.margins.minPower!).toBeCloseTo(g(i, j), 12);
  });

  it('never reads across an unreachable cell or a corner near the edge', () => {
    const f = (i: number, j: number) => (i === 10 && j === 10 ? null : i < 30 ? SAFE_MARGIN / 2 : 1);
    const { out } = run(40, 20, f);
    expect(out[10]![10]).toBeNull();
    // Every cell round the unreachable one, and every cell whose corners sit within the safe margin, is worked out.
    for (let i = 8; i <= 12; i++) for (let j = 8; j <= 12; j++) if (i !== 10 || j !== 10) expect(out[i]![j]!.exact).toBe(true);
    for (let i = 0; i < 28; i++) for (let j = 0; j < 20; j++) if (out[i]![j]) expect(out[i]![j]!.exact).toBe(true);
  });
});
