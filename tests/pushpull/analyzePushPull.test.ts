import { describe, expect, it } from 'vitest';
import { analyzePushPull, findOutputTube, raaThrough, type PushPullDesign } from '../../src/index';
import { expectClose } from '../helpers/expectClose';
import { primaryCurrent } from '../../src/output/electrodes';

// Our own designs.
const el84: PushPullDesign = {
  tubeId: 'EL84', connection: 'ultralinear', bplus: 320, screenVolts: 320, ulTap: 0.4, raa: 8000, rPrimary: 240,
  bias: 'cathode', rk: 130, vg: 0, rg: 470e3, speakerOhms: 8, thdLimit: 0.03,
};
const analysed = (d: PushPullDesign, opts = {}) => {
  const a = analyzePushPull(findOutputTube(d.tubeId)!, d, opts);
  if (!a.ok) throw new Error(a.message);
  return a;
};
const slope = (line: readonly { v: number; i: number }[]) => (line[1]!.v - line[0]!.v) / (line[0]!.i - line[1]!.i);

describe('the push-pull bench analysis', () => {
  // Langford-Smith, Radiotron Designer's Handbook (4th ed.), ch. 13: while both tubes conduct each sees Raa/2; a tube
  // working alone sees Raa/4. Each half of the primary adds its DC resistance in series.
  it('draws the composite load line through the idle point at Raa/2 + Rpri/2, and the lone tube\'s line from the centre tap at Raa/4 + Rpri/2', () => {
    const a = analysed(el84);
    const { vpk, ip } = a.solution.idle[0];
    expectClose(slope(a.overlay.acLoad), el84.raa / 2 + el84.rPrimary / 2, { rel: 1e-9 }, 'composite slope');
    expectClose(slope(a.overlay.alone), el84.raa / 4 + el84.rPrimary / 2, { rel: 1e-9 }, 'alone slope');
    const onLine = a.overlay.acLoad[0]!.i - (vpk - a.overlay.acLoad[0]!.v) / slope(a.overlay.acLoad);
    expectClose(onLine, ip, { rel: 1e-9 }, 'through the point');
    expect(a.overlay.alone[1]).toEqual({ v: a.solution.supply, i: 0 });
    // Dragging the handle back gives the design's Raa (the inverse the bench uses).
    expectClose(raaThrough(a.solution, a.overlay.loadHandle.v, a.overlay.loadHandle.i)!, el84.raa, { rel: 1e-9 }, 'Raa through the handle');
    expect(raaThrough(a.solution, vpk - 10, ip + 0.001)).toBeNull();
  });

  it('traces the path one tube takes at full drive: from its idle point up to the grid at 0 V and down toward cutoff, within the window', () => {
    const a = analysed(el84);
    const path = a.overlay.swing;
    expect(path.length).toBeGreaterThan(32);
    const vs = path.map((p) => p.v);
    expect(Math.min(...vs)).toBeLessThan(a.solution.idle[0].vpk - 100);
    expect(Math.max(...vs)).toBeGreaterThan(a.solution.idle[0].vpk + 100);
    // In class AB the tube cuts off for part of the cycle: its current there is a small share of its idle current.
    expect(a.figures!.classABFrom).not.toBeNull();
    expect(Math.min(...path.map((p) => p.i))).toBeLessThan(0.2 * a.solution.idle[0].ip);
  });

  it('the light pass (a drag) keeps the last full pass\'s level sweep and curves, and the full pass draws more current at full drive than at idle (class AB)', () => {
    const full = analysed(el84);
    const light = analysed({ ...el84, rk: 150 }, { light: true, previous: full });
    expect(light.figures).toBe(full.figures);
    expect(light.sheet).toBe(full.sheet);
    expect(light.solution.vk).toBeGreaterThan(full.solution.vk);
    expect(full.supplyCurrent.full).toBeGreaterThan(full.supplyCurrent.idle * 1.1);
    expectClose(full.supplyCurrent.idle, full.solution.idle[0].ik + full.solution.idle[1].ik, { rel: 1e-12 }, 'idle supply current');
  });

  it('carries a shared cathode resistor\'s settled bias on the full pass (the light pass keeps the last), and none for fixed bias', () => {
    const full = analysed(el84);
    // Ohm's law on the settled cathode, as settledCathodeBias gives it (checked against ngspice there).
    expectClose(full.settledBias!.vk, el84.rk * full.settledBias!.full.supplyCurrent, { rel: 1e-4 }, 'Vk = Rk·Ī');
    expect(full.settledBias!.idleVk).toBe(full.solution.vk);
    const light = analysed({ ...el84, rk: 150 }, { light: true, previous: full });
    expect(light.settledBias).toBe(full.settledBias);
    expect(analysed({ ...el84, bias: 'fixed', vg: -12 }).settledBias).toBeNull();
  });

  it('checks the worst plate dissipation over the drive range, and says when a mismatch leaves DC in the core', () => {
    // Fixed bias cold enough that class AB's dissipation peaks under drive, above idle (Langford-Smith, ch. 13).
    const cold: PushPullDesign = { ...el84, connection: 'pentode', bias: 'fixed', vg: -16, mismatch: 0.08 };
    const a = analysed(cold);
    const plate = a.findings.filter((f) => f.kind === 'plate-dissipation');
    expect(plate).toHaveLength(2);
    expect(plate.some((f) => f.message.includes('under drive'))).toBe(true);
    const imbalance = a.findings.find((f) => f.kind === 'primary-imbalance');
    expect(imbalance?.value).toBeCloseTo(Math.abs(a.solution.dcImbalance), 12);
    expect(analysed({ ...cold, mismatch: 0 }).findings.some((f) => f.kind === 'primary-imbalance')).toBe(false);
  });

  it('says when the pair distorts past the limit at every level (crossover from a bias too cold)', () => {
    const crossover: PushPullDesign = { ...el84, connection: 'pentode', bias: 'fixed', vg: -16, thdLimit: 0.005 };
    const a = analysed(crossover);
    expect(a.figures!.overThdEverywhere).toBe(true);
    expect(a.findings.some((f) => f.kind === 'distortion')).toBe(true);
  });

  it('names the field of a bad value and never throws for finite input', () => {
    const bad = analyzePushPull(findOutputTube('EL84')!, { ...el84, raa: 5 });
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.field).toBe('raa');
    const options = analyzePushPull(findOutputTube('EL84')!, el84, { maxCurves: 0 });
    expect(options.ok).toBe(false);
    // The densest sheet the workbench offers is drawn (it had been refused past 12, so a bench set to 24 could not join the pair); past it, refused.
    const dense = analyzePushPull(findOutputTube('EL84')!, el84, { maxCurves: 24 });
    expect(dense.ok).toBe(true);
    expect(analyzePushPull(findOutputTube('EL84')!, el84, { maxCurves: 25 }).ok).toBe(false);
  });
});

