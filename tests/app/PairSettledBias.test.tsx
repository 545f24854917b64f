import { render, screen, within } from '@testing-library/react';
import { act } from 'react';
import { describe, expect, it } from 'vitest';
import { App } from '../../app/App';
import { cardSections } from '../../app/export/buildCard';
import { compareCells } from '../../app/ui/output/OutputComparePanel';
import { createWorkbenchStore } from '../../app/store/workbenchStore';
import { findOutputTube, settledCathodeBias, solvePushPull } from '../../src/index';

describe('a cathode-biased pair shows where its shared resistor settles under full drive', () => {
  it('the figures and the build card give the settled cathode and the power there, as the model solves it; fixed bias shows none', () => {
    const store = createWorkbenchStore();
    render(<App store={store} />);
    act(() => store.getState().setOutputPair('push-pull'));
    act(() => store.getState().setStageKind('output'));
    const bench = store.getState().outputBench;
    if (bench.pair !== 'push-pull') throw new Error('no pair on the bench');
    const design = bench.analysis.solution.design;
    expect(design.bias).toBe('cathode');
    // The same pair solved straight from the model (checked against ngspice in settledBias.spice.test.ts).
    const s = solvePushPull(findOutputTube(design.tubeId)!, design);
    if (!s.ok) throw new Error(s.message);
    const r = settledCathodeBias(s);
    if (!r.ok) throw new Error(r.message);
    const figures = within(screen.getByRole('region', { name: 'Push-pull output stage figures' }));
    const figure = (name: string) => figures.getByText((_, el) => el?.getAttribute('data-figure') === name).querySelector('dd')!.textContent;
    expect(figure('settled-vk')).toBe(`${r.idleVk.toPrecision(3)} V → ${r.vk.toPrecision(3)} V`);
    expect(figure('settled-power')).toMatch(new RegExp(`^${r.full.power.toPrecision(3)} W at `));
    const card = cardSections(store.getState()).flatMap((c) => c.lines);
    expect(card.some((l) => l.startsWith(`The shared Rk settles under full drive at Vk ${r.vk.toPrecision(3)} V`))).toBe(true);

    // A second tube in the same sockets on the same Rk settles where its own currents put it: one row each, side by side.
    act(() => store.getState().setOutputRival({ on: true, tubeId: '6L6GC', connection: 'ultralinear' }));
    const st = store.getState();
    const rival = st.outputRivalBench;
    if (!rival?.ok || rival.pair !== 'push-pull' || st.outputBench.pair !== 'push-pull') throw new Error('no rival pair');
    const theirs = settledCathodeBias(rival.analysis.solution);
    if (!theirs.ok) throw new Error(theirs.message);
    const row = compareCells(st.outputBench, rival).find((c) => c.key === 'settled')!;
    expect(row.a).toBe(`${r.full.power.toPrecision(3)} W`);
    expect(row.b).toBe(`${theirs.full.power.toPrecision(3)} W`);
    // Each type's strong pair against its own rating, side by side.
    const spreadRow = compareCells(st.outputBench, rival).find((c) => c.key === 'spread-pa')!;
    const strong = (a: typeof rival.analysis) => `${((100 * a.spread!.strongest.pa) / a.solution.tube.ratings.maxPlateDissipation).toFixed(0)} %`;
    expect(spreadRow.a).toBe(strong(st.outputBench.settled));
    expect(spreadRow.b).toBe(strong(rival.analysis));

    act(() => { store.getState().setOutputBias('fixed'); });
    const fixed = store.getState();
    if (fixed.outputBench.pair === 'push-pull' && fixed.outputRivalBench?.ok && fixed.outputRivalBench.pair === 'push-pull') {
      expect(compareCells(fixed.outputBench, fixed.outputRivalBench).some((c) => c.key.startsWith('settled') || c.key === 'spread-pa')).toBe(false);
    } else throw new Error('no pairs under fixed bias');
    expect(figures.queryByText((_, el) => el?.getAttribute('data-figure') === 'settled-vk')).toBeNull();
    expect(cardSections(store.getState()).flatMap((c) => c.lines).some((l) => l.startsWith('The shared Rk settles'))).toBe(false);
  });
});
