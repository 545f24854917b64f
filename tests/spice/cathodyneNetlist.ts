import type { CathodyneDesign } from '../../src/index';
import { modelOf } from '../../src/tube/types';
import { triodeSubckt } from './netlists';
import { splitterLoadLines } from './splitterLoads';

/**
 * The split-load splitter for ngspice: the triode by Koren's law, Ra, Rb and
 * Rk, the grid at a fixed voltage or returned through 1 GΩ to the Rb–Rk
 * junction, each output into its load through 1 F. `probe` picks what is
 * driven: the grid (AC 1 V, for the gains) or a 1 A AC current into one
 * output with the grid held (for that output's impedance). An AC run at
 * `hz` prints the real and imaginary parts of both outputs.
 */
const g = (x: number) => x.toPrecision(12);

export function cathodyneNetlist(d: CathodyneDesign, probe: 'gain' | 'plate' | 'cathode', hz: number): string {
  const rl = d.rl ?? Infinity;
  const cl = d.cl ?? 0;
  const lines = ['* split-load phase splitter', triodeSubckt('tri', modelOf(d.tube).params), `VB b 0 DC ${g(d.bplus)}`, `RA b plate ${g(d.ra)}`, 'X1 plate grid cathode tri'];
  lines.push(d.rb > 0 ? `RB cathode tap ${g(d.rb)}` : 'VRB cathode tap DC 0', `RK tap 0 ${g(d.rk)}`);
  const ac = probe === 'gain' ? 'AC 1' : 'AC 0';
  if (d.grid.kind === 'fixed') lines.push(`VG grid 0 DC ${g(d.grid.volts)} ${ac}`);
  else lines.push(`VIN in 0 DC 0 ${ac}`, 'CIN in grid 1', 'RG grid tap 1e9');
  lines.push(...splitterLoadLines(['plate', 'cathode'], rl, cl, probe === 'gain' ? null : probe));
  lines.push('.control', 'set numdgt=12', 'op', 'print v(plate) v(cathode) v(grid)', `ac lin 1 ${g(hz)} ${g(hz)}`, 'print vr(plate) vi(plate) vr(cathode) vi(cathode) vr(grid) vi(grid)', 'quit 0', '.endc', '.end');
  return lines.join('\n');
}
