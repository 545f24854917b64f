import { describe, expect, it } from 'vitest';
import { findOutputTube, pushPullAtDrive, settledCathodeBias, solvePushPull, type PushPullDesign } from '../../src/index';
import { expectClose, relErr } from '../helpers/expectClose';

// Our own design: an EL84 pair on a shared 130 Ω resistor at the voltages of the Philips sheet's cathode-biased example.
const el84: PushPullDesign = { tubeId: 'EL84', connection: 'pentode', bplus: 250, screenVolts: 250, ulTap: 0.4, raa: 8000, rPrimary: 0, bias: 'cathode', rk: 130, vg: 0, rg: 470e3, speakerOhms: 8, thdLimit: 0.05 };
const settled = (d: PushPullDesign) => {
  const s = solvePushPull(findOutputTube(d.tubeId)!, d);
  if (!s.ok) throw new Error(s.message);
  const r = settledCathodeBias(s);
  if (!r.ok) throw new Error(r.message);
  return { s, r };
};

describe('a shared cathode resistor under full drive', () => {
  // Ohm's law on the DC the bypass capacitor leaves: the cathode settles at Rk times the cycle's average current.
  it('settles where Rk drops the average cathode current at that drive', () => {
    const { r } = settled(el84);
    expectClose(r.vk, el84.rk * r.full.supplyCurrent, { rel: 1e-4 }, 'Vk = Rk·Ī');
  });

  // The grids are driven until the first reaches its (risen) cathode: the drive is the settled bias.
  it('drives the grids to 0 V at the settled bias, not at the idle one', () => {
    const { s, r } = settled(el84);
    expectClose(r.full.drive, r.vk, { rel: 1e-9 }, 'drive');
    expect(r.idleVk).toBe(s.vk);
    // In class AB the average current rises with drive, so a self-biased cathode rises with it (common practice: the
    // reason class AB pairs above a few watts are often given fixed bias; ngspice agrees, settledBias.spice.test.ts):
    // by about a sixth here.
    expect(r.full.classAB).toBe(true);
    expect(r.vk / s.vk).toBeGreaterThan(1.1);
    // The power there is less than the idle bias gives with its grids at 0 V.
    const held = pushPullAtDrive(s, -s.vgk);
    if (!held.ok) throw new Error(held.message);
    expect(r.full.power).toBeLessThan(held.power);
  });

  // Philips EL84 sheet, push-pull class AB with a shared 130 Ω cathode resistor: 11 W (from memory, as in
  // dataSheetPushPull.test.ts), within the same 25 % as every push-pull data-sheet example.
  it('gives the EL84 sheet\'s cathode-biased pair its power within 25 % at the settled bias', () => {
    const { r } = settled(el84);
    expect(Math.abs(relErr(r.full.power, 11)), `${r.full.power.toFixed(2)} W against 11 W`).toBeLessThanOrEqual(25);
  });

  it('refuses a fixed-bias pair, naming the bias', () => {
    const s = solvePushPull(findOutputTube('EL84')!, { ...el84, bias: 'fixed', vg: -11 });
    if (!s.ok) throw new Error(s.message);
    const r = settledCathodeBias(s);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.field).toBe('bias');
  });
});
