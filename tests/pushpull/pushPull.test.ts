import { describe, expect, it } from 'vitest';
import { findOutputTube, pairBiasForPoint, pushPullAtDrive as checkedAtDrive, pushPullFigures, pushPullRaaSweep, solvePushPull, type PushPullDesign, type PushPullSolution } from '../../src/index';
import { primaryCurrent } from '../../src/output/electrodes';
import { expectClose } from '../helpers/expectClose';

// Our own designs.
const el34: PushPullDesign = {
  tubeId: 'EL34', connection: 'ultralinear', bplus: 430, screenVolts: 430, ulTap: 0.43, raa: 6600, rPrimary: 200,
  bias: 'fixed', rk: 0, vg: -40, rg: 220e3, speakerOhms: 8, thdLimit: 0.05,
};
const pushPullAtDrive = (s: PushPullSolution, drive: number) => {
  const r = checkedAtDrive(s, drive);
  if (!r.ok) throw new Error(r.message);
  return r;
};
const pair = (d: PushPullDesign) => {
  const s = solvePushPull(findOutputTube(d.tubeId)!, d);
  if (!s.ok) throw new Error(s.message);
  return s;
};

describe('push-pull output stages', () => {
  // Langford-Smith, Radiotron Designer's Handbook (4th ed.), ch. 13: in class A the pair is two generators μ·eg in
  // series, internal resistance 2rp, into the plate-to-plate load: Vaa = μ·(2eg)·Raa/(2rp + Raa).
  it('at small drive in class A, the plate-to-plate voltage is μ·2eg·Raa/(2rp + Raa) (the textbook equivalent circuit)', () => {
    const d: PushPullDesign = { ...el34, tubeId: '300B', connection: 'triode', bplus: 400, vg: -80, raa: 5000, rPrimary: 0 };
    const s = pair(d);
    const tube = findOutputTube('300B')!;
    const feed = s.feed;
    const { vpk, ip } = s.idle[0];
    const h = 1e-3;
    const gm = (primaryCurrent(tube, feed, vpk, s.vgk + h) - primaryCurrent(tube, feed, vpk, s.vgk - h)) / (2 * h);
    const rp = (2 * h) / (primaryCurrent(tube, feed, vpk + h, s.vgk) - primaryCurrent(tube, feed, vpk - h, s.vgk));
    expect(ip).toBeGreaterThan(0.05);
    const eg = 0.5;
    const vaa = gm * rp * 2 * eg * d.raa / (2 * rp + d.raa);
    const r = pushPullAtDrive(s, eg);
    expectClose(r.power, (vaa * vaa) / (2 * d.raa), { rel: 0.002 }, 'small-signal power');
    expect(r.classAB).toBe(false);
  });

  it('a matched pair cancels its even harmonics and leaves no DC in the core; a mismatch brings H2 in proportion, and a DC imbalance', () => {
    const matched = pushPullAtDrive(pair(el34), 20);
    for (const k of [2, 4, 6, 8]) expect(matched.harmonics[k]!).toBeLessThan(1e-9);
    expect(pair(el34).dcImbalance).toBe(0);
    const five = pair({ ...el34, mismatch: 0.05 });
    const ten = pair({ ...el34, mismatch: 0.1 });
    const h5 = pushPullAtDrive(five, 20).harmonics[2]!;
    const h10 = pushPullAtDrive(ten, 20).harmonics[2]!;
    expect(h5).toBeGreaterThan(1e-4);
    expect(h10 / h5).toBeGreaterThan(1.8);
    expect(h10 / h5).toBeLessThan(2.2);
    // The second tube draws about 5 % more of the idle current, and that difference is the core's DC.
    expectClose(-five.dcImbalance, 0.05 * five.idle[0].mmf, { rel: 0.1 }, 'DC imbalance');
  });

  it('says class AB when the drive cuts a tube off, class A below; dissipation falls and supply current rises with drive in class AB', () => {
    const s = pair({ ...el34, vg: -48 });
    expect(pushPullAtDrive(s, 2).classAB).toBe(false);
    const full = pushPullAtDrive(s, 48);
    expect(full.classAB).toBe(true);
    expect(full.supplyCurrent).toBeGreaterThan(s.supplyCurrent);
    expect(full.harmonics[2]!).toBeLessThan(1e-9);
  });

  it('a shared cathode resistor carries both tubes: Vk = Rk·(Ik1 + Ik2) (Ohm\'s law)', () => {
    const s = pair({ ...el34, bias: 'cathode', rk: 220 });
    expectClose(s.vk, 220 * (s.idle[0].ik + s.idle[1].ik), { rel: 1e-6 }, 'cathode voltage');
    expectClose(s.vgk, -s.vk, { rel: 1e-12 });
  });

  // Langford-Smith, ch. 13: a class B pair's plate dissipation is greatest at about 2/π of the full swing, below full
  // power; in class A it is greatest at idle and falls with drive.
  it('finds the worst dissipation over the levels: below full power deep in class AB, at idle in class A', () => {
    const deep = pushPullFigures(pair({ ...el34, vg: -55 }));
    if (!deep.ok) throw new Error(deep.message);
    expect(deep.worstPlate.drive).toBeGreaterThan(0);
    expect(deep.worstPlate.drive).toBeLessThan(55);
    expect(deep.worstPlate.watts).toBeGreaterThan(pair({ ...el34, vg: -55 }).idle[0].pa * 1.5);
    const classA = pushPullFigures(pair({ ...el34, vg: -34 }));
    if (!classA.ok) throw new Error(classA.message);
    expect(classA.worstPlate.drive).toBe(0);
    expect(classA.classABFrom).toBe(null);
  });

  it('the power at the distortion limit is where THD meets it; class AB begins where a tube first cuts off', () => {
    const s = pair({ ...el34, vg: -48, thdLimit: 0.03 });
    const f = pushPullFigures(s);
    if (!f.ok) throw new Error(f.message);
    expect(f.atZeroGrid.thd).toBeGreaterThan(0.03);
    expectClose(f.atThdLimit!.thd, 0.03, { rel: 0.01 }, 'THD at the limit');
    expect(pushPullAtDrive(s, f.atThdLimit!.drive * 1.02).thd).toBeGreaterThan(0.03);
    const from = f.classABFrom!;
    expect(pushPullAtDrive(s, from * 0.99).classAB).toBe(false);
    expect(pushPullAtDrive(s, from * 1.01).classAB).toBe(true);
  });

  // Langford-Smith, ch. 13: in class A the pair's source impedance plate to plate is two plate resistances in series
  // (and the primary's own resistance with them); at the speaker, scaled by the impedance ratio.
  it('its source impedance is 2·rp plate to plate in class A, plus the primary\'s resistance; the damping factor follows', () => {
    const tube = findOutputTube('300B')!;
    const d: PushPullDesign = { ...el34, tubeId: '300B', connection: 'triode', bplus: 400, vg: -80, raa: 5000, rPrimary: 0 };
    const s = pair(d);
    const h = 1e-3;
    const rp = (2 * h) / (primaryCurrent(tube, s.feed, s.idle[0].vpk + h, s.vgk) - primaryCurrent(tube, s.feed, s.idle[0].vpk - h, s.vgk));
    const f = pushPullFigures(s);
    if (!f.ok) throw new Error(f.message);
    expectClose(f.zPlateToPlate!, 2 * rp, { rel: 1e-4 }, 'two plate resistances');
    expectClose(f.zSpeaker!, (2 * rp * 8) / 5000, { rel: 1e-4 }, 'at the speaker');
    expectClose(f.dampingFactor!, 5000 / (2 * rp), { rel: 1e-4 }, 'damping factor');
    // With 300 Ω of primary the plates sit lower (its DC drop), so rp is taken at the new point.
    const sw = pair({ ...d, rPrimary: 300 });
    const rpW = (2 * h) / (primaryCurrent(tube, sw.feed, sw.idle[0].vpk + h, sw.vgk) - primaryCurrent(tube, sw.feed, sw.idle[0].vpk - h, sw.vgk));
    const wound = pushPullFigures(sw);
    if (!wound.ok) throw new Error(wound.message);
    expectClose(wound.zPlateToPlate!, 2 * rpW + 300, { rel: 1e-4 }, 'with the primary\'s resistance');
  });

  it('sweeps Raa from a third to three times the design\'s: each row the power within the limit at that load, the best marked', () => {
    const d = { ...el34, thdLimit: 0.03 };
    const r = pushPullRaaSweep(findOutputTube('EL34')!, d, 5);
    if (!r.ok) throw new Error(r.message);
    expect(r.rows.map((x) => Math.round(x.raa))).toEqual([2200, 3811, 6600, 11432, 19800]);
    // The middle row is the design itself: the same figure pushPullFigures gives.
    const own = pushPullFigures(pair(d));
    if (!own.ok) throw new Error(own.message);
    expectClose(r.rows[2]!.power, (own.atThdLimit ?? own.atZeroGrid).power, { rel: 1e-12 });
    for (const row of r.rows) expect(row.power).toBeLessThanOrEqual(r.rows[r.best]!.power);
    expect(pushPullRaaSweep(findOutputTube('EL34')!, d, 1)).toMatchObject({ ok: false, field: 'points' });
  });

  it('names the field of a bad value', () => {
    const tube = findOutputTube('EL34')!;
    expect(solvePushPull(tube, { ...el34, raa: 10 })).toMatchObject({ ok: false, field: 'raa' });
    expect(solvePushPull(tube, { ...el34, mismatch: 0.5 })).toMatchObject({ ok: false, field: 'mismatch' });
    expect(solvePushPull(tube, { ...el34, vg: -200 })).toMatchObject({ ok: false, reason: 'cutoff', field: 'vg' });
    expect(checkedAtDrive(pair(el34), 20, 100)).toMatchObject({ ok: false, field: 'samples' });
    expect(checkedAtDrive({ ok: true } as never, 20)).toMatchObject({ ok: false });
  });
});

