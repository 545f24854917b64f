import { render, screen } from '@testing-library/react';
import { singleEnded } from '../helpers/singleEnded';
import userEvent from '@testing-library/user-event';
import { act } from 'react';
import { describe, expect, it } from 'vitest';
import { App } from '../../app/App';
import { readDesignFile, writeDesignFile } from '../../app/keep/designFile';
import { createWorkbenchStore } from '../../app/store/workbenchStore';
import { expectClose } from '../helpers/expectClose';

async function setup() {
  const store = createWorkbenchStore();
  const user = userEvent.setup();
  const view = render(<App store={store} />);
  await user.click(screen.getByLabelText('Output stage (transformer-coupled)'));
  const figure = (name: string) => view.container.querySelector(`[data-figure="${name}"] dd`)!.textContent;
  const field = (label: RegExp) => screen.getByRole('textbox', { name: label }) as HTMLInputElement;
  return { store, user, view, figure, field };
}

describe('the output stage on the bench', () => {
  it('shows the output figures, chart and schematic once chosen, and keeps the voltage stage as it was', async () => {
    const { store, figure, view } = await setup();
    expect(store.getState().design.stageKind).toBe('output');
    expect(figure('clean-power')).toMatch(/W at .* % THD/);
    expect(figure('damping')).toMatch(/^\d/);
    expect(view.container.querySelector('svg.plate-chart .layer-curves path')).not.toBeNull();
    expect(screen.getByRole('img', { name: /EL34 single-ended output stage, ultralinear connection/ })).toBeTruthy();
    expect(store.getState().design.ra).toBe(27e3);
  });

  it('a bad primary impedance gets its message beside the field and the last good design stays', async () => {
    const { store, user, field, figure } = await setup();
    const before = figure('clean-power');
    const z = field(/^Primary Z/);
    await user.clear(z);
    await user.type(z, '50');
    expect(screen.getByText('Primary impedance must be at least 100 Ω')).toBeTruthy();
    expect(z.getAttribute('aria-invalid')).toBe('true');
    expect(store.getState().design.output.zPrimary).toBe(3500);
    expect(figure('clean-power')).toBe(before);
    await user.clear(z);
    await user.type(z, '5k');
    expect(store.getState().design.output.zPrimary).toBe(5000);
  });

  it('switching to fixed bias keeps the idle current with B+ unchanged; back to cathode bias gives the Rk that holds the grid', async () => {
    const { store, user } = await setup();
    const before = singleEnded(store.getState().outputBench).analysis.solution.op;
    const bplus = store.getState().design.output.bplus;
    await user.click(screen.getByLabelText('Fixed bias'));
    const fixed = singleEnded(store.getState().outputBench).analysis.solution.op;
    expect(store.getState().design.output.bias).toBe('fixed');
    expect(store.getState().design.output.bplus).toBe(bplus);
    // The grid supply is rounded to 0.1 V: the current lands within a couple of per cent.
    expectClose(fixed.ip, before.ip, { rel: 0.02 }, 'idle current');
    expect(fixed.vpk).toBeGreaterThan(before.vpk + 0.9 * before.vk);
    await user.click(screen.getByLabelText('Cathode bias (Rk, bypassed)'));
    const rk = store.getState().design.output.rk;
    expectClose(rk, -fixed.vgk / fixed.ik, { abs: 0.5 }, 'Rk = -Vgk/Ik');
  });

  it('a power triode offers only the triode connection', async () => {
    const { store, user } = await setup();
    await user.selectOptions(screen.getByLabelText('Output tube'), '300B');
    expect(store.getState().design.output.tubeId).toBe('300B');
    expect((screen.getByLabelText('Pentode') as HTMLInputElement).disabled).toBe(true);
    expect((screen.getByLabelText('Triode-connected') as HTMLInputElement).checked).toBe(true);
  });

  it('compares a second output tube on the same parts', async () => {
    const { store, user, view } = await setup();
    await user.click(screen.getByLabelText('Compare with'));
    expect(store.getState().outputRival.on).toBe(true);
    const row = view.container.querySelector('tr[data-row="clean"]')!;
    expect(row.textContent).toMatch(/W.*W/);
    expect(view.container.querySelectorAll('.layer-rival-curves path').length).toBeGreaterThan(3);
  });

  it('the rival is wired as the socket is (the demo EL34 is ultralinear, so the 6L6GC keeps the tap) until another connection is chosen', async () => {
    const { store, user, view } = await setup();
    await user.click(screen.getByLabelText('Compare with'));
    const connection = screen.getByLabelText('Its connection') as HTMLSelectElement;
    expect(connection.selectedOptions[0]!.textContent).toBe('as wired (ultralinear)');
    const rivalOp = () => {
      const b = store.getState().outputRivalBench;
      return b?.ok && b.pair === 'single-ended' ? b.analysis.solution.op.connection : null;
    };
    expect(rivalOp()).toBe('ultralinear');
    expect(view.container.querySelector('section.compare .compare-table thead')!.textContent).toMatch(/6L6GC \(ultralinear\)/);
    await user.selectOptions(connection, 'pentode');
    expect(rivalOp()).toBe('pentode');
    // A power triode has no screen: one choice, whatever the socket.
    await user.selectOptions(screen.getByLabelText('Second output tube'), '300B');
    expect([...connection.options].map((o) => o.textContent)).toEqual(['triode']);
    expect(rivalOp()).toBe('triode');
  });
});

