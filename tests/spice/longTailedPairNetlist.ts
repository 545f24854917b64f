import type { LongTailedPairDesign } from '../../src/index';
import { modelOf } from '../../src/tube/types';
import { triodeSubckt } from './netlists';
import { splitterLoadLines } from './splitterLoads';

/**
 * The long-tailed pair for ngspice: two triodes by Koren's law, the plate
 * resistors, the shared Rk and a tail resistor to its supply or an ideal
 * current source, grids at a fixed voltage or returned through 1 GΩ to the
 * tail's top with grid 2 held at signal ground by 1 F, and each plate into
 * its load through 1 F. `probe` drives grid 1 (AC 1 V) or puts a 1 A AC
 * current into one plate; an AC run at `hz` prints both plates.
 */
const g = (x: number) => x.toPrecision(12);

export function longTailedPairNetlist(d: LongTailedPairDesign, probe: 'gain' | 'p1' | 'p2', hz: number): string {
  const rl = d.rl ?? Infinity;
  const cl = d.cl ?? 0;
  const ac = probe === 'gain' ? 'AC 1' : 'AC 0';
  const lines = ['* long-tailed pair', triodeSubckt('tri', modelOf(d.tube).params), `VB b 0 DC ${g(d.bplus)}`, `RA1 b p1 ${g(d.ra1)}`, `RA2 b p2 ${g(d.ra2)}`, 'X1 p1 g1 k tri', 'X2 p2 g2 k tri'];
  lines.push(d.rk > 0 ? `RK k t ${g(d.rk)}` : 'VRK k t DC 0');
  if (d.tail.kind === 'resistor') lines.push(`RT t vee ${g(d.tail.rt)}`, `VEE vee 0 DC ${g(d.tail.vee ?? 0)}`);
  else lines.push(`IT t 0 DC ${g(d.tail.amps)}`);
  if (d.grid.kind === 'fixed') lines.push(`VG1 g1 0 DC ${g(d.grid.volts)} ${ac}`, `VG2 g2 0 DC ${g(d.grid.volts)}`);
  else lines.push(`VIN in 0 DC 0 ${ac}`, 'CIN in g1 1', 'RG1 g1 t 1e9', 'RG2 g2 t 1e9', 'CG2 g2 0 1');
  lines.push(...splitterLoadLines(['p1', 'p2'], rl, cl, probe === 'gain' ? null : probe));
  lines.push('.control', 'set numdgt=12', 'op', 'print v(p1) v(p2) v(k) v(g1)', `ac lin 1 ${g(hz)} ${g(hz)}`, 'print vr(p1) vi(p1) vr(p2) vi(p2) vr(g1) vi(g1)', 'quit 0', '.endc', '.end');
  return lines.join('\n');
}
