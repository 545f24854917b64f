import { describe, expect, it } from 'vitest';
import { findTube, solveChain, solveFollower, solveStage } from '../../src/index';
import { expectClose } from '../helpers/expectClose';

const ax7 = findTube('12AX7')!;
const au7 = findTube('12AU7')!;
const first = { kind: 'common-cathode' as const, tube: ax7, bplus: 300, ra: 100e3, rk: 1500 };

describe('solveChain', () => {
  it('a gain stage plus a cathode follower inverts; the follower passes the phase unchanged (common practice)', () => {
    const r = solveChain([first, { kind: 'follower', tube: au7, bplus: 300, rk: 47e3, heaterVolts: 0 }]);
    if (!r.ok) throw new Error(r.message);
    expect(r.inverting).toBe(true);
    const [s, f] = r.links;
    expect(s!.gain).toBeLessThan(0);
    expect(f!.gain).toBeGreaterThan(0);
    expect(f!.gain).toBeLessThan(1);
    expectClose(r.gain, s!.gain * f!.gain, { rel: 1e-12 });
    expectClose(r.zout, f!.zout, { rel: 1e-12 });
    expect(r.zout).toBeLessThan(1000);
  });

  // 12AX7: 180 V heater–cathode, either polarity (Tung-Sol 12AX7, design-centre; shared reference).
  it('the follower\'s heater-to-cathode voltage is checked against its rating', () => {
    const r = solveChain([first, { kind: 'follower', tube: ax7, bplus: 400, rk: 150e3 }]);
    if (!r.ok) throw new Error(r.message);
    const f = r.links[1]!;
    expect(f.kind === 'follower' && f.vhk).toBeGreaterThan(180);
    expect(f.findings.some((x) => x.kind === 'heater-cathode' && x.severity === 'danger')).toBe(true);
  });

  // Common practice: each plate output inverts, so two invert back; the next grid leak is in parallel with the load.
  it('two common-cathode stages do not invert overall, and the second stage\'s grid leak loads the first (common practice)', () => {
    const r = solveChain([first, { kind: 'common-cathode', tube: au7, bplus: 300, ra: 22e3, rk: 1000, rg: 220e3 }]);
    if (!r.ok) throw new Error(r.message);
    expect(r.inverting).toBe(false);
    const loaded = solveStage({ ...first, rl: 220e3 });
    expect(loaded.ok && r.links[0]!.gain).toBeCloseTo(loaded.ok ? loaded.gain : 0, 12);
  });

  // Common practice: a later stage sees the earlier gain, so the chain cannot swing more than its first stage allows.
  it('the chain\'s clean swing is no more than the first stage\'s own (common practice)', () => {
    const alone = solveChain([first]);
    const both = solveChain([first, { kind: 'common-cathode', tube: au7, bplus: 300, ra: 22e3, rk: 1000, rg: 220e3 }]);
    if (!alone.ok || !both.ok) throw new Error('both should solve');
    expect(both.inputPeak).toBeLessThanOrEqual(alone.inputPeak);
    expect(both.limitedBy.link).toBe(1); // the second stage, with 40 times the drive, clips first
  });

  // Ohm's law: the follower's leak is the first plate's load; its grid sits where its bias holds it.
  it('a capacitor-coupled follower sits on its own grid bias, its leak loading the plate, as the amplifier form has it', () => {
    const coupling = { cc: 100e-9, rg: 1e6, vbias: 150 };
    const r = solveChain([first, { kind: 'follower', tube: au7, bplus: 300, rk: 47e3, coupling }]);
    if (!r.ok) throw new Error(r.message);
    const own = solveFollower({ tube: au7, bplus: 300, vgrid: 150, rk: 47e3 });
    expect(own.ok && r.links[1]!.op.vk).toBeCloseTo(own.ok ? own.op.vk : 0, 9);
    const loaded = solveStage({ ...first, rl: 1e6 });
    expect(loaded.ok && r.links[0]!.gain).toBeCloseTo(loaded.ok ? loaded.gain : 0, 12);
    const amp = solveChain({
      source: { rsource: 0 },
      stages: [{ ...first, bypassed: true, coupling: { kind: 'direct' } }, { kind: 'follower', tube: au7, bplus: 300, rk: 47e3, vbias: 150, coupling: { kind: 'capacitor', cc: 100e-9, rg: 1e6 } }],
    });
    if (!amp.ok) throw new Error(amp.message);
    expectClose(r.inputPeak, amp.inputPeak, { rel: 1e-9 }, 'same clean limit');
    expectClose(r.gain, amp.gain, { rel: 1e-9 }, 'same gain');
  });

  it('names what is wrong with a malformed chain', () => {
    expect(solveChain([])).toEqual({ ok: false, reason: 'invalid-input', message: 'A chain has one or two links' });
    expect(solveChain([first, { kind: 'common-cathode', tube: au7, bplus: 300, ra: 22e3, rk: 1000 }])).toEqual({
      ok: false, reason: 'invalid-input', message: 'A capacitor-coupled second stage needs its grid leak Rg', field: 'rg',
    });
  });
});
