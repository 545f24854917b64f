import { render, screen, within } from '@testing-library/react';
import { act } from 'react';
import { describe, expect, it } from 'vitest';
import { App } from '../../app/App';
import { cardSections } from '../../app/export/buildCard';
import { createWorkbenchStore } from '../../app/store/workbenchStore';

describe('the voltages to check at first switch-on', () => {
  it("list every stage of the demo with its electrodes' voltages to chassis, as the solved amplifier has them, on the sheet and the card", () => {
    const store = createWorkbenchStore();
    render(<App store={store} />);
    const table = screen.getByRole('table', { name: 'Voltages to check at first switch-on' });
    const rows = within(table).getAllByRole('row').slice(1);
    expect(rows.map((r) => within(r).getByRole('rowheader').textContent)).toEqual(['Stage 1 · 12AX7', 'Stage 2 · 12AU7', 'Output · EL34']);
    // Stage 2 is the bench's: the same plate and cathode its figures show (Va 152 V, Vk 5.45 V at Ia 4.54 mA); its grid on its leak reads 0 V.
    const cells = (r: HTMLElement) => within(r).getAllByRole('cell').map((c) => c.textContent);
    expect(cells(rows[1]!)).toEqual(['275 V', '152 V', '5.45 V', '0 V', '—', '4.54 mA']);
    // The ultralinear EL34's screens sit on the taps: at its B+ at DC.
    expect(cells(rows[2]!)[0]).toBe('330 V');
    expect(cells(rows[2]!)[4]).toBe('330 V');
    const card = cardSections(store.getState()).find((c) => c.heading === 'Voltages to check at first switch-on')!;
    expect(card.lines[1]).toBe('Stage 2 · 12AU7: B+ 275 V, plate 152 V, cathode 5.45 V, grid 0 V; Ia 4.54 mA');
    expect(card.lines.at(-1)).toMatch(/common practice/);
  });

  it('with the output stage apart, list the voltage stages here and the output stage with its own parts, each bench its own, as the parts lists do', () => {
    const store = createWorkbenchStore();
    render(<App store={store} />);
    act(() => store.getState().setDrivesOutput(false));
    const heads = () => within(screen.getByRole('table', { name: 'Voltages to check at first switch-on' })).getAllByRole('rowheader').map((h) => h.textContent);
    expect(heads()).toEqual(['Stage 1 · 12AX7', 'Stage 2 · 12AU7']);
    expect(screen.getByText(/The output stage is apart from the voltage stages/)).toBeTruthy();
    const cardHeads = () => cardSections(store.getState()).find((c) => c.heading === 'Voltages to check at first switch-on')!.lines.slice(0, -1).map((l) => l.split(':')[0]);
    expect(cardHeads()).toEqual(['Stage 1 · 12AX7', 'Stage 2 · 12AU7']);
    // On the output bench: its own row, from its own analysis (the cathode its figures show).
    act(() => store.getState().setStageKind('output'));
    expect(heads()).toEqual(['Output · EL34']);
    expect(cardHeads()).toEqual(['Output · EL34']);
    const op = store.getState().outputBench;
    if (op.pair !== 'single-ended') throw new Error('the demo is single-ended');
    const row = within(screen.getByRole('table', { name: 'Voltages to check at first switch-on' })).getAllByRole('row')[1]!;
    expect(within(row).getAllByRole('cell').map((c) => c.textContent)[2]).toBe(`${op.settled.solution.op.vk.toPrecision(3)} V`);
    // A pair on its own bench: each tube's row.
    act(() => store.getState().setOutputPair('push-pull'));
    expect(heads()).toEqual(['Output · EL34 (each tube)']);
  });

  it("a long-tailed pair's row gives both plates and both currents, each pair of figures as the model solved them", () => {
    const store = createWorkbenchStore();
    render(<App store={store} />);
    act(() => {
      store.getState().setOutputPair('push-pull');
      store.getState().setSplitter({ kind: 'long-tailed-pair' });
    });
    const row = within(screen.getByRole('table', { name: 'Voltages to check at first switch-on' })).getByRole('row', { name: /^Splitter · 12AU7/ });
    const cells = within(row).getAllByRole('cell').map((c) => c.textContent);
    const amp = store.getState().amplifier!.result;
    if (!amp.ok) throw new Error(amp.message);
    const ltp = amp.stages.find((st) => st.kind === 'long-tailed-pair')!;
    expect(ltp.pins.plate2Current).toBeGreaterThan(0);
    expect(cells[1]).toMatch(/^\d+ V, \d+ V$/);
    expect(cells.at(-1)).toMatch(/^\d\.\d+ mA, \d\.\d+ mA$/);
  });
});
