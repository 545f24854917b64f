import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { act } from 'react';
import { describe, expect, it } from 'vitest';
import { App } from '../../app/App';
import { outputCardSections } from '../../app/export/outputCard';
import { cardSections } from '../../app/export/buildCard';
import { hertz, milliamps, volts } from '../../app/format';
import { outputPartsOf } from '../../app/store/outputParts';
import { createWorkbenchStore } from '../../app/store/workbenchStore';
import { transformerLines } from '../../app/ui/output/OutputPartsPanel';
import { analyzePushPull, findOutputTube, pushPullPartsList, type PushPullDesign } from '../../src/index';

describe('a fixed-bias output stage\'s adjustment', () => {
  it('is on the parts to order and the card with its range and how to set it; cathode bias has none', async () => {
    const store = createWorkbenchStore();
    const user = userEvent.setup();
    render(<App store={store} />);
    await user.click(screen.getByLabelText('Output stage (transformer-coupled)'));
    expect(screen.queryByText(/^Bias adjustment/)).toBeNull();
    act(() => store.getState().commit({ ...store.getState().design, output: { ...store.getState().design.output, bias: 'fixed', vg: -24 } }));
    const parts = outputPartsOf(store.getState()).biasAdjustment;
    if (!parts?.ok) throw new Error('no adjustment for a fixed-bias stage');
    const line = screen.getByText(/^Bias adjustment, for the tube: the grid from/).textContent!;
    expect(line).toContain(`from ${volts(parts.weakest)} to ${volts(parts.strongest)} sets ${milliamps(parts.idlePlate)} idle plate current`);
    expect(parts.nominal).toBeCloseTo(-24, 6);
    expect(screen.getByText(/^Set it by a 1 Ω 1 % resistor from the cathode to ground/)).toBeTruthy();
    expect(screen.getByText(/lifted wiper leaves the grid at the negative end/)).toBeTruthy();
    // The grid stopper's line, with its corner from the parts list.
    const stopper = outputPartsOf(store.getState()).gridStopper;
    expect(screen.getByText(/^Grid stopper 1 kΩ at the output grid pin, against parasitic oscillation \(common practice\)/).textContent).toContain(`its corner is ${hertz(stopper.cornerHz)}, far above the band, so the figures leave it out.`);
    const card = outputCardSections(store.getState()).flatMap((x) => x.lines);
    expect(card).toContain(line);
  });

  it('a pair\'s lines say one adjustment for each tube and one sense resistor in each cathode', () => {
    const design: PushPullDesign = { tubeId: 'EL34', connection: 'ultralinear', bplus: 430, screenVolts: 430, ulTap: 0.43, raa: 6600, rPrimary: 200, bias: 'fixed', rk: 220, vg: -40, rg: 220e3, speakerOhms: 8, thdLimit: 0.05 };
    const a = analyzePushPull(findOutputTube('EL34')!, design);
    if (!a.ok) throw new Error(a.message);
    const lines = transformerLines({ pair: 'push-pull', ...pushPullPartsList(a, 'E24') });
    expect(lines.some((l) => l.startsWith('Bias adjustment, one for each tube: the grid from'))).toBe(true);
    expect(lines.some((l) => l.startsWith('Set it by a 1 Ω 1 % resistor from each cathode to ground'))).toBe(true);
  });
});

describe('a cathode-biased output stage across its tubes', () => {
  it('shows the idle from the weakest to the strongest tube and the strongest\'s dissipation; fixed bias shows none', async () => {
    const store = createWorkbenchStore();
    const user = userEvent.setup();
    const view = render(<App store={store} />);
    await user.click(screen.getByLabelText('Output stage (transformer-coupled)'));
    const spread = store.getState().outputBench.settled.spread;
    if (!spread) throw new Error('no spread for the demo\'s cathode-biased stage');
    const figure = (name: string) => view.container.querySelector(`[data-figure="${name}"] dd`)?.textContent ?? null;
    expect(figure('spread-ia')).toBe(`${milliamps(spread.weakest.ip)} to ${milliamps(spread.strongest.ip)}`);
    expect(figure('spread-pa')).toMatch(/^\d+(\.\d+)? W \(\d+(\.\d+)? %\)$/);
    expect(outputCardSections(store.getState()).flatMap((x) => x.lines)).toContain(`Tubes 20 % weak to 20 % strong: Ia ${milliamps(spread.weakest.ip)} to ${milliamps(spread.strongest.ip)}; a strong tube dissipates ${figure('spread-pa')!.replace(/ \((.*)\)$/, ' at idle, $1 of 25 W')}`);
    act(() => store.getState().commit({ ...store.getState().design, output: { ...store.getState().design.output, bias: 'fixed', vg: -24 } }));
    expect(figure('spread-ia')).toBeNull();
  });
});

describe('the ratings list for the whole amplifier', () => {
  it('warns, tagged with the output stage, when the type\'s strong tubes would run past the plate rating', () => {
    const store = createWorkbenchStore();
    render(<App store={store} />);
    expect(screen.queryByText(/A tube passing 20 % more current/)).toBeNull();
    act(() => store.getState().commit({ ...store.getState().design, output: { ...store.getState().design.output, rk: 220 } }));
    const item = screen.getByText(/A tube passing 20 % more current than the law would dissipate/).closest('li')!;
    expect(item.textContent).toMatch(/^Warning\s*Output stage, EL34: A tube passing 20 % more current than the law would dissipate \d+\.\d W at idle, \d+ % of the 25 W rating/);
  });
});

describe('the card with a voltage stage on the bench', () => {
  it('still gives the driven output stage\'s operating point, dissipation and power, single-ended and as a pair', () => {
    const store = createWorkbenchStore({ supplySolver: null });
    const driven = () => cardSections(store.getState()).find((c) => c.heading === `Output stage, ${store.getState().design.output.tubeId}`)!.lines;
    expect(store.getState().design.stageKind).toBe('voltage');
    // The same lines the output stage's own card prints, from the same analysis.
    const own = (heading: string) => outputCardSections(store.getState()).find((c) => c.heading === heading)!.lines;
    const single = driven();
    for (const line of own('Operating point')) expect(single).toContain(line);
    expect(single).toContainEqual(expect.stringMatching(/^Pa [\d.]+ W \(\d+ % of 25 W\)/));
    expect(single).toContain(own('Power and distortion')[0]);
    expect(single).toContainEqual(expect.stringMatching(/^Output transformer: /));
    act(() => store.getState().setOutputPair('push-pull'));
    const pair = driven();
    for (const line of own('Operating point, each tube')) expect(pair).toContain(line);
    expect(pair).toContainEqual(expect.stringMatching(/^Grids to 0 V: [\d.]+ W at /));
  });
});
