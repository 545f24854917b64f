import { describe, expect, it } from 'vitest';
import { createWorkbenchStore } from '../../../app/store/workbenchStore';
import { benchIndex, voltageStages } from '../../../app/store/stagePlans';
import { benchFindings } from '../../../app/store/amplifierFindings';
import { cornersOf, findTube, solvedStage } from '../../../src/index';

/** The demo's driver alone before the output stage (its input stage removed): one voltage stage. */
function oneStage(options?: Parameters<typeof createWorkbenchStore>[0]) {
  const store = createWorkbenchStore(options);
  store.getState().dropStage(0);
  return store;
}

/** One voltage stage, a second gain stage and a follower after it: four stages to the speaker. */
function fourStages() {
  const store = oneStage();
  store.getState().addStage(0, 'common-cathode');
  store.getState().addStage(1, 'follower');
  return store;
}

const kinds = (store: ReturnType<typeof createWorkbenchStore>) => voltageStages(store.getState().design).map((p) => `${p.kind}:${p.tubeId}`);

describe('the amplifier as a chain of stages', () => {
  it('adding a gain stage puts it on the bench, after the one it follows, capacitor-coupled', () => {
    const store = oneStage();
    store.getState().addStage(0, 'common-cathode');
    const d = store.getState().design;
    expect(kinds(store)).toEqual(['common-cathode:12AU7', 'common-cathode:12AU7']);
    expect(benchIndex(d)).toBe(1);
    expect(d.cin).toBe(100e-9);
    expect(d.rg).toBe(470e3);
    const amp = store.getState().amplifier!.result;
    if (!amp.ok) throw new Error(amp.message);
    expect(amp.stages.map((s) => s.kind)).toEqual(['common-cathode', 'common-cathode', 'single-ended-output']);
    // Two gain stages and the output tube, all common-cathode, the transformer taken plate-phased: three inversions
    // (common practice: an odd count of common-cathode stages inverts).
    expect(amp.inverting).toBe(true);
    store.getState().dropStage(1);
    const two = store.getState().amplifier!.result;
    expect(two.ok && two.inverting).toBe(false);
  });

  it('the bench stage is fed by the stage before it and loaded by the stage after it', () => {
    const store = fourStages();
    const s = store.getState();
    const amp = s.amplifier!.result;
    if (!amp.ok) throw new Error(amp.message);
    // On the bench: stage 2, with its follower; stage 1's output impedance is its source.
    expect(benchIndex(s.design)).toBe(1);
    expect(s.design.stage2.kind).toBe('follower');
    expect(s.analysis.solution.op.va).toBeCloseTo(amp.stages[1]!.op.va, 6);
    // The bench's own solve and the chain's agree on the operating point of the bench stage and of its follower.
    const link = s.analysis.signal.chain;
    if (!link?.ok) throw new Error('the follower solves');
    expect(link.links[1]!.op.vk).toBeCloseTo(amp.stages[2]!.op.vk, 3);
    // The whole amplifier's gain is the product of its stages' (each into the load the next presents).
    const product = amp.stages.reduce((g, st) => g * st.gain, 1);
    const sourceLoss = amp.gain / product;
    expect(sourceLoss).toBeGreaterThan(0.99); // 1 kΩ into a 1 MΩ grid leak
    expect(sourceLoss).toBeLessThanOrEqual(1);
  });

  it('any stage goes on the bench; a follower opens its gain stage', () => {
    const store = fourStages();
    store.getState().showStage(0);
    expect(benchIndex(store.getState().design)).toBe(0);
    expect(store.getState().design.stage2.kind).toBe('none');
    store.getState().showStage(2);
    expect(benchIndex(store.getState().design)).toBe(1);
    expect(store.getState().design.stage2.kind).toBe('follower');
    // The chain is the same whichever stage is on the bench.
    expect(kinds(store)).toEqual(['common-cathode:12AU7', 'common-cathode:12AU7', 'follower:12AU7']);
  });

  it('moves a stage with its follower, removes stages, and each change is one undo step', () => {
    let now = 0;
    const store = oneStage({ now: () => (now += 5000) });
    store.getState().addStage(0, 'common-cathode');
    store.getState().commit({ ...store.getState().design, tubeId: '12AX7', ra: 100e3, rk: 1500 });
    store.getState().addStage(1, 'follower');
    expect(kinds(store)).toEqual(['common-cathode:12AU7', 'common-cathode:12AX7', 'follower:12AX7']);
    store.getState().shiftStage(1, -1);
    expect(kinds(store)).toEqual(['common-cathode:12AX7', 'follower:12AX7', 'common-cathode:12AU7']);
    // The stage that moved from the input keeps a coupling capacitor; the one now first keeps its own.
    expect(voltageStages(store.getState().design)[2]).toMatchObject({ cc: 470e-9 });
    store.getState().dropStage(1);
    expect(kinds(store)).toEqual(['common-cathode:12AX7', 'common-cathode:12AU7']);
    store.getState().undo();
    expect(kinds(store)).toEqual(['common-cathode:12AX7', 'follower:12AX7', 'common-cathode:12AU7']);
    store.getState().undo();
    expect(kinds(store)).toEqual(['common-cathode:12AU7', 'common-cathode:12AX7', 'follower:12AX7']);
  });

  it('refuses what the chain cannot hold, with a reason', () => {
    const store = oneStage();
    store.getState().dropStage(0);
    expect(store.getState().chainNote).toMatch(/at least one gain stage/);
    store.getState().addStage(0, 'common-cathode');
    // Only the first stage may be direct-coupled: the source is at 0 V, a plate is not.
    store.getState().editField('cin', 'none');
    expect(store.getState().errors.cin).toBe('Cin must be a coupling capacitor: only the first stage may be direct-coupled (to the source)');
    expect(store.getState().design.cin).toBe(100e-9);
    for (let k = 0; k < 6; k++) store.getState().addStage(0, 'common-cathode');
    expect(voltageStages(store.getState().design)).toHaveLength(7);
    expect(store.getState().chainNote).toMatch(/at most 7 voltage stages/);
  });

  it('every stage\'s findings are in the one ratings list, named by place', () => {
    const store = oneStage();
    store.getState().addStage(0, 'common-cathode');
    // Stage 2 run past its plate dissipation: a 12AU7 section at 450 V with 4.7 kΩ.
    store.getState().commit({ ...store.getState().design, bplus: 450, ra: 4.7e3, rk: 470 });
    store.getState().showStage(0);
    const names = new Set(benchFindings(store.getState()).map((f) => f.stageName));
    expect([...names].some((n) => n.startsWith('Stage 2, 12AU7 gain stage'))).toBe(true);
    expect(benchFindings(store.getState()).some((f) => f.stageName.startsWith('Stage 2') && f.severity === 'danger')).toBe(true);
  });

  it('a drag (the light pass) cannot leave a follower drawing grid current, which the full pass refuses', () => {
    // Regression: the light pass skipped the follower, so a drag held a design no stage could then be put on the bench with.
    const store = oneStage();
    store.getState().addStage(0, 'common-cathode');
    store.getState().addStage(1, 'follower');
    store.getState().editField('ra', '100k');
    store.getState().chooseTube('12AX7');
    const full = store.getState().commit({ ...store.getState().design, ra: 50e3 });
    const light = store.getState().commit({ ...store.getState().design, ra: 50e3 }, { light: true });
    expect(full).toMatchObject({ reason: 'grid-current' });
    expect(light).toMatchObject({ reason: 'grid-current', field: 'stage2' });
    expect(store.getState().design.ra).toBe(100e3);
  });

  it('the bench stage\'s own figures are taken with the stage before it as its source and the next grid as its load', () => {
    // The demo: its driver (stage 2) on the bench after the 12AX7 input stage, with a third gain stage added after it.
    const store = createWorkbenchStore();
    store.getState().addStage(1, 'common-cathode');
    store.getState().commit({ ...store.getState().design, rg: 220e3, cin: 22e-9 });
    store.getState().showStage(1);
    const s = store.getState();
    const amp = s.amplifier!.result;
    if (!amp.ok) throw new Error(amp.message);
    const tube = findTube('12AU7')!;
    const next = s.design.after[0]!;
    if (next.kind !== 'common-cathode') throw new Error('a gain stage follows');
    // The same stage solved by hand: fed from stage 1's output impedance, loaded by stage 3's 220 kΩ grid leak through its 22 nF.
    const byHand = solvedStage({
      tube, bplus: s.design.bplus, ra: s.design.ra, rk: s.design.rk, bypassed: true, ck: s.design.ck!, rg: s.design.rg, cin: s.design.cin!,
      rsource: amp.stages[0]!.zout, rl: next.rg, cout: next.cc!,
    });
    if (!byHand.ok) throw new Error(byHand.message);
    expect(next).toMatchObject({ rg: 220e3, cc: 22e-9 });
    expect(s.analysis.solution.gain).toBeCloseTo(byHand.solution.gain, 9);
    const corners = cornersOf(byHand);
    expect(s.analysis.signal.corners.lowHz).toBeCloseTo(corners.lowHz!, 6);
    expect(s.analysis.signal.corners.highHz).toBeCloseTo(corners.highHz!, 3);
    // And the chain's own solve of that stage, into the same load, agrees on its gain (common practice: a stage's gain is set by the load it drives).
    expect(amp.stages[1]!.gain).toBeCloseTo(byHand.solution.gain, 3);
  });
});
