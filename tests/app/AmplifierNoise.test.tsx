import { render, screen, within } from '@testing-library/react';
import { act } from 'react';
import { describe, expect, it } from 'vitest';
import { App } from '../../app/App';
import { createWorkbenchStore } from '../../app/store/workbenchStore';

/** "0.894 µV at the input" → 0.894e-6. */
const inputNoiseOf = (text: string | null | undefined) => {
  const m = /([\d.]+) µV at the input/.exec(text ?? '');
  if (!m) throw new Error(`no input noise in “${text}”`);
  return Number(m[1]) * 1e-6;
};

describe('the amplifier\'s own noise', () => {
  it('is in the strip at the speaker against 1 W and at the input, and on the card; a grid stopper at the input adds its own', async () => {
    const store = createWorkbenchStore();
    render(<App store={store} />);
    const line = () => within(screen.getByTestId('amplifier-figures')).getByTestId('strip-noise').textContent;
    expect(line()).toMatch(/^Noise[\d.]+ µV rms at the speaker, [\d.]+ µV A-weighted \(\d+ dB and \d+ dB\(A\) below 1 W into 8 Ω\); [\d.]+ µV at the input$/);
    const bare = inputNoiseOf(line());
    // A 12AX7 input stage from a 1 kΩ source: its equivalent noise resistance 2.5/gm (about 1.5 kΩ at its 1.6 mA/V,
    // Valley and Wallman, from memory) and the source's 1 kΩ give about 0.9 µV over 20 kHz (Nyquist, 4kTRB at 290 K).
    expect(bare).toBeGreaterThan(0.7e-6);
    expect(bare).toBeLessThan(1.2e-6);
    const { cardSections } = await import('../../app/export/buildCard');
    expect(cardSections(store.getState())[0]!.lines).toEqual(expect.arrayContaining([expect.stringMatching(/^Noise \(20 Hz to 20 kHz\): [\d.]+ µV rms at the speaker, [\d.]+ µV A-weighted/)]));
    // 68 kΩ at stage 1's grid (the demo's stage 2 is on the bench: reach stage 1 through the store): its own thermal noise,
    // √(4kT·68k·20 kHz) ≈ 4.7 µV (Nyquist), less what the stopper's corner with the grid's Miller capacitance takes off the top.
    act(() => {
      store.getState().showStage(0);
      store.getState().commit({ ...store.getState().design, rstopper: 68e3 });
    });
    const stopped = inputNoiseOf(line());
    const added = Math.sqrt(stopped ** 2 - bare ** 2);
    expect(added).toBeGreaterThan(3.5e-6);
    expect(added).toBeLessThan(4.8e-6);
  });
});
