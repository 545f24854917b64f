import { describe, expect, it } from 'vitest';
import { designFor, findTube, plateCurrent, solveStage, tubeLibrary } from '../../src/index';
import { expectClose } from '../helpers/expectClose';

describe('designFor', () => {
  it('gives the Ra and Rk that solveStage puts back at the asked point within 0.1 %, for every library tube', () => {
    for (const tube of tubeLibrary) {
      const typ = tube.typical[0]!;
      // Targets the tube can reach with a negative grid: a share of what it passes at 0 V grid there.
      for (const [vaFrac, iaFrac] of [[0.5, 0.5], [0.8, 0.9], [0.6, 0.2]] as const) {
        const bplus = typ.va * 1.5;
        const va = typ.va * vaFrac;
        const ia = plateCurrent(tube, va, 0) * iaFrac;
        const d = designFor({ tube, bplus, va, ia });
        if (!d.ok) throw new Error(`${tube.id}: ${d.message}`);
        const s = solveStage({ tube, bplus, ra: d.ra, rk: d.rk });
        if (!s.ok) throw new Error(`${tube.id}: ${s.message}`);
        expectClose(s.op.va, va, { rel: 1e-3 }, `${tube.id} va`);
        expectClose(s.op.ia, ia, { rel: 1e-3 }, `${tube.id} ia`);
      }
    }
  });

  it('Ra is Ohm\'s law across the plate resistor: (B+ − Va)/Ia', () => {
    const d = designFor({ tube: findTube('12AX7')!, bplus: 300, va: 180, ia: 1.2e-3 });
    expect(d.ok && d.ra).toBeCloseTo(100e3, 6);
  });

  it('refuses a plate at or above B+', () => {
    expect(designFor({ tube: findTube('12AX7')!, bplus: 250, va: 260, ia: 1e-3 })).toEqual({
      ok: false,
      reason: 'supply-too-low',
      message: 'The plate cannot sit at 260.0 V: that is not below B+ 250.0 V.',
      field: 'va',
    });
  });

  it('refuses a current the tube cannot pass without grid current, and says the most it can', () => {
    const r = designFor({ tube: findTube('12AX7')!, bplus: 300, va: 100, ia: 20e-3 });
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.reason).toBe('unreachable');
      expect(r.message).toMatch(/^At 100\.0 V the tube passes at most \d+\.\d\d mA with 0 V on the grid; more would need grid current\.$/);
    }
  });
});
