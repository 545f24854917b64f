import { render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { act } from 'react';
import { describe, expect, it } from 'vitest';
import { App } from '../../app/App';
import { createWorkbenchStore } from '../../app/store/workbenchStore';

describe('a phase splitter\'s grid stopper', () => {
  it('typed in the splitter\'s values: its corner is noted, the parts list and the drawing carry it, for a split-load and at a long-tailed pair\'s driven grid', async () => {
    const store = createWorkbenchStore();
    const user = userEvent.setup();
    const view = render(<App store={store} />);
    act(() => {
      store.getState().setOutputPair('push-pull');
      store.getState().setStageKind('output');
    });
    const group = within(screen.getByRole('group', { name: 'Phase splitter' }));
    const field = group.getByRole('textbox', { name: /^Splitter grid stopper/ }) as HTMLInputElement;
    expect(field.value).toBe('none');
    await user.clear(field);
    await user.type(field, '47k{Tab}');
    expect(store.getState().design.output.splitter.rstopper).toBe(47e3);
    // Its plate inverts at nearly unity and its cathode follows: Cgp counts about twice, Cgk hardly (Miller), some 3 pF for
    // a 12AU7 (Cgp 1.5 pF, Cgk 1.6 pF), so 47 kΩ alone has its corner near 1.1 MHz (first-order RC, 1/(2πRC)).
    await waitFor(() => expect(screen.getByText(/^Grid stopper 47 kΩ with the grid's (2\.\d+|3\.\d+) pF \(Miller effect\): its own corner is 1\.\d+ MHz, above the audio band/)).toBeTruthy());
    expect(view.container.querySelector('[data-part-line="Rsts"]')?.textContent).toMatch(/^Rsts \(splitter grid stopper, at the socket\)47 kΩ E24/);
    expect(within(screen.getByRole('group', { name: /^Amplifier drawing|amplifier/i })).getByRole('button', { name: /Grid stopper 47 kΩ/ })).toBeTruthy();
    // A long-tailed pair keeps it, at its driven grid: its cathodes follow that grid about half way, so Cgk counts about
    // half, and one less its first plate's gain (about −6 for a 12AU7 pair here) multiplies Cgp: some 11 pF, a corner near
    // 300 kHz.
    await user.click(group.getByRole('radio', { name: 'Long-tailed pair' }));
    expect((group.getByRole('textbox', { name: /^Splitter grid stopper/ }) as HTMLInputElement).value).toBe('47k');
    await waitFor(() => expect(view.container.querySelector('[data-part-line="Rsts"]')?.textContent).toMatch(/^Rsts \(splitter grid stopper, at the first grid's socket\)47 kΩ E24/));
    expect(screen.getByText(/^Grid stopper 47 kΩ with the grid's 1[01]\.\d pF \(Miller effect\): its own corner is 3\d\d kHz, above the audio band/)).toBeTruthy();
    await user.clear(group.getByRole('textbox', { name: /^Splitter grid stopper/ }));
    await user.type(group.getByRole('textbox', { name: /^Splitter grid stopper/ }), 'none{Tab}');
    await waitFor(() => expect(view.container.querySelector('[data-part-line="Rsts"]')).toBeNull());
  });
});
