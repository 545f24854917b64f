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

  it('driven by the voltage stages, lists the whole amplifier\'s parts in chain order, as the build card does', () => {
    const store = createWorkbenchStore();
    render(<App store={store} />);
    act(() => store.getState().setStageKind('output'));
    const sheet = within(screen.getByRole('region', { name: 'Parts to order' }));
    // The demo: two gain stages driving the EL34; each stage's parts under its own heading, the output stage's last.
    expect(sheet.getAllByRole('heading', { level: 3 }).map((h) => h.textContent)).toEqual(['Stage 1, 12AX7 gain stage', 'Stage 2, 12AU7 gain stage', 'Output stage, EL34 (on the bench)', 'Voltages to check at first switch-on', 'Your meter readings, stage by stage']);
    expect(sheet.getByRole('rowheader', { name: /^Ra1 / })).toBeTruthy();
    expect(sheet.getByRole('rowheader', { name: /^Cout / })).toBeTruthy();
    // Apart, the output stage is the whole design on this bench: its parts alone.
    act(() => store.getState().setDrivesOutput(false));
    expect(sheet.queryAllByRole('heading', { level: 3 }).map((h) => h.textContent)).toEqual(['Voltages to check at first switch-on', 'Your meter readings, stage by stage']);
    expect(sheet.queryByRole('rowheader', { name: /^Ra1 / })).toBeNull();
    // Its switch-on voltages too: its own row alone.
    expect(within(sheet.getByRole('table', { name: 'Voltages to check at first switch-on' })).getAllByRole('rowheader').map((h) => h.textContent)).toEqual(['Output · EL34']);
    // And its meter readings: the output tube's alone.
    expect(sheet.getAllByRole('group', { name: /^Meter readings, / }).map((g) => g.getAttribute('aria-label'))).toEqual(['Meter readings, Output · EL34']);
  });
});
