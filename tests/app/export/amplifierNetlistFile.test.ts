import { describe, expect, it, vi } from 'vitest';
import { amplifierNetlistOf } from '../../../app/export/amplifierNetlistFile';
import { createWorkbenchStore } from '../../../app/store/workbenchStore';
import { onSupplyInputOf } from '../../../app/store/supplyPlan';

// What the netlist does in a simulator is held against ngspice in tests/spice/amplifierNetlist.spice.test.ts; here, that
// the export takes the amplifier the strip shows, its working level and the design's feedback.
describe('the amplifier netlist the export panel writes', () => {
  it('is the chain strip\u2019s amplifier, driven at its working level, with the design\u2019s feedback while the stages drive the output', () => {
    const store = createWorkbenchStore();
    const s = store.getState();
    const net = amplifierNetlistOf(s);
    if (!net.ok) throw new Error(net.message);
    expect(net.text.split('\n')[0]).toBe(`* ${s.title}: a netlist for ngspice`);
    // The demo's three stages: two gain stages and the EL34 (Koren's pentode).
    expect(net.text).toMatch(/^\* stage 3 \(single-ended-output\)/m);
    expect(net.text).toMatch(/^X2 p2 tap g2 k2 pent$/m);
    const peak = s.amplifier!.atLevel!.ok ? s.amplifier!.atLevel!.inputPeak : NaN;
    expect(net.text).toContain(`SIN(0 ${peak.toPrecision(12)} 1000)`);
    expect(net.text).not.toMatch(/^RF /m);
    store.getState().editField('feedbackRf', '47k');
    store.getState().settleAnalysis();
    const fed = amplifierNetlistOf(store.getState());
    expect(fed.ok && fed.text).toMatch(/^RF sec k0 47000\.0+$/m);
    // The voltage stages apart from the output stage: they alone, and no loop from a speaker.
    store.getState().setDrivesOutput(false);
    store.getState().settleAnalysis();
    const apart = amplifierNetlistOf(store.getState());
    if (!apart.ok) throw new Error(apart.message);
    expect(apart.text).not.toMatch(/pent|^RF /m);
    expect(apart.text).toMatch(/^\* stage 2 \(common-cathode\)/m);
  });

  it('with the supply: every stage drawn from its node behind the design\u2019s rectifier and filter, the other channels as loads, a fixed-bias grid on its bias supply', async () => {
    const store = createWorkbenchStore();
    const s = store.getState();
    expect(s.design.supply.on).toBe(true);
    const net = amplifierNetlistOf(s, true);
    if (!net.ok) throw new Error(net.message);
    // No stage keeps a DC source of its own: each is an ammeter to the node the supply plan names.
    expect(net.text).not.toMatch(/^VB\d+ \S+ 0 DC/m);
    const fed = [...net.text.matchAll(/^VB(\d+) \S+ sn(\d+) DC 0$/gm)].map((m) => Number(m[2]));
    expect(fed).toEqual(onSupplyInputOf(s.design, s.registry)!.input.feeds);
    expect(net.text).toMatch(/^VSECA /m);
    expect(net.text).toMatch(/^\* The supply: secondary, rectifier and filter/m);
    expect(net.text).not.toMatch(/^ISUP/m);
    // Two channels on the one supply: this file holds one, and the other draws its idle current at each node.
    store.getState().setSupply({ channels: 2 });
    store.getState().settleAnalysis();
    const stereo = amplifierNetlistOf(store.getState(), true);
    expect(stereo.ok && stereo.text).toMatch(/^ISUP\d+ sn\d+ 0 DC /m);
    // A fixed-bias output stage: its grid on a DC source until the bias supply is solved, then on its wiper.
    store.getState().setOutputBias('fixed');
    store.getState().settleAnalysis();
    const before = amplifierNetlistOf(store.getState(), true);
    expect(before.ok && before.text).toMatch(/^\* The output grids' bias is a DC source \(VGB2\)/m);
    await vi.waitFor(() => expect(store.getState().biasView?.result.ok).toBe(true), { timeout: 5000 });
    const biased = amplifierNetlistOf(store.getState(), true);
    if (!biased.ok) throw new Error(biased.message);
    expect(biased.text).toMatch(/^RG2 \S+ bw0 /m);
    expect(biased.text).not.toMatch(/^VGB2 /m);
    expect(biased.text).toMatch(/^\* The grid bias: /m);
    // With the supply off, the plain netlist is still written, and there is no supply to put in one.
    store.getState().setSupply({ on: false });
    expect(amplifierNetlistOf(store.getState()).ok).toBe(true);
    const off = amplifierNetlistOf(store.getState(), true);
    expect(!off.ok && off.message).toMatch(/no supply/);
  });
});
