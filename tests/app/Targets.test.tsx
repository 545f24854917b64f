import { act, render, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { App } from '../../app/App';
import { stageDesignOf } from '../../app/store/analysis';
import { createWorkbenchStore } from '../../app/store/workbenchStore';
import { feasibleRegion, findOutputTube, findTube, judgeDesign, nearestPreferred, outputRegion, preferredAround, preferredBest } from '../../src/index';
import { targetsOf } from '../../app/store/targetPlan';
import { benchPoint } from '../../app/store/outputAnalysis';
import { cardSections } from '../../app/export/buildCard';
import { failingAt } from '../../app/store/regionSlice';
import { LIBRARY_TUBES } from '../../app/store/tubeRegistry';

function setup() {
  const store = createWorkbenchStore();
  const user = userEvent.setup();
  const view = render(<App store={store} />);
  const field = (label: RegExp) => screen.getByRole('textbox', { name: label }) as HTMLInputElement;
  return { store, user, view, field };
}

describe('targets on the voltage bench', () => {
  it('a target typed shades the chart where it holds: the cells the model marks inside, and says how many', async () => {
    const { store, user, view, field } = setup();
    await user.type(field(/^Least gain/), '12');
    expect(store.getState().design.targets.minGain).toBe(12);
    await waitFor(() => expect(store.getState().region?.complete).toBe(true));
    const d = store.getState().design;
    const sd = stageDesignOf(d, findTube(d.tubeId)!, LIBRARY_TUBES);
    const model = feasibleRegion({ tube: sd.tube, bplus: sd.bplus, rl: sd.rl!, rsource: sd.rsource!, bypassed: sd.bypassed!, rg: sd.rg! }, { minGain: 12 }, { nx: 60, ny: 40, extent: store.getState().analysis.sheet.extent });
    if (!model.ok) throw new Error(model.message);
    const inside = model.inside.flat().filter(Boolean).length;
    expect(inside).toBeGreaterThan(0);
    expect(view.container.querySelectorAll('[data-region="inside"] rect').length).toBe(inside);
    expect(screen.getByTestId('region-status').textContent).toMatch(new RegExp(`^${inside} of \\d+ reachable points on the 60 × 40 grid meet every target\\.$`));
    // The target's own edge is drawn, in its own dash, and keyed.
    expect(view.container.querySelector('[data-target-edge="minGain"]')?.getAttribute('d')).toMatch(/^M/);
    expect(screen.getByText('Edge of the gain target')).toBeTruthy();
  });

  it('an impossible target says which target shuts the plane out and how far the best point misses', async () => {
    const { store, user, field } = setup();
    await user.type(field(/^Least gain/), '500');
    await waitFor(() => expect(store.getState().region?.complete).toBe(true));
    expect(screen.getByTestId('region-status').textContent).toMatch(/^No point meets every target\. Gain fails at 100 % of them\. The best point's weakest target is gain, missed by \d+(\.\d+)? %\.$/);
  });

  it('the best point is one click away, and the ranking takes a tube and its design', async () => {
    const { store, user, field } = setup();
    await user.type(field(/^Least gain/), '12');
    await user.type(field(/^Most plate dissipation/), '60');
    await waitFor(() => expect(store.getState().region?.complete).toBe(true));
    const best = store.getState().region!.result;
    if (!best.ok || !best.best) throw new Error('a best point');
    // Snapping (the demo's E24): the parts to order around the best point, the pair whose weakest target holds best.
    expect(store.getState().design.snap).toBe(true);
    await user.click(screen.getByRole('button', { name: 'Move to the best point' }));
    const want = preferredBest(stageDesignOf({ ...store.getState().design, ra: best.best.ra, rk: best.best.rk }, store.getState().analysis.tube, store.getState().registry), targetsOf(store.getState().design.targets), 'E24');
    if (!want.ok) throw new Error(want.message);
    expect([store.getState().design.ra, store.getState().design.rk]).toEqual([want.ra, want.rk]);
    expect(preferredAround(best.best.ra, 'E24')).toContain(want.ra);
    // Not snapping: the exact point.
    act(() => store.getState().setSnap(false));
    await user.click(screen.getByRole('button', { name: 'Move to the best point' }));
    expect(store.getState().design.ra).toBeCloseTo(best.best.ra, 6);
    await user.click(screen.getByRole('button', { name: 'Rank every tube for these targets' }));
    await waitFor(() => expect(store.getState().ranking?.result?.ok).toBe(true));
    const ranking = store.getState().ranking!.result!;
    if (!ranking.ok) throw new Error(ranking.message);
    const top = ranking.ranks[0]!;
    await user.click(screen.getByRole('button', { name: new RegExp(`^Take the ${top.tubeId} at`) }));
    expect(store.getState().design.tubeId).toBe(top.tubeId);
    expect(store.getState().design.ra).toBeCloseTo(top.ra, 6);
    expect(store.getState().design.rk).toBeCloseTo(top.rk, 6);
  }, 20_000); // ranks every library tube on the test's own thread (the page does it in a worker)

  it('each target is judged at the operating point now, beside the region and on the build card', async () => {
    const { store, user, view, field } = setup();
    await user.type(field(/^Least gain/), '12');
    await user.type(field(/^Most Zout/), '5k');
    const d = store.getState().design;
    const model = judgeDesign(stageDesignOf(d, findTube(d.tubeId)!, LIBRARY_TUBES), { minGain: 12, maxZout: 5e3 });
    if (!model.ok) throw new Error(model.message);
    const items = [...view.container.querySelectorAll('.target-verdicts li')].map((li) => [li.getAttribute('data-target'), li.textContent]);
    expect(items.map(([k]) => k)).toEqual(['minGain', 'maxZout']);
    for (const [k, text] of items) expect(text!.startsWith(model.failing.includes(k as 'minGain') ? '✗' : '✓')).toBe(true);
    const card = cardSections(store.getState()).find((c) => c.heading === 'Targets');
    expect(card?.lines).toHaveLength(2);
    expect(card!.lines[0]).toMatch(model.failing.includes('minGain') ? /^MISSED: gain [\d.]+ ×, missed by/ : /^Met: gain [\d.]+ ×, met with/);
    // The value shown is the model's gain at this design.
    expect(model.values.minGain).toBeCloseTo(Math.abs(store.getState().analysis.solution.gain), 9);
    expect(items[0]![1]).toContain(`${Number(model.values.minGain!.toPrecision(3))} ×`);
    // A level past the clean swing has no THD to show: the phrase is set off from the label, not run into it.
    await user.type(field(/^Most THD/), '1');
    await user.type(field(/^THD measured at/), '200');
    const thd = view.container.querySelector('.target-verdicts li[data-target="maxThdAt"]')!;
    expect(thd.textContent).toMatch(/^✗ THD at level: the level is past the clean swing; missed by [\d.]+ %$/);
    expect(cardSections(store.getState()).find((c) => c.heading === 'Targets')!.lines).toContainEqual(expect.stringMatching(/^MISSED: THD at level: the level is past the clean swing, missed by/));
  });

  it('a bad target is refused beside its box, and the design keeps its last targets', async () => {
    const { store, user, field } = setup();
    // "8" is taken as typed; "80" is refused, and 8 % stays in force.
    await user.type(field(/^Most THD/), '80');
    expect(screen.getByText('THD must be from 0.001 to 50 %')).toBeTruthy();
    expect(store.getState().design.targets.maxThd).toBeCloseTo(0.08, 12);
  });

  it('with the point kept inside, a drag toward a failing point stops inside the region', async () => {
    const { store, user, field } = setup();
    await user.type(field(/^Most plate dissipation/), '30');
    await waitFor(() => expect(store.getState().region?.complete).toBe(true));
    await user.click(screen.getByRole('checkbox', { name: /Keep the point inside the region/ }));
    const s = store.getState();
    const { vmax, iaMax } = s.analysis.sheet.extent;
    s.beginDrag('point');
    // Far up at mid voltage: well past 30 % of the rated dissipation.
    store.getState().dragPointTo(vmax * 0.5, iaMax * 0.9);
    const op = store.getState().analysis.solution.op;
    const rating = findTube(store.getState().design.tubeId)!.ratings.maxPlateDissipation;
    expect(op.pa).toBeLessThanOrEqual(0.3 * rating * 1.05);
    expect(store.getState().dragNote).toBe('Held inside the target region.');
    store.getState().endDrag();
    // Released: snapped to preferred values that keep it inside (each the nearest or its neighbour in the series).
    const after = store.getState();
    const region = after.region!.result;
    if (!region.ok) throw new Error(region.message);
    expect(failingAt(region, after.analysis.solution.op.vpk, after.analysis.solution.op.ia)).toEqual([]);
    expect(preferredAround(after.design.ra, after.design.series)[0]).toBe(after.design.ra);
  });
});

describe('targets on the output bench', () => {
  /** The output bench with the demo's single-ended EL34, a power target typed (box by box, as a builder does). */
  async function onOutput(power: string, thd: string) {
    const s = setup();
    act(() => s.store.getState().setStageKind('output'));
    await s.user.type(s.field(/^Least power/), power);
    await s.user.type(s.field(/^within THD/), thd);
    await waitFor(() => expect(s.store.getState().outputRegion?.complete).toBe(true));
    return s;
  }

  it('a power target hatches the idle points (bias and B+) that meet it at this primary: the model\'s own cells', async () => {
    const { store, view } = await onOutput('4', '5');
    const d = store.getState().design.output;
    expect(store.getState().design.outputTargets).toMatchObject({ minPowerW: 4, powerThd: 0.05 });
    const { pair: _p, splitter: _s, raa: _r, mismatch: _m, idleMismatch: _i, ...design } = d;
    const model = outputRegion({ pair: 'single-ended', tube: findOutputTube('EL34')!, design }, { minPower: { power: 4, thd: 0.05 } }, { nx: 60, ny: 40, extent: store.getState().outputBench.analysis.sheet.extent });
    if (!model.ok) throw new Error(model.message);
    const inside = model.inside.flat().filter(Boolean).length;
    expect(inside).toBeGreaterThan(0);
    expect(view.container.querySelectorAll('.plate-chart [data-region="inside"] rect').length).toBe(inside);
    expect(screen.getByTestId('region-status').textContent).toMatch(new RegExp(`^${inside} of \\d+ reachable points on the 60 × 40 grid meet every target\\.$`));
    expect(view.container.querySelector('[data-target-edge="minPower"]')?.getAttribute('d')).toMatch(/^M/);
    expect(screen.getByText('Edge of the power target')).toBeTruthy();
    // The gain stage's boxes are not offered here: they say nothing of an output stage.
    expect(screen.queryByRole('textbox', { name: /^Least gain/ })).toBeNull();
    // The cursor's readout names what fails under it, as the region has it.
    const i = model.inside.findIndex((column) => column.some(Boolean));
    const j = model.inside[i]!.findIndex(Boolean);
    act(() => store.getState().setOutputHover({ vpk: model.va[i]!, ip: model.ia[j]! }));
    expect(screen.getByTestId('output-hover-readout').textContent).toMatch(/· targets: all met$/);
    act(() => store.getState().setOutputHover({ vpk: model.va[i]!, ip: model.ia[0]! }));
    expect(screen.getByTestId('output-hover-readout').textContent).toMatch(/· targets failing: power$/);
  }, 20_000);

  it('keeps its own targets: the voltage stage\'s Zout and dissipation are not the output stage\'s, and neither empties the other\'s chart', async () => {
    const s = setup();
    await s.user.type(s.field(/^Most Zout/), '20k');
    await s.user.type(s.field(/^Most plate dissipation/), '40');
    act(() => s.store.getState().setStageKind('output'));
    // The output bench's boxes start empty: the voltage stage's 20 kΩ and 40 % are not its.
    expect(s.field(/^Most Zout/).value).toBe('');
    await s.user.type(s.field(/^Most Zout/), '2');
    await s.user.type(s.field(/^Least power/), '4');
    await s.user.type(s.field(/^within THD/), '5');
    await waitFor(() => expect(s.store.getState().outputRegion?.complete).toBe(true));
    expect(s.store.getState().design.outputTargets).toMatchObject({ maxZout: 2, minPowerW: 4, maxDissipationFraction: null });
    expect(s.store.getState().design.targets).toMatchObject({ maxZout: 20e3, maxDissipationFraction: 0.4, minPowerW: null });
    act(() => s.store.getState().setStageKind('voltage'));
    expect(s.field(/^Most Zout/).value).toBe('20k');
    await waitFor(() => expect(s.store.getState().region?.complete).toBe(true));
    const r = s.store.getState().region!.result;
    if (!r.ok) throw new Error(r.message);
    // The gain stage's region answers its own two targets only (the output stage's 2 Ω would empty it).
    expect(r.inside.flat().some(Boolean)).toBe(true);
    // Clearing on the output bench clears its targets only.
    act(() => s.store.getState().setStageKind('output'));
    await s.user.click(screen.getByRole('button', { name: 'Clear targets' }));
    expect(s.store.getState().design.outputTargets.maxZout).toBeNull();
    expect(s.store.getState().design.targets.maxZout).toBe(20e3);
  }, 30_000);

  it('judges the stage at its idle point, on the panel and the card; the best point is one click away', async () => {
    const { store, user, view } = await onOutput('4', '5');
    const v = store.getState().verdict;
    if (!v?.ok) throw new Error('a verdict');
    const item = view.container.querySelector('.target-verdicts li[data-target="minPower"]')!;
    expect(item.textContent).toMatch(new RegExp(`^${v.failing.includes('minPower') ? '✗' : '✓'} Power ${Number(v.values.minPower!.toPrecision(3))} W: `));
    expect(cardSections(store.getState()).find((c) => c.heading === 'Targets')?.lines[0]).toMatch(/^(Met|MISSED): power [\d.]+ W, /);
    const region = store.getState().outputRegion!.result;
    if (!region.ok || !region.best) throw new Error('a best point');
    await user.click(screen.getByRole('button', { name: 'Move to the best point' }));
    expect(store.getState().design.output.bplus).toBe(Math.round(region.best.parts.bplus));
    // Rk snapped to the series: the bias the best point asked for, to the nearest preferred value.
    expect(store.getState().design.output.rk).toBe(nearestPreferred(region.best.parts.rk, store.getState().design.series));
  }, 20_000);

  it('ranks every output tube in the socket and takes one at its best bias and B+', async () => {
    const { store, user } = await onOutput('4', '5');
    await user.click(screen.getByRole('button', { name: 'Rank every tube for these targets' }));
    await waitFor(() => expect(store.getState().outputRanking?.result?.ok).toBe(true));
    const ranking = store.getState().outputRanking!.result!;
    if (!ranking.ok) throw new Error(ranking.message);
    const top = ranking.ranks.find((r) => r.tubeId !== 'EL34')!;
    await user.click(screen.getByRole('button', { name: new RegExp(`^Take the ${top.tubeId} at B\\+`) }));
    expect(store.getState().design.output.tubeId).toBe(top.tubeId);
    expect(store.getState().design.output.bplus).toBe(Math.round(top.parts.bplus));
  }, 30_000);

  it('with the point kept inside, a drag toward a failing idle point stops inside the region', async () => {
    const { store, user } = await onOutput('4', '5');
    await user.click(screen.getByRole('checkbox', { name: /Keep the point inside the region/ }));
    const region = store.getState().outputRegion!.result;
    if (!region.ok) throw new Error(region.message);
    // Far below the region: a whisper of current, where no power target holds.
    act(() => {
      store.getState().beginDrag('output-point');
      store.getState().dragOutputPointTo(region.va[30]!, region.ia[1]!);
    });
    expect(store.getState().dragNote).toBe('Held inside the target region.');
    const op = benchPoint(store.getState().outputBench);
    expect(failingAt(region, op.vpk, op.ip)).toEqual([]);
    act(() => store.getState().endDrag());
  }, 20_000);
});
