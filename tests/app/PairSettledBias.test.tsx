import { render, screen, within } from '@testing-library/react';
import { act } from 'react';
import { describe, expect, it } from 'vitest';
import { App } from '../../app/App';
import { cardSections } from '../../app/export/buildCard';
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

    act(() => { store.getState().setOutputBias('fixed'); });
    expect(figures.queryByText((_, el) => el?.getAttribute('data-figure') === 'settled-vk')).toBeNull();
    expect(cardSections(store.getState()).flatMap((c) => c.lines).some((l) => l.startsWith('The shared Rk settles'))).toBe(false);
  });
});
