import { describe, expect, it } from 'vitest';
import { analyzeOutput, analyzePushPull, findOutputTube, solveOutput, type OutputDesign, type PushPullDesign } from '../../src/index';
import { outputSpread } from '../../src/output/outputSpread';

const el34 = findOutputTube('EL34')!;
// Our own scenario: the demo's EL34 ultralinear on a 330 Ω cathode resistor.
const design: OutputDesign = { tubeId: 'EL34', connection: 'ultralinear', bplus: 330, screenVolts: 300, ulTap: 0.43, zPrimary: 3500, rPrimary: 130, bias: 'cathode', rk: 330, vg: -22, rg: 220e3, speakerOhms: 8, thdLimit: 0.05 };

describe('a cathode-biased output stage over its tubes\' spread', () => {
  it('moves the idle by less than the tubes differ: the cathode resistor takes back part of it (common practice: why cathode bias needs no adjustment)', () => {
    const s = solveOutput(el34, design);
    if (!s.ok) throw new Error(s.message);
    const r = outputSpread(s);
    if (!r.ok) throw new Error(r.message);
    expect(r.spread).toBe(0.2);
    const up = r.strongest.ip / s.op.ip - 1;
    const down = r.weakest.ip / s.op.ip - 1;
    expect(up).toBeGreaterThan(0);
    expect(up).toBeLessThan(0.2);
    expect(down).toBeLessThan(0);
    expect(down).toBeGreaterThan(-0.2);
    // The stronger tube biases itself further back: its cathode sits higher.
    expect(r.strongest.vk).toBeGreaterThan(s.op.vk);
    expect(r.strongest.pa).toBeGreaterThan(s.op.pa);
  });

  it('Ohm\'s law and the small-signal limit: for a 1 % stronger tube the cathode current rises by 1 %/(1 + gk·Rk), gk the cathode current\'s slope against the cathode\'s voltage', () => {
    const s = solveOutput(el34, design);
    if (!s.ok) throw new Error(s.message);
    const r = outputSpread(s, 0.01);
    if (!r.ok) throw new Error(r.message);
    // The cathode current's slope against the cathode's own voltage, every other electrode where it idles (moving the
    // cathode moves grid, screen and plate against it at once): a fixed-bias solve with all three shifted by ±10 mV.
    const at = (dv: number) => solveOutput(el34, { ...design, bias: 'fixed', vg: s.op.vgk - dv, bplus: design.bplus - s.op.vk - dv, screenVolts: design.screenVolts - s.op.vk - dv });
    const lower = at(-0.01);
    const higher = at(0.01);
    if (!lower.ok || !higher.ok) throw new Error('no slope');
    const gk = (lower.op.ik - higher.op.ik) / 0.02;
    const ik = s.op.ik;
    const rise = (r.strongest.ig2 + r.strongest.ip) / ik - 1;
    // Within 2 %: a 1 % step is not yet the limit (measured: 0.96 % under the linear figure, the law's curvature).
    expect(Math.abs(rise / (0.01 / (1 + gk * design.rk)) - 1)).toBeLessThan(0.02);
  });

  it('warns when the strongest tube would run past the plate rating, not for the demo', () => {
    const demo = analyzeOutput(el34, design);
    if (!demo.ok) throw new Error(demo.message);
    expect(demo.spread).not.toBeNull();
    expect(demo.findings.some((f) => f.kind === 'tube-spread')).toBe(false);
    // Run hot: near the rating with the law's tube (Rk 220 Ω at 330 V).
    const hot = analyzeOutput(el34, { ...design, rk: 220 });
    if (!hot.ok) throw new Error(hot.message);
    expect(hot.spread!.strongest.pa).toBeGreaterThan(el34.ratings.maxPlateDissipation);
    const f = hot.findings.find((x) => x.kind === 'tube-spread');
    expect(f?.severity).toBe('warning');
    expect(f?.message).toMatch(/^A tube passing 20 % more current than the law would dissipate \d+\.\d W at idle, \d+ % of the 25 W rating/);
  });

  it('has nothing to say under fixed bias (each tube is set by its own adjustment)', () => {
    const fixed = analyzeOutput(el34, { ...design, bias: 'fixed', vg: -24 });
    if (!fixed.ok) throw new Error(fixed.message);
    expect(fixed.spread).toBeNull();
    const s = solveOutput(el34, { ...design, bias: 'fixed', vg: -24 });
    if (!s.ok) throw new Error(s.message);
    expect(outputSpread(s)).toMatchObject({ ok: false, field: 'bias' });
  });

  it('a pair on a shared cathode resistor: matched pairs of weak and strong tubes move its idle by less than they differ', () => {
    // Our own scenario: an EL84 pair on a shared 130 Ω at 250 V.
    const pair: PushPullDesign = { tubeId: 'EL84', connection: 'pentode', bplus: 250, screenVolts: 250, ulTap: 0.43, raa: 8000, rPrimary: 200, bias: 'cathode', rk: 130, vg: -10, rg: 470e3, speakerOhms: 8, thdLimit: 0.05 };
    const a = analyzePushPull(findOutputTube('EL84')!, pair);
    if (!a.ok) throw new Error(a.message);
    const r = a.spread!;
    const ip = a.solution.idle[0].ip;
    expect(r.strongest.ip / ip - 1).toBeGreaterThan(0);
    expect(r.strongest.ip / ip - 1).toBeLessThan(0.2);
    expect(r.weakest.ip / ip - 1).toBeLessThan(0);
    expect(r.strongest.vk).toBeGreaterThan(a.solution.vk);
    const fixed = analyzePushPull(findOutputTube('EL84')!, { ...pair, bias: 'fixed', vg: -11 });
    if (!fixed.ok) throw new Error(fixed.message);
    expect(fixed.spread).toBeNull();
  });
});
