import { describe, expect, it } from 'vitest';
import { plateCurrent, solveStage, tubeLibrary, findTube, triode, type StageSolution } from '../../src/index';
import { expectClose } from '../helpers/expectClose';

const ax7 = findTube('12AX7')!;
const au7 = findTube('12AU7')!;

function ok<T>(r: { ok: true } & T | { ok: false; message: string }): T {
  if (!r.ok) throw new Error(`expected a solution, got: ${r.message}`);
  return r;
}

describe('solveStage', () => {
  it('puts the operating point on the load line, the bias line and the plate curve of every library tube (1e-6 relative)', () => {
    for (const tube of tubeLibrary) {
      const typ = tube.typical[0]!;
      // A design near the datasheet point: B+ a bit above Va, Rk from the point's own bias.
      const rk = -typ.vg / typ.ia;
      const ra = (typ.va * 0.6) / typ.ia;
      const bplus = typ.va * 1.6;
      for (const bypassed of [true, false]) {
        const s = ok<StageSolution>(solveStage({ tube, bplus, ra, rk, bypassed }));
        const { va, vk, ia, vgk, vpk } = s.op;
        expectClose(va, bplus - ia * ra, { rel: 1e-6 }, `${tube.id} load line`);
        expectClose(vk, ia * rk, { rel: 1e-6 }, `${tube.id} cathode`);
        expectClose(vgk, -ia * rk, { rel: 1e-6 }, `${tube.id} bias line`);
        expectClose(vpk, va - vk, { rel: 1e-6 }, `${tube.id} vpk`);
        expectClose(plateCurrent(tube, vpk, vgk), ia, { rel: 1e-6 }, `${tube.id} plate curve`);
      }
    }
  });

  it('with fixed bias the grid sits at the bias voltage less the cathode drop', () => {
    const s = ok<StageSolution>(solveStage({ tube: au7, bplus: 300, ra: 10e3, rk: 0, vbias: -8 }));
    expect(s.op.vgk).toBe(-8);
    expect(s.op.vk).toBe(0);
    const s2 = ok<StageSolution>(solveStage({ tube: au7, bplus: 300, ra: 10e3, rk: 100, vbias: -6 }));
    expectClose(s2.op.vgk, -6 - s2.op.ia * 100, { rel: 1e-9 });
  });

  it('a plate output inverts (common practice)', () => {
    for (const tube of tubeLibrary) {
      const typ = tube.typical[0]!;
      const s = ok<StageSolution>(solveStage({ tube, bplus: typ.va * 1.6, ra: (typ.va * 0.6) / typ.ia, rk: -typ.vg / typ.ia }));
      expect(s.gain, tube.id).toBeLessThan(0);
    }
  });

  it('bypassing Rk raises the gain (common practice)', () => {
    const by = ok<StageSolution>(solveStage({ tube: ax7, bplus: 250, ra: 100e3, rk: 1500, bypassed: true }));
    const un = ok<StageSolution>(solveStage({ tube: ax7, bplus: 250, ra: 100e3, rk: 1500, bypassed: false }));
    expect(Math.abs(by.gain)).toBeGreaterThan(Math.abs(un.gain));
    expect(by.op).toEqual(un.op); // the capacitor changes nothing at DC
  });

  it('more Ra on the same tube and B+ lowers Ia (common practice)', () => {
    let last = Infinity;
    for (const ra of [22e3, 47e3, 100e3, 220e3, 470e3]) {
      const s = ok<StageSolution>(solveStage({ tube: ax7, bplus: 300, ra, rk: 1500 }));
      expect(s.op.ia).toBeLessThan(last);
      last = s.op.ia;
    }
  });

  it('gain follows the equivalent-circuit formulas (Langford-Smith, RDH4 ch. 12)', () => {
    const s = ok<StageSolution>(solveStage({ tube: au7, bplus: 250, ra: 22e3, rk: 1000, bypassed: false, rl: 100e3 }));
    const rl = (22e3 * 100e3) / 122e3;
    expectClose(s.gain, (-s.mu * rl) / (s.rp + rl + (s.mu + 1) * 1000), { rel: 1e-12 });
    expectClose(s.gainBypassed, (-s.mu * rl) / (s.rp + rl), { rel: 1e-12 });
    expectClose(s.zout, (22e3 * (s.rp + (s.mu + 1) * 1000)) / (22e3 + s.rp + (s.mu + 1) * 1000), { rel: 1e-12 });
  });

  // Common practice: the load is in parallel with Ra for gain, while Zout is seen looking back into the plate.
  it('the next-stage load lowers the gain but not the output impedance (common practice)', () => {
    const open = ok<StageSolution>(solveStage({ tube: ax7, bplus: 250, ra: 100e3, rk: 1500 }));
    const loaded = ok<StageSolution>(solveStage({ tube: ax7, bplus: 250, ra: 100e3, rk: 1500, rl: 100e3 }));
    expect(Math.abs(loaded.gain)).toBeLessThan(Math.abs(open.gain));
    expect(loaded.zout).toBe(open.zout);
  });

  // J. M. Miller, "Dependence of the input impedance of a three-electrode vacuum tube upon the load in the
  // plate circuit", Scientific Papers of the Bureau of Standards 15 (351), 1920; Langford-Smith, RDH4 ch. 2 §9.
  it('input capacitance grows with gain by the Miller effect: Cgk + Cgp·(1 + |A|) when bypassed', () => {
    const s = ok<StageSolution>(solveStage({ tube: ax7, bplus: 250, ra: 100e3, rk: 1500 }));
    const { cgk, cgp } = ax7.capacitances;
    expectClose(s.cin, cgk + cgp * (1 + Math.abs(s.gain)), { rel: 1e-12 });
    expect(s.cin).toBeGreaterThan(50e-12); // a 12AX7 at gain ~60: ~100 pF, the reason high-mu stages lose treble (common practice)
  });

  it('unbypassed, Cgk sees only the grid\'s swing over the cathode: Cgk·(1 − Ak) with Ak = μ·Rk/(rp + Ra′ + (μ + 1)·Rk), the cathode follower\'s gain (Langford-Smith, RDH4 ch. 12)', () => {
    const s = ok<StageSolution>(solveStage({ tube: ax7, bplus: 250, ra: 100e3, rk: 1500, bypassed: false, rl: 470e3 }));
    const { cgk, cgp } = ax7.capacitances;
    const raLoaded = (100e3 * 470e3) / (100e3 + 470e3);
    const ak = (s.mu * 1500) / (s.rp + raLoaded + (s.mu + 1) * 1500);
    expectClose(s.cin, cgk * (1 - ak) + cgp * (1 + Math.abs(s.gain)), { rel: 1e-9 });
  });

  it('reports the grid swing left to grid current and to cutoff', () => {
    const s = ok<StageSolution>(solveStage({ tube: ax7, bplus: 250, ra: 100e3, rk: 1500 }));
    expectClose(s.toGridCurrent, -0.7 - s.op.vgk, { rel: 1e-12 }); // to the onset of grid current, not to 0 V
    expect(s.toCutoff).toBeGreaterThan(0);
  });

  it('works with a bare Koren model in place of a library tube (no ratings, no capacitances)', () => {
    const s = ok<StageSolution>(solveStage({ tube: triode({ mu: 100, ex: 1.4, kg1: 1060, kp: 600, kvb: 300 }), bplus: 250, ra: 100e3, rk: 1500 }));
    expect(s.cin).toBe(0);
    expect(s.findings).toEqual([]);
  });
});

