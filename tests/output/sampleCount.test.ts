import { describe, expect, it } from 'vitest';
import { findOutputTube, solveOutput, type OutputDesign } from '../../src/index';
import * as calls from '../../src/output/outputCalls';

// The single-ended stage's public calls read a cycle's harmonics by a radix-2 Fourier transform (Cooley and Tukey,
// 1965), which takes a power of two points only: any other count is refused by field, as the pair's calls already did.
describe('a cycle\'s sample count', () => {
  it('refuses a sample count its Fourier transform cannot take (a power of two), by field, where it once answered 0.00014 W for 10.4 W', () => {
    const d: OutputDesign = { tubeId: 'EL34', connection: 'pentode', bplus: 330, screenVolts: 300, ulTap: 0.43, zPrimary: 3500, rPrimary: 130, bias: 'cathode', rk: 330, vg: -22, rg: 220e3, speakerOhms: 8, thdLimit: 0.05 };
    const s = solveOutput(findOutputTube('EL34')!, d);
    if (!s.ok) throw new Error(s.message);
    for (const r of [calls.atDrive(s, 10, undefined, 1000), calls.cleanLimit(s, undefined, 1000), calls.waveform(s, 10, undefined, 96)]) {
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r).toMatchObject({ field: 'samples', message: expect.stringMatching(/power of two/) });
    }
    expect(calls.atDrive(s, 10, undefined, 1024).ok).toBe(true);
  });
});
