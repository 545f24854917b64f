import { render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { App } from '../../app/App';
import { readDesignFile, writeDesignFile } from '../../app/keep/designFile';
import { createWorkbenchStore } from '../../app/store/workbenchStore';

/** "46.0 dB (199×" → 46.0: the amplifier's gain in dB as the strip writes it. */
const gainDbOf = (text: string | null) => {
  const m = /Gain([\d.]+) dB/.exec(text ?? '');
  if (!m) throw new Error(`no gain in “${text}”`);
  return Number(m[1]);
};

describe('a gain stage\'s volume control', () => {
  it('typed on the bench: Rg becomes a pot, the amplifier loses what the wiper drops, the parts list and drawings carry it, a slip is named, and none takes it out', async () => {
    const store = createWorkbenchStore();
    const user = userEvent.setup();
    const view = render(<App store={store} />);
    const strip = () => screen.getByTestId('amplifier-figures').textContent;
    const gain0 = gainDbOf(strip());
    const field = screen.getByRole('textbox', { name: /^Volume control/ }) as HTMLInputElement;
    expect(field.value).toBe('none');
    await user.clear(field);
    await user.type(field, '-12{Tab}');
    expect(store.getState().design.volume).toBe(-12);
    // The wiper passes 10^(−12/20) of the track's signal (a resistive divider, Ohm's law); the grid's own input loads it
    // a little, so the amplifier's gain falls by about 12 dB.
    await waitFor(() => expect(gainDbOf(strip())).toBeCloseTo(gain0 - 12, 0));
    // The ratings list says what the pot does at its worst setting: a quarter of its track (Thévenin) against the 12AU7's
    // some 21 pF of Miller capacitance, about 30 kHz by 1/(2πRC): above the audio band, a note.
    expect(screen.getByText(/^Volume control 1 MΩ: at half its track \(−6 dB\) the wiper drives the grid through 250 kΩ; with the grid's 2\d.\d pF \(Miller effect\) its corner is 3\d.\d kHz, above the audio band/)).toBeTruthy();
    // The stage's own input figures are then at the wiper, the strip's at the source.
    expect(view.container.querySelector('[data-figure="input-needed"] dt')!.textContent).toBe('Input needed, at the wiper');
    const part = view.container.querySelector('[data-part-line="VR2"]');
    expect(part?.textContent).toMatch(/^VR2 \(stage 2 volume control, audio taper, in the grid leak's place: wiper to the grid\)1 MΩ pot/);
    expect(view.container.querySelector('[data-part-line="Rg2"]')).toBeNull();
    expect(view.container.querySelector('[data-part="rg"]')!.textContent).toBe('VR 1 MΩ');
    expect(view.container.querySelector('[data-part="volume"]')!.textContent).toBe('−12 dB');
    expect(within(screen.getByRole('group', { name: /^Amplifier drawing|amplifier/i })).getByRole('button', { name: /Stage 2 set to −12 dB/ })).toBeTruthy();
    // Kept in the design file; a file from before it opens with a fixed Rg.
    const back = readDesignFile(writeDesignFile({ title: 't', design: store.getState().design }));
    expect(back.ok && back.doc.design.volume).toBe(-12);
    const old = JSON.parse(writeDesignFile({ title: 't', design: store.getState().design }));
    delete old.design.volume;
    const before = readDesignFile(JSON.stringify(old));
    expect(before.ok && before.doc.design.volume).toBe(null);
    old.design.volume = 6;
    expect(readDesignFile(JSON.stringify(old))).toMatchObject({ ok: false });
    // A setting above full is named beside the box, and the design keeps its last good value.
    await user.type(field, '6', { initialSelectionStart: 0, initialSelectionEnd: field.value.length });
    expect(screen.getByText(/^Volume control must be from −?60 to 0 dB/)).toBeTruthy();
    expect(store.getState().design.volume).toBe(-12);
    await user.clear(field);
    await user.type(field, 'none{Tab}');
    expect(store.getState().design.volume).toBe(null);
    await waitFor(() => expect(gainDbOf(strip())).toBeCloseTo(gain0, 1));
    expect(view.container.querySelector('[data-part-line="VR2"]')).toBeNull();
    expect(view.container.querySelector('[data-part="volume"]')).toBeNull();
    expect(view.container.querySelector('[data-figure="input-needed"] dt')!.textContent).toBe('Input needed');
  });
});