describe('output stage in the store', () => {
  it('dragging the point puts it under the pointer by setting Rk and B+, and the drag is one undo step', () => {
    const store = createWorkbenchStore();
    const s = store.getState();
    s.setStageKind('output');
    const before = store.getState().design;
    store.getState().beginDrag('output-point');
    store.getState().dragOutputPointTo(280, 0.07);
    store.getState().dragOutputPointTo(320, 0.06);
    const op = singleEnded(store.getState().outputBench).analysis.solution.op;
    expectClose(op.vpk, 320, { rel: 1e-4 }, 'Vpk under the pointer');
    expectClose(op.ip, 0.06, { rel: 1e-4 }, 'Ia under the pointer');
    store.getState().endDrag();
    const after = store.getState().design.output;
    expect(after.rk).not.toBe(before.output.rk);
    expect(Number.isInteger(after.bplus)).toBe(true);
    store.getState().undo();
    expect(store.getState().design).toEqual(before);
  });

  it('dragging the load handle sets the primary impedance through that point', () => {
    const store = createWorkbenchStore();
    store.getState().setStageKind('output');
    const { vpk, ip } = singleEnded(store.getState().outputBench).analysis.solution.op;
    const rPri = store.getState().design.output.rPrimary;
    store.getState().beginDrag('output-load');
    store.getState().dragOutputLoadTo(vpk + 0.03 * (5000 + rPri), ip - 0.03);
    store.getState().endDrag();
    expect(store.getState().design.output.zPrimary).toBe(5000);
    expect(store.getState().outputBench.light).toBe(false);
  });

  it('a design file carries the output stage and which stage is shown', () => {
    const store = createWorkbenchStore();
    store.getState().setStageKind('output');
    store.getState().changeOutput({ tubeId: 'KT88', connection: 'triode', zPrimary: 2500 });
    const s = store.getState();
    const back = readDesignFile(writeDesignFile({ title: s.title, design: s.design }));
    if (!back.ok) throw new Error(back.message);
    expect(back.doc.design.stageKind).toBe('output');
    expect(back.doc.design.output).toEqual(s.design.output);
  });
});

describe('the build card for an output stage', () => {
  it('lists the stage, power, ratings, transformer and parts, and the comparison when on', async () => {
    const { cardSections } = await import('../../app/export/buildCard');
    const store = createWorkbenchStore();
    store.getState().setStageKind('output');
    store.getState().setOutputRival({ on: true, tubeId: 'KT88', connection: 'ultralinear' });
    const sections = cardSections(store.getState());
    const text = sections.map((s) => `${s.heading}\n${s.lines.join('\n')}`).join('\n');
    // The demo's stages are joined, so the card opens with the whole amplifier and ends with the parts of the voltage stages driving it,
    // then the tubes for the whole design, and last every stage's voltages to check at first switch-on.
    expect(sections.map((s) => s.heading)).toEqual([
      'Amplifier', 'Output stage', 'Operating point', 'Power and distortion', 'Ratings, every stage', 'Parts to order', 'Compared: EL34 against KT88 (same parts)',
      'Stage 1, 12AX7 gain stage', 'Stage 2, 12AU7 gain stage', 'Tubes to order', 'Voltages to check at first switch-on',
    ]);
    expect(text).toMatch(/Tubes to order\nTubes: 1 × 12AX7 \(1 of 2 sections used\), 1 × 12AU7 \(1 of 2 sections used\), 1 × EL34$/m);
    expect(text).toMatch(/Output transformer: 3\.5 kΩ to 8 Ω/);
    expect(text).toMatch(/screen on a 43 % tap/);
    expect(text).toMatch(/At the onset of (grid current|cutoff): .* W at .* THD/);
  });
});

