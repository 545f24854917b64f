import { fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import { act } from 'react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { COALESCE_MS } from '../../app/store/historySlice';
import { App } from '../../app/App';
import { cardSections } from '../../app/export/buildCard';
import { readDesignFile, writeDesignFile } from '../../app/keep/designFile';
import { createWorkbenchStore } from '../../app/store/workbenchStore';

const typeInto = (box: HTMLElement, text: string) => act(() => void fireEvent.change(box, { target: { value: text } }));

describe('your meter readings, stage by stage', () => {
  afterEach(() => void vi.useRealTimers());

  it('reads a stage from its plate and cathode, says where its tube sits, and keeps the reading through undo, files and a tube swapped back', async () => {
    // The clock alone is the test's, so undo steps can be told apart (changes within COALESCE_MS merge).
    vi.useFakeTimers({ toFake: ['Date'] });
    const store = createWorkbenchStore();
    render(<App store={store} />);
    // The demo: stage 1 a 12AX7, stage 2 a 12AU7 on Rk 1.2 kΩ (each a gain stage with its cathode resistor).
    const stage2 = within(screen.getByRole('group', { name: 'Meter readings, Stage 2 · 12AU7' }));
    expect(screen.getByRole('group', { name: 'Meter readings, Stage 1 · 12AX7' })).toBeTruthy();
    const plate = stage2.getByLabelText(/^Plate to chassis/);
    const cathode = stage2.getByLabelText(/^Cathode to chassis/);
    // Each box shows what the design should read there.
    expect((plate as HTMLInputElement).placeholder).toMatch(/^designed \d+(\.\d+)? V$/);
    typeInto(plate, '160');
    // Leaving the plate's box for the cathode's is not yet a reading, nor an error.
    act(() => void fireEvent.blur(plate));
    expect(stage2.queryByRole('alert')).toBeNull();
    expect(store.getState().design.readings).toBeUndefined();
    typeInto(cathode, '4.2');
    act(() => void fireEvent.keyDown(cathode, { key: 'Enter' }));
    // Ohm's law: 4.2 V across 1.2 kΩ is 3.5 mA; the tube at Vpk 155.8 V (shown as 156 V), Vgk −4.2 V.
    const readout = await stage2.findByRole('status');
    expect(readout.textContent).toMatch(/^Ia 3\.5 mA \(the cathode’s drop across Rk\), at Vpk 156 V and Vgk −4\.2 V: [\d.]+ % of a typical 12AU7’s current there, under the ±20 % spread/);
    expect(readout.textContent).toMatch(/Plate dissipation 0\.545 W, 19\.8 % of its 2\.75 W rating\.$/);
    expect(store.getState().design.readings).toEqual([{ stage: 2, tubeId: '12AU7', plate: 160, cathode: 4.2 }]);
    // Settling the same values again changes nothing: no new design, so no undo step.
    const settled = store.getState().design;
    act(() => void fireEvent.keyDown(within(screen.getByRole('group', { name: 'Meter readings, Stage 2 · 12AU7' })).getByLabelText(/^Cathode to chassis/), { key: 'Enter' }));
    expect(store.getState().design).toBe(settled);
    // On the build card, as the bench notes of the amplifier as built; none before a reading is taken.
    expect(cardSections(store.getState()).find((c) => c.heading === 'Meter readings, as built')?.lines).toEqual([expect.stringMatching(/^Stage 2 · 12AU7, read plate 160 V, cathode 4\.2 V: Ia 3\.5 mA \(the cathode’s drop across Rk\)/)]);
    expect(cardSections(createWorkbenchStore().getState()).some((c) => c.heading === 'Meter readings, as built')).toBe(false);
    // A reading past the plate's rating is a danger in the one ratings list, named as read, and so on the card.
    const hot = within(screen.getByRole('group', { name: 'Meter readings, Stage 1 · 12AX7' }));
    typeInto(hot.getByLabelText(/^Plate to chassis/), '300');
    typeInto(hot.getByLabelText(/^Cathode to chassis/), '6');
    act(() => void fireEvent.keyDown(hot.getByLabelText(/^Cathode to chassis/), { key: 'Enter' }));
    // 6 V across the demo's 1.5 kΩ is 4 mA at 294 V: 1.18 W against the 12AX7's 1 W.
    const ratings = within(screen.getByRole('region', { name: 'Ratings checks' }));
    await waitFor(() => expect(ratings.getByText(/^Stage 1 · 12AX7, as read/).closest('.finding')?.className).toMatch(/danger/));
    expect(cardSections(store.getState()).find((c) => c.heading === 'Ratings, every stage')?.lines.some((l) => /Stage 1 · 12AX7, as read.*Plate dissipation 1\.18 W is 118 % of the 1 W rating as read/.test(l))).toBe(true);
    act(() => void store.getState().setReading(1, null));
    // Kept in the file.
    const back = readDesignFile(writeDesignFile({ title: 'as built', design: store.getState().design }));
    expect(back.ok && back.doc.design.readings).toEqual([{ stage: 2, tubeId: '12AU7', plate: 160, cathode: 4.2 }]);
    // Another tube in stage 2's socket: the reading was not taken on it, so it is not shown; the 12AU7 back, it is.
    act(() => void store.getState().chooseTube('12AT7'));
    await waitFor(() => expect(screen.queryByRole('group', { name: 'Meter readings, Stage 2 · 12AU7' })).toBeNull());
    expect((within(screen.getByRole('group', { name: 'Meter readings, Stage 2 · 12AT7' })).getByLabelText(/^Plate to chassis/) as HTMLInputElement).value).toBe('');
    act(() => void store.getState().chooseTube('12AU7'));
    const again = within(await screen.findByRole('group', { name: 'Meter readings, Stage 2 · 12AU7' }));
    expect((again.getByLabelText(/^Cathode to chassis/) as HTMLInputElement).value).toBe('4.2');
    // Both boxes emptied: the reading is taken out, one undo step puts it back.
    vi.setSystemTime(Date.now() + 2 * COALESCE_MS);
    typeInto(again.getByLabelText(/^Plate to chassis/), '');
    typeInto(again.getByLabelText(/^Cathode to chassis/), '');
    act(() => void fireEvent.keyDown(again.getByLabelText(/^Cathode to chassis/), { key: 'Enter' }));
    await waitFor(() => expect(store.getState().design.readings).toBeUndefined());
    act(() => void store.getState().undo());
    await waitFor(() => expect(store.getState().design.readings).toEqual([{ stage: 2, tubeId: '12AU7', plate: 160, cathode: 4.2 }]));
  });

  it('says what is wrong beside the box: a slip, a missing half, a reading that cannot be', async () => {
    const store = createWorkbenchStore();
    render(<App store={store} />);
    const stage1 = within(screen.getByRole('group', { name: 'Meter readings, Stage 1 · 12AX7' }));
    const plate = stage1.getByLabelText(/^Plate to chassis/);
    const cathode = stage1.getByLabelText(/^Cathode to chassis/);
    typeInto(plate, '17O');
    act(() => void fireEvent.keyDown(plate, { key: 'Enter' }));
    expect(stage1.getAllByRole('alert').map((a) => a.textContent)).toEqual([expect.stringMatching(/./), 'Give the cathode’s reading too: the stage is read from both.']);
    expect(plate.getAttribute('aria-invalid')).toBe('true');
    typeInto(plate, '1.2');
    typeInto(cathode, '1.4');
    act(() => void fireEvent.keyDown(cathode, { key: 'Enter' }));
    // Both numbers, but the plate below the cathode: the model's own message, where the readout would be.
    await waitFor(() => expect(stage1.getByRole('alert').textContent).toBe('The plate must read above the cathode: check the meter’s leads and the plate resistor.'));
    expect(store.getState().design.readings).toEqual([{ stage: 1, tubeId: '12AX7', plate: 1.2, cathode: 1.4 }]);
  });

  it('names a reading it cannot read as the box is left, while the empty box beside it waits its turn', () => {
    render(<App store={createWorkbenchStore()} />);
    const stage1 = within(screen.getByRole('group', { name: 'Meter readings, Stage 1 · 12AX7' }));
    const plate = stage1.getByLabelText(/^Plate to chassis/);
    const cathode = stage1.getByLabelText(/^Cathode to chassis/);
    typeInto(plate, '17O');
    act(() => void fireEvent.blur(plate));
    // The slip is named beside its box; the cathode, not yet typed, is not asked for.
    expect(stage1.getAllByRole('alert')).toHaveLength(1);
    expect(plate.getAttribute('aria-invalid')).toBe('true');
    expect(cathode.getAttribute('aria-invalid')).toBeNull();
    typeInto(plate, '170');
    act(() => void fireEvent.blur(plate));
    expect(stage1.queryAllByRole('alert')).toEqual([]);
  });

  it('reads a long-tailed pair from its plates, the tail a check on their sum, and a gain stage with no Rk from its plate resistor', async () => {
    const store = createWorkbenchStore();
    render(<App store={store} />);
    act(() => {
      store.getState().setOutputPair('push-pull');
      store.getState().setSplitter({ kind: 'long-tailed-pair' });
    });
    const amp = store.getState().amplifier!;
    if (!amp.result.ok) throw new Error(amp.result.message);
    const at = amp.result.stages.findIndex((st) => st.kind === 'long-tailed-pair');
    const ltp = amp.input.stages[at]!;
    if (ltp.kind !== 'long-tailed-pair') throw new Error('no pair');
    const pins = amp.result.stages[at]!.pins;
    const pair = within(await screen.findByRole('group', { name: 'Meter readings, Splitter · 12AU7' }));
    expect(pair.getAllByRole('textbox').map((b) => b.getAttribute('name'))).toEqual([`reading.${at + 1}.supply`, `reading.${at + 1}.plate`, `reading.${at + 1}.plate2`, `reading.${at + 1}.cathode`]);
    // The design's own idle voltages typed back read as the typical tube, and the tail's current agrees with the plates' sum.
    typeInto(pair.getByLabelText(/^Supply at the top of Ra/), String(ltp.bplus));
    typeInto(pair.getByLabelText(/^First plate to chassis/), String(pins.plate));
    typeInto(pair.getByLabelText(/^Second plate to chassis/), String(pins.plate2));
    typeInto(pair.getByLabelText(/^Cathodes to chassis/), String(pins.cathode));
    act(() => void fireEvent.keyDown(pair.getByLabelText(/^Cathodes to chassis/), { key: 'Enter' }));
    const readout = within(screen.getByRole('group', { name: 'Meter readings, Splitter · 12AU7' })).getByRole('status').textContent!;
    expect(readout).toMatch(/^First triode \(inverting plate\): Ia [\d.]+ mA \(the drop across Ra, supply to plate\), at Vpk [\d.]+ V and Vgk −[\d.]+ V: 100 % of a typical 12AU7’s current there/);
    expect(readout).toMatch(/Second triode: Ia [\d.]+ mA \(the drop across Ra, supply to plate\).*100 % of a typical 12AU7’s/);
    expect(readout).toMatch(/The tail carries [\d.]+ mA \(the cathodes’ drop across Rk and the tail\), the plates [\d.]+ mA together: they agree\.$/);
    // The typed text holds the figures to 15 digits.
    expect(store.getState().design.readings).toEqual([{ stage: at + 1, tubeId: '12AU7', supply: ltp.bplus, plate: expect.closeTo(pins.plate, 9), plate2: expect.closeTo(pins.plate2!, 9), cathode: expect.closeTo(pins.cathode, 9) }]);
    // The first plate 20 % further below the supply than designed: 20 % more current read through the nominal Ra, which the tail does not carry.
    const drifted = ltp.bplus - 1.2 * (ltp.bplus - pins.plate);
    typeInto(pair.getByLabelText(/^First plate to chassis/), String(drifted));
    act(() => void fireEvent.keyDown(pair.getByLabelText(/^First plate to chassis/), { key: 'Enter' }));
    await waitFor(() => expect(within(screen.getByRole('group', { name: 'Meter readings, Splitter · 12AU7' })).getByRole('status').textContent).toMatch(/together: they should agree within 10 %: a plate or tail resistor is off its value/));
    // A plate past its rating as read (1.7 kV across Ra: about 50 mA at 230 V, over 11 W against 2.75 W) is the pair's
    // danger in the one ratings list, each triode named, and so on the card.
    typeInto(pair.getByLabelText(/^Supply at the top of Ra/), '2000');
    act(() => void fireEvent.keyDown(pair.getByLabelText(/^Supply at the top of Ra/), { key: 'Enter' }));
    const ratings = within(screen.getByRole('region', { name: 'Ratings checks' }));
    await waitFor(() => expect(ratings.getAllByText(/^Splitter · 12AU7, as read/).map((e) => e.closest('.finding')?.className)).toEqual([expect.stringMatching(/danger/), expect.stringMatching(/danger/)]));
    const ratingLines = cardSections(store.getState()).find((c) => c.heading === 'Ratings, every stage')?.lines ?? [];
    expect(ratingLines.some((l) => /Splitter · 12AU7, as read.*First triode: plate dissipation/.test(l))).toBe(true);
    expect(ratingLines.some((l) => /Splitter · 12AU7, as read.*Second triode: plate dissipation/.test(l))).toBe(true);
    typeInto(pair.getByLabelText(/^Supply at the top of Ra/), String(ltp.bplus));
    act(() => void fireEvent.keyDown(pair.getByLabelText(/^Supply at the top of Ra/), { key: 'Enter' }));
    // On the card with every box it was read from; kept in the file.
    expect(cardSections(store.getState()).find((c) => c.heading === 'Meter readings, as built')?.lines).toEqual([expect.stringMatching(/^Splitter · 12AU7, read supply \d+ V, plate [\d.]+ V, second plate [\d.]+ V, cathode [\d.]+ V: First triode/)]);
    const back = readDesignFile(writeDesignFile({ title: 'as built', design: store.getState().design }));
    expect(back.ok && back.doc.design.readings).toEqual(store.getState().design.readings);
    // A gain stage with no cathode resistor is read from its plate resistor: the supply at its top and the plate. Its grid
    // sits where its own leak's grid current holds it (grid-leak bias, a fraction of a volt below the cathode).
    act(() => {
      store.getState().editField('rk', '0');
      store.getState().settleField('rk');
      store.getState().settleAnalysis();
    });
    const noRk = within(await screen.findByRole('group', { name: 'Meter readings, Stage 2 · 12AU7' }));
    expect(noRk.getAllByRole('textbox').map((b) => b.getAttribute('name'))).toEqual(['reading.2.supply', 'reading.2.plate']);
    const b = store.getState().amplifier!;
    if (!b.result.ok) throw new Error(b.result.message);
    typeInto(noRk.getByLabelText(/^Supply at the top of Ra/), String(b.input.stages[1]!.bplus));
    typeInto(noRk.getByLabelText(/^Plate to chassis/), String(b.result.stages[1]!.pins.plate));
    act(() => void fireEvent.keyDown(noRk.getByLabelText(/^Plate to chassis/), { key: 'Enter' }));
    await waitFor(() => expect(within(screen.getByRole('group', { name: 'Meter readings, Stage 2 · 12AU7' })).getByRole('status').textContent).toMatch(/^Ia [\d.]+ mA \(the drop across Ra, supply to plate\), at Vpk [\d.]+ V and Vgk −[\d.]+ m?V: 100 % of a typical 12AU7’s current there/));
    expect(store.getState().design.readings?.find((r) => r.stage === 2)).toEqual({ stage: 2, tubeId: '12AU7', supply: b.input.stages[1]!.bplus, plate: expect.closeTo(b.result.stages[1]!.pins.plate, 9), cathode: 0 });
  });

  it('a direct-coupled follower\u2019s grid is taken where the plate before it reads, once that plate is read', async () => {
    const store = createWorkbenchStore();
    render(<App store={store} />);
    act(() => {
      store.getState().addStage(1, 'follower');
      store.getState().settleAnalysis();
    });
    const amp = store.getState().amplifier!;
    if (!amp.result.ok) throw new Error(amp.result.message);
    const at = amp.input.stages.findIndex((st) => st.kind === 'follower');
    expect(amp.input.stages[at]!.coupling.kind).toBe('direct');
    const name = `Meter readings, ${amp.names[at]!.title} · ${amp.names[at]!.tube}`;
    const pins = amp.result.stages[at]!.pins;
    const before = amp.result.stages[at - 1]!.pins;
    const follower = within(screen.getByRole('group', { name }));
    typeInto(follower.getByLabelText(/^Plate to chassis/), String(pins.plate));
    typeInto(follower.getByLabelText(/^Cathode to chassis/), String(pins.cathode));
    act(() => void fireEvent.keyDown(follower.getByLabelText(/^Cathode to chassis/), { key: 'Enter' }));
    // Its own designed voltages read back as the typical tube, its grid where designed (no reading before it yet).
    const first = within(screen.getByRole('group', { name })).getByRole('status').textContent!;
    expect(first).toMatch(/: 100 % of a typical/);
    expect(first).not.toMatch(/direct-coupled/);
    // The plate before it read 10 V high: the follower's grid follows it, 10 V nearer its cathode, so a typical tube would pass
    // more there and this one reads under it.
    const gain = within(screen.getByRole('group', { name: `Meter readings, ${amp.names[at - 1]!.title} · ${amp.names[at - 1]!.tube}` }));
    typeInto(gain.getByLabelText(/^Plate to chassis/), String(before.plate + 10));
    typeInto(gain.getByLabelText(/^Cathode to chassis/), String(before.cathode));
    act(() => void fireEvent.keyDown(gain.getByLabelText(/^Cathode to chassis/), { key: 'Enter' }));
    await waitFor(() => expect(within(screen.getByRole('group', { name })).getByRole('status').textContent).toMatch(new RegExp(`Its grid is direct-coupled: taken at [\\d.]+ V, where stage ${at}’s plate reads\\.$`)));
    const after = within(screen.getByRole('group', { name })).getByRole('status').textContent!;
    expect(after).toMatch(/under the ±20 % spread/);
    expect(cardSections(store.getState()).find((c) => c.heading === 'Meter readings, as built')?.lines.some((l) => /Its grid is direct-coupled/.test(l))).toBe(true);
  });

  it('a file\u2019s readings are checked field by field', () => {
    const store = createWorkbenchStore();
    const doc = JSON.parse(writeDesignFile({ title: 't', design: store.getState().design })) as { design: Record<string, unknown> };
    doc.design.readings = [{ stage: 0, tubeId: '12AX7', plate: 170, cathode: 1.4 }];
    expect(readDesignFile(JSON.stringify(doc))).toMatchObject({ ok: false, message: expect.stringMatching(/^design\.readings\[0\]\.stage must be a stage’s place, a whole number from 1/) });
    doc.design.readings = [{ stage: 1, tubeId: '12AX7', plate: 170, cathode: -3 }];
    expect(readDesignFile(JSON.stringify(doc))).toMatchObject({ ok: false, message: expect.stringMatching(/^design\.readings\[0\]\.cathode must be a number from 0 to 2000 V/) });
    doc.design.readings = [{ stage: 1, tubeId: '12AX7', plate: 170, cathode: 1.4 }, { stage: 1, tubeId: '12AX7', plate: 171, cathode: 1.4 }];
    expect(readDesignFile(JSON.stringify(doc))).toMatchObject({ ok: false, message: expect.stringMatching(/^design\.readings must hold one reading per stage/) });
    doc.design.readings = 'none';
    expect(readDesignFile(JSON.stringify(doc))).toMatchObject({ ok: false, message: expect.stringMatching(/^design\.readings must be a list of readings/) });
    doc.design.readings = [{ stage: 3, tubeId: '12AU7', supply: 2500, plate: 170, plate2: 171, cathode: 40 }];
    expect(readDesignFile(JSON.stringify(doc))).toMatchObject({ ok: false, message: expect.stringMatching(/^design\.readings\[0\]\.supply must be a number from 0 to 2000 V/) });
    delete doc.design.readings;
    doc.design.outputReadings = [{ tube: 3, tubeId: 'EL34', pair: 'single-ended', bias: 'cathode', plate: 318, screen: 330, grid: 0, cathode: 22 }];
    expect(readDesignFile(JSON.stringify(doc))).toMatchObject({ ok: false, message: expect.stringMatching(/^design\.outputReadings\[0\]\.tube must be 1 or 2/) });
    doc.design.outputReadings = [{ tube: 1, tubeId: 'EL34', pair: 'push-pull', bias: 'fixed', plate: 318, screen: null, grid: 5, cathode: 0.065 }];
    expect(readDesignFile(JSON.stringify(doc))).toMatchObject({ ok: false, message: expect.stringMatching(/^design\.outputReadings\[0\]\.grid must be a number from -1000 to 0 V/) });
  });

  it('reads the output tube: the single tube on its Rk, a cathode-biased pair on its shared Rk, a fixed-bias pair tube by tube across the 1 Ω sense resistors', async () => {
    const store = createWorkbenchStore();
    render(<App store={store} />);
    // The demo's ultralinear EL34 on 330 Ω: plate, screen and cathode.
    const single = within(screen.getByRole('group', { name: 'Meter readings, Output · EL34' }));
    expect(single.queryByLabelText(/^Grid to chassis/)).toBeNull();
    typeInto(single.getByLabelText(/^Plate to chassis/), '318');
    typeInto(single.getByLabelText(/^Screen to chassis/), '330');
    typeInto(single.getByLabelText(/^Cathode to chassis/), '22');
    act(() => void fireEvent.keyDown(single.getByLabelText(/^Cathode to chassis/), { key: 'Enter' }));
    // Ohm's law: 22 V across 330 Ω is 66.7 mA of cathode current.
    await waitFor(() => expect(within(screen.getByRole('group', { name: 'Meter readings, Output · EL34' })).getByRole('status').textContent).toMatch(/^Ik 66\.7 mA \(the cathode’s drop across Rk\), at Vpk 296 V, Vg2k 308 V and Vgk −22 V: [\d.]+ % of a typical EL34’s cathode current there/));
    expect(store.getState().design.outputReadings).toEqual([{ tube: 1, tubeId: 'EL34', pair: 'single-ended', bias: 'cathode', plate: 318, screen: 330, grid: 0, cathode: 22 }]);
    // A pair on one shared Rk: one row, each tube's average is half the resistor's current; the single tube's reading is not shown there.
    act(() => void store.getState().setOutputPair('push-pull'));
    const together = within(await screen.findByRole('group', { name: 'Meter readings, Output · EL34 pair, each tube on average (they share Rk)' }));
    expect((together.getByLabelText(/^Cathodes to chassis \(shared Rk\)/) as HTMLInputElement).value).toBe('');
    const rk = store.getState().design.output.rk;
    typeInto(together.getByLabelText(/^Plate to chassis/), '320');
    typeInto(together.getByLabelText(/^Screen to chassis/), '330');
    typeInto(together.getByLabelText(/^Cathodes to chassis/), '20');
    act(() => void fireEvent.keyDown(together.getByLabelText(/^Cathodes to chassis/), { key: 'Enter' }));
    const each = (20 / rk / 2) * 1e3;
    await waitFor(() => expect(screen.getByRole('group', { name: /pair, each tube on average/ }).querySelector('[role=status]')?.textContent).toContain(`Ik ${Number(each.toPrecision(3))} mA (half the drop across the shared Rk)`));
    // The pair's average: its words are the pair's, each tube's dissipation.
    expect(screen.getByRole('group', { name: /pair, each tube on average/ }).querySelector('[role=status]')?.textContent).toMatch(/ of a typical EL34’s cathode current there, (within the ±20 % tubes of the type|under the ±20 % spread: weak or tired tubes|over the ±20 % spread: strong tubes).* Plate dissipation each [\d.]+ W/);
    // Fixed bias: a row per tube, with the grid and the sense resistor's drop.
    act(() => void store.getState().setOutputBias('fixed'));
    const tube2 = within(await screen.findByRole('group', { name: 'Meter readings, Output · EL34, tube 2' }));
    expect(screen.getByRole('group', { name: 'Meter readings, Output · EL34, tube 1' })).toBeTruthy();
    typeInto(tube2.getByLabelText(/^Plate to chassis/), '320');
    typeInto(tube2.getByLabelText(/^Screen to chassis/), '330');
    typeInto(tube2.getByLabelText(/^Grid to chassis/), '30');
    typeInto(tube2.getByLabelText(/^Across its 1 Ω sense resistor/), '65m');
    act(() => void fireEvent.keyDown(tube2.getByLabelText(/^Across its 1 Ω sense resistor/), { key: 'Enter' }));
    // A grid typed without its minus sign is refused beside its box.
    expect(tube2.getByRole('alert').textContent).toBe('A fixed-bias grid reads below chassis: type it with its minus sign, as −38');
    typeInto(tube2.getByLabelText(/^Grid to chassis/), '−30');
    act(() => void fireEvent.keyDown(tube2.getByLabelText(/^Grid to chassis/), { key: 'Enter' }));
    const read = await within(screen.getByRole('group', { name: 'Meter readings, Output · EL34, tube 2' })).findByRole('status');
    // 65 mV across 1 Ω is 65 mA (Ohm's law); the sense reading the design asks is named.
    expect(read.textContent).toMatch(/^Ik 65 mA \(the drop across its 1 Ω sense resistor\), at Vpk 320 V, Vg2k 330 V and Vgk −30\.1 V: /);
    expect(read.textContent).toMatch(/The designed idle reads [\d.]+ mV across the sense resistor: set the trimmer to it\.$/);
    expect(cardSections(store.getState()).find((c) => c.heading === 'Meter readings, as built')?.lines).toEqual([expect.stringMatching(/^Output · EL34, tube 2, read plate 320 V, screen 330 V, grid −30 V, sense resistor 65 mV: Ik 65 mA /)]);
    const back = readDesignFile(writeDesignFile({ title: 'biased', design: store.getState().design }));
    expect(back.ok && back.doc.design.outputReadings?.map((r) => [r.tube, r.pair, r.bias])).toEqual([[1, 'push-pull', 'cathode'], [2, 'push-pull', 'fixed']]);
  });

  it('reads a split-load splitter as a follower: its cathode load to chassis, its grid where its divider holds it', async () => {
    const store = createWorkbenchStore();
    render(<App store={store} />);
    act(() => void store.getState().setOutputPair('push-pull'));
    // The bench's split-load: a 12AU7 with 22 kΩ in its cathode, its grid held at 90 V.
    const splitter = within(await screen.findByRole('group', { name: 'Meter readings, Splitter · 12AU7' }));
    typeInto(splitter.getByLabelText(/^Plate to chassis/), '250');
    typeInto(splitter.getByLabelText(/^Cathode to chassis/), '95');
    act(() => void fireEvent.keyDown(splitter.getByLabelText(/^Cathode to chassis/), { key: 'Enter' }));
    // Ohm's law: 95 V across 22 kΩ is 4.32 mA; the tube at Vpk 155 V and Vgk 90 − 95 = −5 V.
    await waitFor(() => expect(within(screen.getByRole('group', { name: 'Meter readings, Splitter · 12AU7' })).getByRole('status').textContent).toMatch(/^Ia 4\.32 mA \(the cathode’s drop across Rk\), at Vpk 155 V and Vgk −5 V: /));
    expect(store.getState().design.readings).toEqual([{ stage: 3, tubeId: '12AU7', plate: 250, cathode: 95 }]);
  });
});

