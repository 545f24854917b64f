import { fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import { act } from 'react';
import { describe, expect, it } from 'vitest';
import { App } from '../../app/App';
import { cardSections } from '../../app/export/buildCard';
import { readDesignFile, writeDesignFile } from '../../app/keep/designFile';
import { benchFindings } from '../../app/store/amplifierFindings';
import { voltageStages } from '../../app/store/stagePlans';
import { onSupplyInputOf } from '../../app/store/supplyPlan';
import { createWorkbenchStore } from '../../app/store/workbenchStore';
import { LIBRARY_TUBES } from '../../app/store/tubeRegistry';
import { solveOnSupply } from '../../src/index';

type Store = ReturnType<typeof createWorkbenchStore>;
const solved = async (store: Store) => {
  for (let k = 0; k < 150 && !(store.getState().supplyView && !store.getState().supplyView!.stale); k++) await new Promise((r) => setTimeout(r, 20));
};
const result = (store: Store) => {
  const r = store.getState().supplyView!.result;
  if (!r.ok) throw new Error(r.message);
  return r;
};
const nodesOfStages = (store: Store) => voltageStages(store.getState().design).map((p) => (p.kind === 'common-cathode' ? p.node : undefined));
/** The demo's ladder (DEMO_SUPPLY): node 3 (index 2) comes through 1 kΩ from node 2, node 4 (index 3) through 9.1 kΩ from node 3. */
const LAST_R = 9.1e3;

describe('each gain stage on a supply node of its own (the decoupling ladder)', () => {
  it('the demo\'s stage 2 moved up to node 3: its current leaves the last 9.1 kΩ, so node 4 rises by about its drop (Ohm\'s law), each stage is solved at its own node, and the hum budget stays on stage 1\'s', async () => {
    const store = createWorkbenchStore({ supplySolver: async (input) => solveOnSupply(input) });
    await solved(store);
    const before = result(store);
    const view0 = store.getState().supplyView!;
    const stage2 = view0.names.findIndex((n) => n.title === 'Stage 2');
    const i2 = before.amplifier.stages[stage2]!.op.ia;
    act(() => store.getState().setStageNode(1, 2));
    // Held the one way: the voltage stages' node is stage 1's, stage 2 alone carries its own.
    expect(store.getState().design.supply.feeds.voltage).toBe(3);
    expect(nodesOfStages(store)).toEqual([undefined, 2]);
    await solved(store);
    const after = result(store);
    const view = store.getState().supplyView!;
    expect(view.feeds[view.names.findIndex((n) => n.title === 'Stage 1')]).toBe(3);
    expect(view.feeds[stage2]).toBe(2);
    // Node 4 now carries stage 1 alone; node 3's load gains stage 2's plate current.
    const i1 = after.amplifier.stages[view.names.findIndex((n) => n.title === 'Stage 1')]!.op.ia;
    expect(after.loads[3]).toBeCloseTo(i1, 9);
    // Ohm's law through the last section: its drop falls by the current it no longer carries times 9.1 kΩ, about stage 2's
    // (node 3 itself moves by about a volt: stage 1, now higher, draws a little more, and the same total leaves node 3).
    const rise = after.supply.nodes[3]!.dc - before.supply.nodes[3]!.dc;
    const node3Moved = after.supply.nodes[2]!.dc - before.supply.nodes[2]!.dc;
    expect(Math.abs(node3Moved)).toBeLessThan(2);
    expect(rise - node3Moved).toBeCloseTo((before.loads[3]! - after.loads[3]!) * LAST_R, 1);
    expect(rise).toBeGreaterThan(20);
    // About stage 2's drop: 6 % short here, as stage 1 now draws more through the same resistor.
    expect(Math.abs(rise - i2 * LAST_R) / (i2 * LAST_R)).toBeLessThan(0.1);
    // Each stage is solved at its own node's voltage.
    expect(after.bplus[view.names.findIndex((n) => n.title === 'Stage 1')]).toBeCloseTo(after.supply.nodes[3]!.dc, 1);
    expect(after.bplus[stage2]).toBeCloseTo(after.supply.nodes[2]!.dc, 1);
    // The hum budget is stage 1's node, the one every stage after it amplifies.
    const input = onSupplyInputOf(store.getState().design, LIBRARY_TUBES)!.input;
    expect(input.supply.ratings?.hum?.node).toBe(3);
    // Both stages were designed for 275 V: each is named at its own node in the one list and on the card.
    const warnings = benchFindings(store.getState()).filter((f) => f.kind === 'supply-bplus').map((f) => f.message);
    expect(warnings.some((m) => /^Stage 2 \(12AU7\): designed for B\+ 275 V, but node 3 gives \d+ V/.test(m))).toBe(true);
    expect(warnings.some((m) => /^Stage 1 \(12AX7\): designed for B\+ 275 V, but node 4 gives \d+ V/.test(m))).toBe(true);
    expect(cardSections(store.getState()).find((c) => c.heading === 'Ratings, every stage')!.lines.some((l) => l.includes('Stage 2 (12AU7): designed for B+ 275 V, but node 3'))).toBe(true);
    // Taking the supply's B+ gives each stage its own node's.
    act(() => store.getState().useSupplyVolts());
    const bplus = voltageStages(store.getState().design).map((p) => (p.kind === 'common-cathode' ? p.bplus : null));
    expect(bplus).toEqual([Math.round(after.supply.nodes[3]!.dc), Math.round(after.supply.nodes[2]!.dc)]);
    // Undo takes the B+ back, then the node.
    act(() => store.getState().undo());
    act(() => store.getState().undo());
    expect(nodesOfStages(store)).toEqual([undefined, undefined]);
    expect(store.getState().design.supply.feeds.voltage).toBe(3);
  }, 20_000);

  it('is held the one way: both on one node is the voltage stages\' node again; a stage moved toward the input takes its node with it', () => {
    const store = createWorkbenchStore();
    act(() => store.getState().setStageNode(0, 1));
    // Stage 1 on node 2, stage 2 still on node 4: the voltage stages' node is stage 1's, stage 2 keeps its own.
    expect(store.getState().design.supply.feeds.voltage).toBe(1);
    expect(nodesOfStages(store)).toEqual([undefined, 3]);
    act(() => store.getState().setStageNode(1, 1));
    expect(store.getState().design.supply.feeds.voltage).toBe(1);
    expect(nodesOfStages(store)).toEqual([undefined, undefined]);
    act(() => store.getState().setStageNode(1, 2));
    act(() => store.getState().shiftStage(1, -1));
    // The 12AU7 is now stage 1 and still on node 3; the hum budget follows it there.
    const list = voltageStages(store.getState().design);
    expect(list[0]!.tubeId).toBe('12AU7');
    const input = onSupplyInputOf(store.getState().design, LIBRARY_TUBES)!.input;
    expect(input.feeds.slice(0, 2)).toEqual([2, 1]);
    expect(input.supply.ratings?.hum?.node).toBe(2);
  });

  it('a section removed moves a stage on a later node down with the others; a file keeps each stage\'s node and refuses one the supply lacks', () => {
    const store = createWorkbenchStore();
    act(() => store.getState().setStageNode(1, 2));
    // The section to node 3 goes: stage 2 on it moves to node 2 (index 1), stage 1 on node 4 to node 3.
    act(() => store.getState().removeSection(1));
    expect(store.getState().design.supply.feeds.voltage).toBe(2);
    expect(nodesOfStages(store)).toEqual([undefined, 1]);
    const doc = { title: 'Ladder', design: store.getState().design };
    const back = readDesignFile(writeDesignFile(doc));
    expect(back.ok && voltageStages(back.doc.design).map((p) => (p.kind === 'common-cathode' ? p.node : undefined))).toEqual([undefined, 1]);
    const raw = JSON.parse(writeDesignFile(doc)) as { design: Record<string, unknown> };
    raw.design.node = 3;
    expect(readDesignFile(JSON.stringify(raw))).toMatchObject({ ok: false, message: 'design.node must be a node of the supply, 0 (the reservoir) to 2 (found 3). Nothing was opened.' });
    raw.design.node = 1.5;
    expect(readDesignFile(JSON.stringify(raw))).toMatchObject({ ok: false, message: expect.stringContaining('design.node must be a supply node, a whole number from 0 (the reservoir) to 8') });
  });

  it('on the page: one choice per gain stage once there are two, each naming its stage and tube; choosing one puts that stage on its node in the table', async () => {
    const store = createWorkbenchStore({ supplySolver: async (input) => solveOnSupply(input) });
    render(<App store={store} />);
    const panel = within(screen.getByRole('region', { name: 'B+ supply' }));
    expect(panel.queryByLabelText('Voltage stages from')).toBeNull();
    const second = panel.getByLabelText('Stage 2 (12AU7) from') as HTMLSelectElement;
    expect((panel.getByLabelText('Stage 1 (12AX7) from') as HTMLSelectElement).value).toBe('3');
    fireEvent.change(second, { target: { value: '2' } });
    expect(nodesOfStages(store)).toEqual([undefined, 2]);
    await waitFor(() => expect(panel.getByText(/^Stage 2 \(12AU7\): node 3 gives/)).toBeTruthy(), { timeout: 5000 });
    expect(panel.getByText(/^Stage 1 \(12AX7\): node 4 gives/)).toBeTruthy();
    const row3 = document.querySelector('tr[data-node="3"]')!;
    expect(row3.textContent).toContain('Stage 2 (12AU7)');
    expect(document.querySelector('tr[data-node="4"]')!.textContent).not.toContain('Stage 2');
    // One gain stage left: one choice for the voltage stages.
    act(() => store.getState().dropStage(1));
    expect(panel.getByLabelText('Voltage stages from')).toBeTruthy();
  }, 20_000);
});
