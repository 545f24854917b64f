import { describe, expect, it } from 'vitest';
import { atDrive, findOutputTube, solveOutput, type OutputDesign } from '../../src/index';
import { fourierTable, ngspiceGate, runNgspiceFull } from './ngspice';
import { outputNetlist } from './outputNetlist';

// Known miss, found this stop: the single-ended stage's cycle is solved with the primary's magnetising current held
// at its idle value, as it is in the first milliseconds after a drive starts (the 5 ms runs of output.spice.test.ts
// agree with it within 1 %). Sustained, the drive's own DC shift (the average plate current rises at full drive)
// settles into the magnetising inductance and the winding then carries none, so the plate swings about B+ again.
// Measured against ngspice run for 300 ms with the cathode held (10 F) and the 100 H primary's current free to settle:
// an EL34 pentode with its grid driven to 0 V gives 11.75 W where the model reads 10.40 W (11.5 % low), ultralinear
// 8.32 W against 7.66 W. This fails when the cycle is solved to its steady state (the winding's average zero).
const run = ngspiceGate();

// Our own design: the demo's EL34 output stage, wired as a pentode with its screen at 300 V.
const el34: OutputDesign = {
  tubeId: 'EL34', connection: 'pentode', bplus: 330, screenVolts: 300, ulTap: 0.43, zPrimary: 3500, rPrimary: 130,
  bias: 'cathode', rk: 330, vg: -22, rg: 220e3, speakerOhms: 8, thdLimit: 0.05,
};

describe.runIf(run)('known miss: a single-ended stage\'s steady state under sustained full drive', () => {
  it.fails('EL34 pentode, grid driven to 0 V: power within 2 % of ngspice once the primary\'s magnetising current has settled', () => {
    const s = solveOutput(findOutputTube('EL34')!, el34);
    if (!s.ok) throw new Error(s.message);
    const ours = atDrive(s, -s.op.vgk);
    if (!ours.ok) throw new Error(ours.message);
    const sim = runNgspiceFull(outputNetlist(s.tube, el34, -s.op.vgk, false, { ck: 10, ms: 300 }));
    const steady = fourierTable(sim.output).get(1)!.magnitude ** 2 / (2 * el34.speakerOhms);
    expect(Math.abs(ours.power / steady - 1)).toBeLessThan(0.02);
  }, 120_000);
});
