import { describe, expect, it } from 'vitest';
import { createWorkbenchStore } from '../../../app/store/workbenchStore';
import { readDesignFile, writeDesignFile } from '../../../app/keep/designFile';
import { benchPoint } from '../../../app/store/outputAnalysis';
import { outputPartsOf } from '../../../app/store/outputParts';
import { buildSheetOf } from '../../../app/store/buildSheet';
import { cardSections } from '../../../app/export/buildCard';
import { splitterFiguresOf, splitterPlaneOf } from '../../../app/store/splitterPlane';
import { expectClose } from '../../helpers/expectClose';

/** The demo with its output stage as a pair of EL84s on the bench. */
function pairOnBench() {
  const store = createWorkbenchStore();
  store.getState().setStageKind('output');
  store.getState().chooseOutputTube('EL84');
  store.getState().changeOutput({ connection: 'pentode', bplus: 300, screenVolts: 300, rk: 270, raa: 8000 });
  store.getState().setOutputPair('push-pull');
  return store;
}

describe('the push-pull pair on the output bench', () => {
  it('switching to the pair halves the cathode resistor (both cathodes share it: Ohm\'s law), and back doubles it', () => {
    const store = pairOnBench();
    const s = store.getState();
    expect(s.outputBench.pair).toBe('push-pull');
    // 270 Ω / 2 = 135 Ω, snapped to the design's series (the demo snaps to E24: 130 Ω).
    expect(s.design.output.rk).toBe(130);
    s.setOutputPair('single-ended');
    expect(store.getState().design.output.rk).toBe(270);
    expect(store.getState().outputBench.pair).toBe('single-ended');
  });

  it('dragging the point sets the shared Rk and B+ so each tube sits where it was put; the load handle sets Raa', () => {
    const store = pairOnBench();
    const s = store.getState();
    const { vpk, ip } = benchPoint(s.outputBench);
    s.beginDrag('output-point');
    store.getState().dragOutputPointTo(vpk - 20, ip * 1.15);
    // Read during the drag: on release Rk snaps to the design's series, which moves the point a little.
    const dragged = benchPoint(store.getState().outputBench);
    expectClose(dragged.vpk, vpk - 20, { abs: 0.5 }, 'plate voltage');
    expectClose(dragged.ip, ip * 1.15, { rel: 0.01 }, 'plate current');
    store.getState().endDrag();
    const after = benchPoint(store.getState().outputBench);
    const b = store.getState().outputBench;
    if (b.pair !== 'push-pull') throw new Error('still a pair');
    // Raa through a point on the composite line at Raa/2 + Rpri/2 (Langford-Smith, RDH4 ch. 13).
    const r = b.analysis.solution.design.rPrimary;
    const target = 10_000;
    store.getState().beginDrag('output-load');
    store.getState().dragOutputLoadTo(after.vpk + 100, after.ip - 100 / (target / 2 + r / 2));
    store.getState().endDrag();
    expect(store.getState().design.output.raa).toBe(target);
  });

  it('its parts, its build card and the supply current the build sheet counts are the pair\'s', () => {
    const store = pairOnBench();
    const s = store.getState();
    const b = s.outputBench;
    if (b.pair !== 'push-pull') throw new Error('a pair');
    const parts = outputPartsOf(s);
    expect(parts.pair).toBe('push-pull');
    expect(parts.resistors.map((r) => r.ref)).toEqual(['Rk', 'Rg1, Rg2', 'Rst1, Rst2']);
    expect(buildSheetOf(s).outputBplusAmps).toBeCloseTo(b.settled.supplyCurrent.idle, 12);
    const card = cardSections(s).flatMap((x) => x.lines).join('\n');
    expect(card).toContain('Two EL84 in push-pull');
    expect(card).toContain('centre-tapped: 8 kΩ plate to plate');
  });

  it('a file keeps the pair; a file written before pairs opens single-ended with twice its primary as Raa (common practice)', () => {
    const store = pairOnBench();
    const s = store.getState();
    const text = writeDesignFile({ title: 'Pair', design: s.design });
    const back = readDesignFile(text);
    if (!back.ok) throw new Error(back.message);
    expect(back.doc.design.output).toEqual(s.design.output);
    const old = JSON.parse(text) as { design: { output: Record<string, unknown> } };
    delete old.design.output.pair;
    delete old.design.output.raa;
    delete old.design.output.mismatch;
    delete old.design.output.splitter;
    // Written before pairs, a driven design's RL was the output grid's resistor.
    (old.design as Record<string, unknown>).rl = old.design.output.rg;
    const opened = readDesignFile(JSON.stringify(old));
    if (!opened.ok) throw new Error(opened.message);
    expect(opened.doc.design.output).toMatchObject({ pair: 'single-ended', raa: 2 * s.design.output.zPrimary, mismatch: 0 });
    const bad = JSON.parse(text) as { design: { output: Record<string, unknown> } };
    bad.design.output.raa = 50;
    const refused = readDesignFile(JSON.stringify(bad));
    expect(refused.ok).toBe(false);
    if (!refused.ok) expect(refused.message).toContain('design.output.raa');
  });
});

