import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { CATHODE_THERMAL_VOLTS, GRID_CURRENT_ONSET, findTube, gridCurrent, triode } from '../../src/index';
import { expectClose } from '../helpers/expectClose';
import { modelOf } from '../../src/tube/types';

const m = triode({ mu: 100, ex: 1.4, kg1: 1060, kp: 600, kvb: 300 }, 2000);

describe('grid current: Child–Langmuir past the onset, a retarding-field tail below it', () => {
  it('well past the onset it is the 3/2-power law measured from the onset: 1 V past draws 1 V / Rgrid (Child 1911, Langmuir 1913)', () => {
    expectClose(gridCurrent(m, GRID_CURRENT_ONSET + 1), 1 / 2000, { rel: 1e-4 });
    expectClose(gridCurrent(m, GRID_CURRENT_ONSET + 4) / gridCurrent(m, GRID_CURRENT_ONSET + 1), 8, { rel: 1e-4 }); // 4^1.5
  });

  it('below the onset it falls as exp(1.5 ΔV / Vt): the Maxwell–Boltzmann tail (Langmuir, Phys. Rev. 21, 1923)', () => {
    const a = gridCurrent(m, GRID_CURRENT_ONSET - 1);
    const b = gridCurrent(m, GRID_CURRENT_ONSET - 1 - CATHODE_THERMAL_VOLTS);
    expectClose(a / b, Math.exp(1.5), { rel: 1e-3 });
  });

  // ECC83 data sheets give the grid-current start as at most 0.3 µA at −1 V (from memory).
  it('a 12AX7 draws under 0.3 µA at −1 V and some at 0 V (data-sheet grid-current start, from memory)', () => {
    const tube = modelOf(findTube('12AX7')!);
    expect(gridCurrent(tube, -1)).toBeLessThan(0.3e-6);
    expect(gridCurrent(tube, -1)).toBeGreaterThan(0.01e-6);
    expect(gridCurrent(tube, 0)).toBeGreaterThan(10e-6);
  });

  it('it begins near −0.7 V, inside the −0.5 to −1 V of common practice', () => {
    expect(GRID_CURRENT_ONSET).toBeGreaterThanOrEqual(-1);
    expect(GRID_CURRENT_ONSET).toBeLessThanOrEqual(-0.5);
  });

  it('is finite, non-negative and rising for any grid voltage (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: -1e4, max: 1e4, noNaN: true }), fc.double({ min: 1e-6, max: 10, noNaN: true }), (v, dv) => {
        const a = gridCurrent(m, v);
        const b = gridCurrent(m, v + dv);
        return Number.isFinite(a) && a >= 0 && b >= a;
      }),
    );
    expect(gridCurrent(m, Number.NaN)).toBe(0);
  });
});
