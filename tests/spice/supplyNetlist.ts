import { findRectifierTube, perveanceOf } from '../../src/supply/rectifierTubes';
import { SILICON } from '../../src/supply/rectifierLaw';
import type { SupplyDesign } from '../../src/supply/supplyTypes';

/**
 * A supply for ngspice: the secondary as sine sources behind the winding
 * resistance (two in antiphase for a centre-tapped winding; one, into one
 * diode, for half-wave), silicon diodes
 * with the model's own Shockley constants, a 0 V source carrying the rectifier's current (the bridge's winding source itself), a rectifier tube as a behavioural
 * Child–Langmuir source, the filter ladder and constant-current loads. The
 * capacitors start at 90 % of `start` (the model's answer), far enough off
 * that agreement is the simulator's own, and the run lasts `seconds`.
 */
const g = (x: number) => x.toPrecision(12);

export function supplyNetlist(d: SupplyDesign, start: readonly number[], seconds: number): string {
  const peak = Math.SQRT2 * d.secondaryRms;
  const f = d.mainsHz;
  const lines = ['* B+ supply', `.model DSI D(IS=${g(SILICON.is)} N=${g(SILICON.n)} RS=${g(SILICON.rs)})`];
  const into = d.input.kind === 'choke' ? 'r' : 'n0';
  const tube = d.rectifier.kind === 'tube' ? findRectifierTube(d.rectifier.tubeId)! : null;
  const plate = (from: string, name: string) =>
    tube ? `B${name} ${from} rx I = ${g(perveanceOf(tube))}*pwr(max(v(${from},rx),0),1.5)` : `D${name} ${from} rx DSI`;
  if (d.rectifier.kind === 'silicon-bridge') {
    // One floating winding; a large resistor gives its far end a DC path for the simulator's first operating point.
    lines.push(`VA a b SIN(0 ${g(peak)} ${f})`, `RWA a a1 ${g(Math.max(d.windingOhms, 1e-6))}`, 'RFLOAT b 0 1e9');
    // Straight into the filter: a sense source there left the floating winding's far end too loose for the simulator's
    // steps (it stopped at 1.4 s, "timestep too small"); the winding's own source carries every pulse instead.
    lines.push(`D1 a1 ${into} DSI`, `D2 b ${into} DSI`, 'D3 0 a1 DSI', 'D4 0 b DSI');
  } else if (d.rectifier.kind === 'silicon-half-wave') {
    // One winding, one diode.
    lines.push(`VA a 0 SIN(0 ${g(peak)} ${f})`, `RWA a a1 ${g(Math.max(d.windingOhms, 1e-6))}`, plate('a1', '1'));
  } else {
    lines.push(`VA a 0 SIN(0 ${g(peak)} ${f})`, `VB b 0 SIN(0 ${g(-peak)} ${f})`, `RWA a a1 ${g(Math.max(d.windingOhms, 1e-6))}`, `RWB b b1 ${g(Math.max(d.windingOhms, 1e-6))}`);
    lines.push(plate('a1', '1'), plate('b1', '2'));
  }
  // A 0 V source carries the rectifier's current, for its peak.
  if (d.rectifier.kind !== 'silicon-bridge') lines.push(`VSENSE rx ${into} DC 0`);
  if (d.input.kind === 'choke') lines.push(`L0 r rl0 ${g(d.input.l)}`, `RL0 rl0 n0 ${g(Math.max(d.input.rdc, 1e-6))}`);
  lines.push(`C0 n0 0 ${g(d.input.c)}`, `I0 n0 0 DC ${g(d.loads[0]!)}`);
  d.sections.forEach((s, i) => {
    const k = i + 1;
    if (s.kind === 'rc') lines.push(`R${k} n${k - 1} n${k} ${g(s.r)}`);
    else lines.push(`L${k} n${k - 1} m${k} ${g(s.l)}`, `RS${k} m${k} n${k} ${g(Math.max(s.rdc, 1e-6))}`);
    lines.push(`C${k} n${k} 0 ${g(s.c)}`, `I${k} n${k} 0 DC ${g(d.loads[k]!)}`);
  });
  lines.push(`.ic ${start.map((v, k) => `v(n${k})=${g(0.9 * v)}`).join(' ')}`);
  const from = seconds - 1 / f;
  const pulses = d.rectifier.kind === 'silicon-bridge'
    ? [`meas tran ipk MAX i(va) from=${g(from)} to=${g(seconds)}`, `meas tran ineg MIN i(va) from=${g(from)} to=${g(seconds)}`]
    : [`meas tran ipk MAX i(vsense) from=${g(from)} to=${g(seconds)}`];
  const measures = [...pulses, ...start.flatMap((_, k) => [`meas tran avg${k} AVG v(n${k}) from=${g(from)} to=${g(seconds)}`, `meas tran pp${k} PP v(n${k}) from=${g(from)} to=${g(seconds)}`])];
  return [...lines, '.control', 'set numdgt=12', `tran ${g(1 / f / 2000)} ${g(seconds)} 0 ${g(1 / f / 2000)} uic`, ...measures, 'quit 0', '.endc', '.end'].join('\n');
}
