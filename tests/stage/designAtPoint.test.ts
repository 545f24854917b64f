import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { designAtPlanePoint, findTube, gridCurrent, gridVoltageAt, nearestReachable, plateCurrent, solveStage, tubeLibrary, tubeSummary } from '../../src/index';
import { leakLimit } from '../../src/stage/designAtPoint';
import { expectClose } from '../helpers/expectClose';
import { modelOf } from '../../src/tube/types';

const au7 = findTube('12AU7')!;

describe('designAtPlanePoint (the design under the pointer)', () => {
  it('gives Ra and Rk that solveStage puts back at the asked (Vpk, Ia) within 0.1 %', () => {
    for (const [vpk, ia] of [[150, 5e-3], [100, 2e-3], [220, 8e-3]] as const) {
      const d = designAtPlanePoint({ tube: au7, bplus: 300, vpk, ia });
      if (!d.ok) throw new Error(d.message);
      const s = solveStage({ tube: au7, bplus: 300, ra: d.ra, rk: d.rk });
      if (!s.ok) throw new Error(s.message);
      expectClose(s.op.vpk, vpk, { rel: 1e-3 }, 'vpk');
      expectClose(s.op.ia, ia, { rel: 1e-3 }, 'ia');
      expectClose(d.va, s.op.va, { rel: 1e-3 }, 'va');
    }
  });

  it('through a grid leak, the design the stage really sits at: its own grid current biases it by Ig·Rg (Ohm\'s law), Rk the rest', () => {
    const ax7 = findTube('12AX7')!;
    for (const [vpk, ia] of [[140, 0.85e-3], [180, 0.6e-3], [200, 0.5e-3]] as const) {
      const d = designAtPlanePoint({ tube: ax7, bplus: 250, vpk, ia, rg: 1e6 });
      if (!d.ok) throw new Error(d.message);
      const s = solveStage({ tube: ax7, bplus: 250, ra: d.ra, rk: d.rk, rg: 1e6 });
      if (!s.ok) throw new Error(s.message);
      expectClose(s.op.vpk, vpk, { rel: 1e-3 }, 'vpk');
      expectClose(s.op.ia, ia, { rel: 1e-3 }, 'ia');
    }
    // The highest grid a cathode-biased stage reaches through 1 MΩ: where the leak alone biases it (Rk = 0).
    const top = leakLimit(ax7, 1e6);
    expectClose(top, -1e6 * gridCurrent(modelOf(ax7), top), { abs: 1e-8 }, 'Vgk = −Rg·Ig');
    expect(top).toBeLessThan(-0.3);
    const above = designAtPlanePoint({ tube: ax7, bplus: 250, vpk: 100, ia: plateCurrent(ax7, 100, top) * 1.05, rg: 1e6 });
    expect(above).toMatchObject({ ok: false, reason: 'grid-current' });
    if (!above.ok) expect(above.message).toMatch(/through its 1 MΩ leak holds it 0\.\d\d V or more below its cathode\.$/);
    const reach = nearestReachable(ax7, 250, 100, 0.05, 1e6);
    if (!reach.ok) throw new Error(reach.message);
    expectClose(reach.ia, plateCurrent(ax7, 100, top), { rel: 1e-5 }, 'held on the leak\'s curve');
  });

  it('refuses a point above the 0 V grid curve, saying what the tube can pass there', () => {
    const r = designAtPlanePoint({ tube: au7, bplus: 300, vpk: 100, ia: 30e-3 });
    expect(r).toMatchObject({ ok: false, reason: 'grid-current' });
    if (!r.ok) expect(r.message).toMatch(/^At 100 V the tube passes at most \d+\.\d\d mA before its grid goes positive\.$/);
  });

  it('refuses a point the load line cannot reach from B+', () => {
    const r = designAtPlanePoint({ tube: au7, bplus: 200, vpk: 199, ia: 5e-3 });
    expect(r).toMatchObject({ ok: false, reason: 'supply-too-low', field: 'vpk' });
  });
});

describe('nearestReachable (where a drag may go)', () => {
  it('leaves a reachable point alone', () => {
    expect(nearestReachable(au7, 300, 150, 5e-3)).toEqual({ ok: true, vpk: 150, ia: 5e-3, reason: null });
  });

  it('drops a point above the 0 V curve onto it, with the reason', () => {
    const r = nearestReachable(au7, 300, 100, 30e-3);
    if (!r.ok) throw new Error(r.message);
    expectClose(r.ia, plateCurrent(au7, 100, 0), { rel: 1e-5 });
    expect(r.reason).toMatch(/grid would draw current/);
  });

  it('pulls a point beyond B+ back onto the reachable side, with the reason', () => {
    const r = nearestReachable(au7, 200, 260, 5e-3);
    if (!r.ok) throw new Error(r.message);
    expect(r.vpk).toBeLessThan(200);
    expect(r.reason).toMatch(/load line cannot reach further right/);
    expect(designAtPlanePoint({ tube: au7, bplus: 200, vpk: r.vpk, ia: r.ia }).ok).toBe(true);
  });

  it('always lands where a design exists, wherever the pointer goes (property)', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...tubeLibrary),
        fc.double({ min: 20, max: 600, noNaN: true }),
        fc.double({ min: -100, max: 1000, noNaN: true }),
        fc.double({ min: -0.1, max: 0.5, noNaN: true }),
        (tube, bplus, vpk, ia) => {
          const r = nearestReachable(tube, bplus, vpk, ia);
          if (!r.ok) throw new Error(r.message);
          const d = designAtPlanePoint({ tube, bplus, vpk: r.vpk, ia: r.ia });
          expect(d.ok, `${tube.id} ${bplus} ${vpk} ${ia} → ${JSON.stringify(r)} ${d.ok ? '' : d.message}`).toBe(true);
        },
      ),
      { numRuns: 2000 },
    );
  });
});

describe('gridVoltageAt (the hover readout)', () => {
  it('is the grid voltage whose plate curve passes through the cursor', () => {
    const vg = gridVoltageAt(au7, 200, 6e-3)!;
    expectClose(plateCurrent(au7, 200, vg), 6e-3, { rel: 1e-9 });
  });
  it('is null off the family (above the 0 V curve) or off the chart', () => {
    expect(gridVoltageAt(au7, 50, 0.2)).toBeNull();
    expect(gridVoltageAt(au7, -5, 1e-3)).toBeNull();
  });
});

describe('tubeSummary', () => {
  it('gives the 12AU7 figures near the Tung-Sol typical point (mu 20, rp 6 500 Ω, gm 3 100 µmho at 100 V, 0 V)', () => {
    const s = tubeSummary(au7);
    expectClose(s.mu, 20, { rel: 0.2 });
    expectClose(s.rp, 6500, { rel: 0.2 });
    expectClose(s.gm, 3.1e-3, { rel: 0.2 });
    expect(s.maxPlateDissipation).toBe(2.75);
  });
});
