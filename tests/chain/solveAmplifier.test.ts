import { describe, expect, it } from 'vitest';
import { amplifierAtLevel, findOutputTube, findTube, solveChain, type ChainInput, type ChainStage } from '../../src/index';
import { expectClose } from '../helpers/expectClose';
import { solveLinks } from '../../src/signal/solveLinks';

const ax7 = findTube('12AX7')!;
const au7 = findTube('12AU7')!;
const el34 = findOutputTube('EL34')!;

// Our own values.
const gainStage = (rg = 1e6): ChainStage => ({ kind: 'common-cathode', tube: ax7, bplus: 290, ra: 100e3, rk: 1500, bypassed: true, coupling: { kind: 'capacitor', cc: 100e-9, rg } });
const driver: ChainStage = { kind: 'common-cathode', tube: au7, bplus: 290, ra: 22e3, rk: 2200, bypassed: false, coupling: { kind: 'capacitor', cc: 47e-9, rg: 470e3 } };
const follower: ChainStage = { kind: 'follower', tube: au7, bplus: 290, rk: 33e3, coupling: { kind: 'direct' } };
const output: ChainStage = {
  kind: 'single-ended-output', tube: el34, connection: 'ultralinear', bplus: 330, screenVolts: 300, ulTap: 0.43, zPrimary: 3300, rPrimary: 120,
  bias: 'cathode', rk: 330, vg: -20, speakerOhms: 8, thdLimit: 0.05, coupling: { kind: 'capacitor', cc: 220e-9, rg: 270e3 },
};
const amp = (...stages: ChainStage[]): ChainInput => ({ source: { rsource: 1e3 }, stages });

const solved = (c: ChainInput) => {
  const r = solveChain(c);
  if (!r.ok) throw new Error(r.message);
  return r;
};

