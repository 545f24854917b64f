import { describe, expect, it } from 'vitest';
import { amplifierParts, findOutputTube, findTube, solveAmplifier, type ChainInput, type PushPullLink } from '../../src/index';
import { expectClose } from '../helpers/expectClose';
import { chainStageParts } from '../../src/build/chainStageParts';
import { gridDivider } from '../../src/build/gridDivider';

// Our own amplifier: a 12AX7 input stage, a capacitor-coupled 12AU7 follower, a 12AU7 gain stage, a 12AU7 long-tailed pair, EL84s in push-pull.
const pair: PushPullLink = {
  kind: 'push-pull-output', tube: findOutputTube('EL84')!, connection: 'ultralinear', bplus: 300, screenVolts: 300, ulTap: 0.4, raa: 8000, rPrimary: 240,
  bias: 'cathode', rk: 130, vg: 0, speakerOhms: 8, thdLimit: 0.05, coupling: { kind: 'capacitor', cc: 220e-9, rg: 470e3 },
};
const input: ChainInput = {
  source: { rsource: 600 },
  stages: [
    { kind: 'common-cathode', tube: findTube('12AX7')!, bplus: 280, ra: 100e3, rk: 1500, bypassed: true, ck: 22e-6, coupling: { kind: 'direct' } },
    { kind: 'follower', tube: findTube('12AU7')!, bplus: 280, rk: 22e3, vbias: 140, coupling: { kind: 'capacitor', cc: 100e-9, rg: 1e6 } },
    { kind: 'common-cathode', tube: findTube('12AU7')!, bplus: 300, ra: 47e3, rk: 1200, bypassed: false, coupling: { kind: 'capacitor', cc: 220e-9, rg: 470e3 } },
    { kind: 'long-tailed-pair', tube: findTube('12AU7')!, bplus: 350, ra: 33e3, ra2: 36e3, rk: 470, rtail: 10e3, vbias: 60, coupling: { kind: 'capacitor', cc: 100e-9, rg: 1e6 } },
    pair,
  ],
};
const amp = (() => {
  const r = solveAmplifier(input);
  if (!r.ok) throw new Error(r.message);
  return r;
})();
const partsOf = (i: number) => {
  const p = chainStageParts(input, amp, i, 'E12');
  if (!p) throw new Error(`stage ${i + 1} has parts`);
  return p;
};
const line = <T extends { ref: string }>(lines: readonly T[], ref: string) => {
  const l = lines.find((x) => x.ref === ref);
  if (!l) throw new Error(`${ref} is listed (got ${lines.map((x) => x.ref).join(', ')})`);
  return l;
};

