import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

/**
 * Runs ngspice (Debian's package) in batch mode on a netlist and reads back
 * every `name = value` line that `print` wrote. The simulator is the outside
 * reference for the model's solvers: Koren's law goes in as a behavioural
 * current source, the rest of the circuit as ordinary parts.
 */
export function ngspiceAvailable(): boolean {
  const r = spawnSync('ngspice', ['--version'], { encoding: 'utf8' });
  return r.status === 0 && /ngspice/i.test(r.stdout + r.stderr);
}

export const NGSPICE_MISSING_MESSAGE =
  '\n*** ngspice is not installed: the simulator cross-checks are SKIPPED. ***\n' +
  '*** Install it with: sudo apt-get install -y ngspice   (Debian/Ubuntu) ***\n' +
  '*** Under CI=true a missing ngspice fails the run instead. ***\n';

/** Call at the top of a simulator suite: true to run it; false (after a loud warning) to skip; throws under CI. */
export function ngspiceGate(): boolean {
  if (ngspiceAvailable()) return true;
  if (process.env.CI === 'true') throw new Error('ngspice is required under CI=true (apt-get install -y ngspice)');
  console.warn(NGSPICE_MISSING_MESSAGE);
  return false;
}

export interface NgspiceRun {
  /** Every `name = value` line that `print` wrote. */
  readonly values: Record<string, number>;
  /** Everything ngspice wrote, for parsing other reports (e.g. Fourier tables). */
  readonly output: string;
  /** The contents of a file the netlist wrote with `wrdata`, when asked for. */
  readonly data: string;
}

/** Runs a netlist; `{data}` in it is replaced by the path of a scratch file whose contents come back as `data`. */
export function runNgspiceFull(netlist: string): NgspiceRun {
  const dir = mkdtempSync(join(tmpdir(), 'quiescent-spice-'));
  try {
    const file = join(dir, 'check.cir');
    const dataFile = join(dir, 'data.txt');
    writeFileSync(file, netlist.replaceAll('{data}', dataFile));
    const r = spawnSync('ngspice', ['-b', file], { encoding: 'utf8', timeout: 60_000 });
    const out = `${r.stdout}\n${r.stderr}`;
    if (r.status !== 0 || /^Error/m.test(out)) throw new Error(`ngspice failed:\n${out}\n--- netlist ---\n${netlist}`);
    const values: Record<string, number> = {};
    for (const m of out.matchAll(/^\s*([\w@#()[\].,:-]+)\s*=\s*([-+]?\d[\d.]*(?:e[-+]?\d+)?)\s*$/gim)) {
      values[(m[1] as string).toLowerCase()] = Number(m[2]);
    }
    let data = '';
    try {
      data = readFileSync(dataFile, 'utf8');
    } catch {
      /* no data file asked for */
    }
    return { values, output: out, data };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

export function runNgspice(netlist: string): Record<string, number> {
  return runNgspiceFull(netlist).values;
}

/** The "Normalized Magnitude" column of ngspice's Fourier table, by harmonic number (1 = fundamental). */
export function fourierTable(output: string): Map<number, { magnitude: number; normalized: number }> {
  const rows = new Map<number, { magnitude: number; normalized: number }>();
  const start = output.indexOf('Fourier analysis');
  for (const line of output.slice(start).split('\n')) {
    const cols = line.trim().split(/\s+/);
    if (cols.length === 6 && cols.every((c) => /^[-+]?\d/.test(c))) {
      rows.set(Number(cols[0]), { magnitude: Number(cols[2]), normalized: Number(cols[4]) });
    }
  }
  return rows;
}
