import { describe, expect, it } from 'vitest';
import { analyzeOutput, analyzePushPull, findOutputTube, outputPartsList, outputTubeLibrary, pushPullPartsList, type OutputDesign, type PushPullDesign } from '../../src/index';
import { gridStopperFor } from '../../src/output/gridStopper';

const el34 = findOutputTube('EL34')!;
// Our own scenario: the demo's EL34 ultralinear.
const design: OutputDesign = { tubeId: 'EL34', connection: 'ultralinear', bplus: 330, screenVolts: 300, ulTap: 0.43, zPrimary: 3500, rPrimary: 130, bias: 'cathode', rk: 330, vg: -22, rg: 220e3, speakerOhms: 8, thdLimit: 0.05 };

describe('the output grid\'s stopper', () => {
  it('Miller (1920) by hand: Cin = Cgk + Cgp·(1 + gm·(rp ∥ Z)), and the corner 1/(2π·R·Cin)', () => {
    // EL34 capacitances as the record gives them (Koren's errata Table 1): Cgk 15 pF, Cgp 1 pF; gm 10 mA/V, rp 20 kΩ, Z 3.5 kΩ.
    const g = gridStopperFor({ cgk: 15e-12, cgp: 1e-12, cpk: 8e-12, source: 'test' }, 10e-3, 20e3, 3.5e3, 1e3);
    const gain = 10e-3 * ((20e3 * 3.5e3) / 23.5e3); // 29.79
    expect(g.inputCapacitance).toBeCloseTo(15e-12 + 1e-12 * (1 + gain), 18);
    expect(g.cornerHz).toBeCloseTo(1 / (2 * Math.PI * 1e3 * (16e-12 + gain * 1e-12)), 0);
    expect(g.cornerHz / 1e6).toBeCloseTo(3.48, 2);
  });

  it('is ordered at 1 kΩ on the single-ended and the pair\'s lists, its corner from the stage\'s own gm, rp and load', () => {
    const a = analyzeOutput(el34, design);
    if (!a.ok) throw new Error(a.message);
    const parts = outputPartsList(a, 'E24');
    expect(parts.resistors.find((r) => r.ref === 'Rst')?.preferred).toBe(1e3);
    const op = a.solution.op;
    expect(parts.gridStopper.inputCapacitance).toBeCloseTo(el34.capacitances.cgk + el34.capacitances.cgp * (1 + op.gm * ((op.rp * 3500) / (op.rp + 3500))), 18);
    const pair: PushPullDesign = { tubeId: 'EL34', connection: 'ultralinear', bplus: 430, screenVolts: 430, ulTap: 0.43, raa: 6600, rPrimary: 200, bias: 'fixed', rk: 220, vg: -40, rg: 220e3, speakerOhms: 8, thdLimit: 0.05 };
    const p = analyzePushPull(el34, pair);
    if (!p.ok) throw new Error(p.message);
    expect(pushPullPartsList(p, 'E24').resistors.find((r) => r.ref === 'Rst1, Rst2')?.preferred).toBe(1e3);
  });

  it('clears the band by far for every library output tube at its data sheet\'s single-ended point (the figures leave it out)', () => {
    for (const t of outputTubeLibrary) {
      const ex = t.singleEnded?.[0];
      if (!ex) continue;
      const a = analyzeOutput(t, { tubeId: t.id, connection: ex.connection, bplus: ex.va, screenVolts: ex.vg2 ?? ex.va, ulTap: 0.43, zPrimary: ex.load, rPrimary: 0, bias: 'fixed', rk: 1, vg: ex.vg1, rg: 100e3, speakerOhms: 8, thdLimit: 0.05 });
      if (!a.ok) throw new Error(`${t.id}: ${a.message}`);
      expect(outputPartsList(a, 'E24').gridStopper.cornerHz, t.id).toBeGreaterThan(1e6);
    }
  });
});
