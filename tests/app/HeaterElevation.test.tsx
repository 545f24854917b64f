import { fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { act } from 'react';
import { describe, expect, it } from 'vitest';
import { App } from '../../app/App';
import { cardSections } from '../../app/export/buildCard';
import { readDesignFile, writeDesignFile } from '../../app/keep/designFile';
import { benchFindings } from '../../app/store/amplifierFindings';
import { createWorkbenchStore } from '../../app/store/workbenchStore';
import { solveOnSupply } from '../../src/index';

const cardLines = (store: ReturnType<typeof createWorkbenchStore>, heading: string) => cardSections(store.getState()).find((s) => s.heading === heading)?.lines ?? [];
/** Each stage's heater–cathode finding, by its place in the chain. */
const heaterCathode = (store: ReturnType<typeof createWorkbenchStore>) =>
  Object.fromEntries(benchFindings(store.getState()).filter((f) => f.kind === 'heater-cathode').map((f) => [f.stage, { severity: f.severity, volts: Math.round(f.value) }]));

// A 12AU7 follower direct-coupled to the demo's driver, raised to a 400 V B+: its cathode sits near 223 V, past the
// 12AU7's 200 V rating with the cathode positive to the heater (Tung-Sol 12AU7, 1962: 200 V positive, 100 V negative).
function followerOn400() {
  const store = createWorkbenchStore();
  act(() => {
    store.getState().setStage2({ kind: 'follower', tubeId: '12AU7' });
    store.getState().editField('bplus', '400');
    store.getState().settleAnalysis();
    store.getState().settleField('bplus');
  });
  return store;
}

describe('heaters held above ground: the ratings follow, and the divider is designed', () => {
  it('a follower past its heater–cathode rating is brought inside by holding the heaters at 60 V from a divider off stage 1\'s B+', async () => {
    const store = followerOn400();
    const user = userEvent.setup();
    render(<App store={store} />);
    const sheet = within(screen.getByRole('region', { name: 'Build sheet' }));
    // At ground: the follower (stage 3) is past its rating, so the sheet asks for an elevation, no divider yet.
    expect(heaterCathode(store)[2]).toEqual({ severity: 'danger', volts: 223 });
    expect(sheet.getByTestId('elevation').textContent).toMatch(/^Elevate the heater supply to about/);
    expect(sheet.queryByTestId('elevation-divider')).toBeNull();

    const box = sheet.getByLabelText(/^Heaters held at/);
    await user.clear(box);
    await user.type(box, '60');
    expect(store.getState().design.heaters.elevationVolts).toBe(60);
    // Every small tube's heater–cathode voltage is now taken from 60 V: the follower 223 − 60 = 163 V positive (82 % of 200 V);
    // stage 1's 12AX7 at 1.4 V is 58.6 V negative (of 180 V, one figure: Tung-Sol 12AX7); stage 2's 12AU7 at 8.1 V is 52 V negative
    // (of 100 V). The EL34 shares the 6.3 V winding, so its cathode at 23 V is now 37 V negative (of 100 V).
    expect(heaterCathode(store)).toMatchObject({ 0: { volts: 59 }, 1: { severity: 'note', volts: 52 }, 2: { volts: 163 }, 3: { volts: 37 } });
    expect(benchFindings(store.getState()).find((f) => f.stage === 3 && f.kind === 'heater-cathode')?.message).toContain('cathode negative to the heater');
    expect(heaterCathode(store)[2]!.severity).not.toBe('danger');
    expect(sheet.getByTestId('elevation').textContent).toMatch(/^With the heaters held at 60 V, every stage is within its heater–cathode rating/);
    // The divider by Ohm's law (as in tests/build: Rh1 = 220k · (275 − 60) / 60 = 788 kΩ, nearest E24 820 kΩ): from the lowest gain
    // stage's B+, stage 1's 275 V, the heaters at 275 · 220 / 1040 = 58.2 V, 275 V / 1.04 MΩ = 264 µA.
    expect(sheet.getByTestId('elevation-divider').textContent).toBe(
      "Divider from stage 1's B+ (275 V): Rh1 820 kΩ (0.25 W) to Rh2 220 kΩ (0.125 W) to ground, Ch 470 nF 160 V across Rh2; the heater winding's centre tap (or one side) to their junction. The heaters sit at 58.2 V; the divider draws 264 µA from that node (a load on the supply there when the amplifier is solved on it).",
    );
    expect(cardLines(store, 'Heaters').slice(0, 2)).toEqual([
      expect.stringMatching(/^With the heaters held at 60 V/),
      expect.stringMatching(/^Divider from stage 1's B\+ \(275 V\): Rh1 820 kΩ/),
    ]);
    expect(cardLines(store, 'Parts to order')).toContain('Heater elevation Rh1 820 kΩ 0.25 W, Rh2 220 kΩ 0.125 W, Ch 470 nF 160 V');
    // The supply's list of windings says which one the divider holds: the 6.3 V winding the small tubes share with the EL34.
    expect(screen.getByTestId('heater-windings').textContent).toMatch(/^6\.3 V, 2\.1 A \(13\.2 VA\): 12AX7 .*EL34 \(6\.3 V, 1\.5 A\); held at 60 V DC by the elevation divider on the build sheet\./);
    expect(cardLines(store, 'Heaters')).toContain('Winding 6.3 V, 2.1 A (13.2 VA): 12AX7 (6.3 V, 0.3 A), 12AU7 (6.3 V, 0.3 A), EL34 (6.3 V, 1.5 A), held at 60 V');

    // Held too high, the 12AU7 driver's cathode falls past its 100 V negative rating: the advice says so, and so does the list.
    fireEvent.change(box, { target: { value: '150' } });
    expect(heaterCathode(store)[1]).toEqual({ severity: 'danger', volts: 142 });
    expect(sheet.getByTestId('elevation').textContent).toMatch(/^Held at 150 V, the heaters leave a stage past its heater–cathode rating: hold them anywhere from 23\.\d V to 108 V/);

    // Out of range is refused beside the box; the last good value stays. Values typed within a second are one undo step
    // (COALESCE_MS): undone, the heaters are back at ground and the follower past its rating again.
    fireEvent.change(box, { target: { value: '600' } });
    expect(sheet.getByText('must be a number from 0 to 500 V')).toBeTruthy();
    expect(store.getState().design.heaters.elevationVolts).toBe(150);
    act(() => store.getState().undo());
    expect(store.getState().design.heaters.elevationVolts).toBeUndefined();
    expect(heaterCathode(store)[2]).toEqual({ severity: 'danger', volts: 223 });
  });

  it('the output tubes share the elevated winding only on AC: with the small tubes on a DC supply they stay at ground', () => {
    const store = followerOn400();
    act(() => store.getState().setHeaters({ elevationVolts: 60 }));
    expect(heaterCathode(store)[3]).toEqual({ severity: 'note', volts: 37 });
    act(() => store.getState().setHeaters({ voltageStages: 'dc' }));
    expect(heaterCathode(store)[3]).toEqual({ severity: 'note', volts: 23 });
    // The small tubes keep their elevation on the DC supply.
    expect(heaterCathode(store)[2]!.volts).toBe(163);
  });

  it('the heater–cathode target reads the same potential: the driver met at ground, missed with the heaters at 150 V (cathode negative past 100 V)', () => {
    const store = followerOn400();
    render(<App store={store} />);
    act(() => store.getState().setHeaterTarget(true));
    const verdict = () => {
      const v = store.getState().verdict;
      return v?.ok ? v : null;
    };
    expect(screen.getByLabelText(/^Heater–cathode voltage within the rating for its polarity \(heaters at ground\)/)).toBeTruthy();
    expect(verdict()?.failing).not.toContain('heaterCathodeWithinRating');
    act(() => store.getState().setHeaters({ elevationVolts: 150 }));
    expect(screen.getByLabelText(/^Heater–cathode voltage within the rating for its polarity \(heaters held at 150 V\)/)).toBeTruthy();
    expect(verdict()?.failing).toContain('heaterCathodeWithinRating');
    expect(verdict()?.values.heaterCathodeWithinRating).toBeCloseTo(8.06 - 150, 1);
  });

  it('the follower\'s own heater–cathode figure names the rating for its polarity: 200 V above the heaters, 100 V below them', () => {
    const store = followerOn400();
    act(() => store.getState().showStage(2));
    render(<App store={store} />);
    const label = () => document.querySelector('[data-figure="follower-vhk"] dt')?.textContent;
    expect(label()).toBe('Heater–cathode (rated 200 V)');
    // Held at 250 V, the follower's 223 V cathode sits 27 V below its heaters.
    act(() => store.getState().setHeaters({ elevationVolts: 250 }));
    expect(label()).toBe('Heater–cathode (cathode negative, rated 100 V)');
  });

  it('the suggestion is one click: held at the whole volts the advice names, every stage is within its rating', async () => {
    const store = followerOn400();
    const user = userEvent.setup();
    render(<App store={store} />);
    const sheet = within(screen.getByRole('region', { name: 'Build sheet' }));
    // The window: from the follower's 223 V less its 200 V (23 V) to the driver's 8.1 V plus its 100 V negative rating (108 V).
    const button = sheet.getByRole('button', { name: /^Hold them at \d+ V$/ });
    const volts = Number(/(\d+) V$/.exec(button.textContent!)![1]);
    expect(volts).toBeGreaterThan(23);
    expect(volts).toBeLessThan(108);
    await user.click(button);
    expect(store.getState().design.heaters.elevationVolts).toBe(volts);
    expect(sheet.getByTestId('elevation').textContent).toMatch(new RegExp(`^With the heaters held at ${volts} V, every stage is within`));
    expect(sheet.queryByRole('button', { name: /^Hold them at/ })).toBeNull();
    expect(heaterCathode(store)[2]!.severity).not.toBe('danger');
  });

  it('the divider is a load on the supply at its stage\'s node: 264 µA more at node 4, named in the node table', async () => {
    const store = createWorkbenchStore({ supplySolver: async (input) => solveOnSupply(input) });
    render(<App store={store} />);
    const solved = async () => {
      await waitFor(() => expect(store.getState().supplyView?.stale === false && store.getState().supplyView?.result.ok).toBe(true), { timeout: 10_000 });
      const r = store.getState().supplyView!.result;
      if (!r.ok) throw new Error(r.message);
      return r;
    };
    const before = await solved();
    act(() => store.getState().setHeaters({ elevationVolts: 60 }));
    await waitFor(() => expect(store.getState().supplyView?.ownLoads[3]).toBeGreaterThan(0), { timeout: 10_000 });
    const after = await solved();
    // The demo's two gain stages hang from node 4 (275 V): the divider from it draws 275 V / 1.04 MΩ = 264 µA (Ohm's law).
    expect(store.getState().supplyView!.ownLoads).toEqual([0, 0, 0, expect.closeTo(0.2644e-3, 6)]);
    // Node 4 carries its stages' currents and the divider's (Kirchhoff): the stages draw a little less as the node sags.
    const view = store.getState().supplyView!;
    const stagesAt4 = after.amplifier.stages.reduce((sum, st, i) => (view.feeds[i] === 3 ? sum + st.supplyCurrent : sum), 0);
    expect(after.loads[3]! - stagesAt4).toBeCloseTo(0.2644e-3, 6);
    expect(after.bplus.every((b, i) => b <= before.bplus[i]!)).toBe(true);
    expect(screen.getByRole('row', { name: /^4 / }).textContent).toContain('the heater elevation divider (264 µA)');
  });

  it('a divider cannot hold the heaters above nine tenths of its node: the sheet says so in place of parts', () => {
    const store = followerOn400();
    act(() => store.getState().setHeaters({ elevationVolts: 260 }));
    render(<App store={store} />);
    const sheet = within(screen.getByRole('region', { name: 'Build sheet' }));
    expect(sheet.getByTestId('elevation-divider').textContent).toBe('A divider from 275 V cannot hold the heaters at 260 V: take it from a higher node, or elevate less');
    expect(cardLines(store, 'Parts to order').some((l) => l.startsWith('Heater elevation'))).toBe(false);
  });

  it('the phase splitter\'s heater rides with the small tubes\': a cathodyne\'s high cathode is taken from the elevation too', () => {
    const store = createWorkbenchStore();
    act(() => store.getState().setOutputPair('push-pull'));
    const splitter = () => {
      const s = store.getState();
      const i = s.amplifier!.input.stages.findIndex((st) => st.kind === 'split-load' || st.kind === 'long-tailed-pair');
      const f = s.amplifier!.result.ok ? s.amplifier!.result.stages[i]!.findings.find((x) => x.kind === 'heater-cathode') : undefined;
      return { vk: s.amplifier!.result.ok ? s.amplifier!.result.stages[i]!.op.vk : Number.NaN, vhk: f?.value };
    };
    const atGround = splitter();
    expect(atGround.vhk).toBeCloseTo(atGround.vk, 6);
    act(() => store.getState().setHeaters({ elevationVolts: 40 }));
    const held = splitter();
    expect(held.vk).toBeCloseTo(atGround.vk, 6);
    expect(held.vhk).toBeCloseTo(Math.abs(atGround.vk - 40), 6);
  });

  it('the elevation is kept in the design file; a file without it opens with the heaters at ground, and a bad one names the field', () => {
    const store = followerOn400();
    act(() => store.getState().setHeaters({ elevationVolts: 60 }));
    const back = readDesignFile(writeDesignFile({ title: 't', design: store.getState().design }));
    if (!back.ok) throw new Error(back.message);
    expect(back.doc.design.heaters.elevationVolts).toBe(60);
    const old = JSON.parse(writeDesignFile({ title: 't', design: store.getState().design }));
    delete old.design.heaters.elevationVolts;
    const before = readDesignFile(JSON.stringify(old));
    expect(before.ok && before.doc.design.heaters.elevationVolts).toBeUndefined();
    old.design.heaters.elevationVolts = -5;
    expect(readDesignFile(JSON.stringify(old))).toEqual({ ok: false, message: 'design.heaters.elevationVolts must be a number from 0 to 500 V (found -5). Nothing was opened.' });
  });
});
