import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { corners, findTube, solveChain, type ChainInput } from '../../src/index';

// Properties of a series resistor before a grid, by the network's own laws: it adds resistance to what drives the
// grid's capacitance (Miller), so it can only lower the band's top; it carries no midband current into a grid that
// draws none to speak of, so it moves no operating point and hardly the midband gain; and a vanishing one is none.
const tubes = ['12AX7', '12AU7', '12AT7', '6SN7'].map((id) => findTube(id)!);

const stage = fc.record({
  tube: fc.constantFrom(...tubes),
  bplus: fc.double({ min: 200, max: 350, noNaN: true }),
  ra: fc.double({ min: 22e3, max: 220e3, noNaN: true }),
  rk: fc.double({ min: 680, max: 3.3e3, noNaN: true }),
  bypassed: fc.boolean(),
  rsource: fc.double({ min: 100, max: 100e3, noNaN: true }),
  rstopper: fc.double({ min: 1e3, max: 100e3, noNaN: true }),
});

describe('a grid stopper, for any gain stage', () => {
  it('lowers the top of its band and leaves the bottom where it was; a 1 mΩ one is none', () => {
    fc.assert(
      fc.property(stage, ({ rstopper, ...s }) => {
        const design = { ...s, rl: 470e3, rg: 1e6, cin: 100e-9, cout: 100e-9 };
        const bare = corners(design);
        const stopped = corners({ ...design, rstopper });
        const vanishing = corners({ ...design, rstopper: 1e-3 });
        // A design the model refuses (cut off, grid positive) is refused alike with or without a stopper.
        expect(stopped.ok).toBe(bare.ok);
        if (!bare.ok || !stopped.ok || !vanishing.ok) return;
        expect(bare.highHz).not.toBeNull();
        expect(stopped.highHz!).toBeLessThan(bare.highHz!);
        // The bottom stays where the coupling capacitor and leak put it, to 1 %: the grid's own slope, now behind the
        // stopper, loads the leak a hair less, and a top brought down toward it takes a little off the midband the
        // corners are read against.
        expect(Math.abs(stopped.lowHz! / bare.lowHz! - 1)).toBeLessThan(0.01);
        // 1 mΩ against at least 100 Ω driving the grid: at most a hundred-thousandth more drive, so the top within 1e-4.
        expect(Math.abs(vanishing.highHz! / bare.highHz! - 1)).toBeLessThan(1e-4);
      }),
      { numRuns: 60 },
    );
  });

  it('in a two-stage amplifier: the same operating points, a lower top, and a midband gain between the bare one and the grid\'s unloaded one', { timeout: 30_000 }, () => {
    fc.assert(
      fc.property(stage, ({ tube, bplus, ra, rk, bypassed, rsource, rstopper }) => {
        const input = (r: number): ChainInput => ({
          source: { rsource },
          stages: [
            { kind: 'common-cathode', tube, bplus, ra, rk, bypassed, rstopper: r, coupling: { kind: 'capacitor', cc: 100e-9, rg: 1e6 } },
            { kind: 'common-cathode', tube: tubes[1]!, bplus: 300, ra: 47e3, rk: 1500, bypassed: true, rstopper: r / 4, coupling: { kind: 'capacitor', cc: 100e-9, rg: 470e3 } },
          ],
        });
        const bare = solveChain(input(0));
        const stopped = solveChain(input(rstopper));
        // 1 GΩ in series: the grids' own conductance (their retarding-field current's slope) as good as cut off.
        const unloaded = solveChain(input(1e9));
        expect(stopped.ok).toBe(bare.ok);
        if (!bare.ok || !stopped.ok || !unloaded.ok) return;
        stopped.stages.forEach((st, i) => expect(st.op).toEqual(bare.stages[i]!.op));
        expect(stopped.highHz!).toBeLessThan(bare.highHz!);
        // A grid near its onset loads what drives it through its current's slope; the stopper sits in series with that
        // load, so the midband gain can only rise toward the gain with the grids unloaded (a 12AX7 near -0.7 V behind
        // 87 kΩ rises by more than 1 %).
        expect(Math.abs(stopped.gain)).toBeGreaterThanOrEqual(Math.abs(bare.gain) * (1 - 1e-12));
        expect(Math.abs(stopped.gain)).toBeLessThanOrEqual(Math.abs(unloaded.gain) * (1 + 1e-12));
      }),
      { numRuns: 40 },
    );
  });
});
