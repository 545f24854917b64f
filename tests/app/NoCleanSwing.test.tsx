import { act, render, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { App } from '../../app/App';
import { createWorkbenchStore } from '../../app/store/workbenchStore';
import { amplifierSection } from '../../app/export/amplifierLines';

/**
 * An amplifier with no clean swing at all: a follower direct-coupled to the
 * demo's 12AX7 plate (100 kΩ, 1.5 kΩ unbypassed) sits with its grid within a
 * volt of its cathode, so it draws grid current with no signal. The strip
 * says so in words, not as a clean limit of some 10⁻¹⁴ W from "none" in, and
 * no card claims 190 dB of headroom against that nothing.
 */
describe('an amplifier with no clean swing', () => {
  it('says which stage clips with no signal, on the strip and the card, and reads no headroom against it', () => {
    const store = createWorkbenchStore();
    const view = render(<App store={store} />);
    act(() => store.getState().addStage(0, 'follower'));
    const r = store.getState().amplifier?.result;
    if (!r?.ok) throw new Error('the amplifier should solve');
    // The model's own verdict: nothing clean to speak of, stage 2 (the follower) first, by grid current.
    expect(r.input.dBu).toBeNull();
    expect(r.clipsFirst).toMatchObject({ stage: 1, by: 'grid-current' });
    const figures = within(screen.getByTestId('amplifier-figures'));
    expect(figures.getByText('none: stage 2 is in grid current with no signal')).toBeTruthy();
    const cards = [...view.container.querySelectorAll('button.chain-card .card-headroom')].map((c) => c.textContent);
    expect(cards[1]).toBe('clips at rest (grid current)');
    expect(cards.filter((c) => c === 'no clean swing')).toHaveLength(cards.length - 1);
    expect(cards.some((c) => /dB headroom/.test(c ?? ''))).toBe(false);
    // The build card says the same.
    expect(amplifierSection(store.getState())!.lines[2]).toBe('Clean to none: stage 2 is in grid current with no signal');
    // The working level's message gives its voltages with SI prefixes, never an exponent.
    expect(screen.getByTestId('amplifier-figures').textContent).not.toMatch(/\de-\d/);
  });
});
