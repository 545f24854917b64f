import { describe, expect, it } from 'vitest';
import { findTube, solveChain, solveStage } from '../../src/index';
import { expectClose } from '../helpers/expectClose';

const ax7 = findTube('12AX7')!;
const stage = { tube: ax7, bplus: 300, ra: 100e3, rk: 1500, bypassed: true, rl: 470e3, rg: 1e6 };

describe('a gain stage\'s grid stopper', () => {
  // First-order RC low-pass, f = 1/(2πRC): P. Horowitz and W. Hill, The Art of Electronics, 3rd ed., §1.7; C the grid's
  // input capacitance by the Miller effect (J. M. Miller, 1920), which solveStage gives as cin.
  it('names its own corner with the grid\'s Miller capacitance: a note above the audio band, a warning inside it', () => {
    const above = solveStage({ ...stage, rstopper: 10e3 });
    if (!above.ok) throw new Error(above.message);
    const note = above.findings.find((f) => f.kind === 'grid-stopper')!;
    expect(note.severity).toBe('note');
    expectClose(note.value, 1 / (2 * Math.PI * 10e3 * above.cin), { rel: 1e-12 }, 'corner');
    expect(note.message).toMatch(/^Grid stopper 10 kΩ with the grid's [\d.]+ pF \(Miller effect\): its own corner is [\d.]+ kHz, above the audio band/);
    const inside = solveStage({ ...stage, rstopper: 220e3 });
    if (!inside.ok) throw new Error(inside.message);
    const warning = inside.findings.find((f) => f.kind === 'grid-stopper')!;
    expect(warning.severity).toBe('warning');
    expect(warning.value).toBeLessThan(20e3);
    // None without one.
    const none = solveStage(stage);
    if (!none.ok) throw new Error(none.message);
    expect(none.findings.some((f) => f.kind === 'grid-stopper')).toBe(false);
  });

  it('moves no operating point and no gain: it carries no current below the onset of grid current', () => {
    const a = solveStage(stage);
    const b = solveStage({ ...stage, rstopper: 68e3 });
    if (!a.ok || !b.ok) throw new Error('both solve');
    expect(b.op).toEqual(a.op);
    expect(b.gain).toBe(a.gain);
  });

  // Ohm's law, series and parallel: the grid's slope resistance (1/g) sits behind the stopper, the leak before it.
  it('feeds the grid\'s own input conductance through itself: Rin = Rg ∥ (1/g + Rst)', () => {
    const near = { ...stage, rk: 820 };
    const a = solveStage(near);
    const b = solveStage({ ...near, rstopper: 100e3 });
    if (!a.ok || !b.ok || a.rin === null || b.rin === null) throw new Error('both solve with an input resistance');
    const slope = 1 / (1 / a.rin - 1 / 1e6);
    // The grid near −1 V draws enough to matter: its slope takes Rin a tenth or more below the leak.
    expect(a.rin).toBeLessThan(0.9e6);
    expectClose(b.rin, 1 / (1 / 1e6 + 1 / (slope + 100e3)), { rel: 1e-9 }, 'Rin');
  });

  it('in the amplifier, the stage carrying it lists the same finding', () => {
    const r = solveChain({
      source: { rsource: 1e3 },
      stages: [
        { kind: 'common-cathode', tube: ax7, bplus: 300, ra: 100e3, rk: 1500, bypassed: true, rstopper: 68e3, coupling: { kind: 'capacitor', cc: 100e-9, rg: 1e6 } },
        { kind: 'common-cathode', tube: ax7, bplus: 300, ra: 100e3, rk: 1500, bypassed: true, coupling: { kind: 'capacitor', cc: 100e-9, rg: 470e3 } },
      ],
    });
    if (!r.ok) throw new Error(r.message);
    expect(r.stages[0]!.findings.filter((f) => f.kind === 'grid-stopper')).toHaveLength(1);
    expect(r.stages[1]!.findings.some((f) => f.kind === 'grid-stopper')).toBe(false);
  });
});
