import { fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import { act } from 'react';
import { describe, expect, it } from 'vitest';
import { App } from '../../app/App';
import { cardSections } from '../../app/export/buildCard';
import { readDesignFile, writeDesignFile } from '../../app/keep/designFile';
import { createWorkbenchStore } from '../../app/store/workbenchStore';
import { solveOnSupply } from '../../src/index';

/** The workbench with the supply solved in place (the page uses a Web Worker; jsdom has none). */
function bench() {
  const store = createWorkbenchStore({ supplySolver: async (input) => solveOnSupply(input) });
  render(<App store={store} />);
  const panel = within(screen.getByRole('region', { name: 'B+ supply' }));
  return { store, panel };
}

describe('a half-wave B+ supply', () => {
  it('chosen in the rectifier box: one winding, one pulse a cycle, one diode on the parts list, the winding\'s DC warned, and kept in files', async () => {
    const { store, panel } = bench();
    await waitFor(() => expect(store.getState().supplyView?.result.ok).toBe(true), { timeout: 5000 });
    const full = store.getState().supplyView!.result;
    if (!full.ok) throw new Error(full.message);
    act(() => void fireEvent.change(panel.getByLabelText('Rectifier'), { target: { value: 'silicon-half-wave' } }));
    expect(store.getState().design.supply.rectifier).toEqual({ kind: 'silicon-half-wave' });
    await waitFor(() => {
      const r = store.getState().supplyView?.result;
      expect(r?.ok && r.supply.conductionDegrees !== full.supply.conductionDegrees).toBe(true);
    }, { timeout: 5000 });
    const half = store.getState().supplyView!.result;
    if (!half.ok) throw new Error(half.message);
    // One winding, not two halves; each pulse's length read against the whole cycle it comes in.
    expect(panel.getByRole('textbox', { name: /^Secondary \(V rms\)/ })).toBeTruthy();
    expect(panel.getByText(/° of 360°$/)).toBeTruthy();
    // The pulses drawn over two mains cycles, 40 ms at 50 Hz, as for full wave (two pulses now, not four).
    const pulses = screen.getByRole('img', { name: /^The rectifier's current pulses into the reservoir over two mains cycles/ });
    // The time axis's ticks: each a group moved along x with its label as its own child.
    const ticks = [...pulses.querySelectorAll('g')]
      .filter((g) => /^translate\([\d.]+,0\)$/.test(g.getAttribute('transform') ?? '') && g.querySelector(':scope > text'))
      .map((g) => Number(g.querySelector(':scope > text')!.textContent));
    expect(Math.max(...ticks)).toBe(40);
    // Behind one diode the reservoir waits a whole cycle between pulses: more ripple than full wave gave (about twice, common practice).
    expect(half.supply.nodes[0]!.ripplePp).toBeGreaterThan(1.5 * full.supply.nodes[0]!.ripplePp);
    // The demo's amplifier draws some 80 mA: through one winding one way, a warning in the one ratings list.
    const ratings = within(screen.getByRole('region', { name: 'Ratings checks' }));
    await waitFor(() => expect(ratings.getByText(/^Half-wave, the winding carries the load's \d+ mA DC as well as its pulses: that magnetises/)).toBeTruthy());
    // One diode, standing twice the peak (the reservoir at +Vpk while the winding swings to −Vpk).
    const sheet = within(screen.getByRole('region', { name: 'Build sheet' }));
    expect(sheet.getByText((_, el) => el?.getAttribute('data-part-line') === 'rectifier').textContent).toMatch(/^Rectifier, one diode, which stands 7\d\d V peak inverse/);
    expect(cardSections(store.getState()).find((c) => c.heading === 'B+ supply')!.lines[0]).toMatch(/^248 V rms at 200 mA, 35 Ω winding, silicon half wave, 50 Hz;/);
    // A choke input cannot bridge a half-wave rectifier's dead half-cycle: said where the supply's figures were.
    act(() => store.getState().setSupply({ input: { kind: 'choke', l: 10, rdc: 150, c: 100e-6 } }));
    await waitFor(() => expect(panel.getByText(/A choke input needs a full-wave rectifier/)).toBeTruthy(), { timeout: 5000 });
    const back = readDesignFile(writeDesignFile({ title: 'half wave', design: store.getState().design }));
    if (!back.ok) throw new Error(back.message);
    expect(back.doc.design.supply.rectifier).toEqual({ kind: 'silicon-half-wave' });
  });
});
