import { describe, expect, it } from 'vitest';
import { cathodeShare, gainInto } from '../../src/chain/gridConductance';
import type { LinearStage } from '../../src/chain/stageKind';
import { NO_CAPACITANCES } from '../../src/chain/noCapacitances';
import { amplifierAtLevel, findTube, gridCurrent, gridVoltageAt, solveChain, solveStage, type ChainInput } from '../../src/index';
import { expectClose } from '../helpers/expectClose';
import { modelOf } from '../../src/tube/types';

// Our own small-signal values (a 12AU7-like triode): mu = gm·rp = 17.
const gm = 2.2e-3;
const rp = 7.7e3;
const mu = gm * rp;
const stage = (over: Partial<LinearStage>): LinearStage => ({
  gm, rp, plateLoad: 47e3, rk: 1500, ck: null, cathodeGrounded: false, gScreen: 0, caps: NO_CAPACITANCES, output: 'plate', outputScale: 1, ...over,
});

describe('how far the cathode follows the grid (the bootstrap of the grid\'s own current)', () => {
  it('a cathode follower: its gain, mu·R/(rp + (mu + 1)·R) with R = Rk ∥ RL (Langford-Smith, RDH4 ch. 12)', () => {
    const r = (22e3 * 100e3) / (22e3 + 100e3);
    expectClose(cathodeShare(stage({ plateLoad: 0, rk: 22e3, output: 'cathode' }), 100e3), (mu * r) / (rp + (mu + 1) * r), { rel: 1e-12 });
  });

  it('an unbypassed stage: Rk·i with i = mu·vg/(rp + Ra′ + (mu + 1)·Rk), Ra′ = Ra ∥ RL (Millman & Halkias, the degenerated stage)', () => {
    const ra = (47e3 * 470e3) / (47e3 + 470e3);
    expectClose(cathodeShare(stage({}), 470e3), (mu * 1500) / (rp + ra + (mu + 1) * 1500), { rel: 1e-12 });
  });

  it('a bypassed cathode does not follow at midband', () => {
    expect(cathodeShare(stage({ ck: 100e-6 }), 470e3)).toBe(0);
    expect(cathodeShare(stage({ cathodeGrounded: true }), 470e3)).toBe(0);
  });

  it('a gain into another load through the output impedance (Thévenin)', () => {
    // Open-circuit gain 60 behind 40k: 60·100/140 into 100k, 60·50/90 into 50k.
    expectClose(gainInto((60 * 100e3) / 140e3, 40e3, 100e3, 50e3), (60 * 50e3) / 90e3, { rel: 1e-12 });
    expectClose(gainInto(60, 40e3, Infinity, 50e3), (60 * 50e3) / 90e3, { rel: 1e-12 });
  });
});

describe('grid-leak bias: the grid\'s own current through its leak', () => {
  const ax7 = findTube('12AX7')!;
  it('holds the grid at −Ig·Rg (Ohm\'s law), moving a 12AX7 near −1 V by tens of millivolts', () => {
    const held = solveStage({ tube: ax7, bplus: 250, ra: 100e3, rk: 820, rg: 1e6 });
    const ideal = solveStage({ tube: ax7, bplus: 250, ra: 100e3, rk: 820 });
    if (!held.ok || !ideal.ok) throw new Error('solves');
    const grid = held.op.vgk + held.op.vk;
    expectClose(grid, -1e6 * gridCurrent(modelOf(ax7), held.op.vgk), { rel: 1e-6 }, 'grid = −Ig·Rg');
    expect(grid).toBeLessThan(-0.01);
    expect(held.op.ia).toBeLessThan(ideal.op.ia);
  });

  it('a stage biased well below the onset is not moved', () => {
    const held = solveStage({ tube: ax7, bplus: 250, ra: 100e3, rk: 2700, rg: 1e6 });
    const ideal = solveStage({ tube: ax7, bplus: 250, ra: 100e3, rk: 2700 });
    if (!held.ok || !ideal.ok) throw new Error('solves');
    expectClose(held.op.ia, ideal.op.ia, { rel: 1e-6 });
  });

  it('the amplifier\'s small-signal gain agrees with its large-signal transfer at a small level, the grid\'s slope in both', () => {
    const au7 = findTube('12AU7')!;
    const chain: ChainInput = {
      source: { rsource: 250e3 },
      stages: [
        { kind: 'common-cathode', tube: ax7, bplus: 250, ra: 100e3, rk: 820, bypassed: true, coupling: { kind: 'capacitor', cc: 1e-6, rg: 1e6 } },
        { kind: 'common-cathode', tube: au7, bplus: 250, ra: 47e3, rk: 1500, bypassed: true, coupling: { kind: 'capacitor', cc: 1e-6, rg: 1e6 } },
      ],
    };
    const r = solveChain(chain);
    if (!r.ok) throw new Error(r.message);
    // The first grid's input: well under its 1 MΩ leak at this bias.
    expect(r.stages[0]!.zin!).toBeLessThan(0.5e6);
    expect(r.stages[0]!.zin!).toBeGreaterThan(0.2e6);
    // A thousandth of the clean output: the transfer, grid current solved at every instant, is all but linear there.
    const small = amplifierAtLevel(chain, { outputRms: r.output.rms / 1000 });
    if (!small.ok) throw new Error(small.message);
    expectClose(Math.abs(r.gain), small.output.rms / small.input.rms, { rel: 0.005 }, 'small-signal against large-signal gain');
  });
});

