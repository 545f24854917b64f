import { render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { App } from '../../app/App';
import { createWorkbenchStore } from '../../app/store/workbenchStore';

/** "1.75 Hz to 96 kHz" → 96000: the top of a band as the page writes it. */
const topOf = (text: string | null) => {
  const m = /to ([\d.]+) (k?)Hz/.exec(text ?? '');
  if (!m) throw new Error(`no band in “${text}”`);
  return Number(m[1]) * (m[2] === 'k' ? 1e3 : 1);
};

describe('a gain stage\'s grid stopper', () => {
  it('typed on the bench: the stage\'s and the amplifier\'s band lose their top, the parts list and drawings carry it, a slip is named, and none takes it out', async () => {
    const store = createWorkbenchStore();
    const user = userEvent.setup();
    const view = render(<App store={store} />);
    const stageBand = () => topOf(view.container.querySelector('[data-figure="bandwidth"] dd')!.textContent);
    const amplifierBand = () => topOf(screen.getByTestId('amplifier-figures').textContent);
    const [stage0, amp0] = [stageBand(), amplifierBand()];
    const field = screen.getByRole('textbox', { name: /^Grid stopper/ }) as HTMLInputElement;
    expect(field.value).toBe('none');
    await user.clear(field);
    await user.type(field, '220k{Tab}');
    expect(store.getState().design.rstopper).toBe(220e3);
    // The demo's driver (12AU7, gain about 12) has some 21 pF of Miller capacitance: with 220 kΩ its own corner is about
    // 35 kHz, and with stage 1's 68 kΩ before it about 27 kHz (first-order RC, 1/(2πRC)), well inside the 119 kHz band it
    // had; the amplifier's top falls with it.
    // (The signal views and the strip follow when typing pauses.)
    await waitFor(() => expect(stageBand()).toBeLessThan(stage0 / 2));
    await waitFor(() => expect(amplifierBand()).toBeLessThan(amp0 / 2));
    // The ratings list says what the stopper does: its own corner with the grid's Miller capacitance.
    expect(screen.getByText(/^Grid stopper 220 kΩ with the grid's 2\d.\d pF \(Miller effect\): its own corner is 3\d.\d kHz, above the audio band/)).toBeTruthy();
    const part = view.container.querySelector('[data-part-line="Rst2"]');
    expect(part?.textContent).toMatch(/^Rst2 \(stage 2 grid stopper, at the socket\)220 kΩ E24/);
    expect(view.container.querySelector('[data-part="rstopper"]')!.textContent).toBe('Rst 220 kΩ');
    expect(within(screen.getByRole('group', { name: /^Amplifier drawing|amplifier/i })).getByRole('button', { name: /Stage 2 Grid stopper 220 kΩ/ })).toBeTruthy();
    // A value below any real part is named beside the box, and the design keeps its last good value.
    // (Typed over the value: an emptied box reads as none, as in every box that may be left out.)
    await user.type(field, '5', { initialSelectionStart: 0, initialSelectionEnd: field.value.length });
    expect(screen.getByText('Grid stopper must be at least 10 Ω')).toBeTruthy();
    expect(store.getState().design.rstopper).toBe(220e3);
    await user.clear(field);
    await user.type(field, 'none{Tab}');
    expect(store.getState().design.rstopper).toBe(0);
    await waitFor(() => expect(stageBand()).toBe(stage0));
    expect(view.container.querySelector('[data-part-line="Rst2"]')).toBeNull();
  });
});
