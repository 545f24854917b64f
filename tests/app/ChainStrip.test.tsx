import { fireEvent, render, screen, within } from '@testing-library/react';
import { act } from 'react';
import { describe, expect, it } from 'vitest';
import { App } from '../../app/App';
import { createWorkbenchStore } from '../../app/store/workbenchStore';
import { ohms } from '../../app/format';
import { voltageStages } from '../../app/store/stagePlans';

/** The stage cards in the strip (each stage's menu buttons aside). */
const cardsOf = () => [...screen.getByRole('region', { name: 'The amplifier, stage by stage' }).querySelectorAll<HTMLButtonElement>('button.chain-card')];

describe('the amplifier strip', () => {
  it('shows the demo as one amplifier, input stage to output stage, and a card opens its stage', () => {
    const store = createWorkbenchStore();
    render(<App store={store} />);
    const strip = within(screen.getByRole('region', { name: 'The amplifier, stage by stage' }));
    const cards = cardsOf();
    expect(cards.map((c) => c.querySelector('.card-title')!.textContent)).toEqual(['Stage 1 · 12AX7 common cathode', 'Stage 2 · 12AU7 common cathode', 'Output · EL34 single-ended output']);
    // The demo opens on its driver stage.
    expect(cards.map((c) => c.getAttribute('aria-pressed'))).toEqual(['false', 'true', 'false']);
    // The stage with no headroom left is the one named as clipping first.
    expect(strip.getAllByText(/clips first/)).toHaveLength(1);
    expect(strip.getByTestId('amplifier-figures').textContent).toMatch(/Gain[\d.]+ dB .*Band \(−3 dB\)[\d.]+ Hz to [\d.]+ kHz.*Clean to[\d.]+ W/);
    act(() => fireEvent.click(cards[2]!));
    expect(store.getState().design.stageKind).toBe('output');
  });

  it('while joined, RL is the output grid resistor; parting the stages keeps both values', () => {
    const store = createWorkbenchStore();
    render(<App store={store} />);
    act(() => store.getState().commit({ ...store.getState().design, output: { ...store.getState().design.output, rg: 150e3 } }));
    expect(store.getState().design.rl).toBe(150e3);
    act(() => store.getState().commit({ ...store.getState().design, rl: 270e3 }));
    expect(store.getState().design.output.rg).toBe(270e3);
    expect(store.getState().commit({ ...store.getState().design, rl: Infinity })).toMatchObject({ field: 'rl' });
    act(() => fireEvent.click(screen.getByRole('checkbox', { name: 'The voltage stages drive the output stage' })));
    expect(store.getState().design.drivesOutput).toBe(false);
    expect(cardsOf()).toHaveLength(2);
    expect(store.getState().design.rl).toBe(270e3);
  });

  it('a working level past the clean limit shows its input and THD, naming the stage past its own limit', () => {
    const store = createWorkbenchStore();
    render(<App store={store} />);
    act(() => fireEvent.click(screen.getByRole('checkbox', { name: 'The voltage stages drive the output stage' })));
    const amp = store.getState().amplifier!.result;
    if (!amp.ok) throw new Error(amp.message);
    const first = amp.clipsFirst;
    act(() => store.getState().commit({ ...store.getState().design, levelRms: Math.round(1.3 * amp.output.rms) }));
    const at = store.getState().amplifier!.atLevel;
    if (!at?.ok) throw new Error('the level past the clean limit is worked out');
    expect(at.pastClean).toEqual({ stage: first.stage, by: first.by });
    const words = within(screen.getByTestId('amplifier-figures')).getByText(/past the clean limit/);
    expect(words.textContent).toMatch(new RegExp(`dBu\\) in, THD [\\d.]+ %: past the clean limit, stage ${first.stage + 1} ${first.by === 'grid-current' ? 'drawing grid current' : 'cut off'}`));
    expect(words.className).toBe('past-clean');
  });

  it('a second stage joins the chain between the first and the output', () => {
    const store = createWorkbenchStore();
    render(<App store={store} />);
    act(() => store.getState().setStage2({ kind: 'follower' }));
    expect(cardsOf().map((c) => c.querySelector('.card-title')!.textContent)).toEqual([
      'Stage 1 · 12AX7 common cathode', 'Stage 2 · 12AU7 common cathode', 'Stage 3 · 12AU7 cathode follower', 'Output · EL34 single-ended output',
    ]);
    // The ratings list names the output stage's findings too, as part of the amplifier.
    expect(screen.getAllByText(/Output stage, EL34/).length).toBeGreaterThan(0);
  });

  it('each voltage stage\'s menu adds a stage after it, moves it and removes it; the card opens it on the bench', { timeout: 20_000 }, () => {
    const store = createWorkbenchStore();
    render(<App store={store} />);
    // From one voltage stage: the demo's input stage removed, its driver first.
    act(() => fireEvent.click(screen.getByRole('button', { name: 'Remove Stage 1' })));
    expect(cardsOf()).toHaveLength(2);
    act(() => fireEvent.click(screen.getByRole('button', { name: 'Add a gain stage after Stage 1' })));
    expect(cardsOf().map((c) => c.querySelector('.card-title')!.textContent)).toEqual([
      'Stage 1 · 12AU7 common cathode', 'Stage 2 · 12AU7 common cathode', 'Output · EL34 single-ended output',
    ]);
    // The new stage is on the bench; its B+ box is its own.
    expect(cardsOf()[1]!.getAttribute('aria-pressed')).toBe('true');
    act(() => fireEvent.click(screen.getByRole('button', { name: 'Add a cathode follower direct-coupled to Stage 2\'s plate' })));
    expect(cardsOf().map((c) => c.querySelector('.card-kind')!.textContent)).toEqual(['common cathode', 'common cathode', 'cathode follower', 'single-ended output']);
    // The follower rides with its gain stage, which stays the stage shown; the follower's own card puts the follower on the bench.
    expect(cardsOf().map((c) => c.getAttribute('aria-pressed'))).toEqual(['false', 'true', 'false', 'false']);
    act(() => fireEvent.click(cardsOf()[2]!));
    expect(cardsOf().map((c) => c.getAttribute('aria-pressed'))).toEqual(['false', 'false', 'true', 'false']);
    expect(screen.getByRole('group', { name: /^Plate curves of the follower's 12AU7/ })).toBeTruthy();
    act(() => fireEvent.click(cardsOf()[1]!));
    expect((screen.getByRole('button', { name: 'Move Stage 2 toward the output' }) as HTMLButtonElement).disabled).toBe(true);
    act(() => fireEvent.click(screen.getByRole('button', { name: 'Move Stage 2 toward the input' })));
    expect(cardsOf().map((c) => c.querySelector('.card-kind')!.textContent)).toEqual(['common cathode', 'cathode follower', 'common cathode', 'single-ended output']);
    act(() => fireEvent.click(cardsOf()[2]!));
    expect(cardsOf().map((c) => c.getAttribute('aria-pressed'))).toEqual(['false', 'false', 'true', 'false']);
    // The whole amplifier's schematic draws every stage, the bench's shaded; pressing one puts it on the bench.
    const drawing = screen.getByRole('group', { name: 'Schematic of the whole amplifier, 4 stages' });
    expect(within(drawing).getAllByRole('button', { name: /: put it on the bench$/ }).map((b) => b.getAttribute('aria-pressed'))).toEqual(['false', 'false', 'true', 'false']);
    act(() => fireEvent.keyDown(within(drawing).getByRole('button', { name: 'Stage 1, 12AU7 gain stage: put it on the bench' }), { key: 'Enter' }));
    // Stage 1, the follower riding with it (the follower's own card shows the follower).
    expect(cardsOf().map((c) => c.getAttribute('aria-pressed'))).toEqual(['true', 'false', 'false', 'false']);
    act(() => fireEvent.click(cardsOf()[2]!));
    act(() => fireEvent.click(screen.getByRole('button', { name: 'Remove Stage 2' })));
    expect(cardsOf()).toHaveLength(3);
    act(() => fireEvent.click(screen.getByRole('button', { name: 'Remove Stage 1' })));
    expect(cardsOf()).toHaveLength(2);
    // The last gain stage stays.
    expect((screen.getByRole('button', { name: 'Remove Stage 1' }) as HTMLButtonElement).disabled).toBe(true);
  });

  it('every value on the whole amplifier\'s drawing is edited where it stands: its stage goes on the bench and its box opens there', { timeout: 20_000 }, () => {
    const store = createWorkbenchStore();
    const view = render(<App store={store} />);
    const drawing = () => within(screen.getByRole('group', { name: /^Schematic of the whole amplifier/ }));
    // The demo opens on its driver (stage 2); stage 1's plate resistor is pressed on the drawing.
    expect(store.getState().design.before).toHaveLength(1);
    const ra1 = store.getState().design.before[0]!;
    if (ra1.kind !== 'common-cathode') throw new Error('the demo starts with a gain stage');
    act(() => fireEvent.click(drawing().getByRole('button', { name: `Stage 1 Ra ${ohms(ra1.ra)}: change` })));
    expect(store.getState().design.before).toHaveLength(0);
    const editor = () => within(view.container.querySelector('.chain-frame .inline-editor') as HTMLElement).getByRole('textbox');
    expect(editor().getAttribute('value') ?? (editor() as HTMLInputElement).value).toBe('100k');
    act(() => fireEvent.change(editor(), { target: { value: '150k' } }));
    act(() => fireEvent.keyDown(editor(), { key: 'Enter' }));
    expect(view.container.querySelector('.chain-frame .inline-editor')).toBeNull();
    expect(store.getState().design.ra).toBe(150e3);
    expect(drawing().getByRole('button', { name: 'Stage 1 Ra 150 kΩ: change' })).toBeTruthy();
    // Undo takes the edit back, as for any box.
    act(() => store.getState().undo());
    expect(voltageStages(store.getState().design)[0]).toMatchObject({ ra: ra1.ra });
    // A bad value is refused next to the box and the design keeps its last good value.
    act(() => fireEvent.keyDown(drawing().getByRole('button', { name: /^Stage 1 Rk .*: change$/ }), { key: 'Enter' }));
    act(() => fireEvent.change(editor(), { target: { value: '-3' } }));
    expect(within(view.container.querySelector('.chain-frame .inline-editor') as HTMLElement).getByRole('alert').textContent).toMatch(/Rk/);
    expect(voltageStages(store.getState().design)[0]).toMatchObject({ rk: ra1.rk });
    act(() => fireEvent.keyDown(editor(), { key: 'Escape' }));
    // The output stage's grid resistor: the output stage goes on the bench.
    act(() => fireEvent.click(drawing().getByRole('button', { name: /^Output stage Rg .*: change$/ })));
    expect(store.getState().design.stageKind).toBe('output');
    act(() => fireEvent.change(editor(), { target: { value: '220k' } }));
    act(() => fireEvent.blur(editor()));
    expect(store.getState().design.output.rg).toBe(220e3);
    // Its cathode resistor is on the drawing with its value; with fixed bias the grid returns to the bias voltage instead.
    expect(drawing().getByRole('button', { name: `Output stage Rk ${ohms(store.getState().design.output.rk)}: change` })).toBeTruthy();
    act(() => store.getState().commit({ ...store.getState().design, output: { ...store.getState().design.output, bias: 'fixed', vg: -24 } }));
    expect(drawing().queryByRole('button', { name: /^Output stage Rk/ })).toBeNull();
    act(() => fireEvent.click(drawing().getByRole('button', { name: 'Output stage grid leak returned to −24 V: change' })));
    expect((editor() as HTMLInputElement).value).toBe('-24');
    act(() => fireEvent.keyDown(editor(), { key: 'Escape' }));
    // The source's impedance, at the input.
    act(() => fireEvent.click(drawing().getByRole('button', { name: `Source Rs ${ohms(store.getState().design.rsource)}: change` })));
    act(() => fireEvent.change(editor(), { target: { value: '47k' } }));
    act(() => fireEvent.keyDown(editor(), { key: 'Enter' }));
    expect(store.getState().design.rsource).toBe(47e3);
  });

  it('the menu\'s follower is direct-coupled, as it says, even after a capacitor-coupled follower was on the bench', () => {
    const store = createWorkbenchStore();
    render(<App store={store} />);
    act(() => fireEvent.change(screen.getByLabelText('Add', { exact: true }), { target: { value: 'follower-capacitor' } }));
    expect(store.getState().design.stage2.coupling).toBeDefined();
    act(() => fireEvent.click(screen.getByRole('button', { name: 'Add a cathode follower direct-coupled to Stage 1\'s plate' })));
    const list = voltageStages(store.getState().design);
    expect(list.map((p) => p.kind)).toEqual(['common-cathode', 'follower', 'common-cathode', 'follower']);
    expect(list[1]).not.toHaveProperty('coupling', expect.anything());
    expect(list[3]).toHaveProperty('coupling', expect.anything());
  });

  it('on a stage in the middle, the amplifier-end boxes say what this stage really sees', () => {
    const store = createWorkbenchStore();
    render(<App store={store} />);
    // The demo's driver, after the 12AX7 input stage: fed by that stage's output impedance, not the 1 kΩ source.
    const values = within(screen.getByRole('region', { name: 'Circuit values' }));
    const zout = store.getState().amplifier!.result;
    if (!zout.ok) throw new Error(zout.message);
    expect(values.getByText(/^the amplifier's source; this stage is fed by stage 1 \(/).textContent).toBe(`the amplifier's source; this stage is fed by stage 1 (${ohms(zout.stages[0]!.zout)})`);
    // The bench stage's drawing says the same: its grid is driven from stage 1's output impedance, not through Rs.
    const bench = within(screen.getByRole('region', { name: 'Stage schematic: click a value to change it' }));
    expect(bench.queryByRole('button', { name: /^Source Rs/ })).toBeNull();
    expect(bench.getByText('from stage 1')).toBeTruthy();
    expect(bench.getByText(ohms(zout.stages[0]!.zout))).toBeTruthy();
    act(() => store.getState().showStage(0));
    expect(bench.getByRole('button', { name: `Source Rs ${ohms(store.getState().design.rsource)}: change` })).toBeTruthy();
    expect(bench.queryByText('from stage 1')).toBeNull();
    expect(values.getByText('what drives the grid')).toBeTruthy();
    expect(values.getByText(/^the last voltage stage's load; this one drives 1 MΩ at the next grid$/)).toBeTruthy();
  });

  it('the second-stage panel adds a gain stage as a stage of the chain, on the bench', () => {
    const store = createWorkbenchStore();
    render(<App store={store} />);
    act(() => fireEvent.change(screen.getByLabelText('Add', { exact: true }), { target: { value: 'common-cathode' } }));
    expect(cardsOf().map((c) => c.querySelector('.card-title')!.textContent)).toEqual([
      'Stage 1 · 12AX7 common cathode', 'Stage 2 · 12AU7 common cathode', 'Stage 3 · 12AU7 common cathode', 'Output · EL34 single-ended output',
    ]);
    expect(cardsOf()[2]!.getAttribute('aria-pressed')).toBe('true');
    expect(store.getState().design.stage2.kind).toBe('none');
  });

  it('the second-stage panel adds a capacitor-coupled follower: its capacitor, leak and grid bias boxes, and the drawing shows it so', () => {
    const store = createWorkbenchStore();
    render(<App store={store} />);
    act(() => fireEvent.change(screen.getByLabelText('Add', { exact: true }), { target: { value: 'follower-capacitor' } }));
    const s2 = store.getState().design.stage2;
    expect(s2.kind).toBe('follower');
    expect(s2.coupling).toEqual({ cc: 100e-9, rg: 1e6, vbias: Math.round(store.getState().design.bplus / 2) });
    for (const name of [/^Cc \(follower\)/, /^Rg \(follower\)/, /^Follower grid/]) expect(screen.getByRole('textbox', { name })).toBeTruthy();
    expect(screen.getByRole('group', { name: /then a cathode follower, capacitor-coupled/ })).toBeTruthy();
    expect(screen.getByRole('button', { name: 'Stage 3, 12AU7 cathode follower, capacitor-coupled: put it on the bench' })).toBeTruthy();
    // The strip's card says so too.
    expect(cardsOf().map((c) => c.querySelector('.card-title')!.textContent)).toContain('Stage 3 · 12AU7 cathode follower, capacitor-coupled');
  });

  it('one build sheet for the joined amplifier: the output stage\'s transformer and parts, its grid resistor the RL typed, and its current in the B+ total', () => {
    const store = createWorkbenchStore();
    render(<App store={store} />);
    act(() => store.getState().commit({ ...store.getState().design, rl: 270e3 }));
    const sheet = within(screen.getByRole('region', { name: 'Build sheet' }));
    expect(sheet.getByText('Output stage, EL34')).toBeTruthy();
    expect(sheet.getByText(/^Output transformer: 3\.5 kΩ to 8 Ω/)).toBeTruthy();
    const rg = sheet.getAllByRole('row').find((r) => /^Rg \(grid resistor\)/.test(r.textContent ?? ''));
    expect(rg?.textContent).toMatch(/270 kΩ/);
    // Not solved on its supply, the one-section B+ filter estimate counts the output stage's current too.
    act(() => store.getState().setSupply({ on: false }));
    expect(sheet.getByText(/for the output stage ahead of the filter/)).toBeTruthy();
  });

  it('the build card opens with the whole amplifier: the chain, gain and band, the clean power and which stage clips first, and the input for 1 W', async () => {
    const { cardSections } = await import('../../app/export/buildCard');
    const store = createWorkbenchStore();
    const [first] = cardSections(store.getState());
    expect(first!.heading).toBe('Amplifier');
    expect(first!.lines[0]).toBe('12AX7 common cathode → 12AU7 common cathode → EL34 single-ended output');
    // Three common-cathode stages (the output tube's among them): inverting (common practice: an odd count inverts).
    expect(first!.lines[1]).toMatch(/^Gain [\d.]+ × \([\d.]+ dB, inverting\), −3 dB [\d.]+ Hz to [\d.]+ kHz$/);
    expect(first!.lines[2]).toMatch(/^Clean to [\d.]+ W \([\d.]+ V rms at the speaker\) from .* in; output clips first \(grid current\)$/);
    expect(first!.lines[3]).toMatch(/^At 1 W: .* in, THD [\d.]+ %$/);
    // With a voltage stage on the bench the card still carries the output stage it drives: its values and parts (it had been left off).
    const output = cardSections(store.getState()).find((x) => x.heading === 'Output stage, EL34')!;
    expect(output.lines).toEqual(expect.arrayContaining([expect.stringMatching(/^EL34 single-ended/), expect.stringMatching(/^Output transformer: 3\.5 kΩ to 8 Ω/), expect.stringMatching(/^Rk: 330 Ω E24, 5 W/)]));
    // With the output stage on the bench the card still carries every voltage stage's parts, each with its own ratings.
    store.getState().setStageKind('output');
    const outputCard = cardSections(store.getState());
    expect(outputCard.map((x) => x.heading)).toEqual(expect.arrayContaining(['Output stage', 'Stage 1, 12AX7 gain stage', 'Stage 2, 12AU7 gain stage']));
    expect(outputCard.find((x) => x.heading === 'Stage 1, 12AX7 gain stage')!.lines).toEqual(expect.arrayContaining([expect.stringMatching(/^Ra1: 100 kΩ E24, [\d.]+ W \(runs at /)]));
    store.getState().setStageKind('voltage');
    // The stages apart and one voltage stage left: its own sections say it all.
    store.getState().setDrivesOutput(false);
    expect(cardSections(store.getState())[0]!.heading).toBe('Amplifier');
    store.getState().dropStage(0);
    expect(cardSections(store.getState())[0]!.heading).toBe('Stage');
  });

  it('during a drag the amplifier\'s figures are marked behind once and then left alone, and are redone on release', () => {
    const store = createWorkbenchStore();
    const first = store.getState().amplifier;
    store.getState().commit({ ...store.getState().design, ra: 28e3 }, { light: true });
    const behind = store.getState().amplifier;
    expect(behind?.stale).toBe(true);
    store.getState().commit({ ...store.getState().design, ra: 29e3 }, { light: true });
    expect(store.getState().amplifier).toBe(behind);
    store.getState().commit({ ...store.getState().design, ra: 30e3 });
    expect(store.getState().amplifier?.stale).toBe(false);
    expect(store.getState().amplifier).not.toBe(first);
  });
});
