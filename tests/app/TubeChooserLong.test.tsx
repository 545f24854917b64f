import { act, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { App } from '../../app/App';
import { saveCustomTubes } from '../../app/keep/customTubes';
import { MAX_LISTED } from '../../app/ui/panels/TubeChooser';
import { createWorkbenchStore } from '../../app/store/workbenchStore';
import { korenPublishedSets } from '../../src/index';

describe('the tube chooser with many tubes of your own', () => {
  it('lists the first matches and says how many more; the filter finds the rest', async () => {
    await saveCustomTubes(Array.from({ length: 80 }, (_, k) => ({ name: `Batch ${k}`, params: korenPublishedSets['12AU7']!, maxPlateVoltage: 300, maxPlateDissipation: 2.75, maxHeaterCathodeVoltage: 200, points: [], rmsPercent: 1 })));
    const store = createWorkbenchStore();
    render(<App store={store} />);
    act(() => store.getState().refreshTubes());
    const chooser = within(screen.getByRole('region', { name: 'Tube' }));
    expect(chooser.getAllByRole('radio')).toHaveLength(MAX_LISTED);
    expect(chooser.getByText(/^\d+ more: type in the box to narrow the list\.$/)).toBeTruthy();
    await userEvent.setup().type(chooser.getByRole('searchbox'), 'Batch 79');
    expect(chooser.getAllByRole('radio').map((r) => (r as HTMLInputElement).value)).toEqual(['Batch 79']);
  });
});
