import { fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import { act } from 'react';
import { describe, expect, it } from 'vitest';
import { App } from '../../app/App';
import { cardSections } from '../../app/export/buildCard';
import { readDesignFile, writeDesignFile } from '../../app/keep/designFile';
import { DEMO_SUPPLY, onSupplyInputOf } from '../../app/store/supplyPlan';
import { createWorkbenchStore } from '../../app/store/workbenchStore';
import { findOutputTube, solveOnSupply, supplyHum } from '../../src/index';
import { solveOutput } from '../../src/output/solveOutput';
import { placedOnSupply } from '../../src/chain/solveOnSupply';
import { LIBRARY_TUBES } from '../../app/store/tubeRegistry';

/** The workbench with the supply solved in place (the page uses a Web Worker; jsdom has none). */
function bench() {
  const store = createWorkbenchStore({ supplySolver: async (input) => solveOnSupply(input) });
  render(<App store={store} />);
  const panel = within(screen.getByRole('region', { name: 'B+ supply' }));
  return { store, panel };
}

const nodeDc = (node: number) => document.querySelector(`tr[data-node="${node}"] [data-figure="node-dc"]`)?.textContent;

describe('the B+ supply on the bench', () => {
  it('says one voltage for a node: the line under the table, the button and the table agree (the demo\'s node 4 is 274.50 V)', async () => {
    const { store, panel } = bench();
    await waitFor(() => expect(store.getState().supplyView?.result.ok).toBe(true), { timeout: 5000 });
    const line = panel.getByText(/^Voltage stages: node 4 gives/);
    expect(line.textContent).toBe(`Voltage stages: node 4 gives ${nodeDc(4)} under load; the bench holds 275 V.`);
    // The bench already holds what the node gives, so there is nothing to use.
    expect(panel.queryByRole('button', { name: 'Use these B+ on the bench' })).toBeNull();
  });

  it('follows a drag: the nodes are solved again while the point moves, from the last steady state, and nothing is committed until release', async () => {
    const { store } = bench();
    await waitFor(() => expect(store.getState().supplyView?.result.ok).toBe(true), { timeout: 5000 });
    const before = store.getState().supplyView!.result;
    if (!before.ok) throw new Error(before.message);
    const s = store.getState();
    const { vpk, ia } = s.analysis.solution.op;
    act(() => {
      s.beginDrag('point');
      store.getState().dragPointTo(vpk * 0.8, ia * 1.4);
    });
    const design = store.getState().design;
    // While still dragging, an answer for the dragged design arrives: the bench stage's node moves with its current.
    await waitFor(() => expect(store.getState().supplyView?.result).not.toBe(before), { timeout: 5000 });
    expect(store.getState().dragging).toBe('point');
    const during = store.getState().supplyView!.result;
    if (!during.ok) throw new Error(during.message);
    const model = solveOnSupply(onSupplyInputOf(design, LIBRARY_TUBES)!.input);
    if (!model.ok) throw new Error(model.message);
    during.supply.nodes.forEach((n, k) => expect(Math.abs(n.dc - model.supply.nodes[k]!.dc)).toBeLessThan(0.05));
    expect(during.supply.nodes[2]!.dc).not.toBeCloseTo(before.supply.nodes[2]!.dc, 1);
    expect(store.getState().design).toBe(design);
    act(() => store.getState().endDrag());
  });

  it('solves the demo amplifier on its supply: every node, which stage it feeds, the cautions and the bleeder', async () => {
    const { store, panel } = bench();
    expect(panel.getByRole('note').textContent).toMatch(/Lethal voltages.*licensed electrician/s);
    await waitFor(() => expect(panel.getByTestId('supply-results')).toBeTruthy(), { timeout: 5000 });
    const view = store.getState().supplyView!;
    if (!view.result.ok) throw new Error(view.result.message);
    // Four nodes: the output stage after the choke, the voltage stages at the end of the ladder (DEMO_SUPPLY).
    expect(panel.getAllByRole('row')).toHaveLength(1 + 4);
    expect(within(panel.getByText((_, el) => el?.getAttribute('data-node') === '2')).getByText(/Output \(EL34\)/)).toBeTruthy();
    expect(within(panel.getByText((_, el) => el?.getAttribute('data-node') === '4')).getByText(/Stage 1 \(12AX7\)/)).toBeTruthy();
    expect(within(panel.getByText((_, el) => el?.getAttribute('data-node') === '4')).getByText(/Stage 2 \(12AU7\)/)).toBeTruthy();
    // B+ falls down the ladder, each node's shown value the model's.
    const dcs = view.result.supply.nodes.map((n) => n.dc);
    expect(dcs[0]!).toBeGreaterThan(dcs[1]!);
    expect(dcs[1]!).toBeGreaterThan(dcs[2]!);
    expect(dcs[2]!).toBeGreaterThan(dcs[3]!);
    expect(nodeDc(1)).toBe(`${Number(dcs[0]!.toPrecision(3))} V`);
    // And at full power (the output stage at its clean limit).
    expect(document.querySelector('tr[data-node="1"] [data-figure="node-full"]')?.textContent).toBe(`${Number(view.result.atFullPower!.volts[0]!.toPrecision(3))} V`);
    // The winding's 200 mA rating and the 5 mV hum budget are checked (notes: well within both).
    const ratings = within(panel.getByRole('list', { name: 'The supply against its ratings' }));
    expect(ratings.getByText(/winding|secondary/i)).toBeTruthy();
    expect(ratings.getByText(/hum|ripple/i)).toBeTruthy();
    expect(panel.getByTestId('bleeder').textContent).toMatch(/^Bleeder: .*Ω across node 1 brings every capacitor under 60 V in .* s/);
    // The bleeder is a load on the reservoir like any other: node 1 feeds no stage, so its load is the bleeder's current, the one the panel names.
    const bleeder = view.bleeder;
    if (!bleeder?.ok || !bleeder.needed) throw new Error('the demo needs a bleeder');
    // Within the rounds' 10 mV at the reservoir.
    expect(Math.abs(view.result.bleederAmps - bleeder.amps)).toBeLessThanOrEqual(0.01 / bleeder.ohms);
    expect(view.result.loads[0]).toBe(view.result.bleederAmps);
    expect(document.querySelector('tr[data-node="1"]')!.textContent).toContain(`${Number((bleeder.amps * 1e3).toPrecision(3))} mA`);
    expect(document.querySelector('tr[data-node="1"] td:last-child')!.textContent).toMatch(/^the bleeder \([\d.]+ mA\)$/);
    // The build card carries it, after the amplifier: the supply, every node and what it feeds, the currents, the bleeder.
    const card = cardSections(store.getState());
    expect(card.map((c) => c.heading).slice(0, 2)).toEqual(['Amplifier', 'B+ supply']);
    const lines = card[1]!.lines;
    expect(lines[0]).toMatch(/^248 V rms a side at 200 mA, 35 Ω winding, silicon full wave, 50 Hz; 100 µF → 5 H \(100 Ω\) \/ 100 µF → 1 kΩ \/ 47 µF → 9.1 kΩ \/ 220 µF$/);
    expect(lines[1]).toMatch(/^Nodes 1: [^(]*; 2: .* \(output\); 3: .*; 4: .* \(stage 1, stage 2\)$/);
    // Ripple in the unit that reads, as in the table: the reservoir's volts, the last node's microvolts (not "6480 mV", "0.00563 mV").
    expect(lines[1]).toMatch(/^Nodes 1: [\d.]+ V, [\d.]+ V p-p; .*; 4: [\d.]+ V, [\d.]+ µV p-p/);
    expect(lines.some((l) => /^Bleeder .*Ω, .* W across node 1: under 60 V in/.test(l))).toBe(true);
  });

  it('lists the supply\'s parts to order on the build sheet and the card: each filter capacitor rated for the cold voltage with high mains (IEC 60038), the filter resistors, the bleeder and the diodes', async () => {
    const { store } = bench();
    await waitFor(() => expect(store.getState().supplyView?.parts?.ok).toBe(true), { timeout: 5000 });
    const view = store.getState().supplyView!;
    if (!view.result.ok) throw new Error(view.result.message);
    const cold = view.result.supply.noLoadVolts;
    const sheet = within(screen.getByRole('region', { name: 'Build sheet' }));
    // DEMO_SUPPLY: 100 µF, a 5 H choke into 100 µF, then 1 kΩ / 47 µF and 9.1 kΩ / 220 µF; about 358 V cold, 394 V with the
    // mains 10 % high: 400 V parts.
    expect(cold * 1.1).toBeGreaterThan(350);
    expect(cold * 1.1).toBeLessThan(400);
    for (const ref of ['Cf1', 'Cf2', 'Cf3', 'Cf4']) expect(sheet.getByText((_, el) => el?.getAttribute('data-part-line') === ref).textContent).toMatch(/µF.*400 V$/);
    // The last node's capacitor carries a few tens of nanoamps of ripple: read in its own unit, as the node table reads it, not "0.0000314 mA".
    const lastRipple = view.result.supply.nodes[3]!.capacitorRippleRms;
    expect(lastRipple).toBeLessThan(1e-6);
    expect(sheet.getByText((_, el) => el?.getAttribute('data-part-line') === 'Cf4').textContent).toMatch(/\d nA rms400 V$/);
    expect(document.querySelector('tr[data-node="4"]')!.textContent).toMatch(/\d nA rms/);
    // The 9.1 kΩ carries node 4's current (Kirchhoff): I²R is what the line says it runs at.
    const amps = view.result.loads[3]!;
    expect(sheet.getByText((_, el) => el?.getAttribute('data-part-line') === 'Rf4').textContent).toContain(`${Number((amps * amps * 9100).toPrecision(3))} W`);
    expect(sheet.getByText((_, el) => el?.getAttribute('data-part-line') === 'Rbleed')).toBeTruthy();
    // The choke carries every node after the reservoir: the output stage's current and the rest, at full power where more.
    const through = [1, 2, 3].reduce((a, k) => a + Math.max(view.result.ok ? view.result.loads[k]! : 0, view.result.ok ? (view.result.atFullPower?.loads[k] ?? 0) : 0), 0);
    expect(sheet.getByText((_, el) => el?.getAttribute('data-part-line') === 'Lf2').textContent).toBe(`Lf2 (filter, node 1 to node 2): 5 H, 100 Ω, rated for at least ${Number((through * 1e3).toPrecision(3))} mA DC`);
    // Centre-tapped full wave: each diode stands twice the peak, about 716 V, 788 V with high mains: the 800 V 1N400x part.
    expect(sheet.getByText((_, el) => el?.getAttribute('data-part-line') === 'rectifier').textContent).toMatch(/two diodes, each stands 7\d\d V peak inverse.*: 800 V or more/);
    // The one-section estimate gives way to the supply's own ladder, on the sheet and on the card.
    expect(sheet.getByTestId('filter-on-supply')).toBeTruthy();
    expect(sheet.queryByTestId('filter')).toBeNull();
    const card = cardSections(store.getState());
    expect(card.find((c) => c.heading === 'Parts to order')!.lines.some((l) => l.startsWith('B+ filter'))).toBe(false);
    const supplyParts = card.find((c) => c.heading === 'B+ supply: parts to order')!.lines;
    expect(supplyParts.filter((l) => /^Cf\d .*400 V/.test(l))).toHaveLength(4);
    expect(supplyParts.some((l) => l.startsWith('Rf3 ') && l.includes('1 kΩ'))).toBe(true);
    expect(supplyParts.some((l) => l.startsWith('Lf2 ') && l.includes('5 H'))).toBe(true);
  });

  it('says the hum the supply leaves at the speaker: each stage\'s node ripple carried to the output, their sum a bound, the output stage on the reservoir the largest share', async () => {
    const { store, panel } = bench();
    await waitFor(() => expect(store.getState().supplyView?.hum?.ok).toBe(true), { timeout: 5000 });
    const view = store.getState().supplyView!;
    if (!view.result.ok || !view.hum?.ok) throw new Error('solved');
    const r = view.result;
    // The model apart: the amplifier at its nodes' B+, each stage's share per volt times its node's ripple.
    const input = onSupplyInputOf(store.getState().design, LIBRARY_TUBES)!.input;
    const perVolt = supplyHum({ ...input.amplifier, stages: input.amplifier.stages.map((st, k) => ({ ...st, bplus: r.bplus[k]! })) }, r.amplifier);
    if (!perVolt.ok) throw new Error(perVolt.message);
    const shares = perVolt.perVolt.map((x, k) => (x === null ? null : Math.abs(x) * r.supply.nodes[input.feeds[k]!]!.rippleRms));
    // The EL34 on the reservoir (1.85 V rms of ripple, its ultralinear screen on the tap) gives the most.
    expect(shares.every((x) => x !== null)).toBe(true);
    expect(Math.max(...(shares as number[]))).toBe(shares.at(-1));
    expect(view.hum.bound).toBeCloseTo(shares.reduce<number>((a, v) => a + (v ?? 0), 0), 12);
    const line = panel.getByTestId('supply-hum').textContent!;
    expect(line).toMatch(/^Hum at the speaker: at most [\d.]+ (µV|mV) rms \(\d+ dB below 1 W into 8 Ω\)/);
    expect(line).toMatch(/Output \(EL34\) [\d.]+ (µV|mV)/);
    expect(line).not.toMatch(/not counted/i);
    // And among the amplifier's figures at the top.
    expect(screen.getByTestId('strip-hum').textContent).toMatch(/^Humat most [\d.]+ (µV|mV) rms \(\d+ dB below 1 W into 8 Ω\)$/);
    // On the card with the supply.
    expect(cardSections(store.getState()).find((c) => c.heading === 'B+ supply')!.lines).toContainEqual(expect.stringMatching(/^Hum at the speaker: at most [\d.]+ (µV|mV) rms \(\d+ dB below 1 W into 8 Ω\), each stage's ripple carried/));
  });

  it('counts a pentode output stage\'s screens in the hum: fed straight from its node they carry that node\'s whole ripple', async () => {
    const { store, panel } = bench();
    await waitFor(() => expect(store.getState().supplyView?.hum?.ok).toBe(true), { timeout: 5000 });
    const ultralinear = store.getState().supplyView!.hum!;
    if (!ultralinear.ok) throw new Error('solved');
    // The demo's EL34, pentode-connected with its screens at its B+: straight from node 2.
    act(() => {
      expect(store.getState().changeOutput({ connection: 'pentode', screenVolts: store.getState().design.output.bplus })).toBeNull();
    });
    await waitFor(() => expect(store.getState().supplyView?.stale).toBe(false), { timeout: 5000 });
    const view = store.getState().supplyView!;
    if (!view.result.ok || !view.hum?.ok) throw new Error('solved');
    const r = view.result;
    const out = view.names.length - 1;
    const node2 = r.supply.nodes[view.feeds[out]!]!.rippleRms;
    // The model apart: the output stage's share is its plate's and its screens', each per volt times node 2's ripple.
    const input = onSupplyInputOf(store.getState().design, LIBRARY_TUBES)!.input;
    // Placed on the supply as the solve places it (placedOnSupply): each stage at its node, screens wired to B+ with it.
    const hum = supplyHum(placedOnSupply(input.amplifier, r.bplus, r.screenVolts), r.amplifier, store.getState().design.supply.mainsHz);
    if (!hum.ok) throw new Error(hum.message);
    expect(hum.screenShare[out]).toBe(1);
    expect(view.hum.screens[out]).toBeCloseTo(Math.abs(hum.screenPerVolt[out]!) * node2, 12);
    expect(view.hum.volts[out]).toBeCloseTo((Math.abs(hum.perVolt[out]!) + Math.abs(hum.screenPerVolt[out]!)) * node2, 12);
    // The screens' share is most of the output stage's: a screen moves the plate current many times harder than the plate.
    expect(view.hum.screens[out]!).toBeGreaterThan(0.8 * view.hum.volts[out]!);
    const line = panel.getByTestId('supply-hum').textContent!;
    expect(line).toMatch(/Output \(EL34\) [\d.]+ (µV|mV) \(its screens [\d.]+ (µV|mV)\)/);
    expect(line).toMatch(/screens take the ripple of the node feeding them/);
    expect(line).not.toMatch(/screen supply is taken as clean/);
  });

  it('counts a push-pull pair\'s own hum: nothing for a matched pair, what a mismatch leaves of its centre tap\'s ripple', async () => {
    const { store, panel } = bench();
    await waitFor(() => expect(store.getState().supplyView?.result.ok).toBe(true), { timeout: 5000 });
    act(() => store.getState().setOutputPair('push-pull'));
    const settled = async () => {
      await waitFor(() => {
        const v = store.getState().supplyView;
        expect(v && !v.stale && v.hum?.ok && v.names.some((n) => n.role === 'splitter')).toBe(true);
      }, { timeout: 5000 });
      const v = store.getState().supplyView!;
      if (!v.result.ok || !v.hum?.ok) throw new Error('solved');
      return { v, r: v.result, hum: v.hum, out: v.names.length - 1 };
    };
    const matched = await settled();
    expect(matched.hum.volts[matched.out]).toBeLessThan(1e-12);
    let line = panel.getByTestId('supply-hum').textContent!;
    expect(line).toMatch(/Output \(EL34\) 0 µV/);
    // The splitter's own is counted: the difference its ripple makes between its outputs, which the pair passes on.
    expect(line).toMatch(/Splitter \(12AU7\) [\d.]+ (µV|mV)/);
    expect(matched.hum.volts[matched.out - 1]!).toBeGreaterThan(0);
    expect(line).not.toMatch(/not counted/i);
    expect(line).toMatch(/a push-pull pair’s own is what its mismatch leaves/);
    // A 5 % mismatch: the pair's share is its hum per volt (the model apart) times its node's ripple.
    act(() => {
      expect(store.getState().changeOutput({ mismatch: 0.05 })).toBeNull();
    });
    await waitFor(() => {
      const h = store.getState().supplyView?.hum;
      expect(h?.ok === true && (h.volts.at(-1) ?? 0) > 0).toBe(true);
    }, { timeout: 5000 });
    const { v, r, hum, out } = await settled();
    const input = onSupplyInputOf(store.getState().design, LIBRARY_TUBES)!.input;
    const perVolt = supplyHum({ ...input.amplifier, stages: input.amplifier.stages.map((st, k) => ({ ...st, bplus: r.bplus[k]! })) }, r.amplifier, 50);
    if (!perVolt.ok) throw new Error(perVolt.message);
    expect(hum.volts[out]).toBeCloseTo(Math.abs(perVolt.perVolt[out]!) * r.supply.nodes[v.feeds[out]!]!.rippleRms, 12);
    expect(hum.volts[out]!).toBeGreaterThan(0);
    line = panel.getByTestId('supply-hum').textContent!;
    expect(line).not.toMatch(/Output \(EL34\) 0 µV/);
  });

  it('feeds a pentode output stage\'s screens from a node of their own: drawn there, no dropper, compared with the node, saved in the file', async () => {
    const { store, panel } = bench();
    await waitFor(() => expect(store.getState().supplyView?.result.ok).toBe(true), { timeout: 5000 });
    // Ultralinear screens are on the primary's taps: nothing to choose.
    expect(panel.queryByRole('combobox', { name: 'Output screens from' })).toBeNull();
    act(() => {
      expect(store.getState().changeOutput({ connection: 'pentode' })).toBeNull();
    });
    // The demo's screens at 300 V from its 330 V B+: through a dropper, on the build sheet.
    await waitFor(() => expect(screen.getAllByText(/screen dropper from B\+/).length).toBeGreaterThan(0), { timeout: 5000 });
    fireEvent.change(panel.getByRole('combobox', { name: 'Output screens from' }), { target: { value: '2' } });
    expect(store.getState().design.supply.feeds.screens).toBe(2);
    await waitFor(() => {
      const v = store.getState().supplyView;
      expect(v && !v.stale && v.result.ok && v.screenFeeds.includes(2)).toBe(true);
    }, { timeout: 5000 });
    const view = store.getState().supplyView!;
    if (!view.result.ok || !view.hum?.ok) throw new Error('solved');
    const r = view.result;
    const out = view.names.length - 1;
    // Node 3 feeds the screens alone: its load is their current, the EL34 solved at the B+ and screen voltage the supply gave.
    const design = { ...store.getState().design.output, bplus: r.bplus[out]!, screenVolts: r.screenVolts[out]! };
    const alone = solveOutput(findOutputTube('EL34')!, design);
    if (!alone.ok) throw new Error(alone.message);
    expect(r.screenVolts[out]).toBeCloseTo(r.supply.nodes[2]!.dc, 1);
    expect(r.loads[2]!).toBeCloseTo(alone.op.ig2, 6);
    expect(document.querySelector('tr[data-node="3"]')!.textContent).toContain('Output screens (EL34)');
    // No dropper now: the screens hang straight from their node, and the parts list says so, as the card does.
    expect(screen.queryAllByText(/screen dropper from B\+/)).toHaveLength(0);
    expect(screen.getAllByText("Screens: straight from the B+ supply's node 3, their own (no dropper; the supply's table gives its voltage under load).").length).toBeGreaterThan(0);
    expect(cardSections(store.getState()).some((c) => c.lines.includes("Screens: straight from the B+ supply's node 3, their own (no dropper; the supply's table gives its voltage under load)."))).toBe(true);
    // Their hum comes from node 3's ripple, all of it.
    const input = onSupplyInputOf(store.getState().design, LIBRARY_TUBES)!.input;
    const atNodes = { ...input.amplifier, stages: input.amplifier.stages.map((st, k) => (k === out ? { ...st, bplus: r.bplus[k]!, screenVolts: r.screenVolts[k]!, screenFromNode: true } : { ...st, bplus: r.bplus[k]! })) } as typeof input.amplifier;
    const hum = supplyHum(atNodes, r.amplifier, 50);
    if (!hum.ok) throw new Error(hum.message);
    expect(hum.screenShare[out]).toBe(1);
    expect(view.hum.screens[out]).toBeCloseTo(Math.abs(hum.screenPerVolt[out]!) * r.supply.nodes[2]!.rippleRms, 12);
    // The screens as designed against their node: a line under the table, and a warning past 5 %.
    expect(panel.getByText(/^Output stage's screens: node 3 gives/).textContent).toBe(`Output stage's screens: node 3 gives ${nodeDc(3)} under load; the bench holds 300 V.`);
    const off = Math.abs(r.supply.nodes[2]!.dc - 300) / 300 > 0.05;
    expect(screen.queryAllByText(/designed for screens at 300 V/).length > 0).toBe(off);
    // The card names what node 3 feeds; the file keeps the screens' node, and a file without it hangs them from their plates' node.
    expect(cardSections(store.getState()).find((c) => c.heading === 'B+ supply')!.lines.some((l) => /3: [\d.]+ V, [^;]*\(output screens\)/.test(l))).toBe(true);
    const text = writeDesignFile({ title: 't', design: store.getState().design });
    const file = readDesignFile(text);
    expect(file.ok && file.doc.design.supply.feeds.screens).toBe(2);
    const old = JSON.parse(text);
    delete old.design.supply.feeds.screens;
    const before = readDesignFile(JSON.stringify(old));
    expect(before.ok && before.doc.design.supply.feeds).toEqual({ output: 1, voltage: 3 });
    old.design.supply.feeds.screens = 'node 3';
    expect(readDesignFile(JSON.stringify(old))).toMatchObject({ ok: false, message: expect.stringContaining('.feeds.screens must be the output stage\'s screens\' node') });
    // Taking the supply's voltages onto the bench sets the screens' too.
    act(() => store.getState().useSupplyVolts());
    expect(store.getState().design.output.screenVolts).toBe(Math.round(r.supply.nodes[2]!.dc));
    // Back to the plates' node.
    fireEvent.change(panel.getByRole('combobox', { name: 'Output screens from' }), { target: { value: '' } });
    expect(store.getState().design.supply.feeds.screens).toBeUndefined();
  });

  it('the demo\'s supply delivers the demo\'s B+; a higher secondary does not, and its B+ can be taken onto the bench', async () => {
    const { store, panel } = bench();
    await panel.findByText('The bench\'s B+ are the supply\'s (within 1 %).', {}, { timeout: 5000 });
    fireEvent.change(panel.getByRole('textbox', { name: /^Secondary, each half/ }), { target: { value: '260' } });
    const use = await panel.findByRole('button', { name: 'Use these B+ on the bench' }, { timeout: 5000 });
    await waitFor(() => expect(store.getState().supplyView?.stale).toBe(false), { timeout: 5000 });
    const r = store.getState().supplyView!.result;
    if (!r.ok) throw new Error(r.message);
    fireEvent.click(use);
    // The supply's B+ per stage, input first: the input stage, the driver on the bench, the output stage.
    expect(store.getState().design.before[0]).toMatchObject({ bplus: Math.round(r.bplus[0]!) });
    expect(store.getState().design.bplus).toBe(Math.round(r.bplus[1]!));
    expect(store.getState().design.output.bplus).toBe(Math.round(r.bplus[2]!));
    await waitFor(() => expect(panel.getByText('The bench\'s B+ are the supply\'s (within 1 %).')).toBeTruthy(), { timeout: 5000 });
  }, 20_000);

  it('a bad value gets a message beside its box and the last good supply stays; undo brings a changed one back', async () => {
    const { store, panel } = bench();
    const secondary = panel.getByRole('textbox', { name: /^Secondary, each half/ });
    fireEvent.change(secondary, { target: { value: '2x0' } });
    expect(panel.getByRole('alert').textContent).toBeTruthy();
    expect(store.getState().design.supply.secondaryRms).toBe(248);
    const reservoir = panel.getByRole('textbox', { name: /^Node 1 capacitor/ });
    fireEvent.change(reservoir, { target: { value: '0' } });
    expect(within(reservoir.parentElement!).getByRole('alert').textContent).toMatch(/Node 1|capacit|above 0/i);
    expect(store.getState().design.supply.input.c).toBe(100e-6);
    // Regulation is typed in percent and held as a fraction.
    fireEvent.change(panel.getByRole('textbox', { name: /^Or its regulation/ }), { target: { value: '8' } });
    expect(store.getState().design.supply.regulation).toBeCloseTo(0.08, 12);
    fireEvent.change(reservoir, { target: { value: '220u' } });
    expect(store.getState().design.supply.input.c).toBeCloseTo(220e-6, 12);
    act(() => store.getState().undo());
    expect(store.getState().design.supply.input.c).toBe(100e-6);
    expect(reservoir).toHaveProperty('value', '100u');
  });

  it('a supply too weak for the amplifier says which node gives out and what to change', async () => {
    const { panel } = bench();
    fireEvent.change(panel.getByRole('textbox', { name: /^Secondary, each half/ }), { target: { value: '10' } });
    const alert = await panel.findByText(/^The supply cannot deliver the stages' current: node \d falls to .* Raise the secondary's voltage/, {}, { timeout: 5000 });
    expect(alert.getAttribute('role')).toBe('alert');
  }, 15_000);

  it('the supply\'s dangers are in the one ratings list and on the card, tagged with the supply', async () => {
    const { store, panel } = bench();
    // A winding rated 50 mA carries well over 100 mA rms.
    fireEvent.change(panel.getByRole('textbox', { name: /^At its rated current/ }), { target: { value: '50m' } });
    const ratings = within(screen.getByRole('region', { name: 'Ratings checks' }));
    const item = await ratings.findByText(/^The secondary carries .* rms against its 50 mA rms rating/, {}, { timeout: 5000 });
    expect(item.closest('li')!.textContent).toMatch(/^Danger B\+ supply:/);
    const card = cardSections(store.getState()).find((c) => c.heading === 'Ratings, every stage')!;
    expect(card.lines.some((l) => /^DANGER: B\+ supply: The secondary carries/.test(l))).toBe(true);
  }, 15_000);

  it('adds and removes filter sections; a stage fed from a node that goes moves to the node before it', () => {
    const { store, panel } = bench();
    fireEvent.click(panel.getByRole('button', { name: 'Add an L–C section' }));
    expect(store.getState().design.supply.sections).toHaveLength(4);
    expect(panel.getByRole('textbox', { name: /^Node 5: choke/ })).toBeTruthy();
    // The voltage stages on node 4: it goes, then its successor at node 3 goes; they move down to node 2, with the output stage.
    fireEvent.click(panel.getByRole('button', { name: 'Remove the section to node 3' }));
    expect(store.getState().design.supply.feeds).toEqual({ output: 1, voltage: 2 });
    fireEvent.click(panel.getByRole('button', { name: 'Remove the section to node 3' }));
    expect(store.getState().design.supply.sections).toHaveLength(2);
    expect(store.getState().design.supply.feeds).toEqual({ output: 1, voltage: 1 });
  });

  it('with a push-pull pair, the phase splitter has its own node: chosen beside the others, and its B+ set against its own', async () => {
    const { store, panel } = bench();
    expect(panel.queryByLabelText('Phase splitter from')).toBeNull();
    act(() => store.getState().setOutputPair('push-pull'));
    const choice = panel.getByLabelText('Phase splitter from') as HTMLSelectElement;
    expect(choice.value).toBe('2');
    await waitFor(() => expect(panel.getByText(/^Phase splitter: node 3 gives/)).toBeTruthy(), { timeout: 5000 });
    // The output stage's line is the output stage's node, not the splitter's (it had been the first 'output' stage listed).
    expect(panel.getByText(/^Output stage: node 2 gives/)).toBeTruthy();
    fireEvent.change(choice, { target: { value: '3' } });
    expect(store.getState().design.supply.feeds.splitter).toBe(3);
    // Remove the last section: the splitter on node 4 moves to node 3, like the stages.
    fireEvent.click(panel.getByRole('button', { name: 'Remove the section to node 4' }));
    expect(store.getState().design.supply.feeds).toEqual({ output: 1, voltage: 2, splitter: 2 });
  });

  it('with "follow" on, the stages\' B+ are their nodes\' after every solve, read-only with the node named; undo still undoes', async () => {
    const { store, panel } = bench();
    await panel.findByText('The bench\'s B+ are the supply\'s (within 1 %).', {}, { timeout: 5000 });
    fireEvent.click(panel.getByRole('checkbox', { name: 'The stages\' B+ follow their nodes' }));
    const bplus = screen.getByRole('textbox', { name: /^B\+/ });
    expect(bplus).toHaveProperty('readOnly', true);
    expect(screen.getByText(/^from node 4 of the supply/)).toBeTruthy();
    // A higher secondary: the supply is solved again and the bench's B+ follow it.
    fireEvent.change(panel.getByRole('textbox', { name: /^Secondary, each half/ }), { target: { value: '260' } });
    await waitFor(() => expect(store.getState().design.bplus).toBeGreaterThan(285), { timeout: 5000 });
    const r = store.getState().supplyView!.result;
    if (!r.ok) throw new Error(r.message);
    expect(store.getState().design.before[0]).toMatchObject({ bplus: Math.round(r.bplus[0]!) });
    expect(store.getState().design.bplus).toBe(Math.round(r.bplus[1]!));
    expect(store.getState().design.output.bplus).toBe(Math.round(r.bplus[2]!));
    // Undo goes back to 248 V and its own B+, which already agreed: nothing follows again to undo the undo.
    act(() => store.getState().undo());
    await waitFor(() => expect(store.getState().design.supply.secondaryRms).toBe(248));
    await new Promise((done) => setTimeout(done, 600));
    expect(store.getState().design.bplus).toBeLessThan(285);
    expect(store.getState().future.length).toBeGreaterThan(0);
  }, 20_000);

  it('lists the heater windings beside the supply: every stage\'s heaters per channel, a directly heated rectifier on its own', () => {
    const { store, panel } = bench();
    const list = () => panel.getByTestId('heater-windings').textContent;
    // 12AX7 and 12AU7 (6.3 V, 0.3 A each in parallel; Tung-Sol data sheets) and EL34 (6.3 V, 1.5 A; from memory): one 6.3 V winding of 2.1 A, 13.2 VA.
    expect(list()).toMatch(/^6\.3 V, 2\.1 A \(13\.2 VA\): 12AX7 \(6\.3 V, 0\.3 A\), 12AU7 \(6\.3 V, 0\.3 A\), EL34 \(6\.3 V, 1\.5 A\)$/);
    fireEvent.change(panel.getByLabelText('Rectifier'), { target: { value: 'tube:5U4GB' } });
    fireEvent.change(panel.getByLabelText('Channels'), { target: { value: '2' } });
    expect(store.getState().design.supply.channels).toBe(2);
    expect(list()).toMatch(/^6\.3 V, 4\.2 A .*2 × 12AX7.*2 × 12AU7.*2 × EL34.*5 V, 3 A \(15 VA\): 5U4GB rectifier .*sits at B\+/);
  });

  it('a hum budget the node misses offers the capacitor that meets it; one press fits it, and the node is then within', async () => {
    const { store, panel } = bench();
    await waitFor(() => expect(store.getState().supplyView?.result.ok).toBe(true), { timeout: 5000 });
    const before = store.getState().supplyView!.result;
    if (!before.ok) throw new Error(before.message);
    // The demo's node 4 carries about 0.23 µV rms; a budget of 0.1 µV asks for more than twice its 220 µF.
    act(() => store.getState().editSupplyValue('humRms', '100n'));
    await waitFor(() => expect(store.getState().supplyView?.humCure).not.toBeNull(), { timeout: 5000 });
    const cure = store.getState().supplyView!.humCure!;
    expect(cure.node).toBe(3);
    expect(cure.farads).toBeGreaterThan(2 * 220e-6);
    const warning = panel.getByText(/^Ripple at node 4, which feeds the first stage, is .* expect hum; node 4's capacitor at \d+ µF \(rounded up to E12\)/);
    expect(warning.closest('li')!.className).toContain('warning');
    fireEvent.click(panel.getByRole('button', { name: `Use ${Math.round(cure.farads * 1e6)} µF at node 4` }));
    expect(store.getState().design.supply.sections[2]!.c).toBeCloseTo(cure.farads, 12);
    // Solved again with it: the node is within the budget, and there is nothing more to offer.
    await waitFor(() => expect(panel.getByText(/^Ripple at node 4, which feeds the first stage, is .* against your budget of 100 nV\.$/)).toBeTruthy(), { timeout: 5000 });
    expect(panel.queryByRole('button', { name: /^Use .* at node 4$/ })).toBeNull();
    // One undo step takes the capacitor back.
    act(() => store.getState().undo());
    expect(store.getState().design.supply.sections[2]!.c).toBe(220e-6);
  });

  it('is kept in the design file; a file from before the supply opens on the default one', () => {
    const store = createWorkbenchStore({ supplySolver: null });
    store.getState().setSupply({ channels: 2, rectifier: { kind: 'tube', tubeId: '5AR4' }, regulation: 0.08 });
    const text = writeDesignFile({ title: 't', design: store.getState().design });
    const back = readDesignFile(text);
    if (!back.ok) throw new Error(back.message);
    expect(back.doc.design.supply).toEqual(store.getState().design.supply);
    const old = JSON.parse(text);
    // A supply from before regulation was given opens with the winding's resistance.
    delete old.design.supply.regulation;
    const earlier = readDesignFile(JSON.stringify(old));
    expect(earlier.ok && earlier.doc.design.supply.regulation).toBe(null);
    delete old.design.supply;
    const opened = readDesignFile(JSON.stringify(old));
    if (!opened.ok) throw new Error(opened.message);
    expect(opened.doc.design.supply).toBe(DEMO_SUPPLY);
    old.design.supply = { ...store.getState().design.supply, sections: [{ kind: 'rc', r: -5, c: 47e-6 }] };
    expect(readDesignFile(JSON.stringify(old))).toMatchObject({ ok: false, message: expect.stringMatching(/^design\.supply: Section 1: .*Nothing was opened\.$/) });
  });
});