describe('each stage kind\'s parts, rated from its place in the solved amplifier', () => {
  it('a gain stage: its resistors dissipate I²R at its own current (Joule\'s law), its bypass sees its cathode', () => {
    const p = partsOf(0);
    expect(p.title).toBe('Stage 1, 12AX7 gain stage');
    const ia = amp.stages[0]!.op.ia;
    // 100 kΩ and 1.5 kΩ are E12 values, so the preferred value is the design's.
    expectClose(line(p.resistors, 'Ra1').watts, ia * ia * 100e3, { rel: 1e-12 }, 'Ra1');
    expectClose(line(p.resistors, 'Rk1').watts, ia * ia * 1500, { rel: 1e-12 }, 'Rk1');
    // Direct from the source: no coupling capacitor and no grid leak of its own.
    expect(p.resistors.map((r) => r.ref)).toEqual(['Ra1', 'Rk1']);
    const ck = line(p.capacitors, 'Ck1');
    expect(ck.value).toBe(22e-6);
    expectClose(ck.volts, amp.stages[0]!.op.vk, { rel: 1e-12 }, 'Ck1 volts');
  });

  it('a capacitor-coupled follower: its capacitor across the plate before it less its grid, its B+ less its grid cold; its divider holds the grid', () => {
    const p = partsOf(1);
    expect(p.title).toBe('Stage 2, 12AU7 cathode follower, capacitor-coupled');
    const cc = line(p.capacitors, 'Cc2');
    expectClose(cc.volts, amp.stages[0]!.outputDc - 140, { rel: 1e-12 }, 'running');
    expect(cc.voltsAtSwitchOn).toBe(280 - 140);
    // The divider: 220 kΩ below (common practice), above it the E12 value nearest 220k·(280 − 140)/140 = 220 kΩ (Ohm's law).
    expect(line(p.resistors, 'Rd2a').preferred).toBe(220e3);
    expect(line(p.resistors, 'Rd2b').preferred).toBe(220e3);
    expectClose(line(p.resistors, 'Rk2').watts, amp.stages[1]!.op.ia ** 2 * 22e3, { rel: 1e-12 }, 'Rk2');
  });

  it('a gain stage after a follower: coupled from the follower\'s cathode, cold at the B+ before it', () => {
    const p = partsOf(2);
    const cc = line(p.capacitors, 'Cc3');
    expect(cc.role).toBe('coupling from stage 2 into stage 3');
    expectClose(cc.volts, amp.stages[1]!.outputDc, { rel: 1e-12 }, 'running');
    expect(cc.voltsAtSwitchOn).toBe(280);
    expect(line(p.resistors, 'Rg3').value).toBe(470e3);
    // Unbypassed: no Ck.
    expect(p.capacitors.map((c) => c.ref)).toEqual(['Cc3']);
  });

  it('a gain stage with a grid stopper lists it after its leak, carrying no current (its grid draws none below the onset)', () => {
    const stopped: ChainInput = { ...input, stages: input.stages.map((s, i) => (i === 2 ? { ...s, rstopper: 33e3 } : s)) };
    const r = solveAmplifier(stopped);
    if (!r.ok) throw new Error(r.message);
    const p = chainStageParts(stopped, r, 2, 'E12')!;
    expect(p.resistors.map((x) => x.ref)).toEqual(['Ra3', 'Rk3', 'Rg3', 'Rst3']);
    const rst = line(p.resistors, 'Rst3');
    expect(rst.role).toBe('stage 3 grid stopper, at the socket');
    expect(rst.preferred).toBe(33e3);
    expect(rst.watts).toBe(0);
    // Without one, none is listed.
    expect(partsOf(2).resistors.map((x) => x.ref)).not.toContain('Rst3');
  });

  it('a follower\'s and a splitter\'s grid stoppers are listed with their own parts, carrying no current', () => {
    const follower: ChainInput = { ...input, stages: input.stages.map((s, i) => (i === 1 ? { ...s, rstopper: 47e3 } : s)) };
    const r = solveAmplifier(follower);
    if (!r.ok) throw new Error(r.message);
    const p = chainStageParts(follower, r, 1, 'E12')!;
    expect(p.resistors.map((x) => x.ref)).toEqual(['Rk2', 'Rg2', 'Rd2a', 'Rd2b', 'Rst2']);
    expect(line(p.resistors, 'Rst2')).toMatchObject({ role: 'stage 2 follower grid stopper, at the socket', preferred: 47e3, watts: 0 });
    expect(partsOf(1).resistors.map((x) => x.ref)).not.toContain('Rst2');

    const splitter = { kind: 'split-load' as const, tube: findTube('12AU7')!, bplus: 300, ra: 22e3, rk: 22e3, vbias: 90, rstopper: 10e3, coupling: { kind: 'capacitor' as const, cc: 100e-9, rg: 1e6 } };
    const split: ChainInput = { source: { rsource: 600 }, stages: [input.stages[2]!, splitter, pair] };
    const rs = solveAmplifier(split);
    if (!rs.ok) throw new Error(rs.message);
    const ps = chainStageParts(split, rs, 1, 'E12')!;
    expect(line(ps.resistors, 'Rsts')).toMatchObject({ role: 'splitter grid stopper, at the socket', preferred: 10e3, watts: 0 });
    // A long-tailed pair's, at the grid the signal drives.
    const tail: ChainInput = { ...input, stages: input.stages.map((s, i) => (i === 3 ? { ...s, rstopper: 4.7e3 } : s)) };
    const rt = solveAmplifier(tail);
    if (!rt.ok) throw new Error(rt.message);
    expect(line(chainStageParts(tail, rt, 3, 'E12')!.resistors, 'Rsts')).toMatchObject({ role: 'splitter grid stopper, at the first grid\'s socket', preferred: 4.7e3, watts: 0 });
  });

  it('a gain stage with a volume control lists the pot in its leak\'s place, at its value as given (pots come in their own few values)', () => {
    const potted: ChainInput = { ...input, stages: input.stages.map((s, i) => (i === 2 && s.kind === 'common-cathode' && s.coupling.kind === 'capacitor' ? { ...s, volume: 0.5, coupling: { ...s.coupling, rg: 250e3 } } : s)) };
    const r = solveAmplifier(potted);
    if (!r.ok) throw new Error(r.message);
    const p = chainStageParts(potted, r, 2, 'E12')!;
    expect(p.resistors.map((x) => x.ref)).toEqual(['Ra3', 'Rk3', 'VR3']);
    const vr = line(p.resistors, 'VR3');
    expect(vr.role).toBe('stage 3 volume control, audio taper, in the grid leak\'s place: wiper to the grid');
    // 250 kΩ is no E12 value (220k and 270k are): a pot is ordered as given.
    expect(vr.preferred).toBe(250e3);
    expect(vr.potentiometer).toBe(true);
    expect(vr.watts).toBe(0);
  });

  it('a long-tailed pair: the tail carries both triodes\' current, its outputs are coupled by the pair\'s capacitors', () => {
    const p = partsOf(3);
    expect(p.title).toBe('Phase splitter, 12AU7 long-tailed pair');
    const st = amp.stages[3]!;
    expectClose(line(p.resistors, 'Rtail').watts, st.supplyCurrent ** 2 * 10e3, { rel: 1e-12 }, 'tail');
    // 36 kΩ is not an E12 value: 39 kΩ is ordered, and rated at its own value.
    const ras2 = line(p.resistors, 'Ras2');
    expect(ras2.preferred).toBe(39e3);
    expectClose(ras2.watts, (st.supplyCurrent - st.op.ia) ** 2 * 39e3, { rel: 1e-12 }, 'second plate');
    const [c1, c2] = [line(p.capacitors, 'Ccs1'), line(p.capacitors, 'Ccs2')];
    expect([c1.value, c2.value]).toEqual([220e-9, 220e-9]);
    expectClose(c1.volts, st.op.va, { rel: 1e-12 }, 'first plate');
    // The second plate by Ohm's law: B+ less its current through Ra2.
    expectClose(c2.volts, 350 - (st.supplyCurrent - st.op.ia) * 36e3, { rel: 1e-12 }, 'second plate');
    const divider = gridDivider({ upper: 'Rd1', lower: 'Rd2', cap: 'Cd' }, 350, 60, 'E12');
    expect(line(p.resistors, 'Rd1').preferred).toBe(divider.resistors[0]!.preferred);
  });

  it('the output stage\'s parts come with its own analysis; a stage past the end has none', () => {
    expect(chainStageParts(input, amp, 4, 'E12')).toBeNull();
    expect(chainStageParts(input, amp, 9, 'E12')).toBeNull();
  });

  it('a divider for 90 V from 330 V: 560 kΩ over 220 kΩ (E12), decoupled at or below a 2 Hz corner with an E12 capacitor (Ohm\'s law; common practice for the corner and the series)', () => {
    const d = gridDivider({ upper: 'Rd1', lower: 'Rd2', cap: 'Cd' }, 330, 90, 'E12');
    // 220k·(330 − 90)/90 = 587 kΩ: nearest E12 is 560 kΩ.
    expect(d.resistors.map((r) => r.preferred)).toEqual([560e3, 220e3]);
    expectClose(d.resistors[0]!.watts, (330 / 780e3) ** 2 * 560e3, { rel: 1e-12 }, 'upper');
    // 1/(2π·2 Hz·(560k ∥ 220k)) = 0.504 µF, ordered at the next E12 value up (common practice): 560 nF, a 1.8 Hz corner.
    expect(d.capacitor.value).toBe(560e-9);
    expectClose(1 / (2 * Math.PI * d.capacitor.value! * ((560e3 * 220e3) / 780e3)), 1.80, { rel: 0.005 }, 'corner');
  });
});

