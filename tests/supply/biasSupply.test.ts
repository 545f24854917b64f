import { describe, expect, it } from 'vitest';
import { solveChain, withBiasHum, type ChainInput, analyzeOutput, analyzePushPull, findOutputTube, outputBiasSupply, pairBiasSupply, solveBiasSupply, COLD_END_MARGIN, HOT_END_SLACK, POT_VALUES, E12, type OutputDesign, type PushPullDesign } from '../../src/index';
import { hotEnd } from '../../src/output/hotEnd';
import { designString, reachOn } from '../../src/supply/biasString';
import { expectClose } from '../helpers/expectClose';

// Our own bias rail: a 50 V tap, 150 Ω, 47 µF, 4.7 kΩ into 100 µF, on 50 Hz mains.
const rail = { mainsHz: 50, secondaryRms: 50, windingOhms: 150, reservoir: 47e-6, r: 4700, c: 100e-6 };
const el34 = findOutputTube('EL34')!;
const l6 = findOutputTube('6L6GC')!;
const pair: PushPullDesign = { tubeId: 'EL34', connection: 'ultralinear', bplus: 430, screenVolts: 430, ulTap: 0.43, raa: 6600, rPrimary: 200, bias: 'fixed', rk: 220, vg: -40, rg: 220e3, speakerOhms: 8, thdLimit: 0.05 };
const single: OutputDesign = { tubeId: '6L6GC', connection: 'pentode', bplus: 350, screenVolts: 250, ulTap: 0.43, zPrimary: 4200, rPrimary: 150, bias: 'fixed', rk: 1, vg: -18, rg: 100e3, speakerOhms: 8, thdLimit: 0.05 };
const isE12 = (r: number) => E12.some((m) => Math.abs(r / 10 ** Math.floor(Math.log10(r)) - m) < 1e-9);

describe('a bias string', () => {
  it('reaches from just below the weakest tube to past the strongest, in E12 resistors and a 1-2-5 trimmer (Ohm\'s law along the string)', () => {
    const s = designString(56, { weakest: 33, strongest: 41 })!;
    expect(isE12(s.top) && isE12(s.bottom)).toBe(true);
    expect(POT_VALUES).toContain(s.pot);
    const total = s.top + s.pot + s.bottom;
    expectClose(s.least, (56 * s.bottom) / total, { rel: 1e-12 }, 'hot end');
    expectClose(s.most, (56 * (s.bottom + s.pot)) / total, { rel: 1e-12 }, 'cold end');
    expect(s.least).toBeLessThanOrEqual(33);
    expect(s.least).toBeGreaterThanOrEqual(33 * (1 - HOT_END_SLACK));
    expect(s.most).toBeGreaterThanOrEqual(41 * (1 + COLD_END_MARGIN));
    // Near the current it is designed to: within one E12 step either way of 1 mA.
    expect(s.amps).toBeGreaterThan(1e-3 / 1.25);
    expect(s.amps).toBeLessThan(1e-3 * 1.25);
  });

  it('is not offered when the rail cannot reach past the strongest tube', () => {
    expect(designString(44, { weakest: 33, strongest: 41 })).toBeNull();
    expect(designString(60, { weakest: 0, strongest: 41 })).toBeNull();
  });
});

