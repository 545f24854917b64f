import { fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import { act } from 'react';
import { describe, expect, it } from 'vitest';
import { App } from '../../app/App';
import { cardSections } from '../../app/export/buildCard';
import { readDesignFile, writeDesignFile } from '../../app/keep/designFile';
import { createWorkbenchStore } from '../../app/store/workbenchStore';
import { solveOnSupply } from '../../src/index';

function bench() {
  const store = createWorkbenchStore();
  render(<App store={store} />);
  const panel = within(screen.getByRole('region', { name: 'B+ supply' }));
  return { store, panel };
}

describe('the bias supply of a fixed-bias output stage', () => {
  it('appears with fixed bias: its rail, the string covering the tube\'s adjustment, the hot end warned, its parts on the sheet and card, kept in files', async () => {
    const { store, panel } = bench();
    // The demo's output stage is cathode-biased: no bias supply to design.
    expect(panel.queryByRole('region', { name: 'Bias supply' })).toBeNull();
    act(() => void store.getState().setOutputBias('fixed'));
    const bias = within(panel.getByRole('region', { name: 'Bias supply' }));
    // Solved once the design holds still, not in the keystroke's own frame.
    expect(bias.getByRole('status').textContent).toBe('Solving the bias supply…');
    const results = within(await bias.findByTestId('bias-results'));
    expect(results.getByRole('row', { name: /^Rail −\d+(\.\d+)? V/ })).toBeTruthy();
    // The string: E12 ends, a linear trimmer, and where a typical tube sets it.
    expect(results.getByRole('cell', { name: /^\d+(\.\d+)? kΩ linear$/ })).toBeTruthy();
    expect(results.getByRole('cell', { name: /^−\d+(\.\d+)? V to −\d+(\.\d+)? V$/ })).toBeTruthy();
    // One tube: its grid's ripple reaches the speaker.
    expect(results.getByText(/The grid’s ripple gives [\d.]+ [mµ]?V rms of hum at the speaker\./)).toBeTruthy();
    expect(results.getByText(/^With its bias adjustment turned to the hot end \(−\d+(\.\d)? V\) a typical /)).toBeTruthy();
    // Its parts on the build sheet, the diode turned for a negative rail; the card carries the same.
    const sheet = within(screen.getByRole('region', { name: 'Build sheet' }));
    expect(sheet.getByText((_, el) => el?.getAttribute('data-part-line') === 'bias-rectifier').textContent).toMatch(/^Bias rectifier, one diode, anode to the reservoir/);
    const card = cardSections(store.getState()).find((c) => c.heading === 'Bias supply: parts to order')!;
    expect(card.lines[0]).toMatch(/^Rail −\d+(\.\d+)? V \([\d.]+ [mµ]?V rms ripple\)\. The trimmer reaches −/);
    expect(card.lines.some((l) => /^VRb \(bias trimmer, linear: wiper to the grid leak\): /.test(l))).toBe(true);
    expect(card.lines.some((l) => /^Cb1 \(bias reservoir\): 47 µF, \d+ V, \+ to ground$/.test(l))).toBe(true);
    const back = readDesignFile(writeDesignFile({ title: 'fixed bias', design: store.getState().design }));
    if (!back.ok) throw new Error(back.message);
    expect(back.doc.design.supply.bias).toEqual(store.getState().design.supply.bias);
  });

  it('names a slip beside its box, keeps the last good rail, and says so in the ratings list when the winding is too low', async () => {
    const { store, panel } = bench();
    act(() => void store.getState().setOutputBias('fixed'));
    const bias = within(panel.getByRole('region', { name: 'Bias supply' }));
    await bias.findByTestId('bias-results');
    const winding = bias.getByRole('textbox', { name: /^Bias winding \(V rms\)/ });
    act(() => void fireEvent.change(winding, { target: { value: '50 volts' } }));
    expect(bias.getByRole('alert').textContent).not.toBe('');
    expect(store.getState().design.supply.bias.secondaryRms).toBe(50);
    act(() => void fireEvent.change(winding, { target: { value: '1' } }));
    expect(bias.getByText(/Bias winding voltage must be at least 5 V/)).toBeTruthy();
    expect(store.getState().design.supply.bias.secondaryRms).toBe(50);
    act(() => void fireEvent.change(winding, { target: { value: '12' } }));
    expect(store.getState().design.supply.bias.secondaryRms).toBe(12);
    // Until the new solve comes in, the last figures stay, marked as behind.
    expect(bias.getByText('Solving again for the changed design; these figures are from before it.')).toBeTruthy();
    expect(await bias.findByText(/^The bias rail gives −[\d.]+ V; tube 1's adjustment must reach −[\d.]+ V/)).toBeTruthy();
    const ratings = within(screen.getByRole('region', { name: 'Ratings checks' }));
    await waitFor(() => expect(ratings.getByText(/^The output tubes cannot be biased: The bias rail gives/)).toBeTruthy());
    // Undo brings the rail back.
    act(() => store.getState().undo());
    expect(store.getState().design.supply.bias.secondaryRms).toBe(50);
  });

  it('adds a single tube\'s bias hum to the amplifier\'s hum at the speaker', async () => {
    const store = createWorkbenchStore({ supplySolver: async (input) => solveOnSupply(input) });
    render(<App store={store} />);
    await waitFor(() => expect(store.getState().supplyView?.hum?.ok).toBe(true), { timeout: 5000 });
    act(() => void store.getState().setOutputBias('fixed'));
    await waitFor(() => expect(screen.getByTestId('supply-hum').textContent).toMatch(/; from the bias rail's ripple at the output tube's grid, [\d.]+ [µm]V\./), { timeout: 5000 });
  });

  it('opens an older file, written before the bias supply, with the bench\'s own', () => {
    const { store } = bench();
    const text = writeDesignFile({ title: 'older', design: store.getState().design });
    const doc = JSON.parse(text) as { design: { supply: Record<string, unknown> } };
    delete doc.design.supply.bias;
    const back = readDesignFile(JSON.stringify(doc));
    if (!back.ok) throw new Error(back.message);
    expect(back.doc.design.supply.bias).toEqual({ secondaryRms: 50, windingOhms: 150, reservoir: 47e-6, r: 4700, c: 100e-6 });
    doc.design.supply.bias = { secondaryRms: 50, windingOhms: 150, reservoir: 47e-6, r: 'x', c: 100e-6 };
    expect(readDesignFile(JSON.stringify(doc))).toMatchObject({ ok: false, message: expect.stringMatching(/^design\.supply\.bias\.r must be a number \(found "x"\)/) });
    doc.design.supply.bias = { secondaryRms: 50, windingOhms: 150, reservoir: 47e-6, r: -1, c: 100e-6 };
    expect(readDesignFile(JSON.stringify(doc))).toMatchObject({ ok: false, message: expect.stringMatching(/^design\.supply: Bias filter resistor must be at least 1 Ω/) });
  });
});
