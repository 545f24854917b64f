import { describe, expect, it } from 'vitest';
import { createWorkbenchStore } from '../../../app/store/workbenchStore';

describe('the chart window', () => {
  it('zoomed to the load line, a 12AX7 at a fraction of a milliamp fills the chart instead of its bottom few percent', () => {
    const store = createWorkbenchStore();
    store.getState().commit({ ...store.getState().design, tubeId: '12AX7', bplus: 250, ra: 470e3, rk: 2700, rl: 1e6 });
    const s = store.getState();
    const { ia } = s.analysis.solution.op;
    expect(ia).toBeLessThan(0.5e-3);
    expect(ia / s.analysis.sheet.extent.iaMax).toBeLessThan(0.1); // the whole sheet: the point sits low
    s.setChartWindow('load-line');
    const zoomed = store.getState().analysis.sheet.extent;
    expect(ia / zoomed.iaMax).toBeGreaterThan(0.3);
    store.getState().setChartWindow('sheet');
    expect(store.getState().analysis.sheet.extent.iaMax).toBeGreaterThan(zoomed.iaMax);
  });

  it('holds still during a drag and re-ranges on release', () => {
    const store = createWorkbenchStore();
    const g = store.getState;
    g().setChartWindow('load-line');
    const before = g().analysis.sheet.extent;
    g().beginDrag('point');
    for (let k = 0; k < 5; k++) g().dragPointTo(120 + 10 * k, 3e-3);
    expect(g().analysis.sheet.extent).toEqual(before);
    g().endDrag();
    expect(g().analysis.sheet.extent.iaMax).not.toBe(before.iaMax);
  });
});