describe('the amplifier\'s parts, stage by stage', () => {
  it('lists every voltage stage and the splitter in chain order, and Cout with the last voltage stage, across its plate less the splitter\'s grid', () => {
    const all = amplifierParts(input, amp, { series: 'E12' });
    expect(all.map((p) => p.index)).toEqual([0, 1, 2, 3]);
    const cout = all[2]!.capacitors.find((c) => c.ref === 'Cout')!;
    expect(cout.role).toBe('coupling into the splitter\'s grid from stage 3\'s plate');
    expect(cout.value).toBe(100e-9);
    expectClose(cout.volts, amp.stages[2]!.outputDc - 60, { rel: 1e-12 }, 'running');
    expect(cout.voltsAtSwitchOn).toBe(300 - 60);
    // Only one Cout, and the unique refs a build card needs.
    const refs = all.flatMap((p) => [...p.resistors, ...p.capacitors].map((x) => x.ref));
    expect(new Set(refs).size).toBe(refs.length);
  });

  it('into a fixed-bias output grid, Cout holds the plate\'s DC less the (negative) grid bias', () => {
    const se: ChainInput = {
      source: { rsource: 600 },
      stages: [
        input.stages[0]!,
        { kind: 'single-ended-output', tube: findOutputTube('EL34')!, connection: 'pentode', bplus: 350, screenVolts: 300, ulTap: 0.43, zPrimary: 3500, rPrimary: 120, bias: 'fixed', rk: 0, vg: -24, speakerOhms: 8, thdLimit: 0.05, coupling: { kind: 'capacitor', cc: 220e-9, rg: 220e3 } },
      ],
    };
    const r = solveAmplifier(se);
    if (!r.ok) throw new Error(r.message);
    const cout = amplifierParts(se, r, { series: 'E12' })[0]!.capacitors.find((c) => c.ref === 'Cout')!;
    expectClose(cout.volts, r.stages[0]!.outputDc + 24, { rel: 1e-12 }, 'running');
    expect(cout.voltsAtSwitchOn).toBe(280 + 24);
  });

  it('a capacitor standing for an ideal one is ordered at the value for the wanted corner, C = 1/(2π·f·R) (Horowitz & Hill, 3rd ed., §1.7)', () => {
    const two: ChainInput = { source: { rsource: 600 }, stages: [input.stages[0]!, { ...(input.stages[2] as Extract<ChainInput['stages'][number], { kind: 'common-cathode' }>), coupling: { kind: 'capacitor', cc: 1, rg: 470e3 } }], load: { rl: 100e3 } };
    const r = solveAmplifier(two);
    if (!r.ok) throw new Error(r.message);
    const all = amplifierParts(two, r, { series: 'E12', loadCoupling: null, unsized: { cc: 1, cornerHz: 5 } });
    const cc2 = all[1]!.capacitors.find((c) => c.ref === 'Cc2')!;
    // 1/(2π · 5 Hz · (Zout1 + 470 kΩ)), then the next E12 value up.
    const exact = 1 / (2 * Math.PI * 5 * (r.stages[0]!.zout + 470e3));
    expect(cc2.value!).toBeGreaterThanOrEqual(exact);
    expect(cc2.value!).toBeLessThan(exact * 1.25);
    expect(cc2.role).toMatch(/sized for a 5 Hz corner/);
    // Into the load, Cout is the design's: ideal, so to choose.
    const cout = all[1]!.capacitors.find((c) => c.ref === 'Cout')!;
    expect(cout.value).toBeNull();
    expect(cout.role).toBe('output coupling from stage 2\'s plate');
  });
});
