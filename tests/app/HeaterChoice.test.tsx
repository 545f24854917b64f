import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { act } from 'react';
import { describe, expect, it } from 'vitest';
import { App } from '../../app/App';
import { cardSections } from '../../app/export/buildCard';
import { readDesignFile, writeDesignFile } from '../../app/keep/designFile';
import { DEFAULT_HEATERS } from '../../app/store/heaterChoice';
import { createWorkbenchStore } from '../../app/store/workbenchStore';

const cardLines = (store: ReturnType<typeof createWorkbenchStore>, heading: string) => cardSections(store.getState()).find((s) => s.heading === heading)?.lines ?? [];

// Heater figures: 12AX7 and 12AU7 6.3 V 0.3 A in parallel wiring (Tung-Sol data sheets); EL34 6.3 V 1.5 A (from memory);
// 5AR4 5 V 1.9 A (from memory; the rectifier record's own figures).
describe('how the small tubes are lit: one choice for the build sheet, the supply\'s windings and the card', () => {
  it('on the AC winding the voltage stages share the output tube\'s 6.3 V winding and need no dropper; from DC they leave it for a DC supply with its dropper', async () => {
    const store = createWorkbenchStore();
    const user = userEvent.setup();
    render(<App store={store} />);
    const sheet = within(screen.getByRole('region', { name: 'Build sheet' }));
    const windings = () => screen.getByTestId('heater-windings').textContent;
    expect(store.getState().design.heaters).toEqual(DEFAULT_HEATERS);
    expect(sheet.getByTestId('heater-totals').textContent).toBe('From the heater winding: 6.3 V, 0.6 A, 3.78 W for the voltage stages (the winding, with the output tubes on it, is listed with the B+ supply).');
    expect(sheet.queryByTestId('dropper')).toBeNull();
    // 0.3 + 0.3 + 1.5 A on one winding.
    expect(windings()).toMatch(/^6\.3 V, 2\.1 A \(13\.2 VA\): 12AX7 .*12AU7 .*EL34/);
    expect(cardLines(store, 'Heaters').join('\n')).toContain('Winding 6.3 V, 2.1 A (13.2 VA): 12AX7');

    await user.selectOptions(sheet.getByLabelText(/heaters run/), 'dc');
    expect(store.getState().design.heaters.voltageStages).toBe('dc');
    expect(sheet.getByTestId('heater-totals').textContent).toBe('From the DC heater supply: 6.3 V, 0.6 A, 3.78 W for the voltage stages.');
    // The dropper by Ohm's law: (12.6 − 6.3) V / 0.6 A = 10.5 Ω.
    expect(sheet.getByTestId('dropper').textContent).toMatch(/^Dropping resistor 10.5 Ω exactly, order 11 Ω/);
    // The winding now lights the EL34 alone (1.5 A, 9.45 VA); the DC supply the two small tubes.
    expect(windings()).toMatch(/^6\.3 V, 1\.5 A \(9\.45 VA\): EL34 \(6\.3 V, 1\.5 A\)DC heater supply 12\.6 V, 0\.6 A at the heaters: 12AX7 \(6\.3 V, 0\.3 A\), 12AU7 \(6\.3 V, 0\.3 A\)\./);
    expect(cardLines(store, 'Heaters')).toEqual(expect.arrayContaining(['Winding 6.3 V, 1.5 A (9.45 VA): EL34 (6.3 V, 1.5 A)', 'DC heater supply 12.6 V, 0.6 A: 12AX7 (6.3 V, 0.3 A), 12AU7 (6.3 V, 0.3 A)']));
    expect(cardLines(store, 'Parts to order')).toContain('Heater dropper 11 Ω 10 W from the 12.6 V DC supply');

    // Stereo: each channel's heaters have their dropper (sized for that channel's 0.6 A); the DC supply delivers both channels' 1.2 A.
    act(() => store.getState().setSupply({ channels: 2 }));
    expect(sheet.getByTestId('dropper').textContent).toMatch(/^Dropping resistor 10.5 Ω exactly, order 11 Ω \(10 W\), one for each channel: /);
    expect(sheet.getByTestId('heater-totals').textContent).toBe('From the DC heater supply: 6.3 V, 0.6 A, 3.78 W for the voltage stages of each channel.');
    expect(windings()).toContain('DC heater supply 12.6 V, 1.2 A at the heaters: 2 × 12AX7');
    expect(cardLines(store, 'Parts to order')).toContain('Heater dropper 11 Ω 10 W from the 12.6 V DC supply, one for each channel (2)');
    act(() => store.getState().undo());
    expect(store.getState().design.supply.channels).toBe(1);

    // The choice is a step of the design: undone like any other.
    act(() => store.getState().undo());
    expect(store.getState().design.heaters.voltageStages).toBe('ac');
    expect(sheet.queryByTestId('dropper')).toBeNull();
    expect(cardLines(store, 'Parts to order').some((l) => l.startsWith('Heater dropper'))).toBe(false);
  });

  it('a DC supply typed out of range is refused beside its box and the last good one stays; wiring and supply are kept in the design file', async () => {
    const store = createWorkbenchStore();
    const user = userEvent.setup();
    render(<App store={store} />);
    const sheet = within(screen.getByRole('region', { name: 'Build sheet' }));
    await user.selectOptions(sheet.getByLabelText(/heaters run/), 'dc');
    const box = sheet.getByLabelText(/^DC heater supply/);
    await user.clear(box);
    await user.type(box, '24');
    expect(store.getState().design.heaters.dcVolts).toBe(24);
    await user.clear(box);
    await user.type(box, '0');
    expect(sheet.getByText('must be a number from 0.5 to 500 V')).toBeTruthy();
    expect(store.getState().design.heaters.dcVolts).toBe(24);
    expect((box as HTMLInputElement).value).toBe('0');
    // The 12AX7 wired for 12.6 V (its heater's series connection, 0.15 A: Tung-Sol 12AX7).
    await user.selectOptions(sheet.getByLabelText(/^12AX7: 1 envelope/), 'series');
    expect(store.getState().design.heaters.wiring).toEqual({ '12AX7': 'series' });

    const back = readDesignFile(writeDesignFile({ title: 't', design: store.getState().design }));
    if (!back.ok) throw new Error(back.message);
    expect(back.doc.design.heaters).toEqual({ voltageStages: 'dc', dcVolts: 24, wiring: { '12AX7': 'series' } });
    const old = JSON.parse(writeDesignFile({ title: 't', design: store.getState().design }));
    delete old.design.heaters;
    const before = readDesignFile(JSON.stringify(old));
    expect(before.ok && before.doc.design.heaters).toEqual(DEFAULT_HEATERS);
    old.design.heaters = { voltageStages: 'mains', dcVolts: 12.6, wiring: {} };
    expect(readDesignFile(JSON.stringify(old))).toEqual({ ok: false, message: 'design.heaters.voltageStages must be one of ac, dc (found "mains"). Nothing was opened.' });
    old.design.heaters = { voltageStages: 'dc', dcVolts: 0, wiring: {} };
    expect(readDesignFile(JSON.stringify(old))).toEqual({ ok: false, message: 'design.heaters.dcVolts must be a number from 0.5 to 500 V (found 0). Nothing was opened.' });
    old.design.heaters = { voltageStages: 'dc', dcVolts: 12.6, wiring: { '12AX7': 7 } };
    expect(readDesignFile(JSON.stringify(old))).toMatchObject({ ok: false, message: expect.stringMatching(/^design\.heaters\.wiring\.12AX7 must name a heater wiring .*\(found 7\)/) });
  });

  it('the tubes to order count every channel\'s envelopes, the output tubes and a rectifier tube', () => {
    const store = createWorkbenchStore();
    render(<App store={store} />);
    const line = () => screen.getAllByTestId('tubes-to-order')[0]!.textContent;
    expect(line()).toBe('Tubes: 1 × 12AX7 (1 of 2 sections used), 1 × 12AU7 (1 of 2 sections used), 1 × EL34');
    act(() => store.getState().setSupply({ channels: 2, rectifier: { kind: 'tube', tubeId: '5AR4' } }));
    act(() => store.getState().setOutputPair('push-pull'));
    expect(store.getState().design.output.pair).toBe('push-pull');
    // Two channels of a push-pull pair: four EL34; the splitter's 12AU7 shares nothing with the driver's (one section each per channel here).
    expect(line()).toMatch(/^Tubes: .*4 × EL34, 1 × 5AR4$/);
    // On the card once, whichever bench it is made from: no stage's section repeats it.
    const everyLine = () => cardSections(store.getState()).flatMap((c) => c.lines);
    expect(cardLines(store, 'Tubes to order')).toEqual([line()]);
    expect(everyLine().filter((l) => l.startsWith('Tubes: '))).toHaveLength(1);
    act(() => store.getState().setStageKind('output'));
    expect(cardLines(store, 'Tubes to order')).toEqual([line()]);
    expect(everyLine().filter((l) => l.startsWith('Tubes: '))).toHaveLength(1);
  });
});
