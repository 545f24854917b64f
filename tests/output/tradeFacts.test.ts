import { describe, expect, it } from 'vitest';
import { analyzeOutput, findOutputTube, solveOutput, zPrimarySweep, type OutputDesign } from '../../src/index';

// Facts of the trade (common practice), checked on every pentode in the library.
const PENTODES = ['EL84', '6V6GT', 'EL34', '6L6GC', 'KT88', '6550'];
const design = (id: string, connection: OutputDesign['connection']): OutputDesign => ({
  tubeId: id, connection, bplus: 300, screenVolts: 280, ulTap: 0.4, zPrimary: 4000, rPrimary: 100,
  bias: 'cathode', rk: 250, vg: -20, rg: 220e3, speakerOhms: 8, thdLimit: 0.05,
});

describe('facts of the trade', () => {
  it.each(PENTODES)('a triode-connected %s has a lower output impedance than as a pentode, ultralinear in between', (id) => {
    const tube = findOutputTube(id)!;
    const rp = (c: OutputDesign['connection']) => {
      const s = solveOutput(tube, design(id, c));
      if (!s.ok) throw new Error(s.message);
      return s.op.rp;
    };
    const [p, u, t] = [rp('pentode'), rp('ultralinear'), rp('triode')];
    expect(t).toBeLessThan(u);
    expect(u).toBeLessThan(p);
  });

  it.each(PENTODES)('the %s damps the speaker better triode-connected', (id) => {
    const tube = findOutputTube(id)!;
    const df = (c: OutputDesign['connection']) => {
      const a = analyzeOutput(tube, design(id, c), { light: true });
      if (!a.ok) throw new Error(a.message);
      return a.dampingFactor;
    };
    expect(df('triode')).toBeGreaterThan(df('pentode'));
  });

  it.each([['EL34', 'pentode'], ['EL34', 'ultralinear'], ['6L6GC', 'pentode'], ['300B', 'triode'], ['2A3', 'triode']] as const)(
    'power at a distortion limit peaks at some primary impedance inside the sweep (%s, %s)',
    (id, connection) => {
      const tube = findOutputTube(id)!;
      const s = solveOutput(tube, { ...design(id, connection), bplus: id === '2A3' ? 250 : 300, rk: id === '2A3' ? 750 : id === '300B' ? 1000 : 250 });
      if (!s.ok) throw new Error(s.message);
      const sweep = zPrimarySweep(s, 0.05);
      if (!sweep.ok) throw new Error(sweep.message);
      const k = sweep.rows.indexOf(sweep.best);
      expect(k, sweep.rows.map((r) => `${r.zPrimary}:${r.power.toFixed(2)}`).join(' ')).toBeGreaterThan(0);
      expect(k).toBeLessThan(sweep.rows.length - 1);
      expect(sweep.best.power).toBeGreaterThan(sweep.rows[0]!.power * 1.2);
      expect(sweep.best.power).toBeGreaterThan(sweep.rows[sweep.rows.length - 1]!.power * 1.2);
    },
  );
});
