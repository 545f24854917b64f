import { fireEvent, render, screen, within } from '@testing-library/react';
import { act, createElement } from 'react';
import { describe, expect, it, vi } from 'vitest';
import { App } from '../../../app/App';
import { cardSections } from '../../../app/export/buildCard';
import { BEHIND_WORDS } from '../../../app/export/supplyLines';
import { solvesPending, whenSolved } from '../../../app/store/whenSolved';
import { createWorkbenchStore } from '../../../app/store/workbenchStore';
import { gatedSolver, solvedOnGate, until } from './gatedSolver';

const supplyLines = (s: Parameters<typeof cardSections>[0]) => cardSections(s).find((c) => c.heading === 'B+ supply')!.lines;
const partLines = (s: Parameters<typeof cardSections>[0]) => cardSections(s).find((c) => c.heading === 'B+ supply: parts to order')!.lines;

describe('an export waits for the supply solved for the design it shows', () => {
  it('after a change the card says its supply is the last solve\u2019s until the new one lands, and whenSolved resolves with it', async () => {
    const { store, gate } = await solvedOnGate();
    expect(solvesPending(store.getState())).toBe(false);
    expect(supplyLines(store.getState())[0]).not.toBe(BEHIND_WORDS);
    const before = supplyLines(store.getState()).find((l) => l.startsWith('Nodes'))!;

    // A lower secondary: every node moves. Until the solve lands, the card's figures are the last design's, and it says so.
    store.getState().setSupply({ secondaryRms: 230 });
    expect(solvesPending(store.getState())).toBe(true);
    expect(supplyLines(store.getState())[0]).toBe(BEHIND_WORDS);
    expect(partLines(store.getState())[0]).toBe(BEHIND_WORDS);
    let settled: boolean | null = null;
    void whenSolved(store).then((v) => (settled = v));
    await until(() => gate.asked() > 0);
    expect(settled).toBeNull();
    gate.answer();
    await until(() => settled !== null);
    expect(settled).toBe(true);
    const lines = supplyLines(store.getState());
    expect(lines[0]).not.toBe(BEHIND_WORDS);
    expect(lines[0]).toMatch(/^230 V rms a side/);
    expect(lines.find((l) => l.startsWith('Nodes'))).not.toBe(before);
    expect(partLines(store.getState())[0]).not.toBe(BEHIND_WORDS);
  });

  it('gives up after its wait when the solve never lands, and says it did not settle', async () => {
    const { store } = await solvedOnGate();
    store.getState().setSupply({ secondaryRms: 230 });
    expect(await whenSolved(store, 60)).toBe(false);
    expect(supplyLines(store.getState())[0]).toBe(BEHIND_WORDS);
  });

  it('answers at once when nothing is pending, and with the supply off', async () => {
    const store = createWorkbenchStore({ supplySolver: null });
    expect(await whenSolved(store, 10_000)).toBe(true);
    store.getState().setSupply({ on: false });
    expect(solvesPending(store.getState())).toBe(false);
  });
});

describe('the export panel', () => {
  it('holds an export made straight after a change until the supply is solved for it, saying so; the strip\u2019s hum greyed meanwhile', async () => {
    const gate = gatedSolver();
    const store = createWorkbenchStore({ supplySolver: gate.solver });
    const made: Blob[] = [];
    vi.spyOn(URL, 'createObjectURL').mockImplementation((b) => (made.push(b as Blob), 'blob:made'));
    vi.spyOn(URL, 'revokeObjectURL').mockImplementation(() => undefined);
    // jsdom cannot follow the download's link.
    vi.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(() => undefined);
    try {
      render(createElement(App, { store }));
      await until(() => gate.asked() > 0);
      act(() => gate.answer());
      await until(() => store.getState().supplyView?.result.ok === true);
      expect(screen.getByTestId('strip-hum').className).toBe('');
      act(() => store.getState().setSupply({ secondaryRms: 230 }));
      // The strip's hum is the last solve's until the new one lands: greyed, with why on hover.
      expect(screen.getByTestId('strip-hum').className).toBe('stale');
      const panel = within(screen.getByRole('region', { name: 'Export' }));
      act(() => void fireEvent.click(panel.getByRole('button', { name: 'Netlist with the supply (.cir)' })));
      await until(() => panel.queryByRole('status')?.textContent === 'Netlist with the supply: waiting for the supply to be solved for this design…');
      await until(() => gate.asked() > 0);
      expect(made).toEqual([]);
      act(() => gate.answer());
      await until(() => made.length === 1);
      await until(() => /^Netlist with the supply saved as /.test(panel.queryByRole('status')?.textContent ?? ''));
      expect(screen.getByTestId('strip-hum').className).toBe('');
    } finally {
      vi.restoreAllMocks();
    }
  });
});
