import { describe, expect, it } from 'vitest';
import { findOutputTube, findTube, pushPullAtDrive, solveAmplifier, solveCathodyne, solveLongTailedPair, solvePushPull, splitterPlane, solveSplitter, millerInputCapacitance, type ChainInput, type PushPullLink } from '../../src/index';
import { expectClose } from '../helpers/expectClose';
import { prepareAmplifier } from '../../src/chain/solveAmplifier';

// Our own push-pull amplifier: a 12AX7 input stage, a phase splitter, and a pair of EL84s in ultralinear.
const input = { kind: 'common-cathode' as const, tube: findTube('12AX7')!, bplus: 300, ra: 100e3, rk: 1500, bypassed: true, coupling: { kind: 'capacitor' as const, cc: 100e-9, rg: 1e6 } };
const pair: PushPullLink = {
  kind: 'push-pull-output', tube: findOutputTube('EL84')!, connection: 'ultralinear', bplus: 300, screenVolts: 300, ulTap: 0.4, raa: 8000, rPrimary: 240,
  bias: 'cathode', rk: 130, vg: 0, speakerOhms: 8, thdLimit: 0.05, coupling: { kind: 'capacitor', cc: 220e-9, rg: 470e3 },
};
const cathodyne: ChainInput = {
  source: { rsource: 600 },
  stages: [input, { kind: 'split-load', tube: findTube('12AU7')!, bplus: 300, ra: 22e3, rk: 22e3, vbias: 90, coupling: { kind: 'capacitor', cc: 100e-9, rg: 1e6 } }, pair],
};
const ltp: ChainInput = {
  source: { rsource: 600 },
  stages: [input, { kind: 'long-tailed-pair', tube: findTube('12AU7')!, bplus: 350, ra: 33e3, ra2: 36e3, rk: 470, rtail: 10e3, vbias: 60, coupling: { kind: 'capacitor', cc: 100e-9, rg: 1e6 } }, pair],
};
const solved = (c: ChainInput) => {
  const r = solveAmplifier(c, { power: 1 });
  if (!r.ok) throw new Error(r.message);
  return r;
};

describe('phase splitters and push-pull pairs in the chain', () => {
  it('the split-load stage is the splitter solved on its own with the pair\'s grid resistors as its loads', () => {
    const r = solved(cathodyne);
    const own = solveCathodyne({ tube: findTube('12AU7')!, bplus: 300, ra: 22e3, rk: 22e3, rb: 0, grid: { kind: 'fixed', volts: 90 }, rl: 470e3 });
    if (!own.ok) throw new Error(own.message);
    const st = r.stages[1]!;
    expectClose(st.op.ia, own.op.ia, { rel: 1e-12 }, 'current');
    expectClose(st.gain, own.gainPlate, { rel: 1e-12 }, 'plate gain');
    // Common practice: equal plate and cathode resistors give two outputs of nearly equal size, each just under unity.
    expect(Math.abs(own.gainPlate)).toBeLessThan(1);
    expectClose(Math.abs(own.gainCathode / own.gainPlate), 1, { abs: 0.02 }, 'balance');
  });

  it('its two outputs carry one current, so they stay in the ratio −Rk′/Ra′ even driven hard (Ohm\'s law)', () => {
    const a = prepareAmplifier(cathodyne);
    if (!a.ok) throw new Error(a.message);
    const link = a.links[1]!;
    const out = { vout: 0, vgk: 0, ia: 0, vout2: 0 };
    for (const vin of [0.5, 5, -5, 20]) {
      link.sample(vin, out);
      expectClose(out.vout2 / out.vout, -1, { rel: 1e-9 }, `ratio at ${vin} V`);
    }
  });

  it('the pair idles where solvePushPull puts it, and with a balanced splitter it gives its own power at 0 V on the grids', () => {
    const r = solved(cathodyne);
    const own = solvePushPull(findOutputTube('EL84')!, { ...pair, tubeId: 'EL84', rg: 470e3 });
    if (!own.ok) throw new Error(own.message);
    const st = r.stages[2]!;
    expectClose(st.op.ia, own.idle[0].ip, { rel: 1e-12 }, 'idle current');
    expectClose(st.supplyCurrent, own.supplyCurrent, { rel: 1e-12 }, 'supply current');
    // The chain's clean limit is a pair grid reaching 0 V (class AB cutoff is not clipping).
    expect(r.clipsFirst).toEqual({ stage: 2, by: 'grid-current' });
    const alone = pushPullAtDrive(own, -own.vgk);
    if (!alone.ok) throw new Error(alone.message);
    // Within 5 %: the stages before the pair (the 12AX7 swinging 12 V peak, the splitter) add their own curvature, so one
    // grid reaches 0 V on a half-cycle a little larger than the other's; the pair alone is driven by pure sines.
    expectClose(r.outputPower!, alone.power, { rel: 0.05 }, 'power at the clean limit');
    expect(r.outputPower!).toBeLessThan(alone.power);
    expect(st.fullPowerCurrent!).toBeGreaterThan(st.supplyCurrent);
  });

  it('the long-tailed pair is solved as on its own; its first plate carries the chain; the amplifier gives the pair\'s power at low distortion at 1 W', () => {
    const r = solved(ltp);
    const own = solveLongTailedPair({ tube: findTube('12AU7')!, bplus: 350, ra1: 33e3, ra2: 36e3, rk: 470, tail: { kind: 'resistor', rt: 10e3 }, grid: { kind: 'fixed', volts: 60 }, rl: 470e3 });
    if (!own.ok) throw new Error(own.message);
    expectClose(r.stages[1]!.gain, own.gain1, { rel: 1e-12 }, 'first plate gain');
    expectClose(r.stages[1]!.supplyCurrent, own.ops[0].ia + own.ops[1].ia, { rel: 1e-12 }, 'tail current');
    // Three inversions: the input stage, the splitter's first plate, and the pair's first plate (the speaker is phased to it).
    expect(r.gain).toBeLessThan(0);
    expect(r.outputPower!).toBeGreaterThan(8);
    if (!r.atLevel?.ok) throw new Error('a level');
    expect(r.atLevel.thd).toBeLessThan(0.02);
  });

  it('a pair needs a splitter just before it, and a splitter a pair just after it: each refusal names the stage', () => {
    const noSplitter = solveAmplifier({ ...cathodyne, stages: [input, pair] });
    expect(noSplitter.ok).toBe(false);
    if (!noSplitter.ok) expect(noSplitter.field).toBe('stages.1.kind');
    const splitterLast = solveAmplifier({ ...cathodyne, stages: cathodyne.stages.slice(0, 2) });
    expect(splitterLast.ok).toBe(false);
    if (!splitterLast.ok) expect(splitterLast.message).toMatch(/^Stage 2: a phase splitter drives a push-pull stage/);
    const badGrid = solveAmplifier({ ...cathodyne, stages: [input, { ...cathodyne.stages[1]!, vbias: 250 } as ChainInput['stages'][number], pair] });
    expect(badGrid.ok).toBe(false);
    if (!badGrid.ok) expect(badGrid.field).toBe('stages.1.vbias');
  });
});

