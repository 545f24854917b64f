import { describe, expect, it } from 'vitest';
import { atDrive, findOutputTube, solveOutput, type OutputDesign } from '../../src/index';
import { expectClose } from '../helpers/expectClose';
import { fourierTable, ngspiceGate, runNgspiceFull } from './ngspice';
import { outputNetlist } from './outputNetlist';

// Outside reference: ngspice (Debian's package) on the full circuit: Koren's
// laws as behavioural sources and the transformer as coupled inductors with
// the primary's DC resistance. Agreement asked, as in the signal checks:
// operating point to 0.1 %, power to 1 %, H2 and H3 within 1 dB. The drive
// is held for 300 ms, so the primary's magnetising current (20 H: its time
// constant 30 ms at most here, the 300B's) has settled where a sustained
// drive puts it, the steady state the figures are of; the cathode is held by
// 10 F as the model holds it.
const run = ngspiceGate();
const SETTLE = { ck: 10, ms: 300, lp: 20 } as const;

const base: OutputDesign = {
  tubeId: 'EL34', connection: 'ultralinear', bplus: 300, screenVolts: 300, ulTap: 0.4, zPrimary: 3000, rPrimary: 150,
  bias: 'cathode', rk: 220, vg: -20, rg: 220e3, speakerOhms: 8, thdLimit: 0.05,
};

const cases: { label: string; design: OutputDesign }[] = [
  { label: 'EL34 ultralinear (40 % tap), cathode bias', design: base },
  { label: '6L6GC pentode, fixed bias, separate screen supply', design: { ...base, tubeId: '6L6GC', connection: 'pentode', bias: 'fixed', vg: -16, screenVolts: 270, zPrimary: 3500 } },
  { label: '300B, cathode bias', design: { ...base, tubeId: '300B', connection: 'triode', bplus: 400, rk: 900, zPrimary: 3500, rPrimary: 120 } },
  { label: 'EL34 triode-connected, cathode bias', design: { ...base, connection: 'triode', zPrimary: 2500 } },
];

const dB = (x: number) => 20 * Math.log10(x);

describe.runIf(run)('transformer-coupled stages agree with ngspice', () => {
  it.each(cases.map((c) => [c.label, c.design] as const))('%s', { timeout: 60_000 }, (_label, d) => {
    const tube = findOutputTube(d.tubeId)!;
    const s = solveOutput(tube, d);
    if (!s.ok) throw new Error(s.message);
    const drive = 0.8 * -s.op.vgk;
    const ours = atDrive(s, drive);
    if (!ours.ok) throw new Error(ours.message);
    const sim = runNgspiceFull(outputNetlist(tube, d, drive, false, SETTLE));
    expectClose(s.op.vpk + s.op.vk, sim.values['v(plate)']!, { rel: 1e-3 }, 'plate voltage');
    expectClose(s.op.vk, sim.values['v(cathode)'] ?? 0, { rel: 1e-3, abs: 1e-6 }, 'cathode voltage');
    // The B+ source feeds the plate (and a tied or tapped screen); a pentode's screen has its own supply.
    const fromBplus = d.connection === 'pentode' && tube.law.kind === 'pentode' ? s.op.ia : s.op.ik;
    expectClose(fromBplus, -sim.values['i(vb)']!, { rel: 1e-3 }, 'B+ current');
    const f = fourierTable(sim.output);
    const simPower = f.get(1)!.magnitude ** 2 / (2 * d.speakerOhms);
    expectClose(ours.power, simPower, { rel: 0.01 }, 'power');
    expect(Math.abs(dB(ours.harmonics[2]!) - dB(f.get(2)!.normalized)), `H2 ${ours.harmonics[2]} vs ${f.get(2)!.normalized}`).toBeLessThan(1);
    expect(Math.abs(dB(ours.harmonics[3]!) - dB(f.get(3)!.normalized)), `H3 ${ours.harmonics[3]} vs ${f.get(3)!.normalized}`).toBeLessThan(1);
  });
});
