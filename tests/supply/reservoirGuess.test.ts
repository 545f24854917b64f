import { describe, expect, it } from 'vitest';
import { solveSupply } from '../../src/index';
import { reservoirGuess } from '../../src/supply/reservoirGuess';
import { expectClose } from '../helpers/expectClose';

describe('reservoirGuess: the reservoir behind a winding\u2019s resistance, a first guess at the steady state', () => {
  // The conduction-angle integral worked by hand at a = π/6 (the reservoir at half the peak, no diode drop):
  // I = Vpk / (2πR) · (2·cos(π/6) − sin(π/6)·(π − π/3)) = Vpk / (2πR) · (√3 − π/3) per pulse a cycle.
  it('solves the average diode current for the reservoir\u2019s voltage', () => {
    const peak = 100;
    const ohms = 1000;
    const load = (peak / (2 * Math.PI * ohms)) * (Math.sqrt(3) - Math.PI / 3);
    expectClose(reservoirGuess(peak, 0, ohms, load, 1), peak / 2, { rel: 1e-6 });
    // Two pulses a cycle (full wave) carry the same load from a higher reservoir.
    expect(reservoirGuess(peak, 0, ohms, load, 2)).toBeGreaterThan(peak / 2);
    // A stiff winding, or no load: the peak less the drop; a winding that cannot carry the load into 0 V: 0.
    expect(reservoirGuess(peak, 1, 0, load, 1)).toBe(99);
    expect(reservoirGuess(peak, 1, ohms, 0, 1)).toBe(99);
    expect(reservoirGuess(peak, 0, ohms, peak / ohms, 1)).toBe(0);
  });

  // From a guess at the peak less the drop, shooting did not converge here and the solver marched 1,430 cycles.
  it('a winding behind kilohms settles by shooting in a few cycles, where marching agrees', () => {
    const d = { mainsHz: 50, secondaryRms: 120, windingOhms: 5000, rectifier: { kind: 'silicon-half-wave' as const }, input: { kind: 'capacitor' as const, c: 47e-6 }, sections: [{ kind: 'rc' as const, r: 10e3, c: 47e-6 }], loads: [0, 0.5e-3] };
    const shot = solveSupply(d);
    const marched = solveSupply(d, { steady: 'marching' });
    if (!shot.ok || !marched.ok) throw new Error('unsolved');
    expect(shot.cycles).toBeLessThan(50);
    shot.nodes.forEach((n, k) => expectClose(n.dc, marched.nodes[k]!.dc, { rel: 1e-3 }));
  });
});
