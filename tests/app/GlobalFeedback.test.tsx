import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { act } from 'react';
import { describe, expect, it } from 'vitest';
import { App } from '../../app/App';
import { cardSections } from '../../app/export/buildCard';
import { readDesignFile, writeDesignFile } from '../../app/keep/designFile';
import { createWorkbenchStore } from '../../app/store/workbenchStore';
import { globalFeedback } from '../../src/index';

// The figures are the model's (globalFeedback, checked against ngspice in tests/spice/globalFeedback.spice.test.ts);
// here: that the bench shows them, keeps the resistor in the design and refuses what the model cannot use.
describe('global negative feedback on the bench', () => {
  it('typing Rf shows the closed loop under the amplifier\'s figures, labels the others open loop, lists Rf to order, and undo takes it off', async () => {
    const store = createWorkbenchStore();
    const user = userEvent.setup();
    render(<App store={store} />);
    const strip = within(screen.getByTestId('global-feedback'));
    expect(screen.queryByTestId('feedback-figures')).toBeNull();
    const box = strip.getByLabelText(/^Feedback Rf/);
    expect((box as HTMLInputElement).value).toBe('none');
    await user.clear(box);
    await user.type(box, '47k');
    act(() => { store.getState().settleAnalysis(); store.getState().settleField('feedbackRf'); });
    expect(store.getState().design.feedbackRf).toBe(47e3);
    const view = store.getState().amplifier!;
    const model = globalFeedback(view.input, 47e3);
    if (!model.ok) throw new Error(model.message);
    const text = screen.getByTestId('feedback-figures').textContent!;
    // The value is in the words too (on paper the box is not).
    expect(text).toMatch(/^With feedback \(Rf 47 kΩ\): /);
    expect(text).toContain(`${model.feedbackDb.toFixed(1)} dB of feedback`);
    expect(text).toContain(`damping factor ${Number(model.dampingFactor.toPrecision(3))}`);
    expect(text).toMatch(/not modelled: check with a square wave/);
    // The closed loop's noise: at the speaker lower than the open loop's by about the feedback (the loop cuts the noise its
    // stages make with their gain), referred to the input about the same.
    const closedNoise = /noise ([\d.]+) µV rms at the speaker, [\d.]+ µV A-weighted \(\d+ dB and \d+ dB\(A\) below 1 W into 8 Ω\); ([\d.]+) µV at the input/.exec(text);
    const openNoise = /Noise, open loop([\d.]+) µV rms at the speaker/.exec(screen.getByTestId('amplifier-figures').textContent!);
    if (!closedNoise || !openNoise) throw new Error(`no noise in “${text}”`);
    expect(20 * Math.log10(Number(openNoise[1]) / Number(closedNoise[1]))).toBeCloseTo(model.feedbackDb, 0);
    expect(screen.getByTestId('amplifier-figures').textContent).toMatch(/^Gain, open loop/);
    // The drawing carries it: round under the stages from the secondary to stage 1's cathode, its value editable there.
    expect(screen.getByRole('button', { name: /^Global feedback Rf .*47 kΩ/ })).toBeTruthy();
    // Joule's law at the clean limit: (8.1 V)² / 47 kΩ ≈ 1.4 mW, twice that rounded up to the smallest stocked rating.
    expect(screen.getByTestId('feedback-part').textContent).toMatch(/^Rf \(global feedback, speaker to stage 1's cathode\): 47 kΩ, 0\.125 W \(runs at 0\.001\d+ W/);
    const amp = cardSections(store.getState()).find((c) => c.heading === 'Amplifier')!.lines;
    expect(amp.some((l) => l.startsWith('Open loop: Gain'))).toBe(true);
    expect(amp.some((l) => l.startsWith('Global feedback, Rf 47 kΩ from the speaker to stage 1\'s cathode: '))).toBe(true);
    expect(cardSections(store.getState()).find((c) => c.heading === 'Parts to order')!.lines.some((l) => l.startsWith('Rf (global feedback'))).toBe(true);
    // Kept in the design file; a file from before it opens with none.
    const back = readDesignFile(writeDesignFile({ title: 't', design: store.getState().design }));
    expect(back.ok && back.doc.design.feedbackRf).toBe(47e3);
    const old = JSON.parse(writeDesignFile({ title: 't', design: store.getState().design }));
    delete old.design.feedbackRf;
    const before = readDesignFile(JSON.stringify(old));
    expect(before.ok && before.doc.design.feedbackRf).toBe(null);
    old.design.feedbackRf = 5;
    expect(readDesignFile(JSON.stringify(old))).toEqual({ ok: false, message: 'design.feedbackRf must be a number from 100 to 10000000 Ω (found 5). Nothing was opened.' });
    // Undo: typing it was a step.
    act(() => store.getState().undo());
    expect(store.getState().design.feedbackRf).toBe(null);
    expect(screen.queryByTestId('feedback-figures')).toBeNull();
    expect(screen.queryByRole('button', { name: /^Global feedback Rf/ })).toBeNull();
  });

  it('a value out of range gets its message beside the box and the last good one stays; a bypassed first cathode is said to have nothing to return to', async () => {
    const store = createWorkbenchStore();
    const user = userEvent.setup();
    render(<App store={store} />);
    const box = within(screen.getByTestId('global-feedback')).getByLabelText(/^Feedback Rf/);
    await user.clear(box);
    await user.type(box, '10');
    expect(screen.getByText('Feedback resistor must be at least 100 Ω')).toBeTruthy();
    expect(store.getState().design.feedbackRf).toBe(null);
    await user.clear(box);
    await user.type(box, '47k');
    act(() => { store.getState().settleAnalysis(); store.getState().settleField('feedbackRf'); });
    // Stage 1 bypassed: Ck would short the feedback.
    act(() => store.getState().showStage(0));
    act(() => store.getState().setBypassed(true));
    expect(screen.getByTestId('feedback-figures').textContent).toMatch(/^The feedback needs an unbypassed cathode resistor in the first stage/);
  });
});
