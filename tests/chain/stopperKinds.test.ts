import { describe, expect, it } from 'vitest';
import { findOutputTube, findTube, recordOf, solveChain, type ChainInput, type ChainStage } from '../../src/index';
import { expectClose } from '../helpers/expectClose';
import { longTailedPairKind } from '../../src/chain/longTailedPairKind';
import type { LinkSample } from '../../src/chain/stageKind';

// A follower's and a split-load splitter's grid stopper, as a gain stage's: checked as a field of its stage, and noted
// with its own corner, 1/(2π·Rst·Cin), Cin by the Miller effect from the stage's own gains (J. M. Miller, Bureau of
// Standards Scientific Papers 15, no. 351, 1920): Cin = Cgp·(1 − Ap) + Cgk·(1 − Ak), Ap grid to plate, Ak grid to cathode.
const au7 = findTube('12AU7')!;
const caps = recordOf(au7)!.capacitances;
const gainStage: ChainStage = { kind: 'common-cathode', tube: findTube('12AX7')!, bplus: 300, ra: 220e3, rk: 1500, bypassed: true, coupling: { kind: 'capacitor', cc: 47e-9, rg: 1e6 } };
const follower = (rstopper: number): ChainInput => ({ source: { rsource: 600 }, stages: [gainStage, { kind: 'follower', tube: au7, bplus: 300, rk: 47e3, rstopper, coupling: { kind: 'direct' } }], load: { rl: 10e3 } });
const splitter = (rstopper: number): ChainInput => ({
  source: { rsource: 600 },
  stages: [
    gainStage,
    { kind: 'split-load', tube: au7, bplus: 300, ra: 22e3, rk: 22e3, vbias: 90, rstopper, coupling: { kind: 'capacitor', cc: 100e-9, rg: 1e6 } },
    {
      kind: 'push-pull-output', tube: findOutputTube('EL84')!, connection: 'ultralinear', bplus: 300, screenVolts: 300, ulTap: 0.4, raa: 8000, rPrimary: 240,
      bias: 'cathode', rk: 130, vg: 0, speakerOhms: 8, thdLimit: 0.05, coupling: { kind: 'capacitor', cc: 100e-9, rg: 470e3 },
    },
  ],
});
const longTail = (rstopper: number): ChainInput => {
  const s = splitter(rstopper);
  return { ...s, stages: [s.stages[0]!, { kind: 'long-tailed-pair', tube: au7, bplus: 400, ra: 47e3, ra2: 51e3, rk: 470, rtail: 15e3, vbias: 80, rstopper, coupling: { kind: 'capacitor', cc: 100e-9, rg: 1e6 } }, s.stages[2]!] };
};
const cornerOf = (r: ReturnType<typeof solveChain>, stage: number) => {
  if (!r.ok) throw new Error(r.message);
  return r.findings.find((f) => f.kind === 'grid-stopper' && f.stage === stage);
};

describe('a grid stopper on a follower or a splitter', () => {
  it('a follower\'s: its corner with Cgp plus Cgk bootstrapped by the follower\'s gain (its plate at signal ground)', () => {
    const r = solveChain(follower(100e3));
    if (!r.ok) throw new Error(r.message);
    const a = r.stages[1]!.gain;
    const note = cornerOf(r, 1)!;
    expect(note.severity).toBe('note');
    expectClose(note.value!, 1 / (2 * Math.PI * 100e3 * (caps.cgp + caps.cgk * (1 - a))), { rel: 1e-9 }, 'corner');
    expect(note.message).toMatch(/^Grid stopper 100 kΩ with the grid's 1\.73 pF \(Miller effect\): its own corner is 922 kHz, above the audio band/);
  });

  it('a split-load\'s: Cgp multiplied by one plus the plate\'s gain, Cgk by one less the cathode\'s', () => {
    const r = solveChain(splitter(220e3));
    if (!r.ok) throw new Error(r.message);
    const s = r.stages[1]!;
    // One current through both loads, each 22 kΩ beside a 470 kΩ leak: the cathode moves as far as the plate, in phase
    // with the grid (Ohm's law).
    const ak = -s.gain;
    expect(ak).toBeGreaterThan(0.8);
    const note = cornerOf(r, 1)!;
    expectClose(note.value!, 1 / (2 * Math.PI * 220e3 * (caps.cgp * (1 - s.gain) + caps.cgk * (1 - ak))), { rel: 1e-9 }, 'corner');
  });

  it('a long-tailed pair\'s, at its driven grid: Cgp by one less the first plate\'s gain, Cgk by one less the joined cathodes\' (about a half)', () => {
    const chain = longTail(100e3);
    const r = solveChain(chain);
    if (!r.ok) throw new Error(r.message);
    const s = r.stages[1]!;
    // How far the cathodes follow the first grid, read off the pair's own large-signal transfer (Koren's law solved at
    // each instant): a millivolt on the grid, less what its grid-to-cathode voltage moves.
    const solved = longTailedPairKind.solve(chain.stages[1] as Parameters<typeof longTailedPairKind.solve>[0], { gridDc: null, load: 470e3 });
    if (!solved.ok) throw new Error(solved.message);
    const out: LinkSample = { vout: 0, vout2: 0, vgk: 0, ia: 0 };
    solved.sample(1e-3, out);
    const ak = 1 - (out.vgk - s.op.vgk) / 1e-3;
    expect(ak).toBeGreaterThan(0.3);
    expect(ak).toBeLessThan(0.7);
    const note = cornerOf(r, 1)!;
    expectClose(note.value!, 1 / (2 * Math.PI * 100e3 * (caps.cgp * (1 - s.gain) + caps.cgk * (1 - ak))), { rel: 1e-4 }, 'corner');
  });

  it('none without one, and the same operating points with one', () => {
    const bare = solveChain(follower(0));
    const stopped = solveChain(follower(100e3));
    if (!bare.ok || !stopped.ok) throw new Error('solves');
    expect(cornerOf(bare, 1)).toBeUndefined();
    stopped.stages.forEach((s, i) => expect(s.op).toEqual(bare.stages[i]!.op));
  });

  it('a bad value is named as the stage\'s field', () => {
    expect(solveChain(follower(-1))).toMatchObject({ ok: false, field: 'stages.1.rstopper', message: expect.stringMatching(/^Stage 2: Grid stopper/) });
    expect(solveChain(splitter(Number.NaN))).toMatchObject({ ok: false, field: 'stages.1.rstopper' });
    expect(solveChain(longTail(-1))).toMatchObject({ ok: false, field: 'stages.1.rstopper' });
  });
});
