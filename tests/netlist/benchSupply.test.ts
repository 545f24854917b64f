import { describe, expect, it } from 'vitest';
import { settlingNote, spectrumBase } from '../../src/netlist/benchSupply';
import type { SupplyDesign } from '../../src/supply/supplyTypes';

// What the netlist with the supply reads its transient with; the file itself is run by ngspice in
// tests/spice/amplifierOnSupplyNetlist.spice.test.ts.
describe('the netlist\u2019s transient on a supply', () => {
  it('reads the output over a window holding whole cycles of 1 kHz and of the ripple: 20 ms at 50 Hz, 50 ms at 60 Hz', () => {
    expect(spectrumBase(50)).toBe(50);
    expect(spectrumBase(60)).toBe(20);
    expect(spectrumBase(40)).toBe(40);
    // 70 Hz shares only 10 Hz with 1 kHz (a 100 ms window, longer than the run's own settling allows), and a
    // fractional mains frequency none: the last millisecond is read instead.
    expect(spectrumBase(70)).toBeUndefined();
    expect(spectrumBase(50.5)).toBeUndefined();
  });

  it('names the first filter part slower than a third of the run, and where its node starts reading high', () => {
    const d: SupplyDesign = {
      mainsHz: 50, secondaryRms: 300, windingOhms: 40, rectifier: { kind: 'silicon-full-wave' }, input: { kind: 'capacitor', c: 100e-6 },
      sections: [{ kind: 'rc', r: 470, c: 47e-6 }, { kind: 'rc', r: 10e3, c: 47e-6 }], loads: [0, 0, 0],
    };
    // 470 Ω · 47 µF = 22 ms is quick beside a 0.2 s run; 10 kΩ · 47 µF = 0.47 s is not.
    expect(settlingNote(d, 0.2)).toEqual({ from: 2, note: expect.stringMatching(/^\* RN2\*CN2 is 0\.47 s, against a run of 0\.20 s: sn2 and the nodes after it are still settling/) });
    expect(settlingNote(d, 2)).toEqual({ from: null, note: null });
    // A choke input rings with its capacitor: 10 H and 47 µF have a period of 2π√(LC) = 0.14 s.
    const choke = { ...d, input: { kind: 'choke' as const, l: 10, rdc: 150, c: 47e-6 } };
    expect(settlingNote(choke, 0.2)).toMatchObject({ from: 0, note: expect.stringMatching(/^\* LIN with CN0 rings with a period of 0\.14 s/) });
  });
});
