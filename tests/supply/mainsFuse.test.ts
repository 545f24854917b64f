import { describe, expect, it } from 'vitest';
import { fullPowerVa, htFuseCurrent, mainsFuse, FUSE_AMPS } from '../../src/index';
import { expectClose } from '../helpers/expectClose';

describe('mainsFuse', () => {
  it('adds every winding\'s VA, takes the primary\'s current through the efficiency, and fuses it at the next IEC 60127-2 rating past twice that', () => {
    const r = mainsFuse({ mainsVolts: 230, bplusVa: 90, bplusVaFull: 120, heaterVa: 40, biasVa: 0.5 });
    if (!r.ok) throw new Error(r.message);
    // The larger of idle and full power for the B+ winding, then the heaters and the bias winding.
    expect(r.va).toBe(160.5);
    // P = V·I: 160.5 VA over 85 % at 230 V is 0.821 A.
    expectClose(r.primaryAmps, 160.5 / 0.85 / 230, { rel: 1e-12 }, 'primary current');
    // Twice 0.821 A is 1.64 A: the next R10 rating is 2 A (IEC 60127-2: 1.6 A would be under it).
    expect(r.fuseAmps).toBe(2);
    // At 120 V the same load draws more than 1.9 times the current.
    const us = mainsFuse({ mainsVolts: 120, bplusVa: 90, bplusVaFull: 120, heaterVa: 40, biasVa: 0.5 });
    expect(us.ok && us.primaryAmps / r.primaryAmps).toBeCloseTo(230 / 120, 12);
    // Twice 1.574 A is 3.147 A: just under the 3.15 A rating.
    expect(us.ok && us.fuseAmps).toBe(3.15);
  });

  it('gives the R10 series (IEC 60127-2): each value about 1.26 times the last', () => {
    for (let k = 1; k < FUSE_AMPS.length; k++) expect(FUSE_AMPS[k]! / FUSE_AMPS[k - 1]!).toBeGreaterThan(1.2);
    for (let k = 1; k < FUSE_AMPS.length; k++) expect(FUSE_AMPS[k]! / FUSE_AMPS[k - 1]!).toBeLessThan(1.3);
  });

  it('names a bad mains voltage, and gives no fuse past 10 A', () => {
    expect(mainsFuse({ mainsVolts: 1000, bplusVa: 90, heaterVa: 40 })).toMatchObject({ ok: false, field: 'mainsVolts' });
    expect(mainsFuse({ mainsVolts: 100, bplusVa: 900, heaterVa: 40 })).toMatchObject({ ok: true, fuseAmps: null });
  });
});

describe('the B+ winding\'s fuse', () => {
  it('sits in a centre tap carrying the rectifier\'s whole current, or in series with a bridge\'s or a half-wave\'s winding, at twice its current', () => {
    expect(htFuseCurrent('silicon-full-wave', 0.18, 0.13)).toEqual({ where: 'centre tap', amps: 0.18 });
    expect(htFuseCurrent('tube', 0.18, 0.13)).toEqual({ where: 'centre tap', amps: 0.18 });
    expect(htFuseCurrent('silicon-bridge', 0.18, 0.2)).toEqual({ where: 'winding', amps: 0.2 });
    expect(htFuseCurrent('silicon-half-wave', 0.18, 0.18)).toEqual({ where: 'winding', amps: 0.18 });
    // Twice 0.18 A is 0.36 A: the next IEC 60127-2 rating is 400 mA.
    const r = mainsFuse({ mainsVolts: 230, bplusVa: 90, heaterVa: 40, htAmps: 0.18 });
    expect(r.ok && r.htFuseAmps).toBe(0.4);
    expect(mainsFuse({ mainsVolts: 230, bplusVa: 90, heaterVa: 40 })).toMatchObject({ ok: true, htFuseAmps: null });
  });
});

describe('fullPowerVa', () => {
  it('scales the idle VA with the DC drawn, and is none when full power draws no more', () => {
    expect(fullPowerVa(100, [0.08, 0.02], [0.14, 0.02])).toBeCloseTo(160, 12);
    expect(fullPowerVa(100, [0.08, 0.02], [0.08, 0.02])).toBeNull();
    expect(fullPowerVa(100, [0.08, 0.02], null)).toBeNull();
  });
});