describe('bias for a wanted point', () => {
  it('typing 300 V and 70 mA sets Rk (snapped) and B+ so the point lands there to the snap', async () => {
    const { store, user } = await setup();
    await user.type(screen.getByRole('textbox', { name: 'Vpk (V)' }), '300');
    await user.type(screen.getByRole('textbox', { name: 'Ia (mA)' }), '70');
    await user.click(screen.getByRole('button', { name: 'Set Rk and B+' }));
    expect(screen.getByText('Bias and B+ set for that point.')).toBeTruthy();
    const { op } = singleEnded(store.getState().outputBench).analysis.solution;
    // Rk snapped to E24 (±5 %) moves the current a little; B+ is set to the volt.
    expectClose(op.ip, 0.07, { rel: 0.05 }, 'Ia');
    expectClose(op.vpk, 300, { rel: 0.02 }, 'Vpk');
  });

  it('a point above the 0 V grid curve gets the model\'s reason', async () => {
    const { user } = await setup();
    await user.type(screen.getByRole('textbox', { name: 'Vpk (V)' }), '60');
    await user.type(screen.getByRole('textbox', { name: 'Ia (mA)' }), '400');
    await user.click(screen.getByRole('button', { name: 'Set Rk and B+' }));
    expect(screen.getByRole('alert').textContent).toMatch(/grid above the cathode/);
  });
});

describe('exports read settled figures', () => {
  it('a build card made right after typing carries the full analysis for the new value, not the last one', async () => {
    const { cardSections } = await import('../../app/export/buildCard');
    const store = createWorkbenchStore();
    store.getState().setStageKind('output');
    const before = singleEnded(store.getState().outputBench).analysis.atLimit!.power;
    store.getState().editField('oZ', '5k'); // a keystroke: the light pass
    expect(store.getState().outputBench.light).toBe(true);
    store.getState().settleAnalysis(); // what the export buttons do first
    const after = singleEnded(store.getState().outputBench).analysis.atLimit!.power;
    expect(after).not.toBeCloseTo(before, 3);
    const text = cardSections(store.getState()).flatMap((s) => s.lines).join('\n');
    expect(text).toContain(`Within 5 % THD: ${Number(after.toPrecision(3))} W`);
  });
});

describe('what the single-ended figures hold', () => {
  // The figures' steady state (tests/spice/outputSteadyState.spice.test.ts) is said where the single-ended figures are.
  it('a single-ended stage says its figures are for a sustained drive, the magnetising current settled; a pair, whose halves cancel it, does not', () => {
    const store = createWorkbenchStore();
    render(<App store={store} />);
    act(() => store.getState().setStageKind('output'));
    expect(screen.getByTestId('single-ended-steady-state').textContent).toMatch(/sustained drive.*magnetising current/);
    act(() => store.getState().setOutputPair('push-pull'));
    expect(screen.queryByTestId('single-ended-steady-state')).toBeNull();
  });

  // The screen dropper's sag (tests/output/screenFeed.test.ts) is a warning like any: in the one ratings list and on the card.
  it('a pentode screen dropped below B+ warns of its sag at full drive in the ratings list and on the build card', async () => {
    const store = createWorkbenchStore();
    render(<App store={store} />);
    act(() => { store.getState().changeOutput({ connection: 'pentode' }); });
    const ratings = screen.getByRole('region', { name: 'Ratings checks' });
    expect(ratings.textContent).toMatch(/Output stage, EL34: At full drive the screens draw 18\.\d mA on average/);
    const { cardSections } = await import('../../app/export/buildCard');
    const lines = cardSections(store.getState()).flatMap((c) => c.lines);
    expect(lines.some((l) => /^WARNING: Output stage, EL34: At full drive the screens draw/.test(l))).toBe(true);
  });
});
