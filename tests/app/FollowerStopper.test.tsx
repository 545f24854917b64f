import { render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { App } from '../../app/App';
import { cardSections } from '../../app/export/buildCard';
import type { BenchDesign } from '../../app/store/analysis';
import { createWorkbenchStore } from '../../app/store/workbenchStore';

describe('a cathode follower\'s grid stopper', () => {
  it('typed in the follower\'s values: the ratings name its corner, the parts list, the drawing and the amplifier carry it, a slip is named, and none takes it out', async () => {
    const store = createWorkbenchStore();
    const user = userEvent.setup();
    const view = render(<App store={store} />);
    // The demo's driver (stage 2, 12AU7) gets a direct-coupled 12AU7 follower, which becomes stage 3.
    await user.selectOptions(screen.getByRole('combobox', { name: 'Add' }), 'follower');
    // Its boxes are named for the follower (it is the amplifier's stage 3 here, not "stage 2").
    expect((screen.getByRole('textbox', { name: /^Rk \(follower\)/ }) as HTMLInputElement).value).toBe('22k');
    const field = screen.getByRole('textbox', { name: /^Grid stopper \(follower\)/ }) as HTMLInputElement;
    expect(field.value).toBe('none');
    await user.clear(field);
    await user.type(field, '100k{Tab}');
    expect(store.getState().design.stage2.rstopper).toBe(100e3);
    // The follower's input capacitance is Cgp plus Cgk less what its cathode follows (Miller): about 1.6 pF for a 12AU7
    // (Cgp 1.5 pF, Cgk 1.6 pF, gain near 0.95), so 100 kΩ alone has its corner near 1 MHz (first-order RC, 1/(2πRC)).
    await waitFor(() => expect(screen.getByText(/^Grid stopper 100 kΩ with the grid's 1\.\d+ pF \(Miller effect\): its own corner is (9\d\d|1\.0\d) (kHz|MHz), above the audio band/)).toBeTruthy());
    expect(view.container.querySelector('[data-part-line="Rst3"]')?.textContent).toMatch(/^Rst3 \(stage 3 follower grid stopper, at the socket\)100 kΩ E24/);
    expect(within(screen.getByRole('group', { name: /^Amplifier drawing|amplifier/i })).getByRole('button', { name: /Stage 3 Grid stopper 100 kΩ/ })).toBeTruthy();
    // The bench's own drawing of the stage and its follower draws it too, at the follower's grid, its value a button.
    const bench = within(screen.getByRole('region', { name: 'Stage schematic: click a value to change it' }));
    expect(bench.getByRole('button', { name: 'Grid stopper (follower) Rst 100 kΩ: change' })).toBeTruthy();
    // A value below any real part is named beside the box, and the design keeps its last good value.
    // On the card, under its own number (the bench's stage is the demo's second, so its follower is the third).
    const card = cardSections(store.getState()).find((x) => x.heading.startsWith('Stage 3: 12AU7 cathode follower'));
    expect(card?.heading).toBe('Stage 3: 12AU7 cathode follower, direct-coupled');
    expect(card?.lines[0]).toBe('Rk 22 kΩ; grid stopper 100 kΩ');
    await user.type(field, '5', { initialSelectionStart: 0, initialSelectionEnd: field.value.length });
    expect(screen.getByText('Grid stopper must be at least 10 Ω')).toBeTruthy();
    expect(store.getState().design.stage2.rstopper).toBe(100e3);
    await user.clear(field);
    await user.type(field, 'none{Tab}');
    expect(store.getState().design.stage2.rstopper).toBe(0);
    await waitFor(() => expect(view.container.querySelector('[data-part-line="Rst3"]')).toBeNull());
    expect(within(screen.getByRole('region', { name: 'Stage schematic: click a value to change it' })).queryByRole('button', { name: /^Grid stopper \(follower\)/ })).toBeNull();
    expect(screen.queryByText(/^Grid stopper 100 kΩ/)).toBeNull();
  });

  it('a follower off the bench is written on the build card as it is wired: its coupling and its stopper', () => {
    const store = createWorkbenchStore();
    const d = store.getState().design;
    const input = { kind: 'common-cathode', tubeId: '12AX7', bplus: 280, ra: 100e3, rk: 1500, bypassed: true, ck: 22e-6, cc: 470e-9, rg: 1e6 };
    const follower = { kind: 'follower', tubeId: '12AU7', rk: 22e3, coupling: { cc: 100e-9, rg: 1e6, vbias: 140 }, rstopper: 4.7e3 };
    store.getState().commit({ ...d, before: [input, follower] as BenchDesign['before'] });
    const section = cardSections(store.getState()).find((x) => x.heading === 'Stage 2, 12AU7 cathode follower, capacitor-coupled');
    expect(section?.lines[0]).toBe('Rk 22 kΩ, Cc 100 nF from stage 1\'s plate into 1 MΩ, grid held at 140 V, grid stopper 4.7 kΩ');
    expect(section?.lines).toEqual(expect.arrayContaining([expect.stringMatching(/^Rst2: 4\.7 kΩ E24/)]));
  });
});
