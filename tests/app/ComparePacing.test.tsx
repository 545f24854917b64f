import { act, render } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { App } from '../../app/App';
import { DRAG_TABLE_INTERVAL_MS, useDragPaced } from '../../app/ui/panels/useDragPaced';
import { StoreProvider } from '../../app/store/StoreProvider';
import { createWorkbenchStore } from '../../app/store/workbenchStore';

describe('the comparison table during a drag', () => {
  it('holds while the point moves, catches up at its pace, and shows the final values on release', async () => {
    const store = createWorkbenchStore();
    const view = render(<App store={store} />);
    act(() => store.getState().setRival({ on: true, tubeId: '12AT7' }));
    const tableIa = () => view.container.querySelector('tr[data-row="ia"] td')!.textContent;
    const stripIa = () => view.container.querySelector('[data-figure="ia"] dd')!.textContent;
    const before = tableIa();
    const { vpk, ia } = store.getState().analysis.solution.op;
    act(() => store.getState().beginDrag('point'));
    act(() => store.getState().dragPointTo(vpk + 20, ia * 0.8));
    act(() => store.getState().dragPointTo(vpk + 40, ia * 0.7));
    // Within the pacing interval: the strip follows the point, the table holds.
    expect(stripIa()).not.toBe(before);
    expect(tableIa()).toBe(before);
    await act(() => new Promise((done) => setTimeout(done, DRAG_TABLE_INTERVAL_MS + 50)));
    expect(tableIa()).toBe(stripIa());
    act(() => store.getState().dragPointTo(vpk + 10, ia * 0.9));
    act(() => store.getState().endDrag());
    expect(tableIa()).toBe(stripIa());
  });
});

describe('the ratings list during a drag', () => {
  it('shows a check that turns dangerous at once, while the sentences\' numbers follow at the table\'s pace', () => {
    const store = createWorkbenchStore();
    const view = render(<App store={store} />);
    const severities = () => [...view.container.querySelectorAll('.findings li')].map((li) => li.className);
    expect(severities()).toContain('finding note');
    act(() => store.getState().beginDrag('point'));
    // Far up and right: held on the highest grid curve the grid leak allows, well past the 12AU7's 2.75 W.
    act(() => store.getState().dragPointTo(200, 0.025));
    expect(store.getState().analysis.solution.op.pa).toBeGreaterThan(2.75);
    expect(severities()).toContain('finding danger');
    act(() => store.getState().endDrag());
  });
});

describe('a paced reader', () => {
  it('is not rendered at all on the moves between its refreshes', () => {
    const store = createWorkbenchStore();
    let renders = 0;
    function Probe() {
      useDragPaced((s) => s.analysis);
      renders++;
      return null;
    }
    render(<StoreProvider store={store}><Probe /></StoreProvider>);
    const { vpk, ia } = store.getState().analysis.solution.op;
    act(() => store.getState().beginDrag('point'));
    act(() => store.getState().dragPointTo(vpk + 5, ia));
    const afterFirstMove = renders;
    for (let k = 1; k <= 8; k++) act(() => store.getState().dragPointTo(vpk + 5 + k, ia * (1 - k / 100)));
    expect(renders).toBe(afterFirstMove);
    act(() => store.getState().endDrag());
    expect(renders).toBe(afterFirstMove + 1);
  });
});

describe('the parts during a drag', () => {
  it('show live in the figures strip, while the form box follows at the table\'s pace and ends exact', () => {
    const store = createWorkbenchStore();
    const view = render(<App store={store} />);
    const strip = () => view.container.querySelector('[data-figure="ra"] dd')!.textContent;
    const box = () => (view.container.querySelector('input[name="ra"]') as HTMLInputElement).value;
    const { vpk, ia } = store.getState().analysis.solution.op;
    act(() => store.getState().beginDrag('point'));
    act(() => store.getState().dragPointTo(vpk + 20, ia * 0.8));
    const shownAfterFirst = box();
    const stripAfterFirst = strip();
    act(() => store.getState().dragPointTo(vpk + 40, ia * 0.6));
    expect(strip()).not.toBe(stripAfterFirst);
    expect(store.getState().drafts.ra).not.toBe(shownAfterFirst);
    expect(box()).toBe(shownAfterFirst);
    act(() => store.getState().endDrag());
    expect(box()).toBe(store.getState().drafts.ra);
  });
});
