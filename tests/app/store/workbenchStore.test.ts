import { describe, expect, it } from 'vitest';
import { E24, findTube, gridCurrent, plateCurrent, solveStage } from '../../../src/index';
import { createWorkbenchStore } from '../../../app/store/workbenchStore';
import { TYPING_SETTLE_MS } from '../../../app/store/designSlice';
import { expectClose } from '../../helpers/expectClose';
import { modelOf } from '../../../src/tube/types';

describe('workbench store', () => {
  it('opens on the demo line stage, solved', () => {
    const s = createWorkbenchStore().getState();
    expect(s.design).toMatchObject({ tubeId: '12AU7', bplus: 275, ra: 27e3, rk: 1200, rl: 220e3 });
    expect(s.analysis.solution.op.ia).toBeGreaterThan(1e-3);
    expect(s.drafts).toMatchObject({ bplus: '275', ra: '27k', rk: '1.2k', rl: '220k', cin: '470n', ck: '100u', level: '2' });
  });

  it('an entry that does not parse leaves a specific message and keeps the design and its figures', () => {
    const store = createWorkbenchStore();
    const before = store.getState();
    store.getState().editField('ra', 'bad');
    const after = store.getState();
    expect(after.errors.ra).toBe('“bad” is not a part value: use digits with an optional multiplier (p n u m k M), e.g. 33k, 3k3 or 68n');
    expect(after.drafts.ra).toBe('bad');
    expect(after.design).toBe(before.design);
    expect(after.analysis).toBe(before.analysis);
  });

  it('an entry the model cannot run with is refused with the model\'s reason', () => {
    const store = createWorkbenchStore();
    const before = store.getState().design;
    store.getState().editField('bplus', '0');
    expect(store.getState().errors.bplus).toBe('B+ must be above 0 V');
    // The lowest B+ the bench takes (5 V, the one table of limits) with a 10 MΩ cathode resistor: cut off.
    store.getState().editField('rk', '10M');
    const held = store.getState().design;
    store.getState().editField('bplus', '5');
    expect(store.getState().errors.bplus).toBe('The tube is cut off: plate current below 1 µA. Lower Rk, make the grid bias less negative, or raise B+.');
    expect(store.getState().design).toEqual(held);
    expect(held).toEqual({ ...before, rk: 10e6 });
  });

  it('a refused entry typed just after an accepted one keeps its text beside its message when the deferred full pass runs', async () => {
    const store = createWorkbenchStore();
    // Typed fast: "1" and "10" (kV) are taken; the third key makes 100 kV, past the one table of limits.
    store.getState().editField('bplus', '1');
    store.getState().editField('bplus', '10');
    store.getState().editField('bplus', '100k');
    const refused = store.getState().errors.bplus;
    expect(refused).toMatch(/B\+/);
    // The full analysis the accepted keystroke scheduled runs after the typing pauses; it must not put "10" back in the box.
    await new Promise((r) => setTimeout(r, TYPING_SETTLE_MS + 100));
    expect(store.getState().analysis.signal.stale).toBe(false);
    expect(store.getState().drafts.bplus).toBe('100k');
    expect(store.getState().errors.bplus).toBe(refused);
    expect(store.getState().design.bplus).toBe(10);
    // Opening a document starts every box afresh: no refused text without its message.
    const kept = { title: '', design: store.getState().design };
    expect(store.getState().loadDocument(kept)).toBeNull();
    expect(store.getState().drafts.bplus).toBe('10');
    expect(store.getState().errors.bplus).toBeUndefined();
  });

  it('a valid entry replaces the value, clears the message and re-solves once', () => {
    const store = createWorkbenchStore();
    store.getState().editField('ra', 'bad');
    store.getState().editField('ra', '68k');
    const s = store.getState();
    expect(s.design.ra).toBe(68e3);
    expect(s.errors.ra).toBeUndefined();
    const direct = solveStage({ tube: findTube('12AU7')!, bplus: 275, ra: 68e3, rk: 1200, rl: 220e3, rg: s.design.rg });
    expect(direct.ok && s.analysis.solution.op).toEqual(direct.ok && direct.op);
  });

  it('keeps the curve sheet object across Ra changes and drags (one change, one solve)', () => {
    const store = createWorkbenchStore();
    const sheet = store.getState().analysis.sheet;
    store.getState().editField('ra', '33k');
    store.getState().beginDrag('point');
    store.getState().dragPointTo(150, 5e-3);
    expect(store.getState().analysis.sheet).toBe(sheet);
  });

  it('dragging puts the operating point under the pointer with B+ fixed, then snaps Ra and Rk to E24 on release', () => {
    const store = createWorkbenchStore();
    const g = store.getState;
    g().beginDrag('point');
    g().dragPointTo(150, 5e-3);
    expectClose(g().analysis.solution.op.vpk, 150, { rel: 1e-3 });
    expectClose(g().analysis.solution.op.ia, 5e-3, { rel: 1e-3 });
    expect(g().design.bplus).toBe(275);
    g().endDrag();
    const { ra, rk } = g().design;
    const decade = (v: number) => v / Math.pow(10, Math.floor(Math.log10(v)));
    expect(E24.some((e) => Math.abs(e - decade(ra)) < 1e-9)).toBe(true);
    expect(E24.some((e) => Math.abs(e - decade(rk)) < 1e-9)).toBe(true);
    // The point shown after release is the real one for the snapped parts.
    const op = g().analysis.solution.op;
    expectClose(plateCurrent(findTube('12AU7')!, op.vpk, op.vgk), op.ia, { rel: 1e-6 });
  });

  it('a drag past the grid-current limit stops on it and says why: with a 1 MΩ leak, where the leak alone biases the grid', () => {
    const store = createWorkbenchStore();
    store.getState().beginDrag('point');
    store.getState().dragPointTo(100, 0.05);
    expect(store.getState().dragNote).toMatch(/grid would draw current/);
    const op = store.getState().analysis.solution.op;
    const tube = findTube('12AU7')!;
    // Rk all but gone: the grid's own current through its 1 MΩ leak biases it (Ohm's law), a little below 0 V.
    const rg = store.getState().design.rg;
    expect(rg).toBe(1e6);
    expect(op.vk).toBeLessThan(0.02);
    expectClose(op.vgk + op.vk, -rg * gridCurrent(modelOf(tube), op.vgk), { rel: 1e-6 }, 'grid = −Ig·Rg');
    expect(op.vgk).toBeLessThan(0);
    expectClose(op.ia, plateCurrent(tube, op.vpk, op.vgk), { rel: 1e-3 });
  });

  it('a keyboard nudge changes Ra and Rk, and settling it snaps them like a drag release', () => {
    const store = createWorkbenchStore();
    const { ra, rk } = store.getState().design;
    store.getState().nudgePoint(0.01, 0);
    expect(store.getState().dragging).toBe('point');
    expect(store.getState().design.ra).not.toBe(ra);
    expect(store.getState().design.rk).not.toBe(rk);
    const vpk = store.getState().analysis.solution.op.vpk;
    store.getState().nudgePoint(0.01, 0);
    expect(store.getState().analysis.solution.op.vpk).toBeGreaterThan(vpk);
    store.getState().endDrag();
    const decade = (v: number) => Number((v / Math.pow(10, Math.floor(Math.log10(v)))).toFixed(6));
    expect(E24).toContain(decade(store.getState().design.ra));
    expect(E24).toContain(decade(store.getState().design.rk));
  });

  it('cancelling a drag puts back the design it started from', () => {
    const store = createWorkbenchStore();
    const start = store.getState().design;
    store.getState().nudgePoint(0.05, 0.05);
    expect(store.getState().design).not.toEqual(start);
    store.getState().cancelDrag();
    expect(store.getState().design).toEqual(start);
    expect(store.getState().dragging).toBeNull();
  });

  it('dragging the load line\'s foot changes B+ with the chart window held still, then releases it', () => {
    const store = createWorkbenchStore();
    const extent = store.getState().analysis.sheet.extent;
    store.getState().beginDrag('bplus');
    store.getState().dragBplusTo(330.2);
    expect(store.getState().design.bplus).toBe(330);
    expect(store.getState().analysis.sheet.extent).toBe(extent);
    store.getState().endDrag();
    expect(store.getState().analysis.sheet.extent.vmax).toBeGreaterThanOrEqual(330);
  });

  it('choosing another tube redraws its curves and keeps the parts (a tube swap in the same socket)', () => {
    const store = createWorkbenchStore();
    const before = store.getState().analysis.sheet;
    store.getState().chooseTube('6SN7');
    const s = store.getState();
    expect(s.design.tubeId).toBe('6SN7');
    expect(s.analysis.sheet).not.toBe(before);
    expect(s.analysis.sheet.family[0]!.points).not.toEqual(before.family[0]!.points);
    expect(s.design.ra).toBe(27e3);
    expect(s.errors.tube).toBeUndefined();
  });

  it('a tube the model cannot run with these parts is refused, and the bench keeps the old one', () => {
    const store = createWorkbenchStore();
    // 8 V and 2.2 MΩ: the 12AU7 still draws 1.02 µA, the 6DJ8 is cut off (the model's own figures).
    store.getState().editField('bplus', '8');
    store.getState().editField('rk', '2M2');
    const before = store.getState().design;
    store.getState().chooseTube('6DJ8');
    expect(store.getState().design).toEqual(before);
    expect(store.getState().errors.tube).toMatch(/^The 6DJ8 cannot run with these parts: The tube is cut off/);
  });

  it('hover reads the grid voltage the model gives at the cursor', () => {
    const store = createWorkbenchStore();
    store.getState().setHover(200, 6e-3);
    const h = store.getState().hover!;
    expectClose(plateCurrent(findTube('12AU7')!, 200, h.vgk!), 6e-3, { rel: 1e-9 });
  });
});
