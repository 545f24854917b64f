import { describe, expect, it } from 'vitest';
import { readDesignFile, writeDesignFile } from '../../../app/keep/designFile';
import { buildSheetOf } from '../../../app/store/buildSheet';
import { chainInputOf } from '../../../app/store/amplifierChain';
import { followerCouplingFor, voltageStages } from '../../../app/store/stagePlans';
import { createWorkbenchStore } from '../../../app/store/workbenchStore';
import { findTube, solveFollower, solveStage } from '../../../src/index';
import { expectClose } from '../../helpers/expectClose';

/** The demo's first stage with a capacitor-coupled cathode follower after it (parted from the output stage). */
function coupledFollower() {
  const store = createWorkbenchStore();
  store.getState().commit({ ...store.getState().design, drivesOutput: false });
  store.getState().showStage(0);
  const d = store.getState().design;
  store.getState().setStage2({ kind: 'follower', coupling: followerCouplingFor(d.bplus) });
  return store;
}

describe('a capacitor-coupled cathode follower', () => {
  it('sits on its own grid bias, not the plate before it, and its leak loads that plate (Ohm\'s law)', () => {
    const store = coupledFollower();
    const s = store.getState();
    const c = s.design.stage2.coupling!;
    // Common practice: the grid at half the B+, 100 nF into 1 MΩ.
    expect(c).toEqual({ cc: 100e-9, rg: 1e6, vbias: Math.round(s.design.bplus / 2) });
    const link = s.analysis.signal.chain?.ok ? s.analysis.signal.chain.links[1] : undefined;
    if (link?.kind !== 'follower') throw new Error('the follower is solved with its stage');
    const own = solveFollower({ tube: findTube(s.design.stage2.tubeId)!, bplus: s.design.bplus, vgrid: c.vbias, rk: s.design.stage2.rk, rl: s.design.rl });
    if (!own.ok) throw new Error(own.message);
    expectClose(link.op.vk, own.op.vk, { rel: 1e-9 }, 'the follower on its own bias');
    // The gain stage's plate drives the follower's 1 MΩ leak: its gain is the stage's into that load.
    const first = solveStage({ tube: s.analysis.tube, bplus: s.design.bplus, ra: s.design.ra, rk: s.design.rk, bypassed: s.design.bypassed, rl: 1e6, rg: s.design.rg });
    expectClose(s.analysis.solution.gain, first.ok ? first.gain : NaN, { rel: 1e-9 }, 'stage gain into the leak');
    // The amplifier holds it as a capacitor-coupled follower, its grid at its bias.
    const chain = chainInputOf(s.design, s.registry)!;
    const st = chain.input.stages[1]!;
    expect(st).toMatchObject({ kind: 'follower', vbias: c.vbias, coupling: { kind: 'capacitor', cc: c.cc, rg: c.rg } });
    const amp = s.amplifier!.result;
    expect(amp.ok && amp.stages[1]!.op.vk).toBeCloseTo(own.op.vk, 6);
  });

  it('on the bench its grid is its bias; typing the bias moves it, and the build sheet lists its capacitor, leak and divider at their own voltages', () => {
    const store = coupledFollower();
    store.getState().showStage(1);
    expect(store.getState().followerBench!.vgrid).toBe(store.getState().design.stage2.coupling!.vbias);
    store.getState().editField('fVbias', '120');
    // The typing pauses: the whole amplifier (whose parts the sheet lists) catches up.
    store.getState().settleAnalysis();
    const s = store.getState();
    expect(s.design.stage2.coupling!.vbias).toBe(120);
    expect(s.followerBench!.vgrid).toBe(120);
    const sheet = buildSheetOf(s);
    const resistors = sheet.stages.flatMap((st) => st.resistors);
    const capacitors = sheet.stages.flatMap((st) => st.capacitors);
    const refs = [...resistors.map((r) => r.ref), ...capacitors.map((c) => c.ref)];
    expect(refs).toEqual(expect.arrayContaining(['Rg2', 'Rd2a', 'Rd2b', 'Cc2', 'Cd2']));
    const cc = capacitors.find((c) => c.ref === 'Cc2')!;
    // Running, the capacitor holds the plate's DC less the grid's; cold, the plate sits at B+.
    expectClose(cc.volts, s.analysis.solution.op.va - 120, { rel: 1e-9 }, 'Cc running');
    expectClose(cc.voltsAtSwitchOn, s.design.bplus - 120, { rel: 1e-9 }, 'Cc cold');
  });

  it('is kept by a design file, off the bench as on it; a damaged coupling is named', () => {
    const store = coupledFollower();
    const d = store.getState().design;
    const back = readDesignFile(writeDesignFile({ title: 'coupled', design: d }));
    if (!back.ok) throw new Error(back.message);
    expect(back.doc.design.stage2.coupling).toEqual(d.stage2.coupling);
    // With another stage on the bench the follower waits in the chain, its coupling with it.
    store.getState().addStage(1, 'common-cathode');
    const moved = store.getState().design;
    const again = readDesignFile(writeDesignFile({ title: 'coupled', design: moved }));
    if (!again.ok) throw new Error(again.message);
    expect(voltageStages(again.doc.design).find((p) => p.kind === 'follower')).toMatchObject({ coupling: d.stage2.coupling });
    const text = writeDesignFile({ title: 'bad', design: { ...d, stage2: { ...d.stage2, coupling: { cc: 100e-9, rg: 1e6, vbias: -5 } } } });
    const bad = readDesignFile(text);
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.message).toMatch(/design\.stage2\.coupling\.vbias/);
  });

  it('switching back to direct drops its coupling, unless the follower would then draw grid current on this plate: the design stays and says why', () => {
    const store = coupledFollower();
    const held = store.getState().design.stage2.coupling;
    store.getState().setStage2({ kind: 'follower', coupling: undefined });
    // A 12AX7 follower on 47 kΩ cannot rise to the plate's 200 V or so without its grid drawing current.
    expect(store.getState().design.stage2.coupling).toEqual(held);
    expect(store.getState().errors.stage2).toMatch(/grid would sit .* positive to its cathode/);
    store.getState().editField('rk2', '220k');
    store.getState().setStage2({ kind: 'follower', coupling: undefined });
    expect(store.getState().design.stage2.coupling).toBeUndefined();
    expect(store.getState().errors.stage2).toBeUndefined();
  });
});