describe('the pair\'s composite characteristics', () => {
  // Langford-Smith, RDH4 ch. 13: at the bias the composite curve passes through the centre tap's voltage at zero net
  // current, and its slope there is that of the two tubes in parallel (the composite plate resistance rp/2).
  it('at the bias the curve crosses zero at the centre tap, with the slope of both tubes in parallel; more drive lifts it', () => {
    const matched: PushPullDesign = { ...el84, connection: 'triode', rPrimary: 0, bias: 'fixed', vg: -12 };
    const a = analysed(matched);
    const s = a.solution;
    const [atBias, driven] = [a.overlay.composite[0]!, a.overlay.composite[1]!];
    expect(atBias.vg).toBeCloseTo(s.vgk, 12);
    // The net current rises with tube 1's plate voltage: the curve starts where it reaches zero, at the centre tap.
    const step = (2 * s.supply) / 48;
    expect(Math.abs(atBias.points[0]!.v - s.supply)).toBeLessThanOrEqual(step);
    // One tube's plate conductance, by a central difference; the composite's is twice it.
    const tube = findOutputTube('EL84')!;
    const h = 0.5;
    const [p0, p1] = [atBias.points[0]!, atBias.points[1]!];
    const slope = (p1.i - p0.i) / (p1.v - p0.v);
    const gOne = (primaryCurrent(tube, s.feed, s.idle[0].vpk + h, s.vgk) - primaryCurrent(tube, s.feed, s.idle[0].vpk - h, s.vgk)) / (2 * h);
    expectClose(slope, 2 * gOne, { rel: 0.1 }, 'composite conductance');
    // More drive on tube 1 (and less on tube 2) brings the zero crossing below the centre tap.
    expect(driven.points[0]!.v).toBeLessThan(atBias.points[0]!.v);
  });
});

describe('the pair\'s analysis by the names a caller asks for', () => {
  it('op per tube, full with harmonics in dB (H2 first), class AB, the worst dissipation over the sweep', () => {
    const a = analysed({ ...el84, mismatch: { gm: 0.05, idle: 0.03 } });
    expect(a.op[1].ia).toBe(a.solution.idle[1].ia);
    expect(a.op[0].pg2).toBe(a.solution.idle[0].pg2);
    expectClose(a.full.harmonicsDb[0]!, 20 * Math.log10(a.full.harmonics[2]!), { rel: 1e-12 }, 'H2 in dB');
    expect(a.full.harmonicsDb).toHaveLength(9);
    expect(a.classAB).toBe(a.full.classAB);
    expect(a.worstDissipation!.plate).toEqual(a.figures!.worstPlate);
  });
});
