import { render, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { App } from '../../app/App';
import { createWorkbenchStore } from '../../app/store/workbenchStore';
import { stageDesignOf } from '../../app/store/analysis';
import { distortion, findTube, formatValue, levelAtThd, swing } from '../../src/index';
import { LIBRARY_TUBES } from '../../app/store/tubeRegistry';

function setup() {
  const store = createWorkbenchStore();
  const user = userEvent.setup();
  const view = render(<App store={store} />);
  const figure = (name: string) => view.container.querySelector(`[data-figure="${name}"] dd`)?.textContent ?? null;
  return { store, user, view, figure };
}

describe('signal views', () => {
  it('show the model\'s THD and H2 at the chosen output level', async () => {
    const { figure, store } = setup();
    const d = store.getState().design;
    const model = distortion({ tube: findTube(d.tubeId)!, bplus: d.bplus, ra: d.ra, rk: d.rk, rl: d.rl, rg: d.rg, rsource: d.rsource, cin: d.cin!, ck: d.ck!, cout: d.cout! }, { outputRms: 2 });
    if (!model.ok) throw new Error(model.message);
    // Negative with a true minus sign, as every figure on the page.
    expect(figure('h2')).toBe(`${model.harmonicsDb[0]!.toFixed(1).replace('-', '−')} dB`);
    expect(figure('h2')).toMatch(/^−\d/);
    expect(figure('thd')).toMatch(/^\d+(\.\d+)? %$/);
    expect(figure('limited-by')).toBe('grid current');
  });

  it('a level no drive reaches says where clipping starts, and the figures keep their places', async () => {
    const { user, store } = setup();
    const level = screen.getByRole('textbox', { name: /^Output level/ });
    await user.clear(level);
    await user.type(level, '100');
    const d = store.getState().design;
    // The bench's stage as the model sees it: driven from the stage before it, whose output impedance its grid current flows through.
    const clean = swing(stageDesignOf(d, findTube(d.tubeId)!, LIBRARY_TUBES));
    if (!clean.ok) throw new Error(clean.message);
    expect(store.getState().design.levelRms).toBe(100);
    // The signal views catch up once typing pauses.
    expect((await screen.findByText(/^This stage cannot give 100 V rms: it is clean up to/)).textContent).toContain(`${formatValue(clean.output.rms, 'V')} rms out`);
  });

  it('a level past the clean swing shows its distortion and which limit it is past', async () => {
    const { user, store, figure } = setup();
    const d = store.getState().design;
    const clean = swing(stageDesignOf(d, findTube(d.tubeId)!, LIBRARY_TUBES));
    if (!clean.ok) throw new Error(clean.message);
    const level = screen.getByRole('textbox', { name: /^Output level/ });
    await user.clear(level);
    await user.type(level, (clean.output.rms * 1.2).toPrecision(3));
    await waitFor(() => expect(figure('thd')).toContain('past the clean swing'));
    expect(figure('thd')).toMatch(/^\d+(\.\d+)? % past the clean swing \((grid current|cutoff)\)$/);
  });

  it('the THD limit sets the level shown for it: the model\u2019s output at that THD, and what brings it', async () => {
    const { user, store, view } = setup();
    const field = screen.getByRole('textbox', { name: /^THD limit/ });
    await user.clear(field);
    await user.type(field, '1');
    expect(store.getState().design.thdLimit).toBeCloseTo(0.01, 12);
    const d = store.getState().design;
    const model = levelAtThd(stageDesignOf(d, findTube(d.tubeId)!, LIBRARY_TUBES), 0.01);
    if (!model.ok) throw new Error(model.message);
    await waitFor(() => expect(view.container.querySelector('[data-figure="at-thd"] dt')?.textContent).toBe('Output at 1 % THD'));
    await waitFor(() => expect(view.container.querySelector('[data-figure="at-thd"] dd')?.textContent).toMatch(new RegExp(`^${model.outputRms.toPrecision(3)} V rms`)));
  });

  it('draws the transfer curve, the harmonic bars, THD against level and the Bode plot', () => {
    const { view } = setup();
    expect(view.container.querySelector('[data-series="transfer"]')?.getAttribute('d')).toMatch(/^M/);
    expect(view.container.querySelectorAll('[data-bar]').length).toBe(8);
    // The bars' figures: H2 read with a true minus, as every other level; a harmonic below the chart's −120 dB floor carries no figure (it is not −120).
    const figures = [...view.container.querySelectorAll('[data-bar] + text')].map((t) => t.textContent);
    expect(figures[0]).toMatch(/^−\d+$/);
    expect(figures.some((f) => f === '')).toBe(true);
    expect(figures.every((f) => !f!.includes('-'))).toBe(true);
    expect(view.container.querySelector('[data-series="thd"]')?.getAttribute('d')).toMatch(/^M/);
    expect(view.container.querySelector('[data-series="magnitude"]')?.getAttribute('d')).toMatch(/^M/);
    expect(view.container.querySelector('[data-series="phase"]')?.getAttribute('d')).toMatch(/^M/);
  });

  it('adding a cathode follower shows its figures, its own plate curves, the chain as inverting, and grows the schematic', async () => {
    const { user, figure, view } = setup();
    await user.selectOptions(screen.getByRole('combobox', { name: 'Add' }), 'follower');
    expect(figure('chain-gain')).toMatch(/inverting$/);
    expect(figure('stage2-vhk')).toMatch(/V$/);
    expect(view.container.querySelector('[data-stage2-point]')).not.toBeNull();
    expect(screen.getByRole('group', { name: /then a cathode follower/ })).toBeTruthy();
    expect(view.container.querySelector('[data-part="rk2"]')).not.toBeNull();
  });
});