describe('an amplifier of 1 to 8 stages', () => {
  // Common practice: each plate output inverts; a cathode follower does not.
  it('an odd count of common-cathode stages inverts; a follower changes nothing (common practice)', () => {
    expect(solved(amp(gainStage())).inverting).toBe(true);
    expect(solved(amp(gainStage(), driver)).inverting).toBe(false);
    expect(solved(amp(gainStage(), driver, gainStage(470e3))).inverting).toBe(true);
    expect(solved(amp(gainStage(), follower)).inverting).toBe(true);
    expect(solved(amp(gainStage(), driver, follower)).inverting).toBe(false);
  });

  it('the overall gain is the source divider times each stage\'s gain into the next grid', () => {
    const r = solved(amp(gainStage(), driver, follower));
    // The first grid's input: its 1 MΩ leak with its grid current's slope at its bias (see the test below on that slope).
    const zin = r.stages[0]!.zin!;
    expect(zin).toBeLessThanOrEqual(1e6);
    const divider = zin / (zin + 1e3);
    expectClose(r.gain, divider * r.stages[0]!.gain * r.stages[1]!.gain * r.stages[2]!.gain, { rel: 1e-12 });
    // The driver's leak loads the first plate: its gain is lower than unloaded (Ra ∥ Rg).
    const unloaded = solved(amp(gainStage()));
    expect(Math.abs(r.stages[0]!.gain)).toBeLessThan(Math.abs(unloaded.stages[0]!.gain));
  });

  it('a direct-coupled follower\'s grid sits at the plate before it', () => {
    const r = solved(amp(gainStage(), follower));
    expect(r.stages[1]!.op.vk + r.stages[1]!.op.vgk).toBeCloseTo(r.stages[0]!.op.va, 9);
    expect(r.stages[1]!.zin).toBeNull();
  });

  // Common practice: the stage that clips first is the one with the least headroom.
  it('names the stage that clips first as the one with no headroom; every other has some', () => {
    for (const c of [amp(gainStage(), driver, follower), amp(gainStage(), follower, output), amp(gainStage(), driver, gainStage(470e3), follower)]) {
      const r = solved(c);
      const first = r.clipsFirst.stage;
      expect(r.stages[first]!.headroomDb).toBeCloseTo(0, 9);
      r.stages.forEach((s, i) => {
        if (i !== first && s.headroomDb !== null) expect(s.headroomDb).toBeGreaterThan(0);
      });
      expectClose(r.inputPeak, r.stages[first]!.clipsAt!.inputPeak, { rel: 1e-12 });
    }
  });

  // Common practice: sensitivity times gain gives the level asked, at a level well below clipping.
  it('the sensitivity times the gain gives the level asked (common practice), and each stage\'s swing there', () => {
    const c = amp(gainStage(), follower, output);
    const r = solved(c);
    const at = amplifierAtLevel(c, { power: 0.05 });
    if (!at.ok) throw new Error(at.message);
    expectClose(at.output.rms, Math.sqrt(0.05 * 8), { rel: 1e-6 }, 'speaker volts');
    expectClose(at.input.rms * Math.abs(r.gain), at.output.rms, { rel: 0.01 }, 'sensitivity × gain');
    expect(at.thd).toBeGreaterThan(0);
    expect(at.thd).toBeLessThan(0.05);
    at.stages.forEach((s) => expect(s.headroomDb).toBeGreaterThan(0));
    const past = amplifierAtLevel(c, { outputRms: 2 * r.output.rms });
    expect(past.ok === false && past.reason).toBe('clipping');
  });

  it('the clean power is the fundamental\'s (as the output stage states its own): asking for it takes the clean limit\'s input', () => {
    const c = amp(gainStage(), follower, output);
    const r = solved(c);
    // The follower's grid reaches the onset of grid current (−0.7 V to its cathode) before the EL34's reaches 0 V.
    expect(r.clipsFirst).toEqual({ stage: 1, by: 'grid-current' });
    const at = amplifierAtLevel(c, { power: r.outputPower! * (1 - 1e-9) });
    if (!at.ok) throw new Error(at.message);
    expectClose(at.inputPeak, r.inputPeak, { rel: 1e-3 }, 'input for the clean power');
    // The speaker's volts shown beside the power are the same fundamental's: P = V²/R (Ohm's law).
    expectClose(r.speakerRms! ** 2 / 8, r.outputPower!, { rel: 1e-12 }, 'V²/R');
  });

  it('eight stages solve; nine are refused', () => {
    const eight = [gainStage(), driver, gainStage(470e3), driver, gainStage(470e3), driver, gainStage(470e3), follower];
    const r = solveChain(amp(...eight));
    expect(r.ok).toBe(true);
    expect(solveChain(amp(...eight, driver))).toMatchObject({ ok: false, field: 'stages' });
  });

  it("the load's own coupling capacitor sets the low end with the last stage's output impedance and the load (a first-order high pass, Millman & Taub)", () => {
    // Every other capacitor far larger, so this one alone sets the corner: 1/(2π·(Zout + RL)·C), about 34 Hz, far enough
    // below the 1 kHz the band's edges are read against for that reference to move it by under 0.1 %.
    const big: ChainStage = { ...gainStage(), coupling: { kind: 'capacitor', cc: 100e-6, rg: 1e6 } };
    const ideal = solved({ ...amp(big), load: { rl: 10e3 } });
    const real = solved({ ...amp(big), load: { rl: 10e3, cc: 100e-9 } });
    const corner = 1 / (2 * Math.PI * (real.stages[0]!.zout + 10e3) * 100e-9);
    expectClose(real.lowHz!, corner, { rel: 0.01 }, 'low −3 dB with the load capacitor');
    expect(ideal.lowHz ?? 0).toBeLessThan(corner / 100);
    // Midband is the load's alone: the capacitor passes it.
    expectClose(real.gain, ideal.gain, { rel: 1e-9 }, 'midband gain');
    expect(solveChain({ ...amp(big), load: { rl: 10e3, cc: -1e-9 } })).toMatchObject({ ok: false, field: 'load.cc' });
  });

  it('names the stage and field of a bad value, and refuses an output stage before the end', () => {
    expect(solveChain(amp(gainStage(), { ...driver, ra: -5 } as ChainStage))).toMatchObject({ ok: false, field: 'stages.1.ra', message: expect.stringMatching(/^Stage 2: Ra/) });
    expect(solveChain(amp(gainStage(), { ...driver, coupling: { kind: 'capacitor', cc: 47e-9 } } as unknown as ChainStage))).toMatchObject({ ok: false, field: 'stages.1.rg' });
    expect(solveChain(amp(output, gainStage()))).toMatchObject({ ok: false, field: 'stages.0.kind' });
    // An output stage with no tube is named, not read from (found by the robustness run: a throw on the tube's id).
    expect(solveChain(amp(gainStage(), { ...output, tube: null } as unknown as ChainStage))).toMatchObject({ ok: false });
    expect(solveChain(amp(gainStage(), { ...output, coupling: { kind: 'direct' } } as ChainStage))).toMatchObject({ ok: false, field: 'stages.1.coupling' });
    expect(solveChain({ source: { rsource: -1 }, stages: [gainStage()] })).toMatchObject({ ok: false, field: 'source.rsource' });
    expect(solveChain({ source: { rsource: 0 }, stages: [] })).toMatchObject({ ok: false, field: 'stages' });
    // A kind's name is looked up among the kinds themselves, not the object's inherited keys (found by the property test).
    expect(solveChain(amp({ ...driver, kind: 'toString' } as unknown as ChainStage))).toMatchObject({ ok: false, field: 'stages.0.kind' });
  });

  it('the first version\'s array of links keeps its meaning beside the amplifier form', () => {
    const links = [{ kind: 'common-cathode' as const, tube: ax7, bplus: 290, ra: 100e3, rk: 1500 }, { kind: 'follower' as const, tube: au7, bplus: 290, rk: 33e3 }];
    const old = solveChain(links);
    expect(old).toEqual(solveLinks(links));
    const now = solveChain({ source: { rsource: 0 }, stages: [{ ...gainStage(), coupling: { kind: 'direct' } }, follower] });
    if (!old.ok || !now.ok) throw new Error('both solve');
    expectClose(now.gain, old.gain, { rel: 1e-9 }, 'same circuit, same gain');
    expectClose(now.inputPeak, old.inputPeak, { rel: 1e-6 }, 'same clean limit');
  });

  it('every finding is tagged with its stage, in one list', () => {
    const hot: ChainStage = { ...follower, bplus: 420 };
    const r = solved(amp({ ...gainStage(), bplus: 420, ra: 220e3 } as ChainStage, hot));
    expect(r.findings.some((f) => f.stage === 1 && f.kind === 'heater-cathode' && f.severity === 'danger')).toBe(true);
    expect(r.findings.every((f) => f.stageName.startsWith(`Stage ${f.stage + 1}`))).toBe(true);
    expect(r.stages[1]!.findings.every((f) => f.stage === 1)).toBe(true);
  });
});
