import { describe, expect, it } from 'vitest';
import { analyzeOutput, atDrive, findOutputTube, settledCathode, solveOutput, type OutputDesign } from '../../src/index';
import { emptyCurrents, stageCurrentsInto } from '../../src/output/electrodes';
import { outputWithCathodeAt } from '../../src/output/solveOutput';
import { waveform } from '../../src/output/outputSignal';
import { expectClose } from '../helpers/expectClose';

// Our own design: the demo's EL34 stage, its screen on a supply of its own at 300 V.
const el34: OutputDesign = { tubeId: 'EL34', connection: 'pentode', bplus: 330, screenVolts: 300, ulTap: 0.43, zPrimary: 3500, rPrimary: 130, bias: 'cathode', rk: 330, vg: -22, rg: 220e3, speakerOhms: 8, thdLimit: 0.05 };
const settled = (d: OutputDesign) => {
  const s = solveOutput(findOutputTube(d.tubeId)!, d);
  if (!s.ok) throw new Error(s.message);
  const r = settledCathode(s);
  if (!r.ok) throw new Error(r.message);
  return { s, r };
};

describe('a single-ended stage\'s cathode resistor under full drive', () => {
  // Ohm's law on the DC the bypass capacitor leaves: the cathode settles at Rk times the cycle's average cathode
  // current, worked out here on 1024 points of the steady cycle at that bias (the model uses 64).
  it('settles where Rk drops the average cathode current at that drive', () => {
    const { s, r } = settled(el34);
    const there = outputWithCathodeAt(s, r.vk);
    if (!there.ok) throw new Error(there.message);
    const n = 1024;
    const w = waveform(there, r.vk, el34.zPrimary, n);
    const c = emptyCurrents();
    let sum = 0;
    for (let k = 0; k < n; k++) {
      stageCurrentsInto(there.tube, there.op.feed, w.vpk[k]!, -r.vk + r.vk * Math.sin((2 * Math.PI * k) / n), c, w.winding[k]!);
      sum += c.ik;
    }
    expectClose(r.vk, el34.rk * (sum / n), { rel: 1e-4 }, 'Vk = Rk·Īk');
    expectClose(r.full.drive, r.vk, { rel: 1e-9 }, 'the grid driven to 0 V at the settled bias');
  });

  // Common practice: a pentode's screen takes more current as the plate swings low, so its cathode climbs under drive
  // and the power with the grid at 0 V there is less than at the idle bias (ngspice agrees within 0.03 %,
  // settledCathode.spice.test.ts): 21.2 to 24.6 V and 11.75 to 10.24 W here.
  it('rises under drive in a pentode, and the power there falls', () => {
    const { s, r } = settled(el34);
    expect(r.idleVk).toBe(s.op.vk);
    expect(r.vk / s.op.vk).toBeGreaterThan(1.1);
    const held = atDrive(s, -s.op.vgk);
    if (!held.ok) throw new Error(held.message);
    expect(r.full.power).toBeLessThan(0.9 * held.power);
  });

  it('is carried by the full analysis, kept through a drag\'s light pass, and none under fixed bias', () => {
    const tube = findOutputTube('EL34')!;
    const full = analyzeOutput(tube, el34);
    if (!full.ok) throw new Error(full.message);
    expect(full.settledCathode?.vk).toBeCloseTo(settled(el34).r.vk, 6);
    const light = analyzeOutput(tube, { ...el34, rk: 300 }, { light: true, previous: full });
    if (!light.ok) throw new Error(light.message);
    expect(light.settledCathode).toBe(full.settledCathode);
    const fixed = analyzeOutput(tube, { ...el34, bias: 'fixed', vg: -22 });
    if (!fixed.ok) throw new Error(fixed.message);
    expect(fixed.settledCathode).toBeNull();
  });

  it('refuses a fixed-bias stage, naming the bias', () => {
    const s = solveOutput(findOutputTube('EL34')!, { ...el34, bias: 'fixed', vg: -22 });
    if (!s.ok) throw new Error(s.message);
    const r = settledCathode(s);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.field).toBe('bias');
  });
});
