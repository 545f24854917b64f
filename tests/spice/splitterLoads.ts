/**
 * A splitter's two outputs into the next grids for ngspice: each through
 * 1 F (short at audio) to its load resistor and capacitance; and, for an
 * impedance probe, a 1 A AC current into one output.
 */
const g = (x: number) => x.toPrecision(12);

export function splitterLoadLines(outputs: readonly [string, string], rl: number, cl: number, probe: string | null): string[] {
  const lines: string[] = [];
  outputs.forEach((node, i) => {
    const load = `load${i + 1}`;
    lines.push(`C${load} ${node} ${load} 1`);
    if (Number.isFinite(rl)) lines.push(`R${load} ${load} 0 ${g(rl)}`);
    if (cl > 0) lines.push(`CC${load} ${load} 0 ${g(cl)}`);
  });
  if (probe) lines.push(`IZ 0 ${probe} DC 0 AC 1`);
  return lines;
}