describe("a capacitor-coupled follower's grid through its leak", () => {
  const ax7 = findTube('12AX7')!;
  const au7 = findTube('12AU7')!;
  const chainWith = (tube: typeof ax7, rk: number) =>
    solveChain({
      source: { rsource: 1e3 },
      stages: [
        { kind: 'common-cathode', tube: ax7, bplus: 275, ra: 100e3, rk: 1500, bypassed: true, coupling: { kind: 'capacitor', cc: 470e-9, rg: 1e6 } },
        { kind: 'follower', tube, bplus: 275, rk, vbias: 138, coupling: { kind: 'capacitor', cc: 100e-9, rg: 1e6 } },
      ],
    });

  it('is warned with the shift its own current would make through the leak (Ohm\'s law), where that moves the cathode past 1 %', () => {
    // A 12AX7 asked for 2.9 mA through 47k: its grid sits near its cathode and draws microamps.
    const r = chainWith(ax7, 47e3);
    if (!r.ok) throw new Error(r.message);
    const f = r.stages[1]!.findings.find((x) => x.kind === 'grid-leak-bias');
    expect(f?.severity).toBe('warning');
    // Where the leak holds it, the tube's curves and Ohm's law at the leak agree: the cathode at Vk′ = Vk − shift passes
    // Vk′/Rk, the curves give the Vgk′ for that current, and 138 V − (Vgk′ + Vk′) is Rg·Ig(Vgk′).
    const vk = r.stages[1]!.op.vk - f!.value;
    const vgk = gridVoltageAt(ax7, 275 - vk, vk / 47e3)!;
    expectClose(138 - (vgk + vk), 1e6 * gridCurrent(modelOf(ax7), vgk), { rel: 2e-3 }, 'the leak\'s drop');
    expect(f!.message).toMatch(/^Its grid draws [\d.]+ µA at rest .* about [\d.]+ V below the 138 V its divider gives/);
  });

  it('is quiet for a follower biased well below the onset', () => {
    const r = chainWith(au7, 22e3);
    if (!r.ok) throw new Error(r.message);
    expect(r.stages[1]!.findings.some((x) => x.kind === 'grid-leak-bias')).toBe(false);
  });
});

describe("a stage's input resistance on the bench", () => {
  const ax7 = findTube('12AX7')!;
  it('is its leak with its grid current\'s slope, as the amplifier takes it: a 12AX7 near −1 V, a few hundred kilohms behind 1 MΩ', () => {
    const s = solveStage({ tube: ax7, bplus: 250, ra: 100e3, rk: 820, rg: 1e6, rl: 1e6 });
    if (!s.ok) throw new Error(s.message);
    const r = solveChain({ source: { rsource: 1e3 }, stages: [{ kind: 'common-cathode', tube: ax7, bplus: 250, ra: 100e3, rk: 820, bypassed: true, coupling: { kind: 'capacitor', cc: 1e-6, rg: 1e6 } }], load: { rl: 1e6 } });
    if (!r.ok) throw new Error(r.message);
    expectClose(s.rin!, r.stages[0]!.zin!, { rel: 1e-6 }, 'bench and amplifier alike');
    expect(s.rin).toBeLessThan(0.5e6);
    // 1/Rin = 1/Rg + dIg/dVgk at the bias (the cathode bypassed).
    const slope = (gridCurrent(modelOf(ax7), s.op.vgk + 1e-4) - gridCurrent(modelOf(ax7), s.op.vgk - 1e-4)) / 2e-4;
    expectClose(1 / s.rin!, 1e-6 + slope, { rel: 1e-6 });
  });

  it('is the leak alone, to a hundredth of a percent, for a stage biased well below the onset', () => {
    const s = solveStage({ tube: ax7, bplus: 250, ra: 100e3, rk: 2700, rg: 1e6 });
    if (!s.ok) throw new Error(s.message);
    expectClose(s.rin!, 1e6, { rel: 1e-4 });
  });
});
