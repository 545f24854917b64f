import { render, screen, within } from '@testing-library/react';
import { act } from 'react';
import { describe, expect, it } from 'vitest';
import { App } from '../../app/App';
import { createWorkbenchStore } from '../../app/store/workbenchStore';

describe('the output stage on screen', () => {
  it('has a parts sheet like the voltage stage: transformer, resistors with ratings, capacitors with voltages, heater', () => {
    const store = createWorkbenchStore();
    render(<App store={store} />);
    act(() => store.getState().setStageKind('output'));
    const sheet = within(screen.getByRole('region', { name: 'Parts to order' }));
    expect(sheet.getByText(/^Output transformer: 3\.5 kΩ to 8 Ω/)).toBeTruthy();
    expect(sheet.getByRole('rowheader', { name: /^Rk \(/ })).toBeTruthy();
    expect(sheet.getByRole('rowheader', { name: /^Ck \(/ })).toBeTruthy();
    expect(sheet.getByText(/^Heater: 6\.3 V/)).toBeTruthy();
  });
});
