import { describe, expect, it } from 'vitest';
import { atDrive, findOutputTube, solveOutput, type OutputDesign } from '../../src/index';
import { fourierTable, ngspiceGate, runNgspiceFull } from './ngspice';
import { outputNetlist } from './outputNetlist';

// Outside reference: ngspice on the whole single-ended stage with its grid driven to 0 V and the drive held for 300 ms
// (the cathode held by 10 F, the 100 H primary's current free to settle). Under a sustained drive the average plate
// current rises and that shift settles into the primary's magnetising current, so the plate swings about its supply
// again: the steady state a data sheet's power is measured in. Held at its idle value instead (the first milliseconds
// after a drive starts) the power reads 11.5 % low for the EL34 pentode below (10.40 W against ngspice's 11.75 W) and
// 8 % low ultralinear (7.66 against 8.32 W): this check was listed as a known miss until the cycle was solved to its
// steady state. Asked within 2 %, and the magnetising current must have moved by 5 % at least, or the check would say little.
const run = ngspiceGate();

// Our own design: the demo's EL34 output stage, wired as a pentode with its screen at 300 V, and ultralinear.
const el34: OutputDesign = {
  tubeId: 'EL34', connection: 'pentode', bplus: 330, screenVolts: 300, ulTap: 0.43, zPrimary: 3500, rPrimary: 130,
  bias: 'cathode', rk: 330, vg: -22, rg: 220e3, speakerOhms: 8, thdLimit: 0.05,
};
const cases = [el34, { ...el34, connection: 'ultralinear' } as const];

describe.runIf(run)('a single-ended stage\'s steady state under sustained full drive agrees with ngspice', () => {
  it.each(cases.map((d) => [d.connection, d] as const))('EL34 %s, grid driven to 0 V: power within 2 % once the magnetising current has settled', { timeout: 120_000 }, (_label, d) => {
    const s = solveOutput(findOutputTube('EL34')!, d);
    if (!s.ok) throw new Error(s.message);
    const ours = atDrive(s, -s.op.vgk);
    if (!ours.ok) throw new Error(ours.message);
    const sim = runNgspiceFull(outputNetlist(s.tube, d, -s.op.vgk, false, { ck: 10, ms: 300 }));
    const steady = fourierTable(sim.output).get(1)!.magnitude ** 2 / (2 * d.speakerOhms);
    expect(Math.abs(ours.power / steady - 1)).toBeLessThan(0.02);
    // The magnetising current has moved with the drive, by as much as the average current has.
    expect(Math.abs(ours.magnetising - s.op.mmf)).toBeGreaterThan(0.05 * s.op.mmf);
  });
});