describe('solveBiasSupply', () => {
  it('holds each wiper at its tube\'s setting on the solved rail, with the rail\'s ripple scaled by the wiper\'s share', () => {
    const s = solveBiasSupply(rail, [{ weakest: 33, nominal: 37, strongest: 41 }, { weakest: 33, nominal: 37, strongest: 41 }]);
    if (!s.ok) throw new Error(s.message);
    expect(s.taps).toHaveLength(2);
    const t = s.taps[0]!;
    const total = t.string.top + t.string.pot + t.string.bottom;
    // Ohm's law: the wiper's lower part carries the string's current.
    expectClose((s.rail / total) * (t.string.bottom + t.travel * t.string.pot), 37, { rel: 1e-9 }, 'wiper');
    expectClose(t.gridRippleRms, (s.railRippleRms * 37) / s.rail, { rel: 1e-12 }, 'grid ripple');
    // The strings draw the rail's voltage over their resistance, every one.
    expectClose(s.load, (2 * s.rail) / total, { rel: 2e-3 }, 'load');
    // Half-wave into a capacitor: the diode stands the winding's peak and the reservoir's (the textbook relation).
    expectClose(s.piv, 2 * Math.SQRT2 * 50, { rel: 1e-9 }, 'PIV');
    expect(s.rail).toBeLessThan(s.reservoir);
  });

  it('names the winding when the rail cannot reach the strongest tube, and each bad value by its field', () => {
    const low = solveBiasSupply({ ...rail, secondaryRms: 30 }, [{ weakest: 33, nominal: 37, strongest: 41 }]);
    expect(low).toMatchObject({ ok: false, reason: 'supply-too-low', field: 'secondaryRms', message: expect.stringMatching(/^The bias rail gives −\d+\.\d V; tube 1's adjustment must reach −45\.1 V/) });
    expect(solveBiasSupply({ ...rail, r: -1 }, [{ weakest: 33, nominal: 37, strongest: 41 }])).toMatchObject({ ok: false, field: 'r' });
    expect(solveBiasSupply({ ...rail, reservoir: 0 }, [{ weakest: 33, nominal: 37, strongest: 41 }])).toMatchObject({ ok: false, field: 'reservoir' });
    // Named as the bias winding's own limit (the B+ solver's), not in the B+ winding's words.
    expect(solveBiasSupply({ ...rail, windingOhms: 20e3 }, [{ weakest: 33, nominal: 37, strongest: 41 }])).toMatchObject({ ok: false, field: 'windingOhms', message: 'Bias winding resistance must be at most 10000 Ω (got 20000 Ω)' });
    expect(solveBiasSupply(rail, [{ weakest: 41, nominal: 37, strongest: 33 }])).toMatchObject({ ok: false, field: 'reaches' });
  });
});

describe('a fixed-bias output stage\'s bias supply', () => {
  it('gives a pair one string per tube covering its adjustment, rated parts, and no hum figure (the ripple is common to both grids)', () => {
    const a = analyzePushPull(el34, pair);
    if (!a.ok) throw new Error(a.message);
    const b = pairBiasSupply(a, rail);
    if (!b.ok) throw new Error(b.message);
    expect(b.taps).toHaveLength(2);
    expect(b.taps[0]!.string.least).toBeLessThanOrEqual(-b.adjustment.weakest);
    expect(b.taps[0]!.string.most).toBeGreaterThanOrEqual(-b.adjustment.strongest);
    expect(b.humAtSpeaker).toBeNull();
    expect(b.parts.resistors.map((r) => r.ref)).toEqual(['Rb1', 'Rbt1, Rbt2', 'VRb1, VRb2', 'Rbb1, Rbb2']);
    expect(b.parts.capacitors.every((c) => c.polarity === '+ to ground' && c.ratingVolts >= 1.1 * b.noLoadVolts)).toBe(true);
    // 1N4001–1N4007 reverse ratings (their data sheet): the first at or past the PIV with the mains 10 % high.
    expect(b.parts.rectifier.diodeVolts).toBe(200);
  });

  it('feeds every channel\'s tubes from the one rail: a stereo pair hangs four strings on it, which pull it lower', () => {
    const a = analyzePushPull(el34, pair);
    if (!a.ok) throw new Error(a.message);
    const stiff = { ...rail, r: 1000 };
    const mono = pairBiasSupply(a, stiff);
    const stereo = pairBiasSupply(a, stiff, 2);
    if (!mono.ok || !stereo.ok) throw new Error('not solved');
    expect(stereo.taps).toHaveLength(4);
    expect(stereo.parts.resistors.map((r) => r.ref)).toEqual(['Rb1', 'Rbt1, Rbt2, Rbt3, Rbt4', 'VRb1, VRb2, VRb3, VRb4', 'Rbb1, Rbb2, Rbb3, Rbb4']);
    // Each string draws the rail over its resistance (Ohm's law), all four from the one rail.
    const each = stereo.taps[0]!.string;
    expectClose(stereo.load, (4 * stereo.rail) / (each.top + each.pot + each.bottom), { rel: 2e-3 }, 'four strings');
    expect(stereo.load).toBeGreaterThan(1.5 * mono.load);
    expect(stereo.rail).toBeLessThan(mono.rail);
    expect(pairBiasSupply(a, rail, 0)).toMatchObject({ ok: false, field: 'channels' });
    // As many channels as one B+ supply feeds (8): sixteen strings on a stiff rail.
    const eight = pairBiasSupply(a, { ...rail, secondaryRms: 60, windingOhms: 50, reservoir: 100e-6, r: 470, c: 220e-6 }, 8);
    expect(eight.ok && eight.taps.length).toBe(16);
  });

  it('chooses lighter strings where the rail would sag too far under strings at their aim, and still reaches every setting', () => {
    const a = analyzePushPull(el34, pair);
    if (!a.ok) throw new Error(a.message);
    // Through 4.7 kΩ, four strings at 1 mA leave about −45 V, short of the −46 V the strongest tube and its margin need.
    const light = pairBiasSupply(a, rail, 2);
    if (!light.ok) throw new Error(light.message);
    const t = light.taps[0]!.string;
    expect(t.amps).toBeLessThan(0.75e-3);
    expect(t.least).toBeLessThanOrEqual(-light.adjustment.weakest);
    expect(t.most).toBeGreaterThanOrEqual(-light.adjustment.strongest * (1 + COLD_END_MARGIN));
  });

  it('turned to the hot end, a tube runs hotter than at idle, and its finding says to start at the cold end', () => {
    const a = analyzePushPull(el34, pair);
    if (!a.ok) throw new Error(a.message);
    const b = pairBiasSupply(a, rail);
    if (!b.ok) throw new Error(b.message);
    expect(b.hotEnd.ip).toBeGreaterThan(a.solution.idle[0].ip);
    expect(b.findings[0]).toMatchObject({ kind: 'bias-range', message: expect.stringMatching(/hot end .*Set every adjustment to its cold end \(most negative\) before switching on/) });
  });

  it('at the law\'s own setting, the hot-end check gives back the idle current (the adjustment solved the other way)', () => {
    const a = analyzeOutput(l6, single);
    if (!a.ok) throw new Error(a.message);
    const op = a.solution.op;
    const h = hotEnd(l6, single, op.vpk, op.ip, op.vgk);
    if (!h.ok) throw new Error(h.message);
    expectClose(h.ip, op.ip, { rel: 0.005 }, 'idle current');
  });

  it('counts the string behind the wiper into the grid circuit: a 6L6GC\'s 100 kΩ leak is already at the data sheet\'s fixed-bias maximum', () => {
    const a = analyzeOutput(l6, single);
    if (!a.ok) throw new Error(a.message);
    const b = outputBiasSupply(a, { ...rail, secondaryRms: 30 });
    if (!b.ok) throw new Error(b.message);
    // 6L6GC data sheet: grid-circuit resistance 0.1 MΩ at most under fixed bias.
    expect(b.findings.find((f) => f.kind === 'grid-resistor')).toMatchObject({ severity: 'warning', limit: 100e3 });
  });

  it('gives a single tube\'s hum at the speaker as its grid\'s ripple times the stage\'s gain, as the amplifier solves that gain from the large-signal law', () => {
    const a = analyzeOutput(l6, single);
    if (!a.ok) throw new Error(a.message);
    const b = outputBiasSupply(a, rail);
    if (!b.ok) throw new Error(b.message);
    const chain = solveChain({ source: { rsource: 0 }, stages: [{ ...single, kind: 'single-ended-output', tube: l6, coupling: { kind: 'capacitor', cc: 1e-6, rg: 100e3 } }] } as ChainInput);
    if (!chain.ok) throw new Error(chain.message);
    expectClose(b.humAtSpeaker! / b.taps[0]!.gridRippleRms, Math.abs(chain.stages[0]!.gain), { rel: 0.02 }, 'grid to speaker');
  });

  it('refuses a cathode-biased stage by its bias', () => {
    const a = analyzeOutput(l6, { ...single, bias: 'cathode', rk: 250 });
    if (!a.ok) throw new Error(a.message);
    expect(outputBiasSupply(a, rail)).toMatchObject({ ok: false, field: 'bias' });
  });
});

describe('withBiasHum', () => {
  it('adds the bias rail\'s share to the bound as if in phase, and nothing for none', () => {
    const h = { volts: [1e-3, 2e-4], screens: [null, null], bound: 1.2e-3 };
    const added = withBiasHum(h, 3e-4);
    expect(added).toMatchObject({ ok: true, bias: 3e-4 });
    expect(added.ok && added.bound).toBeCloseTo(1.5e-3, 15);
    expect(withBiasHum(h, null)).toMatchObject({ ok: true, bound: 1.2e-3, bias: null });
  });

  // Found by the robustness run on a fresh seed: two finite figures whose sum overflowed came back Infinity.
  it('a sum past the largest double is a typed failure, not Infinity', () => {
    expect(withBiasHum({ volts: [0, null], screens: [null, 0], bound: 1.7e308 }, 9.77e306)).toMatchObject({ ok: false, reason: 'invalid-input' });
  });
});

describe('reachOn', () => {
  it('is Ohm\'s law along the string', () => {
    expect(reachOn({ top: 10e3, pot: 20e3, bottom: 30e3 }, 60)).toEqual({ amps: 1e-3, least: 30, most: 50 });
  });
});
