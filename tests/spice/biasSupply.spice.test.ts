import { describe, it } from 'vitest';
import { solveBiasSupply, type BiasSupplyDesign } from '../../src/supply/biasSupply';
import { SILICON } from '../../src/supply/rectifierLaw';
import { expectClose } from '../helpers/expectClose';
import { ngspiceGate, runNgspiceFull } from './ngspice';

// Outside reference: ngspice's transient run of the whole bias supply as
// built (the diode turned round for a negative rail, with the model's own
// Shockley constants; each string as resistors, its trimmer split at the
// wiper's setting for the law's tube) to a steady state from capacitors
// started 10 % off. Asked: the rail's and each wiper's DC within 0.5 %, the
// rail's and the wipers' ripple peak to peak within 5 %, the diode's peak
// current within 5 %. The model takes the strings as a steady current: this
// holds it to real resistors.
const run = ngspiceGate();
const g = (x: number) => x.toPrecision(12);

// Our own bias supplies, each with the settings its tubes need (V below ground: weakest, nominal, strongest).
const cases: { label: string; d: BiasSupplyDesign; reaches: { weakest: number; nominal: number; strongest: number }[] }[] = [
  { label: 'a pair from a 50 V tap: 47 µF, 4.7 kΩ into 100 µF, 50 Hz', d: { mainsHz: 50, secondaryRms: 50, windingOhms: 150, reservoir: 47e-6, r: 4700, c: 100e-6 }, reaches: [{ weakest: 33, nominal: 37, strongest: 41 }, { weakest: 33, nominal: 37, strongest: 41 }] },
  { label: 'one tube from a 40 V winding: 100 µF, 2.2 kΩ into 47 µF, 60 Hz', d: { mainsHz: 60, secondaryRms: 40, windingOhms: 80, reservoir: 100e-6, r: 2200, c: 47e-6 }, reaches: [{ weakest: 19.5, nominal: 22, strongest: 24.5 }] },
  { label: 'a pair from a 70 V winding: 22 µF, 10 kΩ into 47 µF, 50 Hz', d: { mainsHz: 50, secondaryRms: 70, windingOhms: 300, reservoir: 22e-6, r: 10e3, c: 47e-6 }, reaches: [{ weakest: 44, nominal: 50, strongest: 56 }, { weakest: 44, nominal: 50, strongest: 56 }] },
];

function netlist(d: BiasSupplyDesign, s: Extract<ReturnType<typeof solveBiasSupply>, { ok: true }>, seconds: number): string {
  const f = d.mainsHz;
  const lines = ['* bias supply', `.model DSI D(IS=${g(SILICON.is)} N=${g(SILICON.n)} RS=${g(SILICON.rs)})`];
  lines.push(`VA a 0 SIN(0 ${g(Math.SQRT2 * d.secondaryRms)} ${f})`, `RWA a a1 ${g(Math.max(d.windingOhms, 1e-6))}`);
  // Anode at the reservoir: it conducts while the winding swings below it, and charges it negative.
  lines.push('D1 n0 rx DSI', 'VSENSE a1 rx DC 0', `C0 n0 0 ${g(d.reservoir)}`, `R1 n0 n1 ${g(d.r)}`, `C1 n1 0 ${g(d.c)}`);
  s.taps.forEach((t, i) => {
    const { top, pot, bottom } = t.string;
    lines.push(`RT${i} n1 t${i} ${g(top)}`, `RPA${i} t${i} w${i} ${g(pot * (1 - t.travel))}`, `RPB${i} w${i} b${i} ${g(Math.max(pot * t.travel, 1e-6))}`, `RB${i} b${i} 0 ${g(bottom)}`);
  });
  lines.push(`.ic v(n0)=${g(-0.9 * s.reservoir)} v(n1)=${g(-0.9 * s.rail)}`);
  const from = seconds - 1 / f;
  const span = `from=${g(from)} to=${g(seconds)}`;
  const measures = [`meas tran ipk MAX i(vsense) ${span}`, `meas tran ineg MIN i(vsense) ${span}`, `meas tran avgr AVG v(n1) ${span}`, `meas tran ppr PP v(n1) ${span}`];
  s.taps.forEach((_, i) => measures.push(`meas tran avgw${i} AVG v(w${i}) ${span}`, `meas tran ppw${i} PP v(w${i}) ${span}`));
  return [...lines, '.control', 'set numdgt=12', `tran ${g(1 / f / 2000)} ${g(seconds)} 0 ${g(1 / f / 2000)} uic`, ...measures, 'quit 0', '.endc', '.end'].join('\n');
}

function measured(output: string): Record<string, number> {
  const out: Record<string, number> = {};
  for (const m of output.matchAll(/^(\w+)\s*=\s*([-+]?\d[\d.]*(?:e[-+]?\d+)?)/gim)) out[m[1]!.toLowerCase()] = Number(m[2]);
  return out;
}

describe.runIf(run)('bias supplies agree with an ngspice transient', () => {
  it.each(cases.map((c) => [c.label, c] as const))('%s', (_label, c) => {
    const s = solveBiasSupply(c.d, c.reaches);
    if (!s.ok) throw new Error(s.message);
    const sim = measured(runNgspiceFull(netlist(c.d, s, 4)).output);
    expectClose(-s.rail, sim.avgr!, { rel: 0.005 }, 'rail DC');
    expectClose(s.railRipplePp, sim.ppr!, { rel: 0.05 }, 'rail ripple');
    s.taps.forEach((t, i) => {
      expectClose(-t.nominal, sim[`avgw${i}`]!, { rel: 0.005 }, `wiper ${i + 1} DC`);
      expectClose((s.railRipplePp * t.nominal) / s.rail, sim[`ppw${i}`]!, { rel: 0.05 }, `wiper ${i + 1} ripple`);
    });
    // The diode's current runs from the winding into the reservoir's negative plate: negative through the sense source.
    expectClose(s.diodePeak, Math.max(sim.ipk ?? 0, -(sim.ineg ?? 0)), { rel: 0.05 }, 'diode peak current');
  }, 120_000);
});
