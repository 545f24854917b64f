import { act, fireEvent, render, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { App } from '../../app/App';
import { createWorkbenchStore } from '../../app/store/workbenchStore';
import { ohms } from '../../app/format';

/**
 * The whole amplifier's drawing of a push-pull amplifier: both tubes of the
 * pair on their centre-tapped primary, each grid with its own capacitor and
 * resistor; a long-tailed pair's two triodes with both plate resistors, the
 * shared bias resistor over the tail and the second grid's leak; and every
 * one of their values edited where it stands.
 */
describe('the drawing of a push-pull amplifier', () => {
  const drawing = () => within(screen.getByRole('group', { name: /^Schematic of the whole amplifier/ }));
  /** How many times a tube's type is written under its symbol on the drawing. */
  const tubeLabels = (view: ReturnType<typeof render>, id: string) => [...view.container.querySelectorAll('svg.chain-schematic text')].filter((t) => t.textContent === id).length;
  /** How many tube envelopes of a radius the drawing holds (the voltage stages' and splitter's triodes are 22, the output tubes 26). */
  /** The output stage's cathode bypass, named on the drawing (its value is sized on the build sheet). */
  const bypassNamed = (view: ReturnType<typeof render>) => [...view.container.querySelectorAll('svg.chain-schematic text')].some((t) => t.textContent === 'Ck');
  const envelopes = (view: ReturnType<typeof render>, r: number) => [...view.container.querySelectorAll('svg.chain-schematic circle')].filter((c) => c.getAttribute('r') === String(r)).length;

  it('draws both output tubes, each grid fed through its own capacitor into its own resistor, editable there', { timeout: 20_000 }, () => {
    const store = createWorkbenchStore();
    const view = render(<App store={store} />);
    expect(tubeLabels(view, 'EL34')).toBe(1);
    expect(envelopes(view, 26)).toBe(1);
    expect(bypassNamed(view)).toBe(true);
    act(() => store.getState().setOutputPair('push-pull'));
    expect(bypassNamed(view)).toBe(true);
    const o = () => store.getState().design.output;
    expect(drawing().getByRole('button', { name: 'Output stage, two EL34 in push-pull: put it on the bench' })).toBeTruthy();
    expect(tubeLabels(view, 'EL34')).toBe(2);
    expect(envelopes(view, 26)).toBe(2);
    // One value in one field, drawn at each grid: the second grid's parts open the same boxes.
    expect(drawing().getByRole('button', { name: `Output stage Cc ${'100 nF'}: change` })).toBeTruthy();
    expect(drawing().getByRole('button', { name: 'Output stage second Cc 100 nF: change' })).toBeTruthy();
    expect(drawing().getByRole('button', { name: `Output stage Rg ${ohms(o().rg)}: change` })).toBeTruthy();
    act(() => fireEvent.click(drawing().getByRole('button', { name: `Output stage second Rg ${ohms(o().rg)}: change` })));
    expect(store.getState().design.stageKind).toBe('output');
    const editor = () => within(view.container.querySelector('.chain-frame .inline-editor') as HTMLElement).getByRole('textbox');
    act(() => fireEvent.change(editor(), { target: { value: '150k' } }));
    act(() => fireEvent.keyDown(editor(), { key: 'Enter' }));
    expect(o().rg).toBe(150e3);
    expect(drawing().getByRole('button', { name: 'Output stage Rg 150 kΩ: change' })).toBeTruthy();
    // The shared cathode resistor under the joined cathodes; with fixed bias both grids return to the bias instead.
    expect(drawing().getByRole('button', { name: `Output stage Rk ${ohms(o().rk)}: change` })).toBeTruthy();
    act(() => store.getState().commit({ ...store.getState().design, output: { ...o(), bias: 'fixed', vg: -30 } }));
    expect(drawing().queryByRole('button', { name: /^Output stage Rk/ })).toBeNull();
    expect(bypassNamed(view)).toBe(false);
    expect(drawing().getByRole('button', { name: 'Output stage grid leaks returned to −30 V: change' })).toBeTruthy();
  });

  it('draws a long-tailed pair as two triodes: both plate resistors, the bias resistor over the tail and the held second grid', { timeout: 20_000 }, () => {
    const store = createWorkbenchStore();
    const view = render(<App store={store} />);
    act(() => store.getState().setOutputPair('push-pull'));
    // The split-load: one triode, its plate and cathode loads.
    const before = tubeLabels(view, '12AU7');
    const triodes = envelopes(view, 22);
    expect(drawing().queryByRole('button', { name: /^Phase splitter second Ra/ })).toBeNull();
    const sp = () => store.getState().design.output.splitter;
    act(() => store.getState().commit({ ...store.getState().design, output: { ...store.getState().design.output, splitter: { ...sp(), kind: 'long-tailed-pair', ra: 33e3, ra2: 36e3, rk: 470, rtail: 10e3, vgrid: 60 } } }));
    // One label for the twin triode's envelope, as for the split-load.
    expect(tubeLabels(view, '12AU7')).toBe(before);
    expect(envelopes(view, 22)).toBe(triodes + 1);
    expect(drawing().getByRole('button', { name: 'Phase splitter Ra 33 kΩ: change' })).toBeTruthy();
    expect(drawing().getByRole('button', { name: 'Phase splitter Rk 470 Ω: change' })).toBeTruthy();
    expect(drawing().getByRole('button', { name: 'Phase splitter tail 10 kΩ: change' })).toBeTruthy();
    expect(drawing().getByRole('button', { name: 'Phase splitter grid leak returned to 60 V: change' })).toBeTruthy();
    // Both grids' leaks are the one value: the second grid's opens the leak's box.
    act(() => fireEvent.click(drawing().getByRole('button', { name: 'Phase splitter second grid leak 1 MΩ: change' })));
    const editor = () => within(view.container.querySelector('.chain-frame .inline-editor') as HTMLElement).getByRole('textbox');
    act(() => fireEvent.change(editor(), { target: { value: '680k' } }));
    act(() => fireEvent.keyDown(editor(), { key: 'Enter' }));
    expect(sp().rg).toBe(680e3);
    act(() => fireEvent.click(drawing().getByRole('button', { name: 'Phase splitter second Ra 36 kΩ: change' })));
    act(() => fireEvent.change(editor(), { target: { value: '39k' } }));
    act(() => fireEvent.keyDown(editor(), { key: 'Enter' }));
    expect(sp().ra2).toBe(39e3);
    // The second grid's leak returns to the same divider: its voltage opens the divider's box too.
    act(() => fireEvent.click(drawing().getByRole('button', { name: 'Phase splitter second grid leak returned to 60 V: change' })));
    act(() => fireEvent.change(editor(), { target: { value: '70' } }));
    act(() => fireEvent.keyDown(editor(), { key: 'Enter' }));
    expect(sp().vgrid).toBe(70);
    expect(drawing().getByRole('button', { name: 'Phase splitter grid leak returned to 70 V: change' })).toBeTruthy();
  });
});
