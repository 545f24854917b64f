import { describe, expect, it } from 'vitest';
import { analyzeOutput, analyzePushPull, findOutputTube, outputPartsList, pushPullPartsList, solveOutput, solvePushPull, type OutputDesign, type PushPullDesign } from '../../src/index';
import { biasAdjustment, SENSE_OHMS } from '../../src/output/biasAdjustment';
import { scaledTube } from '../../src/pushpull/solvePushPull';

const el34 = findOutputTube('EL34')!;
const t300b = findOutputTube('300B')!;
// Our own scenarios: an EL34 ultralinear on a fixed grid supply, a 300B the same way, a fixed-bias EL34 pair.
const el34Fixed: OutputDesign = { tubeId: 'EL34', connection: 'ultralinear', bplus: 350, screenVolts: 350, ulTap: 0.43, zPrimary: 3500, rPrimary: 130, bias: 'fixed', rk: 1, vg: -28, rg: 220e3, speakerOhms: 8, thdLimit: 0.05 };
const t300bFixed: OutputDesign = { tubeId: '300B', connection: 'triode', bplus: 360, screenVolts: 360, ulTap: 0.43, zPrimary: 3500, rPrimary: 100, bias: 'fixed', rk: 1, vg: -70, rg: 100e3, speakerOhms: 8, thdLimit: 0.05 };
const pairFixed: PushPullDesign = { tubeId: 'EL34', connection: 'ultralinear', bplus: 430, screenVolts: 430, ulTap: 0.43, raa: 6600, rPrimary: 200, bias: 'fixed', rk: 220, vg: -40, rg: 220e3, speakerOhms: 8, thdLimit: 0.05 };

describe('a fixed-bias tube\'s adjustment range', () => {
  for (const [name, tube, design] of [['EL34 ultralinear', el34, el34Fixed], ['300B', t300b, t300bFixed]] as const) {
    it(`${name}: each end of the range sets a tube ${20} % weaker or stronger to the designed idle (the forward solve checks it)`, () => {
      const s = solveOutput(tube, design);
      if (!s.ok) throw new Error(s.message);
      const r = biasAdjustment(tube, design, s.op.vpk, s.op.ip);
      if (!r.ok) throw new Error(r.message);
      // The law's own tube needs the grid the design holds.
      expect(r.nominal).toBeCloseTo(design.vg, 6);
      expect(r.weakest).toBeGreaterThan(r.nominal);
      expect(r.strongest).toBeLessThan(r.nominal);
      for (const [m, vg] of [[-0.2, r.weakest], [0.2, r.strongest]] as const) {
        const other = solveOutput(scaledTube(tube, m), { ...design, vg });
        if (!other.ok) throw new Error(other.message);
        expect(other.op.ip / s.op.ip - 1).toBeCloseTo(0, 6);
        expect(other.op.vpk).toBeCloseTo(s.op.vpk, 4);
      }
      // Ohm's law: the 1 Ω cathode resistor reads the cathode current (plate and screen) as millivolts.
      expect(SENSE_OHMS).toBe(1);
      expect(r.idleCathode).toBeCloseTo(s.op.ik, 9);
      expect(r.senseVolts).toBeCloseTo(s.op.ik * 1, 9);
    });
  }

  it('is on the single-ended parts list under fixed bias, and absent under cathode bias', () => {
    const fixed = analyzeOutput(el34, el34Fixed);
    if (!fixed.ok) throw new Error(fixed.message);
    const parts = outputPartsList(fixed, 'E24').biasAdjustment;
    expect(parts?.ok && parts.nominal).toBeCloseTo(el34Fixed.vg, 6);
    const cathode = analyzeOutput(el34, { ...el34Fixed, bias: 'cathode', rk: 330 });
    if (!cathode.ok) throw new Error(cathode.message);
    expect(outputPartsList(cathode, 'E24').biasAdjustment).toBeNull();
    expect(biasAdjustment(el34, { ...el34Fixed, bias: 'cathode' }, 300, 0.06)).toMatchObject({ ok: false, field: 'bias' });
  });

  it('a pair: each tube\'s own range sets a stronger tube to the pair\'s idle current per tube', () => {
    const a = analyzePushPull(el34, pairFixed);
    if (!a.ok) throw new Error(a.message);
    const r = pushPullPartsList(a, 'E24').biasAdjustment;
    if (!r?.ok) throw new Error(r ? r.message : 'no adjustment for a fixed-bias pair');
    expect(r.nominal).toBeCloseTo(pairFixed.vg, 6);
    const strong = solvePushPull(scaledTube(el34, 0.2), { ...pairFixed, vg: r.strongest });
    if (!strong.ok) throw new Error(strong.message);
    expect(strong.idle[0].ip / a.solution.idle[0].ip - 1).toBeCloseTo(0, 5);
  });

  it('says when a weak tube cannot reach the idle before its grid reaches 0 V', () => {
    // Idling 1 V from the grid's 0 V: a tube passing 20 % less cannot get there in class A1.
    const near0 = { ...el34Fixed, vg: -1 };
    const s = solveOutput(el34, near0);
    if (!s.ok) throw new Error(s.message);
    const r = biasAdjustment(el34, near0, s.op.vpk, s.op.ip);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toMatch(/^A tube passing 20 % less current cannot be set to this idle/);
  });
});
