import { fireEvent, render, screen, within } from '@testing-library/react';
import { act } from 'react';
import { farads } from '../../app/format';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { App } from '../../app/App';
import { createWorkbenchStore } from '../../app/store/workbenchStore';

describe('the build sheet', () => {
  it('lists the parts to order with ratings, draws the spread on the chart, and sizes the heater dropper', () => {
    const store = createWorkbenchStore();
    const view = render(<App store={store} />);
    const sheet = within(screen.getByRole('region', { name: 'Build sheet' }));
    // Every part numbered by its stage's place: the demo's driver, on the bench, is stage 2.
    const ra = view.container.querySelector('[data-part-line="Ra2"]')!;
    expect(ra.textContent).toMatch(/^Ra2 \(stage 2 plate load\)27 kΩ E24/);
    expect(sheet.getByRole('heading', { name: 'Stage 2, 12AU7 gain stage (on the bench)' })).toBeTruthy();
    // Stage 1's parts come first, as the amplifier runs.
    expect(sheet.getAllByRole('heading', { level: 3 }).map((h) => h.textContent).slice(0, 2)).toEqual(['Stage 1, 12AX7 gain stage', 'Stage 2, 12AU7 gain stage (on the bench)']);
    expect(view.container.querySelector('[data-part-line="Cout"]')!.textContent).toContain('630 V');
    expect(view.container.querySelectorAll('.layer-spread circle').length).toBeGreaterThan(100);
    // The demo lights two envelopes, the 12AX7 input stage and the 12AU7 driver, each 6.3 V 0.3 A in parallel (Tung-Sol 12AX7 and
    // 12AU7 data sheets). On the AC winding they need no dropper; from a 12.6 V DC supply, the dropper by Ohm's law:
    // (12.6 − 6.3) V / 0.6 A = 10.5 Ω; nearest E24 by ratio is 11 Ω; heaters then get 12.6 × 10.5/(10.5 + 11) = 6.15 V; it runs at 0.6² × 11 = 4.0 W, rated twice that, 10 W (common practice).
    expect(sheet.queryByTestId('dropper')).toBeNull();
    act(() => store.getState().setHeaters({ voltageStages: 'dc' }));
    expect(sheet.getByTestId('dropper').textContent).toMatch(/^Dropping resistor 10.5 Ω exactly, order 11 Ω \(10 W\): heaters at 6.15 V/);
    expect(sheet.getByTestId('elevation').textContent).toMatch(/within every rating with the heaters at ground/);
  });

  it('with the bench mid-chain, each capacitor is listed once: the one into the next stage is that stage\'s Cc, Cout leaves the last voltage stage', async () => {
    const { buildSheetOf } = await import('../../app/store/buildSheet');
    const store = createWorkbenchStore();
    store.getState().showStage(0);
    const sheet = buildSheetOf(store.getState());
    expect(sheet.stages.map((st) => [st.title, st.onBench])).toEqual([['Stage 1, 12AX7 gain stage', true], ['Stage 2, 12AU7 gain stage', false]]);
    const refs = sheet.stages.flatMap((st) => [...st.resistors, ...st.capacitors].map((x) => x.ref));
    expect(new Set(refs).size).toBe(refs.length);
    expect(sheet.stages[0]!.capacitors.map((c) => c.ref)).toEqual(['Cc1']);
    expect(sheet.stages[1]!.capacitors.map((c) => c.ref)).toEqual(['Cc2', 'Ck2', 'Cout']);
  });

  it('with the follower on the bench, its parts are the ones marked on the bench, as its card is', async () => {
    const { buildSheetOf } = await import('../../app/store/buildSheet');
    const store = createWorkbenchStore();
    store.getState().setStage2({ kind: 'follower' });
    store.getState().showStage(2);
    expect(store.getState().design.stageKind).toBe('follower');
    const sheet = buildSheetOf(store.getState());
    expect(sheet.stages.filter((st) => st.shown).map((st) => st.title)).toEqual(['Stage 3, 12AU7 cathode follower']);
  });

  it('the capacitors sized for the corner are named as on the parts list; one into the next stage is not written into the amplifier\'s Cout', () => {
    const store = createWorkbenchStore();
    const view = render(<App store={store} />);
    const caps = () => [...view.container.querySelectorAll('.corner-caps li')].map((li) => li.textContent ?? '');
    // The demo's driver (stage 2) is the last voltage stage: its output capacitor is the amplifier's Cout, and Use sets it.
    expect(caps().map((t) => t.split(':')[0])).toEqual(['Cc2', 'Ck2', 'Cout']);
    const use = screen.getByRole('button', { name: /^Use .* for Cout$/ });
    act(() => fireEvent.click(use));
    const sized = store.getState().design.cout;
    expect(use.getAttribute('aria-label')).toContain(farads(sized!));
    // Stage 1 on the bench: its output capacitor is stage 2's Cc; no button writes it into the amplifier's Cout.
    act(() => store.getState().showStage(0));
    expect(caps().map((t) => t.split(':')[0])).toEqual(['Cc1', 'Cc2']);
    expect(caps()[1]).toMatch(/the next stage's coupling/);
    expect(screen.queryByRole('button', { name: /^Use .* for Cc2$/ })).toBeNull();
    expect(store.getState().design.cout).toBe(sized);
  });

  it('a heater supply below the heater voltage and a corner of 0 Hz get specific messages', async () => {
    const store = createWorkbenchStore();
    const user = userEvent.setup();
    render(<App store={store} />);
    const sheet = within(screen.getByRole('region', { name: 'Build sheet' }));
    await user.selectOptions(sheet.getByLabelText(/heaters run/), 'dc');
    const supply = sheet.getByLabelText(/^DC heater supply/);
    await user.clear(supply);
    await user.type(supply, '5');
    expect(sheet.getByText('A 5 V supply is below the 6.3 V the heaters need: no resistor can raise it')).toBeTruthy();
    const corner = sheet.getByLabelText(/^Wanted low corner/);
    await user.clear(corner);
    await user.type(corner, '0');
    expect(sheet.getByText('The corner frequency must be from 0.01 Hz to 1 MHz (got 0 Hz)')).toBeTruthy();
  });

  it('a follower chain gets an elevation when its cathode sits above the heater–cathode rating', () => {
    const store = createWorkbenchStore();
    store.getState().setStage2({ kind: 'follower', tubeId: '12AX7' });
    store.getState().editField('bplus', '400');
    render(<App store={store} />);
    expect(screen.getAllByText(/Elevate the heater supply to about|within every rating/).length).toBe(1);
  });
});
