import { render, screen, waitFor, within } from '@testing-library/react';
import { act } from 'react';
import { describe, expect, it } from 'vitest';
import { App } from '../../app/App';
import { cardSections } from '../../app/export/buildCard';
import { benchFindings } from '../../app/store/amplifierFindings';
import { onSupplyInputOf } from '../../app/store/supplyPlan';
import { createWorkbenchStore } from '../../app/store/workbenchStore';
import { LIBRARY_TUBES } from '../../app/store/tubeRegistry';
import { formatValue, solveOnSupply, supplyLowEnd } from '../../src/index';

type Store = ReturnType<typeof createWorkbenchStore>;

function typed(store: Store, field: Parameters<ReturnType<Store['getState']>['editField']>[0], text: string) {
  act(() => {
    store.getState().editField(field, text);
    store.getState().settleAnalysis();
    store.getState().settleField(field);
  });
}

/** The model's own answer for the store's design, solved afresh. */
function modelLowEnd(store: Store) {
  const input = onSupplyInputOf(store.getState().design, LIBRARY_TUBES)!.input;
  const r = solveOnSupply(input);
  if (!r.ok) throw new Error(r.message);
  const le = supplyLowEnd(input, r);
  if (!le.ok) throw new Error(le.message);
  return le;
}

const settled = (store: Store) => waitFor(() => expect(store.getState().supplyView?.lowEnd?.ok).toBe(true), { timeout: 8000 });

describe('the amplifier\'s low end on its supply, and the loop through it', () => {
  it('the demo: its low end on the supply against an ideal one, a stable loop with room, the ideal transformer said; a 20 H primary leaves it thin (a warning), and 47 µF on node 4 then motorboats (a danger), in the one list and on the card', async () => {
    const store = createWorkbenchStore({ supplySolver: async (input) => solveOnSupply(input) });
    render(<App store={store} />);
    const panel = within(screen.getByRole('region', { name: 'B+ supply' }));
    await settled(store);
    const le = modelLowEnd(store);
    expect([le.unstablePoles, le.thinLoop]).toEqual([0, false]);
    const line = panel.getByTestId('supply-low-end').textContent!;
    expect(line).toBe(`Low end on this supply: −3 dB at ${formatValue(le.lowHz!, 'Hz')} (${formatValue(le.idealLowHz!, 'Hz')} on an ideal supply); the loop through the supply is stable (output transformer taken as ideal: give its primary inductance)`);
    const coupling = () => benchFindings(store.getState()).filter((f) => f.kind === 'supply-coupling').map((f) => [f.severity, f.stageName]);
    expect(coupling()).toEqual([]);
    // A real primary, 20 H: its roll-off adds phase round the loop, which keeps under 10 dB of gain margin.
    typed(store, 'oLp', '20');
    const thin = () => {
      const x = store.getState().supplyView?.lowEnd;
      return x?.ok ? x.thinLoop : null;
    };
    await waitFor(() => expect(thin()).toBe(true), { timeout: 8000 });
    expect(modelLowEnd(store).thinLoop).toBe(true);
    expect(panel.getByTestId('supply-low-end').textContent).toMatch(/the loop through the supply is stable but thin \(under 10 dB of gain margin\)$/);
    expect(coupling()).toEqual([['warning', 'B+ supply']]);
    // The voltage stages' node back at 47 µF: it motorboats (ngspice's transient agrees: tests/spice/supplyLowEnd.spice.test.ts).
    act(() => store.getState().editSupplyValue('sections.2.c', '47u'));
    const poles = () => {
      const x = store.getState().supplyView?.lowEnd;
      return x?.ok ? x.unstablePoles : null;
    };
    await waitFor(() => expect(poles()).toBeGreaterThan(0), { timeout: 8000 });
    expect(modelLowEnd(store).unstablePoles).toBeGreaterThan(0);
    expect(panel.getByTestId('supply-low-end').textContent).toMatch(/the loop through the supply OSCILLATES \(motorboating\)$/);
    expect(coupling()).toEqual([['danger', 'B+ supply']]);
    expect(cardSections(store.getState()).find((c) => c.heading === 'Ratings, every stage')!.lines.some((l) => l.startsWith('DANGER: B+ supply: The loop through the supply oscillates'))).toBe(true);
    expect(cardSections(store.getState()).find((c) => c.heading === 'B+ supply')!.lines.some((l) => /OSCILLATES/.test(l))).toBe(true);
  }, 40_000);
});
