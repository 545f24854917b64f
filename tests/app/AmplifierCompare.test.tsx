import { act, render, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { App } from '../../app/App';
import { analyzeAmplifier } from '../../app/store/amplifierChain';
import { cardSections } from '../../app/export/buildCard';
import { benchIndex } from '../../app/store/stagePlans';
import { createWorkbenchStore } from '../../app/store/workbenchStore';

describe('a tube swap judged in the whole amplifier', () => {
  it('shows the amplifier with each tube in the bench\'s socket: the gain the swap adds is the bench stage\'s own ratio', () => {
    const store = createWorkbenchStore();
    const view = render(<App store={store} />);
    act(() => store.getState().setRival({ on: true, tubeId: '12AT7' }));
    const s = store.getState();
    const first = s.amplifier!;
    const second = s.rivalAmplifier!;
    if (!first.result.ok || !second.result.ok) throw new Error('both amplifiers solve');
    // The same design with only the bench's tube swapped, solved apart.
    const apart = analyzeAmplifier({ ...s.design, tubeId: '12AT7' }, s.registry)!;
    if (!apart.result.ok) throw new Error(apart.result.message);
    expect(second.result.gain).toBeCloseTo(apart.result.gain, 9);
    // A chain's midband gain is the product of its stages' gains (each into the load the next presents): swapping
    // one stage's tube scales it by that stage's ratio; the stages around it see the same loads (common practice).
    const bench = benchIndex(s.design);
    const ratio = second.result.stages[bench]!.gain / first.result.stages[bench]!.gain;
    expect(second.result.gain / first.result.gain).toBeCloseTo(ratio, 6);
    expect(Math.abs(ratio)).toBeGreaterThan(2);
    const table = within(view.container.querySelector('.amplifier-compare') as HTMLElement);
    expect(table.getByText(/^The whole amplifier, each tube in Stage 2/)).toBeTruthy();
    const cells = [...view.container.querySelectorAll('tr[data-row="amp-gain"] td')].map((td) => td.textContent);
    expect(cells).toEqual([`${Number(Math.abs(first.result.gain).toPrecision(3))} × (${(20 * Math.log10(Math.abs(first.result.gain))).toFixed(1)} dB)`, `${Number(Math.abs(second.result.gain).toPrecision(3))} × (${(20 * Math.log10(Math.abs(second.result.gain))).toFixed(1)} dB)`]);
    // More gain ahead of the output stage: less input for the same clean power.
    expect(second.result.input.rms).toBeLessThan(first.result.input.rms);
    // And on the build card, beside the stage's own rows.
    const compared = cardSections(store.getState()).find((x) => x.heading.startsWith('Compared:'))!;
    expect(compared.lines).toContainEqual(`In the amplifier, gain: ${cells[0]}  |  ${cells[1]}`);
    // Not compared: no second amplifier.
    act(() => store.getState().setRival({ on: false }));
    expect(store.getState().rivalAmplifier).toBeNull();
    expect(view.container.querySelector('.amplifier-compare')).toBeNull();
  });
});

describe('a tube swap in an amplifier with global feedback', () => {
  it('the loop evens out the swap: the open loop\'s gain triples with a 12AT7, the closed loop\'s moves far less, and the row says so on screen and card', () => {
    const store = createWorkbenchStore();
    const view = render(<App store={store} />);
    act(() => store.getState().commit({ ...store.getState().design, feedbackRf: 47e3 }));
    act(() => store.getState().setRival({ on: true, tubeId: '12AT7' }));
    const s = store.getState();
    const [a, b] = [s.amplifier!.feedback, s.rivalAmplifier!.feedback];
    if (!a?.ok || !b?.ok) throw new Error('both loops solve');
    // Closed-loop gain G/(1 + T) with T ∝ G: as the loop gain grows, the closed gain tends to 1/β (common practice).
    expect(b.openGain / a.openGain).toBeGreaterThan(2);
    expect(b.closedGain / a.closedGain).toBeLessThan(1.5);
    const cells = [...view.container.querySelectorAll('tr[data-row="amp-feedback"] td')].map((td) => td.textContent);
    expect(cells[0]).toMatch(new RegExp(`^${a.feedbackDb.toFixed(1)} dB: gain ${Number(a.closedGain.toPrecision(3))}×, damping factor`));
    expect(cells[1]).toMatch(new RegExp(`^${b.feedbackDb.toFixed(1)} dB: gain ${Number(b.closedGain.toPrecision(3))}×`));
    const compared = cardSections(store.getState()).find((x) => x.heading.startsWith('Compared:'))!;
    expect(compared.lines).toContainEqual(`In the amplifier, with feedback: ${cells[0]}  |  ${cells[1]}`);
  });
});