describe('a pair whose tubes differ in gm and in idle current apart', () => {
  it('trimmed to equal idle currents, a gm mismatch leaves no DC in the core but still brings H2; an idle mismatch alone sets the currents apart as asked', () => {
    const trimmed = pair({ ...el34, mismatch: { gm: 0.1, idle: 0 } });
    expectClose(trimmed.idle[1].ik, trimmed.idle[0].ik, { rel: 1e-6 }, 'equal idle');
    expect(trimmed.vgk2).toBeLessThan(trimmed.vgk); // the hotter tube biased further down
    const matched = pushPullAtDrive(pair(el34), 20);
    const gmOnly = pushPullAtDrive(trimmed, 20);
    expect(gmOnly.harmonics[2]!).toBeGreaterThan(100 * matched.harmonics[2]!);
    const idleOnly = pair({ ...el34, mismatch: { gm: 0, idle: 0.1 } });
    expectClose(idleOnly.idle[1].ik / idleOnly.idle[0].ik, 1.1, { rel: 1e-6 }, 'idle ratio');
    expect(Math.abs(idleOnly.dcImbalance)).toBeGreaterThan(0.003);
    // A number is the old meaning: the second tube's current scaled at every voltage, idle included.
    const scaled = pair({ ...el34, mismatch: 0.1 });
    expectClose(scaled.vgk2, scaled.vgk, { abs: 0 }, 'no offset');
    expect(checkedAtDrive(scaled, 1).ok).toBe(true);
    const bad = solvePushPull(findOutputTube('EL34')!, { ...el34, mismatch: { gm: 0.5, idle: 0 } });
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.field).toBe('mismatch.gm');
  });
});

