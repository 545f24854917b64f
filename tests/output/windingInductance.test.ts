import { describe, expect, it } from 'vitest';
import { findOutputTube, solveChain, solveOutput, windingProblem, type ChainInput, type OutputDesign } from '../../src/index';

const el34 = findOutputTube('EL34')!;
const design: OutputDesign = { tubeId: 'EL34', connection: 'pentode', bplus: 330, screenVolts: 300, ulTap: 0.43, zPrimary: 3500, rPrimary: 130, bias: 'cathode', rk: 330, vg: -20, rg: 220e3, speakerOhms: 8, thdLimit: 0.05 };

describe('an output transformer\'s inductances', () => {
  it('are optional: without them the transformer is the ideal one', () => {
    expect(windingProblem({})).toBeNull();
    expect(windingProblem({ primaryInductance: null, leakageInductance: null })).toBeNull();
    expect(windingProblem({ primaryInductance: 15, leakageInductance: 8e-3 })).toBeNull();
  });

  it('are refused beside their own field when out of range or not numbers', () => {
    expect(windingProblem({ primaryInductance: 0.01 })).toMatchObject({ ok: false, field: 'primaryInductance', message: 'Primary inductance must be at least 0.1 H (got 0.01 H)' });
    expect(windingProblem({ leakageInductance: 20 })).toMatchObject({ ok: false, field: 'leakageInductance' });
    expect(windingProblem({ primaryInductance: Number.NaN })).toMatchObject({ ok: false, field: 'primaryInductance', message: 'Primary inductance must be a number' });
  });

  it('refuse a leakage that is not well below the primary (a slip of units, mH typed as H)', () => {
    const r = windingProblem({ primaryInductance: 15, leakageInductance: 8 });
    expect(r).toMatchObject({ ok: false, field: 'leakageInductance' });
    expect(r?.ok === false && r.message).toMatch(/well below the primary inductance/);
  });

  it('are checked with the rest of the output stage', () => {
    expect(solveOutput(el34, { ...design, primaryInductance: 0 })).toMatchObject({ ok: false, field: 'primaryInductance' });
    expect(solveOutput(el34, { ...design, primaryInductance: 15, leakageInductance: 8e-3 }).ok).toBe(true);
  });

  // Textbook transformer response (Langford-Smith, RDH4 ch. 5): the primary inductance Lp shunts the reflected load and
  // the source (rp + Rpri) behind it, a low corner near R/(2π·Lp) with R the two in parallel; the leakage Ll in series, a
  // high corner near (source + load)/(2π·Ll). Here with one stage and nothing else in the band, the chain's corners land there.
  it('set the band of a lone output stage where the textbook places it', () => {
    const chain = (lp: number, ll: number): ChainInput => ({
      source: { rsource: 0 },
      stages: [{ ...design, kind: 'single-ended-output', tube: el34, coupling: { kind: 'capacitor', cc: 1e-3, rg: 220e3 }, primaryInductance: lp, leakageInductance: ll }],
    });
    const r = solveChain(chain(15, 8e-3));
    const solved = solveOutput(el34, design);
    if (!r.ok) throw new Error(r.message);
    if (!solved.ok) throw new Error(solved.message);
    const source = solved.op.rp + design.rPrimary;
    const low = (source * design.zPrimary) / (source + design.zPrimary) / (2 * Math.PI * 15);
    const high = (source + design.zPrimary) / (2 * Math.PI * 8e-3);
    expect(r.lowHz! / low).toBeGreaterThan(0.97);
    expect(r.lowHz! / low).toBeLessThan(1.03);
    // The tube's own capacitances add a little beyond the leakage; the leakage's corner still sets it within 10 %.
    expect(r.highHz! / high).toBeGreaterThan(0.9);
    expect(r.highHz! / high).toBeLessThan(1.03);
  });
});
