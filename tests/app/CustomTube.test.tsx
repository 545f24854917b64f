import { fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import { act } from 'react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { App } from '../../app/App';
import { createWorkbenchStore } from '../../app/store/workbenchStore';
import { korenPublishedSets, plateCurrent, triode } from '../../src/index';

/** Points read off a "curve sheet": here made from Koren's published 12AU7 set, in mA as a sheet is read. */
function sheetCsv(): string {
  const m = triode(korenPublishedSets['12AU7']!);
  const lines = ['Va, Vg, Ia'];
  for (const vg of [0, -4, -8, -12]) for (const va of [60, 120, 180, 240, 300]) {
    const ia = plateCurrent(m, va, vg) * 1e3;
    if (ia > 0.05) lines.push(`${va}, ${vg}, ${ia.toFixed(3)}`);
  }
  return lines.join('\n');
}

describe('a tube of your own', () => {
  it('pastes points, fits, shows the fit, refuses a library name, saves, and is usable in a design and a comparison', async () => {
    const store = createWorkbenchStore();
    const user = userEvent.setup();
    render(<App store={store} />);
    const panel = within(screen.getByRole('region', { name: 'A tube of your own' }));
    const csv = panel.getByRole('textbox', { name: /^Points, one per line/ });
    await user.clear(csv);
    await user.click(csv);
    await user.paste(`${sheetCsv()}\n300, -4\n`);
    await user.click(panel.getByRole('button', { name: 'Fit the model' }));
    await waitFor(() => expect(panel.getByTestId('fit-summary')).toBeTruthy());
    const badLine = sheetCsv().split('\n').length + 1; // the line after the sheet's points
    expect(panel.getByRole('alert').textContent).toBe(`Line ${badLine}: expected 3 numbers (Va V, Vg V, Ia mA), found 2`);
    expect(panel.getByTestId('fit-summary').textContent).toMatch(/RMS error 0\.\d\d %/);
    const f = store.getState().custom.fit;
    expect(f?.ok && f.params.mu).toBeCloseTo(21.5, 0);
    // The fitted curves are drawn over every point read: a dot each, in one path.
    const cloud = panel.getByRole('img', { name: /fitted model's plate curves/ }).querySelector('path[data-dots="your-points"]');
    expect(cloud?.getAttribute('d')?.match(/M/g)).toHaveLength(store.getState().custom.points.length);
    expect(store.getState().custom.points.length).toBeGreaterThan(15);

    await user.type(panel.getByRole('textbox', { name: 'Name' }), '12AU7');
    await user.click(panel.getByRole('button', { name: 'Save as my tube' }));
    expect(panel.getByRole('status').textContent).toBe('“12AU7” is a library tube; choose another name');
    await user.clear(panel.getByRole('textbox', { name: 'Name' }));
    await user.type(panel.getByRole('textbox', { name: 'Name' }), 'Bench 12AU7 no. 3');
    await user.click(panel.getByRole('button', { name: 'Save as my tube' }));

    await user.click(screen.getByRole('radio', { name: /^Bench 12AU7 no\. 3 · yours/ }));
    expect(store.getState().design.tubeId).toBe('Bench 12AU7 no. 3');
    expect(store.getState().analysis.tube.userMade).toBe(true);
    store.getState().setRival({ on: true, tubeId: '12AU7' });
    const rival = store.getState().rivalAnalysis;
    expect(rival && 'solution' in rival && Math.abs(rival.solution.op.ia / store.getState().analysis.solution.op.ia - 1)).toBeLessThan(0.02);

    const exported = store.getState().exportCustomTubes();
    expect(JSON.parse(exported)).toMatchObject({ format: 'quiescent-tubes', version: 1, tubes: [{ name: 'Bench 12AU7 no. 3' }] });
    store.getState().removeCustom('Bench 12AU7 no. 3');
    await store.getState().importCustomTubes(exported);
    expect(store.getState().tubes.some((t) => t.id === 'Bench 12AU7 no. 3' && t.userMade)).toBe(true);
    await store.getState().importCustomTubes('{"format":"quiescent-tubes","version":1,"tubes":[{"name":"EL34-T"}]}');
    expect(store.getState().custom.note).toBe('Nothing imported: Tube 1: “EL34-T” is a library tube; choose another name');
  });

  it('points all on one grid voltage get a specific message', async () => {
    const store = createWorkbenchStore();
    store.getState().setCustomCsv('100,-2,1\n150,-2,2\n200,-2,3\n250,-2,4\n300,-2,5');
    await store.getState().fitCustom();
    expect(store.getState().custom.fit).toEqual({ ok: false, reason: 'invalid-input', message: 'All the points are on one grid voltage (-2 V): give points from at least two plate curves so mu can be found' });
  });
});

describe('a tube of your own from typical figures alone', () => {
  it('fits to the datasheet figures (Tung-Sol 12AU7, 1962, p.2) and keeps heater and capacitances', async () => {
    const store = createWorkbenchStore();
    store.getState().setCustomCsv('');
    store.getState().setTypicalCsv('100, 0, 11.8, 20, 6500, 3.1\n250, -8.5, 10.5, 17, 7700, 2.2');
    await store.getState().fitCustom();
    const f = store.getState().custom.fit;
    expect(f?.ok).toBe(true);
    if (f?.ok) expect(f.rmsPercent).toBeLessThan(5);
    store.getState().saveCustom('My ECC82', { maxPlateVoltage: 300, maxPlateDissipation: 2.75, maxHeaterCathodeVoltage: 200 }, { heater: { volts: 6.3, amps: 0.3 }, caps: { cgk: 1.6e-12, cgp: 1.5e-12, cpk: 0.4e-12 } });
    store.getState().chooseTube('My ECC82');
    const tube = store.getState().analysis.tube;
    expect(tube.heaters[0]).toMatchObject({ volts: 6.3, amps: 0.3 });
    expect(tube.capacitances.cgp).toBe(1.5e-12);
    expect(tube.typical).toHaveLength(2);
    expect(store.getState().analysis.solution.cin).toBeGreaterThan(0); // Miller input capacitance from the given Cgp
  });
});

describe('the points box has a size', () => {
  it('refuses a paste past its size with a message and keeps what it had; a full box says a paste was cut', async () => {
    const { MAX_POINTS_TEXT } = await import('../../app/store/customSlice');
    const store = createWorkbenchStore();
    store.getState().setCustomCsv('100, 0, 5');
    store.getState().setCustomCsv('1'.repeat(MAX_POINTS_TEXT + 1));
    expect(store.getState().custom.csv).toBe('100, 0, 5');
    expect(store.getState().custom.note).toMatch(/^The points box holds at most 400,000 characters/);
    store.getState().setCustomCsv('1'.repeat(MAX_POINTS_TEXT));
    expect(store.getState().custom.note).toMatch(/^The points box is full .* a longer paste was cut there/);
  });

  it('a paste of 100,000 lines into the box keeps the whole lines that fit, at the cursor, and says how many it left out', async () => {
    const { MAX_POINTS_TEXT } = await import('../../app/store/customSlice');
    const store = createWorkbenchStore();
    render(<App store={store} />);
    act(() => store.getState().setCustomCsv('# mine\n'));
    const box = document.querySelector<HTMLTextAreaElement>('.custom-tube textarea')!;
    const line = '250, -4, 3.25\n';
    const huge = line.repeat(100_000);
    box.setSelectionRange(7, 7);
    act(() => {
      fireEvent.paste(box, { clipboardData: { getData: () => huge } });
    });
    const held = store.getState().custom.csv;
    expect(held.length).toBeLessThanOrEqual(MAX_POINTS_TEXT);
    expect(held.startsWith('# mine\n250, -4, 3.25\n')).toBe(true);
    expect(held.endsWith('3.25\n')).toBe(true);
    const kept = Math.floor((MAX_POINTS_TEXT - 7) / line.length);
    expect(store.getState().custom.note).toBe(`The paste had 100,000 lines (${huge.length.toLocaleString('en')} characters); the points box holds 400,000 characters (about 10,000 points), so the first ${kept.toLocaleString('en')} lines were kept. Thin the points or fit them in parts.`);
    // So large a set is shown as its first lines, read-only, with its count; all of it is kept for the fit.
    const preview = document.querySelector<HTMLTextAreaElement>('.custom-tube textarea')!;
    expect(preview.readOnly).toBe(true);
    expect(preview.value.length).toBeLessThan(2000);
    expect(screen.getByText(/^28,571 lines \(399,987 characters\): too many to edit here, all kept for the fit/)).toBeTruthy();
    act(() => fireEvent.click(screen.getByRole('button', { name: 'Clear the points' })));
    expect(store.getState().custom.csv).toBe('');
    expect(document.querySelector<HTMLTextAreaElement>('.custom-tube textarea')!.readOnly).toBe(false);
    // A paste that fits goes in whole, where the cursor is.
    act(() => store.getState().setCustomCsv('# mine\n'));
    act(() => store.getState().pastePoints('100, 0, 5\n', 0, 0));
    expect(store.getState().custom.csv).toBe('100, 0, 5\n# mine\n');
  });
});