describe('solveStage failures say what is wrong', () => {
  const base = { tube: ax7, bplus: 250, ra: 100e3, rk: 1500 };
  it.each([
    [{ bplus: -5 }, 'supply-too-low', 'B+ must be above 0 V (got -5 V)', 'bplus'],
    [{ bplus: 0 }, 'supply-too-low', 'B+ must be above 0 V (got 0 V)', 'bplus'],
    [{ ra: Number.NaN }, 'invalid-input', 'Ra must be a number', 'ra'],
    [{ ra: 0 }, 'invalid-input', 'Ra must be at least 1 Ω (got 0 Ω)', 'ra'],
    [{ ra: 5e-324 }, 'invalid-input', 'Ra must be at least 1 Ω (got 5e-324 Ω)', 'ra'],
    [{ rk: -10 }, 'invalid-input', 'Rk must be at least 0 Ω (got -10 Ω)', 'rk'],
    [{ rl: 0 }, 'invalid-input', 'RL must be at least 1 Ω (got 0 Ω)', 'rl'],
    [{ bplus: Infinity }, 'invalid-input', 'B+ must be finite (got Infinity)', 'bplus'],
    [{ bplus: 50_000 }, 'invalid-input', 'B+ must be at most 10000 V (got 50000 V)', 'bplus'],
  ] as const)('%j → %s', (patch, reason, message, field) => {
    const r = solveStage({ ...base, ...patch });
    expect(r).toEqual({ ok: false, reason, message, field });
  });

  it('a positive fixed bias with no Rk is grid current', () => {
    expect(solveStage({ ...base, rk: 0, vbias: 2 })).toEqual({
      ok: false,
      reason: 'grid-current',
      message: 'The grid would sit 2.00 V positive to the cathode and draw current: make the grid bias more negative or raise Rk.',
      field: 'vbias',
    });
  });

  it('a grid far beyond cutoff is cut off', () => {
    expect(solveStage({ ...base, rk: 0, vbias: -50 })).toEqual({
      ok: false,
      reason: 'cutoff',
      message: 'The tube is cut off: plate current below 1 µA. Lower Rk, make the grid bias less negative, or raise B+.',
      field: 'vbias',
    });
  });

  it('an unusable tube model is named', () => {
    expect(solveStage({ ...base, tube: triode({ mu: -3, ex: 1.4, kg1: 1000, kp: 300, kvb: 300 }) })).toEqual({
      ok: false,
      reason: 'invalid-tube',
      message: 'The tube model is not usable: mu must be above 0 (got -3)',
      field: 'tube',
    });
  });
});
