import { render, screen, waitFor, within } from '@testing-library/react';
import { act } from 'react';
import { describe, expect, it } from 'vitest';
import { App } from '../../app/App';
import { createWorkbenchStore } from '../../app/store/workbenchStore';

describe("the phase splitter's balance across the band", () => {
  it('reads each phase error to a tenth of a degree: a split-load that stays balanced reads 0.0°, not a rounding residue in an exponent', async () => {
    const store = createWorkbenchStore();
    render(<App store={store} />);
    act(() => {
      store.getState().setOutputPair('push-pull');
      store.getState().setStageKind('output');
    });
    const group = within(screen.getByRole('group', { name: 'Phase splitter' }));
    const line = await waitFor(() => group.getByText(/^Balance /), { timeout: 5000 });
    const text = line.textContent!;
    expect(text).toMatch(/ \u2212?\d+\.\d° off at 20 kHz, .* \u2212?\d+\.\d° off at 100 kHz/);
    expect(text).not.toMatch(/\de[-+]?\d/);
  });
});
