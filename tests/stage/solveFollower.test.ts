import { describe, expect, it } from 'vitest';
import { findTube, plateCurrent, solveFollower, solveStage, tubeLibrary } from '../../src/index';
import { expectClose } from '../helpers/expectClose';

describe('solveFollower (direct-coupled cathode follower)', () => {
  const ax7 = findTube('12AX7')!;

  it('sits on its loop: Vk = Ia·Rk, Vgk = Vgrid − Vk, plate at B+, on the plate curve', () => {
    const f = solveFollower({ tube: ax7, bplus: 300, vgrid: 150, rk: 100e3 });
    if (!f.ok) throw new Error(f.message);
    expect(f.op.va).toBe(300);
    expectClose(f.op.vk, f.op.ia * 100e3, { rel: 1e-9 });
    expectClose(f.op.vgk, 150 - f.op.vk, { rel: 1e-9 });
    expectClose(plateCurrent(ax7, f.op.vpk, f.op.vgk), f.op.ia, { rel: 1e-6 });
  });

  it('gain is below 1 and positive, and output impedance is near 1/gm (common practice)', () => {
    for (const tube of tubeLibrary.filter((t) => t.model.params.mu > 15)) {
      const typ = tube.typical[0]!;
      // Cathode near the grid at half the typical plate voltage: about half the typical current.
      const rk = typ.va / typ.ia;
      const f = solveFollower({ tube, bplus: typ.va * 1.5, vgrid: typ.va * 0.5, rk });
      if (!f.ok) throw new Error(`${tube.id}: ${f.message}`);
      expect(f.gain, tube.id).toBeGreaterThan(0.8);
      expect(f.gain, tube.id).toBeLessThan(1);
      // rp/(mu+1) ∥ Rk ≈ 1/gm when mu ≫ 1 and Rk ≫ 1/gm: within 10 %.
      expectClose(f.zout, 1 / f.gm, { rel: 0.1 }, `${tube.id} zout`);
    }
  });

  it('reports the heater-to-cathode voltage and flags it past the rating (12AX7: 180 V, Tung-Sol 1947)', () => {
    const f = solveFollower({ tube: ax7, bplus: 400, vgrid: 250, rk: 150e3 });
    if (!f.ok) throw new Error(f.message);
    expectClose(f.vhk, f.op.vk, { rel: 1e-12 });
    expect(f.vhk).toBeGreaterThan(180);
    expect(f.findings.find((x) => x.kind === 'heater-cathode')?.severity).toBe('danger');
    const raised = solveFollower({ tube: ax7, bplus: 400, vgrid: 250, rk: 150e3, heaterVolts: 125 });
    // Elevated by 125 V the heater-cathode voltage falls to about 126 V of 180 V (70 %): a note, no longer a danger.
    expect(raised.ok && raised.findings.find((x) => x.kind === 'heater-cathode')?.severity).toBe('note');
  });

  it('chained after a gain stage: the plate inverts, the follower does not (common practice)', () => {
    const s = solveStage({ tube: ax7, bplus: 300, ra: 100e3, rk: 1500 });
    if (!s.ok) throw new Error(s.message);
    const f = solveFollower({ tube: ax7, bplus: 300, vgrid: s.op.va, rk: 100e3 });
    if (!f.ok) throw new Error(f.message);
    expect(Math.sign(s.gain * f.gain)).toBe(-1);
  });

  it('rejects a zero cathode resistor with a specific message', () => {
    expect(solveFollower({ tube: ax7, bplus: 300, vgrid: 150, rk: 0 })).toEqual({
      ok: false,
      reason: 'invalid-input',
      message: 'Rk must be above 0 Ω (got 0 Ω)',
      field: 'rk',
    });
  });
});
