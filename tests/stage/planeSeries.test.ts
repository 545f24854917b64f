import { describe, expect, it } from 'vitest';
import { dcLoadLine, findTube, plateCurrent, plateExtent, loadLineExtent, plateFamily, solveStage } from '../../src/index';
import { expectClose } from '../helpers/expectClose';
import { acLoadLine, biasLine, dissipationLimit, familyGrids } from '../../src/stage/planeSeries';
import { niceCeil } from '../../src/stage/plateExtent';

const ax7 = findTube('12AX7')!;

describe('plate-plane series', () => {
  it('the DC load line runs from B+/(Ra+Rk) on the current axis to B+ on the voltage axis', () => {
    expect(dcLoadLine(250, 101.5e3)).toEqual([{ v: 0, i: 250 / 101.5e3 }, { v: 250, i: 0 }]);
  });

  it('the AC load line passes through the operating point with slope −1/(Ra ∥ RL)', () => {
    const s = solveStage({ tube: ax7, bplus: 250, ra: 100e3, rk: 1500, rl: 220e3 });
    if (!s.ok) throw new Error(s.message);
    const rac = (100e3 * 220e3) / 320e3;
    const [a, b] = acLoadLine(s.op.vpk, s.op.ia, rac, 400);
    expectClose((b!.i - a!.i) / (b!.v - a!.v), -1 / rac, { rel: 1e-9 });
    expectClose(a!.i + (s.op.vpk - a!.v) * (-1 / rac), s.op.ia, { rel: 1e-9 });
  });

  it('the bias line passes through the operating point of the stage with that Rk', () => {
    const s = solveStage({ tube: ax7, bplus: 250, ra: 100e3, rk: 1500 });
    if (!s.ok) throw new Error(s.message);
    const line = biasLine(ax7, 1500, 0, 4e-3, 400, 400);
    for (const p of line) expectClose(plateCurrent(ax7, p.v, -p.i * 1500), p.i, { rel: 1e-6 });
    // The line rises to the right (more current, more negative grid, more plate voltage needed),
    // and the operating point lies between two neighbouring samples.
    const k = line.findIndex((p) => p.i > s.op.ia);
    expect(k).toBeGreaterThan(0);
    expect(line[k]!.v).toBeGreaterThan(line[k - 1]!.v);
    expect(s.op.vpk).toBeGreaterThan(line[k - 1]!.v);
    expect(s.op.vpk).toBeLessThan(line[k]!.v);
  });

  it('the dissipation limit is Ia = Pmax/Vpk everywhere on it', () => {
    const pts = dissipationLimit(1, 400, 10e-3);
    expect(pts.length).toBeGreaterThan(10);
    for (const p of pts) expectClose(p.v * p.i, 1, { rel: 1e-12 });
    expect(pts[0]!.i).toBeLessThanOrEqual(10e-3 + 1e-15);
  });

  it('grid steps suit the tube: fine for a 12AX7, coarse for a 300B', () => {
    const fine = familyGrids(ax7, 400);
    const coarse = familyGrids(findTube('300B')!, 500);
    expect(fine[0]).toBe(0);
    expect(Math.abs(fine[1]!)).toBeLessThanOrEqual(0.5);
    expect(Math.abs(coarse[1]!)).toBeGreaterThanOrEqual(10);
    expect(fine.length).toBeLessThanOrEqual(12);
    expect(fine.length).toBeGreaterThanOrEqual(5);
  });

  it('the family holds one monotonic curve per grid voltage', () => {
    const fam = plateFamily(ax7, [0, -1, -2], 400, 80);
    expect(fam.map((c) => c.vg)).toEqual([0, -1, -2]);
    for (const c of fam) {
      expect(c.points.length).toBe(81);
      for (let k = 1; k < c.points.length; k++) expect(c.points[k]!.i).toBeGreaterThanOrEqual(c.points[k - 1]!.i);
    }
  });

  it('the chart window depends on B+ and the ratings only, and ends on readable numbers', () => {
    expect(plateExtent(ax7, 250)).toEqual({ vmax: 400, iaMax: 0.008 });
    expect(niceCeil(333)).toBe(400);
    expect(niceCeil(0.0073)).toBe(0.008);
    expect(niceCeil(Number.NaN)).toBe(1);
    // A B+ near the largest number frames finitely (found by the robustness run: an infinite window).
    const huge = plateExtent('' as never, 1.36e308);
    expect(Number.isFinite(huge.vmax) && Number.isFinite(huge.iaMax)).toBe(true);
    expect(Number.isFinite(loadLineExtent(1.36e308, 1e3, 0).vmax)).toBe(true);
  });
});
