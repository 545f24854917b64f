import { render, screen } from '@testing-library/react';
import { act } from 'react';
import { describe, expect, it } from 'vitest';
import { App } from '../../app/App';
import { cardSections } from '../../app/export/buildCard';
import { readDesignFile, writeDesignFile } from '../../app/keep/designFile';
import { benchFindings } from '../../app/store/amplifierFindings';
import { createWorkbenchStore } from '../../app/store/workbenchStore';
import { globalFeedback } from '../../src/index';

// The loop's band and margins are the model's (feedbackBand, checked against ngspice in
// tests/spice/feedbackBand.spice.test.ts); here: that the bench takes the transformer's inductances as design values,
// shows the loop's band and verdict, lists an unsafe loop with the ratings and carries it all to the card and the file.
function typed(store: ReturnType<typeof createWorkbenchStore>, field: Parameters<ReturnType<ReturnType<typeof createWorkbenchStore>['getState']>['editField']>[0], text: string) {
  act(() => {
    store.getState().editField(field, text);
    store.getState().settleAnalysis();
    store.getState().settleField(field);
  });
}

describe('the feedback loop across the band', () => {
  it('with the transformer\'s inductances: the closed loop\'s band, the margins and a verdict; the ratings list warns of thin margins and a danger when it would oscillate', () => {
    const store = createWorkbenchStore();
    render(<App store={store} />);
    typed(store, 'feedbackRf', '47k');
    // Without the inductances the transformer is ideal, and the words say so.
    expect(screen.getByTestId('feedback-band').textContent).toMatch(/The output transformer is taken as ideal/);
    typed(store, 'oLp', '15');
    typed(store, 'oLl', '8m');
    expect(store.getState().design.output.primaryInductance).toBe(15);
    expect(store.getState().design.output.leakageInductance).toBe(8e-3);
    const model = globalFeedback(store.getState().amplifier!.input, 47e3);
    if (!model.ok) throw new Error(model.message);
    const words = screen.getByTestId('feedback-band').textContent!;
    expect(words).toMatch(/^Closed loop −3 dB at .* and .* \(against 1 kHz\)/);
    expect(words).toContain(`high end ${Number(model.band.high!.phaseMarginDeg.toPrecision(2))}°`);
    expect(words).toContain('With primary 15 H and leakage 8 mH.');
    const verdict = model.band.verdict;
    expect(screen.getByTestId('feedback-band').className).toContain(`verdict-${verdict}`);
    // What a scope would show: a 100 Hz and a 10 kHz square wave, closed loop and open.
    const scope = screen.getByTestId('loop-square-waves');
    expect(Array.from(scope.querySelectorAll('figcaption'), (c) => c.textContent)).toEqual([
      '100 Hz square wave at the speaker: closed loop solid, open loop dashed',
      '10 kHz square wave at the speaker: closed loop solid, open loop dashed',
    ]);
    const tagged = benchFindings(store.getState()).filter((f) => f.stageName === 'Global feedback');
    expect(tagged.map((f) => f.severity)).toEqual(verdict === 'stable' ? [] : verdict === 'marginal' ? ['warning'] : ['danger']);
    // Much more feedback: the loop would oscillate; the words stop quoting a band and the ratings list carries a danger.
    typed(store, 'feedbackRf', '3k3');
    expect(screen.getByTestId('feedback-band').textContent).toMatch(/^Unstable: the loop will oscillate\./);
    expect(screen.queryByTestId('loop-square-waves')).toBeNull();
    const danger = benchFindings(store.getState()).find((f) => f.stageName === 'Global feedback');
    expect(danger?.severity).toBe('danger');
    expect(danger?.message).toMatch(/Do not switch on with the loop closed\.$/);
    // The card: the band in the amplifier's section, the danger with the ratings, the inductances with the transformer.
    const card = cardSections(store.getState());
    expect(card.find((c) => c.heading === 'Amplifier')!.lines.some((l) => l.startsWith('Unstable: the loop will oscillate.'))).toBe(true);
    expect(card.flatMap((c) => c.lines).some((l) => l.includes('The loop is unstable'))).toBe(true);
    expect(card.flatMap((c) => c.lines)).toContain('Primary inductance at least 15 H at its DC current, leakage inductance at most 8 mH (the band and the feedback\'s margins were worked out with these).');
  });

  it('a phase-lead capacitor across Rf: a design value beside Rf, in the loop\'s margins, the drawing, the parts and the file; one acting inside the band is refused beside its box', () => {
    const store = createWorkbenchStore();
    render(<App store={store} />);
    typed(store, 'oLp', '15');
    typed(store, 'oLl', '8m');
    typed(store, 'feedbackRf', '22k');
    const without = store.getState().amplifier!.feedback;
    typed(store, 'feedbackCf', '22p');
    expect(store.getState().design.feedbackCf).toBe(22e-12);
    const withLead = store.getState().amplifier!.feedback;
    if (!without?.ok || !withLead?.ok) throw new Error('no loop');
    // The model's own figures (checked against ngspice): here, that the bench asked for them with the capacitor.
    expect(withLead.band.high!.phaseMarginDeg).toBeGreaterThan(without.band.high!.phaseMarginDeg + 20);
    expect(screen.getByTestId('feedback-figures').textContent).toMatch(/^With feedback \(Rf 22 kΩ ∥ 22 pF\): /);
    expect(screen.getByRole('button', { name: /^Global feedback Cf .*22 pF/ })).toBeTruthy();
    expect(screen.getByTestId('feedback-part').textContent).toMatch(/; Cf across it 22 pF, \d+ V$/);
    const back = readDesignFile(writeDesignFile({ title: 't', design: store.getState().design }));
    expect(back.ok && back.doc.design.feedbackCf).toBe(22e-12);
    // 1 nF with 22 kΩ turns at 7.2 kHz, inside the band: refused beside the box, the 22 pF kept.
    act(() => store.getState().editField('feedbackCf', '1n'));
    expect(store.getState().errors.feedbackCf).toMatch(/^The capacitor across Rf turns the feedback at 7\.23 kHz with Rf, inside the audio band/);
    expect(store.getState().design.feedbackCf).toBe(22e-12);
  });

  it('refuses a leakage not well below the primary beside its box, keeping the last good value; the file keeps both and an older file opens ideal', () => {
    const store = createWorkbenchStore();
    render(<App store={store} />);
    typed(store, 'oLp', '15');
    typed(store, 'oLl', '8m');
    // 8 H typed for 8 mH: the model refuses it, the design keeps 8 mH.
    act(() => store.getState().editField('oLl', '8'));
    expect(store.getState().errors.oLl).toMatch(/leakage inductance must be well below the primary inductance/);
    expect(store.getState().design.output.leakageInductance).toBe(8e-3);
    act(() => store.getState().editField('oLp', '0.01'));
    expect(store.getState().errors.oLp).toBe('Primary inductance must be at least 100 mH');
    const written = writeDesignFile({ title: 't', design: store.getState().design });
    const back = readDesignFile(written);
    expect(back.ok && [back.doc.design.output.primaryInductance, back.doc.design.output.leakageInductance]).toEqual([15, 8e-3]);
    const old = JSON.parse(written);
    delete old.design.output.primaryInductance;
    delete old.design.output.leakageInductance;
    const before = readDesignFile(JSON.stringify(old));
    expect(before.ok && (before.doc.design.output.primaryInductance ?? null)).toBe(null);
    old.design.output.leakageInductance = 50;
    expect(readDesignFile(JSON.stringify(old))).toMatchObject({ ok: false, message: expect.stringMatching(/^design\.output\.leakageInductance must be/) });
    // Undo steps back through the typed values.
    act(() => store.getState().undo());
    expect(store.getState().design.output.leakageInductance ?? null).toBe(null);
  });
});