describe('a phase splitter on its plate curves', () => {
  it('its operating point lies on its DC load line (B+ across Ra, the tube and Rk) and on its bias line (Vgk = Vgrid − Ia·Rk)', () => {
    const r = solved(cathodyne);
    const op = r.stages[1]!.op;
    const plane = splitterPlane(findTube('12AU7')!, { kind: 'split-load', bplus: 300, ra: 22e3, rk: 22e3, rtail: 0, vgrid: 90 }, op);
    const [top, foot] = plane.load;
    expect(foot).toEqual({ v: 300, i: 0 });
    // Ohm's law along the line: Vpk = B+ − Ia·(Ra + Rk).
    expectClose(plane.point.v, 300 - plane.point.i * 44e3, { rel: 1e-9 }, 'on the load line');
    expectClose(top!.i, 300 / 44e3, { rel: 1e-12 }, 'load line at 0 V');
    // Between the two bias-line points that straddle the operating current, the line passes through the point.
    const k = plane.bias.findIndex((p, j) => j + 1 < plane.bias.length && p.i <= op.ia && plane.bias[j + 1]!.i >= op.ia);
    expect(k).toBeGreaterThanOrEqual(0);
    const [a, b] = [plane.bias[k]!, plane.bias[k + 1]!];
    expectClose(a.v + ((op.ia - a.i) * (b.v - a.v)) / (b.i - a.i), plane.point.v, { rel: 0.005 }, 'on the bias line');
  });
});

describe('either splitter in one shape (solveSplitter)', () => {
  it('gives the inverted output first, then the in-phase one, as each splitter\'s own solver does; a pair\'s tail with it', () => {
    const tube = findTube('12AU7')!;
    const load = { rl: 470e3, cl: 200e-12 };
    const split = solveSplitter({ kind: 'split-load', tube, bplus: 300, ra: 22e3, rk: 22e3, vgrid: 90, ...load });
    const own = solveCathodyne({ tube, bplus: 300, ra: 22e3, rk: 22e3, rb: 0, grid: { kind: 'fixed', volts: 90 }, ...load });
    if (!split.ok || !own.ok) throw new Error('both solve');
    expect(split.outputs.map((o) => o.gain)).toEqual([own.gainPlate, own.gainCathode]);
    expect(split.outputs.map((o) => o.zout)).toEqual([own.zPlate, own.zCathode]);
    expect(split.tail).toBeNull();
    const ltp = solveSplitter({ kind: 'long-tailed-pair', tube, bplus: 350, ra: 33e3, ra2: 36e3, rk: 470, rtail: 10e3, vgrid: 60, ...load });
    const ownLtp = solveLongTailedPair({ tube, bplus: 350, ra1: 33e3, ra2: 36e3, rk: 470, tail: { kind: 'resistor', rt: 10e3 }, grid: { kind: 'fixed', volts: 60 }, ...load });
    if (!ltp.ok || !ownLtp.ok) throw new Error('both solve');
    expect(ltp.outputs.map((o) => o.gain)).toEqual([ownLtp.gain1, ownLtp.gain2]);
    expect(ltp.tail).toEqual({ current: ownLtp.tailCurrent, volts: ownLtp.tailVolts });
    const bad = solveSplitter({ kind: 'long-tailed-pair', tube, bplus: 350, ra: 33e3, rk: 470, rtail: 10e3, vgrid: 500, ...load });
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.field).toBe('vgrid');
  });

  it('a grid\'s input capacitance is Cgk + Cgp·(1 + A) (the Miller effect)', () => {
    expectClose(millerInputCapacitance({ cgk: 10e-12, cgp: 1e-12 }, -20), 31e-12, { rel: 1e-12 }, 'Cin');
  });
});