describe('class A against class AB at the same idle dissipation', () => {
  // Common practice: a pair run into class AB gives more power than one held in class A at the same idle dissipation
  // (class A's efficiency stops at 50 %; in class AB each tube's current swings past twice its idle).
  it('EL34 pentodes idling at 20 W a tube: held in class A to 0 V on the grids at 220 V into 1 kΩ, several times less power than in class AB at 450 V into 6.6 kΩ', () => {
    const tube = findOutputTube('EL34')!;
    const at = (bplus: number, raa: number) => {
      const d: PushPullDesign = { ...el34, connection: 'pentode', bplus, screenVolts: Math.min(bplus, 350), raa, rPrimary: 0, bias: 'fixed' };
      const bias = pairBiasForPoint(tube, d, bplus, 20 / bplus);
      if (!bias.ok) throw new Error(bias.message);
      const s = pair({ ...d, vg: bias.vgk });
      expectClose(s.idle[0].pa, 20, { rel: 1e-3 }, 'idle dissipation');
      const f = pushPullFigures(s);
      if (!f.ok) throw new Error(f.message);
      return f;
    };
    const classA = at(220, 1000);
    const classAB = at(450, 6600);
    expect(classA.classABFrom).toBeNull();
    expect(classAB.classABFrom).not.toBeNull();
    expect(classAB.atZeroGrid.power).toBeGreaterThan(3 * classA.atZeroGrid.power);
  });
});
