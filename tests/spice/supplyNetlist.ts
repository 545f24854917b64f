import { supplyCircuit } from '../../src/netlist/supplyCircuit';
import type { SupplyDesign } from '../../src/supply/supplyTypes';

/**
 * A supply for ngspice, as the exported netlist writes it (supplyCircuit),
 * with constant-current loads at its nodes. The capacitors start at 90 % of
 * `start` (the model's answer), far enough off that agreement is the
 * simulator's own, and the run lasts `seconds`.
 */
const g = (x: number) => x.toPrecision(12);

export function supplyNetlist(d: SupplyDesign, start: readonly number[], seconds: number): string {
  const f = d.mainsHz;
  const node = (k: number) => `n${k}`;
  const circuit = supplyCircuit(d, node);
  const lines = ['* B+ supply', ...circuit.lines, ...d.loads.map((a, k) => `I${k} ${node(k)} 0 DC ${g(a)}`)];
  lines.push(`.ic ${start.map((v, k) => `v(${node(k)})=${g(0.9 * v)}`).join(' ')}`);
  const from = seconds - 1 / f;
  const pulses = [`meas tran ipk MAX i(${circuit.pulses}) from=${g(from)} to=${g(seconds)}`, `meas tran ineg MIN i(${circuit.pulses}) from=${g(from)} to=${g(seconds)}`];
  const measures = [...pulses, ...start.flatMap((_, k) => [`meas tran avg${k} AVG v(${node(k)}) from=${g(from)} to=${g(seconds)}`, `meas tran pp${k} PP v(${node(k)}) from=${g(from)} to=${g(seconds)}`])];
  return [...lines, '.control', 'set numdgt=12', `tran ${g(1 / f / 2000)} ${g(seconds)} 0 ${g(1 / f / 2000)} uic`, ...measures, 'quit 0', '.endc', '.end'].join('\n');
}
