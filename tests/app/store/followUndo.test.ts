import { describe, expect, it } from 'vitest';
import { COALESCE_MS } from '../../../app/store/historySlice';
import { solvedOnGate, until } from './gatedSolver';

describe('the stages\u2019 B+ following their nodes, and undo', () => {
  it('a follow that lands long after its change is part of that change\u2019s step: one undo takes both back, and nothing follows again', async () => {
    let clock = 1_000_000;
    const { store, gate } = await solvedOnGate({ now: () => clock });
    store.getState().setSupply({ follow: true });
    await until(() => gate.asked() > 0);
    gate.answer();
    await until(() => store.getState().supplyView?.stale === false);
    const held = store.getState().design;
    const steps = store.getState().past.length;

    // A higher secondary; its solve takes five seconds, far past the time that merges typing into one step.
    clock += 5 * COALESCE_MS;
    store.getState().setSupply({ secondaryRms: 260 });
    expect(store.getState().past.length).toBe(steps + 1);
    await until(() => gate.asked() > 0);
    clock += 5 * COALESCE_MS;
    gate.answer();
    await until(() => store.getState().design.bplus > held.bplus + 5);
    // The B+ followed within the change's own step.
    expect(store.getState().past.length).toBe(steps + 1);
    const followed = store.getState().design;

    // One undo: the secondary and the B+ both back; solved again, the nodes agree with them and nothing follows.
    store.getState().undo();
    expect(store.getState().design.supply.secondaryRms).toBe(248);
    expect(store.getState().design.bplus).toBe(held.bplus);
    await until(() => gate.asked() > 0);
    gate.answer();
    await until(() => store.getState().supplyView?.stale === false);
    await new Promise((r) => setTimeout(r, 300));
    expect(store.getState().design.bplus).toBe(held.bplus);
    expect(store.getState().future.length).toBe(1);
    // And redo brings the followed design back.
    store.getState().redo();
    expect(store.getState().design.bplus).toBe(followed.bplus);
    expect(store.getState().design.supply.secondaryRms).toBe(260);
  }, 30_000);
});
