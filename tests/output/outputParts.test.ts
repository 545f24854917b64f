import { describe, expect, it } from 'vitest';
import { analyzeOutput, findOutputTube, outputPartsList, type OutputDesign } from '../../src/index';
import { E12 } from '../../src/parts/preferredValues';
import { expectClose } from '../helpers/expectClose';

const design: OutputDesign = {
  tubeId: 'EL34', connection: 'pentode', bplus: 330, screenVolts: 300, ulTap: 0.43, zPrimary: 3500, rPrimary: 130,
  bias: 'cathode', rk: 330, vg: -22, rg: 220e3, speakerOhms: 8, thdLimit: 0.05,
};

describe('output stage parts list', () => {
  const a = analyzeOutput(findOutputTube('EL34')!, design, { light: true });
  if (!a.ok) throw new Error(a.message);
  const parts = outputPartsList(a, 'E24');

  // Joule's law P = I²R; a resistor rated at twice its worst-case dissipation is common practice.
  it('rates Rk by Joule\'s law on the cathode current, with twice the worst case (common practice)', () => {
    const rk = parts.resistors.find((r) => r.ref === 'Rk')!;
    expectClose(rk.watts, a.solution.op.ik ** 2 * 330, { rel: 1e-9 }, 'Rk watts');
    expect(rk.ratingWatts).toBeGreaterThanOrEqual(2 * rk.wattsWorst);
  });

  // The cathode's impedance (rp + RL)/(μ + 1): Langford-Smith, RDH4 ch. 12; the corner 1/(2πRC) from
  // Horowitz and Hill, 3rd ed., §1.7; a capacitor rated at twice its working voltage is common practice.
  it('sizes Ck for a 10 Hz corner against Rk in parallel with the cathode impedance (rp + Zpri)/(μ + 1)', () => {
    const ck = parts.capacitors.find((c) => c.ref === 'Ck')!;
    const { mu, rp } = a.solution.op;
    const cathode = (rp + 3500) / (mu + 1);
    const shunted = (330 * cathode) / (330 + cathode);
    // Ordered at the next E12 value up from the exact one (common practice), so the corner is at or below 10 Hz.
    const exact = 1 / (2 * Math.PI * 10 * shunted);
    expect(ck.value!).toBeGreaterThanOrEqual(exact);
    expect(ck.value!).toBeLessThan(exact * 1.23);
    expect(E12.some((m) => Math.abs(ck.value! / m / 10 ** Math.round(Math.log10(ck.value! / m)) - 1) < 1e-9)).toBe(true);
    expect(ck.ratingVolts).toBeGreaterThanOrEqual(2 * a.solution.op.vk);
  });

  it('asks for a transformer carrying the idle current and the clean power', () => {
    expect(parts.transformer.dcCurrent).toBe(a.solution.op.ip);
    expect(parts.transformer.power).toBe(a.clean.at.power);
    expect(parts.transformer.screenTap).toBeNull();
  });

  it('has no Rk or Ck with fixed bias', () => {
    const f = analyzeOutput(findOutputTube('EL34')!, { ...design, bias: 'fixed' }, { light: true });
    if (!f.ok) throw new Error(f.message);
    const p = outputPartsList(f, 'E24');
    // The grid resistor, and (its screens 30 V under B+) the screens' dropper and bypass: no cathode parts.
    expect(p.resistors.map((r) => r.ref)).toEqual(['Rg', 'Rst', 'Rs']);
    expect(p.capacitors.map((c) => c.ref)).toEqual(['Cs']);
  });
});
