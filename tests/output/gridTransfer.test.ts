import { describe, expect, it } from 'vitest';
import { findOutputTube, pushPullFigures, solveOutput, solvePushPull, type OutputDesign, type PushPullDesign } from '../../src/index';
import { atDrive, cleanLimit } from '../../src/output/outputSignal';
import { powerAtDistortion } from '../../src/output/powerSweep';
import { cycleAt, cycleForPower, driveToFloor, gridTransfer, highestWithin, powerWithin, singleEndedTransfer } from '../../src/output/gridTransfer';
import { pushPullDriveOf } from '../../src/pushpull/pushPullDrive';
import { pairTransfer } from '../../src/pushpull/pairTransfer';

/**
 * The transfer read from a spline must say what the circuit solved at every
 * sample says: the direct solve (itself held to ngspice in tests/spice) is
 * the reference here, at its full 128 samples per cycle.
 */
const el34 = findOutputTube('EL34')!;
const base: OutputDesign = { tubeId: 'EL34', connection: 'pentode', bplus: 350, screenVolts: 250, ulTap: 0.43, zPrimary: 3000, rPrimary: 150, bias: 'cathode', rk: 220, vg: -20, rg: 470e3, speakerOhms: 8, thdLimit: 0.05 };
const designs: [string, OutputDesign][] = [
  ['EL34 pentode, cathode bias', base],
  ['EL34 ultralinear, fixed bias', { ...base, connection: 'ultralinear', screenVolts: 350, bias: 'fixed', vg: -28 }],
  ['EL34 triode-connected', { ...base, connection: 'triode', rk: 470 }],
  ['300B', { ...base, tubeId: '300B', connection: 'triode', bplus: 400, zPrimary: 3500, rk: 1000 }],
];
const solved = (d: OutputDesign) => {
  const s = solveOutput(findOutputTube(d.tubeId)!, d);
  if (!s.ok) throw new Error(s.message);
  return s;
};

describe('an output stage read from its grid transfer', () => {
  it('reproduces Ohm\'s law on a straight transfer: no distortion, P = V²/2R', () => {
    const t = gridTransfer(10, 2000, (x, out) => {
      out.current = 0.05;
      return 12 * x;
    });
    const c = cycleAt(t, 5);
    expect(c.thd).toBeLessThan(1e-12);
    expect(c.power).toBeCloseTo((60 * 60) / (2 * 2000), 10);
  });

  it.each(designs)('%s: power and THD at every drive agree with the circuit solved at each sample', (_name, d) => {
    const s = solved(d);
    const t = singleEndedTransfer(s);
    for (const share of [0.25, 0.5, 0.75, 1]) {
      const direct = atDrive(s, share * t.span, d.zPrimary, 128);
      const read = cycleAt(t, share * t.span);
      expect(Math.abs(read.power / direct.power - 1), `power at ${share}`).toBeLessThan(0.003);
      expect(Math.abs(read.thd - direct.thd), `THD at ${share}`).toBeLessThan(0.01 * direct.thd + 2e-4);
    }
  });

  it.each(designs)('%s: the power within 5 %% THD and the clean swing agree with the bench\'s own', (_name, d) => {
    const s = solved(d);
    const t = singleEndedTransfer(s);
    const direct = powerAtDistortion(s, 0.05);
    expect(Math.abs(powerWithin(t, 0.05).power / direct.power - 1)).toBeLessThan(0.01);
    const clean = cleanLimit(s);
    const floor = driveToFloor(t, 0.02 * s.op.ip) ?? t.span;
    expect(Math.abs(floor / clean.at.drive - 1)).toBeLessThan(0.003);
  });

  it('finds the drive for a working power, and says when the grid cannot reach it', () => {
    const s = solved(base);
    const t = singleEndedTransfer(s);
    const r = cycleForPower(t, 2);
    expect(r.at).not.toBeNull();
    expect(r.at!.power).toBeCloseTo(2, 3);
    expect(Math.abs(r.at!.thd - atDrive(s, r.at!.drive, base.zPrimary, 128).thd)).toBeLessThan(2e-4);
    const far = cycleForPower(t, 1000);
    expect(far.at).toBeNull();
    expect(far.most).toBeCloseTo(cycleAt(t, t.span).power, 10);
  });

  it('a push-pull pair: its cycles and its power within the THD limit agree with the pair\'s own figures', () => {
    const pp: PushPullDesign = { tubeId: 'EL34', connection: 'ultralinear', bplus: 430, screenVolts: 430, ulTap: 0.43, raa: 6600, rPrimary: 200, bias: 'fixed', rk: 220, vg: -38, rg: 220e3, speakerOhms: 8, thdLimit: 0.02 };
    for (const mismatch of [0, 0.08]) {
      const s = solvePushPull(el34, { ...pp, mismatch });
      if (!s.ok) throw new Error(s.message);
      const t = pairTransfer(s);
      for (const share of [0.3, 0.7, 1]) {
        const direct = pushPullDriveOf(s, share * t.span);
        const read = cycleAt(t, share * t.span);
        expect(Math.abs(read.power / direct.power - 1)).toBeLessThan(0.003);
        expect(Math.abs(read.thd - direct.thd)).toBeLessThan(0.02 * direct.thd + 2e-4);
      }
      const f = pushPullFigures(s);
      if (!f.ok) throw new Error(f.message);
      const within = highestWithin(t, 0.02);
      const want = (f.atThdLimit ?? f.atZeroGrid).power;
      expect(Math.abs(within!.power / want - 1), `mismatch ${mismatch}`).toBeLessThan(0.01);
    }
  });
});
