import { describe, expect, it } from 'vitest';
import { bplusAgreement, BPLUS_AGREEMENT } from '../../src/index';

// The 5 % agreement is common practice (about what a node's parts and the tubes' spread move it by); the figures below are arithmetic.
describe('a stage\'s B+ as designed against what its node gives', () => {
  it('within 5 % says nothing; past it, a warning that says which way, by how much and at what the figures are', () => {
    expect(BPLUS_AGREEMENT).toBe(0.05);
    expect(bplusAgreement('Voltage stages', 3, 275, 262)).toEqual({ ok: true, finding: null }); // 4.7 % low
    expect(bplusAgreement('Voltage stages', 3, 275, 288)).toEqual({ ok: true, finding: null }); // 4.7 % high
    // 207 V for 275 V: 24.7 % low.
    const low = bplusAgreement('Voltage stages', 3, 275, 207);
    if (!low.ok || !low.finding) throw new Error('expected a warning');
    expect(low.finding).toMatchObject({ kind: 'supply-bplus', severity: 'warning', value: 207, limit: 275 });
    expect(low.finding.message).toBe('Voltage stages: designed for B+ 275 V, but node 4 gives 207 V under load (25 % less: less swing and gain than shown). Every figure and rating check for them is at 275 V: design them for the node\'s B+, or change the supply.');
    // 300 V for 275 V: 9.1 % high, which the ratings were not checked at.
    const high = bplusAgreement('Output stage (EL34)', 1, 275, 300);
    expect(high.ok && high.finding?.message).toMatch(/^Output stage \(EL34\): designed for B\+ 275 V, but node 2 gives 300 V under load \(9 % more: more current and dissipation than the ratings checked here\)/);
  });

  it('an output stage\'s screens on a node of their own, compared the same way and named as screens', () => {
    // 320 V for screens designed at 300 V: 6.7 % high.
    const screens = bplusAgreement('Output stage (EL34)', 2, 300, 320, 'screens');
    expect(screens.ok && screens.finding?.message).toBe('Output stage (EL34): designed for screens at 300 V, but node 3 gives 320 V under load (7 % more: more current and dissipation than the ratings checked here). Every figure and rating check for them is at 300 V: design them for the node\'s voltage, or change the supply.');
    expect(bplusAgreement('Output stage (EL34)', 2, 300, 310, 'screens')).toEqual({ ok: true, finding: null });
  });

  it('refuses what it cannot compare, naming the value', () => {
    expect(bplusAgreement('', 0, 275, 270)).toMatchObject({ ok: false, field: 'who' });
    expect(bplusAgreement('x', -1, 275, 270)).toMatchObject({ ok: false, field: 'node' });
    expect(bplusAgreement('x', 0, 0, 270)).toMatchObject({ ok: false, field: 'held', message: 'The B+ as designed must be from 1 mV to 100000 V (got 0)' });
    expect(bplusAgreement('x', 0, 275, 1.7e308)).toMatchObject({ ok: false, field: 'supplied' });
    expect(bplusAgreement('x', 0, 275, Number.NaN)).toMatchObject({ ok: false, field: 'supplied', message: 'The node\'s voltage must be from 0 to 100000 V (got not a number)' });
  });
});
