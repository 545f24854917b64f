import { describe, expect, it } from 'vitest';
import { cardSections } from '../../../app/export/buildCard';
import { benchFindings } from '../../../app/store/amplifierFindings';
import { createWorkbenchStore } from '../../../app/store/workbenchStore';
import { solveOnSupply } from '../../../src/index';

const solved = async (store: ReturnType<typeof createWorkbenchStore>) => {
  for (let k = 0; k < 100 && !(store.getState().supplyView && !store.getState().supplyView!.stale); k++) await new Promise((r) => setTimeout(r, 20));
};
const bplusWarnings = (store: ReturnType<typeof createWorkbenchStore>) => benchFindings(store.getState()).filter((f) => f.kind === 'supply-bplus');

describe('stages designed for a B+ their supply node does not give', () => {
  it('the demo made three channels on its supply: the voltage stages\' node sags far below their 275 V, a warning in the one list and on the card until they take it', async () => {
    const store = createWorkbenchStore({ supplySolver: async (input) => solveOnSupply(input) });
    await solved(store);
    // Mono, the demo's nodes give its B+ within 1 %: nothing to say.
    expect(bplusWarnings(store)).toEqual([]);
    // Three channels draw three times the voltage stages' current through the 9.1 kΩ (and the output stages' through the
    // choke: with two, the output's node gave 314 V, 4.7 % under its 330 V, inside the 5 % that warns).
    store.getState().setSupply({ channels: 3 });
    await solved(store);
    const view = store.getState().supplyView!;
    if (!view.result.ok) throw new Error(view.result.message);
    const node = view.result.bplus[view.names.findIndex((n) => n.role === 'voltage')]!;
    expect(node).toBeLessThan(275 * 0.95);
    const w = bplusWarnings(store);
    expect(w.map((f) => f.stageName)).toContain('B+ supply');
    const voltage = w.find((f) => f.message.startsWith('Voltage stages: '))!;
    expect(voltage).toMatchObject({ severity: 'warning' });
    expect(voltage.message).toMatch(/^Voltage stages: designed for B\+ 275 V, but node 4 gives \d+ V under load \(\d+ % less/);
    // The output stage's node sags too (three times the EL34s' current through the choke), named as the ratings list names the stage.
    expect(w.some((f) => /^Output stage \(EL34\): designed for B\+ 330 V, but node 2 gives \d+ V/.test(f.message))).toBe(true);
    expect(cardSections(store.getState()).find((c) => c.heading === 'Ratings, every stage')!.lines.some((l) => l.startsWith('WARNING: B+ supply: Voltage stages: designed for B+ 275 V'))).toBe(true);
    // Taking the nodes' B+ onto the bench settles it (after the solve that follows).
    store.getState().useSupplyVolts();
    await solved(store);
    expect(store.getState().design.bplus).toBe(Math.round(node));
    await solved(store);
    expect(bplusWarnings(store).filter((f) => f.message.startsWith('Voltage stages: '))).toEqual([]);
  });

  it('says nothing while the stages\' B+ follow their nodes', async () => {
    const store = createWorkbenchStore({ supplySolver: async (input) => solveOnSupply(input) });
    store.getState().setSupply({ channels: 2, follow: true });
    await solved(store);
    await new Promise((r) => setTimeout(r, 200));
    await solved(store);
    expect(bplusWarnings(store)).toEqual([]);
  });
});