describe('the pair in the amplifier, with its phase splitter', () => {
  it('the driven pair joins the chain behind its splitter: the strip names both, the splitter takes RL as its grid leak, and the amplifier reaches the speaker', () => {
    const store = pairOnBench();
    const s = store.getState();
    expect(s.design.drivesOutput).toBe(true);
    const view = s.amplifier!;
    expect(view.names.map((n) => n.role)).toEqual(['voltage', 'voltage', 'splitter', 'output']);
    expect(view.kinds.slice(2)).toEqual(['Split-load phase splitter', 'Push-pull output']);
    if (!view.result.ok) throw new Error(view.result.message);
    expect(view.result.outputPower!).toBeGreaterThan(5);
    // RL is the splitter's grid leak while the pair is driven; typing either moves the other.
    expect(s.design.rl).toBe(s.design.output.splitter.rg);
    s.editField('sRg', '680k');
    expect(store.getState().design.rl).toBe(680e3);
  });

  it('switching the splitter to a long-tailed pair starts it from that kind\'s values; its parts and heaters are on the build sheet', () => {
    const store = pairOnBench();
    expect(store.getState().setSplitter({ kind: 'long-tailed-pair' })).toBeNull();
    const s = store.getState();
    expect(s.design.output.splitter).toMatchObject({ kind: 'long-tailed-pair', rk: 470, rtail: 10e3 });
    if (!s.amplifier?.result.ok) throw new Error('the amplifier solves');
    const sheet = buildSheetOf(s);
    const splitter = sheet.stages.find((st) => st.title.startsWith('Phase splitter'))!;
    expect(splitter.resistors.map((r) => r.ref)).toEqual(['Ras1', 'Ras2', 'Rks', 'Rtail', 'Rgs', 'Rd1', 'Rd2']);
    // Both sections of one 12AU7 (the driver's tube is a 12AU7 too): sections counted across the amplifier.
    const au7 = sheet.tubes.find((t) => t.tube.id === '12AU7')!;
    expect(au7.sectionsUsed).toBe(3);
  });
});

describe('the splitter\'s own figures on the bench', () => {
  it('each output into a pair grid\'s resistor and its Miller capacitance (above Cgk alone): gains of either sign, the balance, the clean peak', () => {
    const store = pairOnBench();
    const f = splitterFiguresOf(store.getState())!;
    expect(f.outputs[0].gain).toBeLessThan(0);
    expect(f.outputs[1].gain).toBeGreaterThan(0);
    expect(f.balance).toBeGreaterThan(0.95);
    expect(f.inputPeak).toBeGreaterThan(1);
    // The balance at 100 kHz falls below midband's with the capacitance the pair's grids put on the outputs.
    expect(f.balanceAt.find((b) => b.hz === 100e3)!.ratio).not.toBe(f.balance);
  });
});

describe('the splitter\'s chart', () => {
  it('a long-tailed pair shows its second triode too (its own load line and point); a split-load stage has one', () => {
    const store = pairOnBench();
    expect(splitterPlaneOf(store.getState())!.second).toBeNull();
    store.getState().setSplitter({ kind: 'long-tailed-pair' });
    const s = store.getState();
    const plane = splitterPlaneOf(s)!;
    const op2 = splitterFiguresOf(s)!.op[1]!;
    expect(plane.second!.point).toEqual({ v: op2.va - op2.vk, i: op2.ia });
    // Its line starts from B+ at no current, and is steeper than the first's by the larger second plate resistor.
    expect(plane.second!.load[1]).toEqual({ v: s.design.output.splitter.bplus, i: 0 });
    expect(plane.second!.load[0]!.i).toBeLessThan(plane.load[0]!.i);
  });
});

describe('a direct-coupled splitter', () => {
  it('takes its grid from the last plate: RL goes to none (typing one is refused with a reason), no leak or divider is ordered, the file keeps it', () => {
    const store = pairOnBench();
    store.getState().editField('sBplus', '450');
    expect(store.getState().setSplitter({ coupling: 'direct' })).toBeNull();
    const s = store.getState();
    expect(s.design.rl).toBe(Infinity);
    if (!s.amplifier?.result.ok) throw new Error(s.amplifier?.result.ok === false ? s.amplifier.result.message : 'no amplifier');
    const names = s.amplifier.names.map((n) => n.role);
    const st = s.amplifier.result.stages[names.indexOf('splitter')]!;
    const before = s.amplifier.result.stages[names.indexOf('splitter') - 1]!;
    // The grid at the plate before it: Vk = Va(before) − |Vgk| (Kirchhoff round the grid).
    expectClose(st.op.vk + st.op.vgk, before.outputDc, { rel: 1e-9 }, 'grid at the plate before');
    const parts = buildSheetOf(s).stages.find((x) => x.title.startsWith('Phase splitter'))!;
    expect(parts.resistors.map((r) => r.ref)).toEqual(['Ras', 'Rks']);
    s.editField('rl', '220k');
    expect(store.getState().errors.rl).toMatch(/no RL to give/);
    expect(store.getState().design.rl).toBe(Infinity);
    const back = readDesignFile(writeDesignFile({ title: 'Direct', design: store.getState().design }));
    if (!back.ok) throw new Error(back.message);
    expect(back.doc.design.output.splitter.coupling).toBe('direct');
    expect(back.doc.design.rl).toBe(Infinity);
  });
});
