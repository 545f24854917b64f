import type { TypicalPoint } from '../tube/types';
import { milli, type CsvLineError } from './parseCurveCsv';

/**
 * A datasheet's typical operating figures pasted as text, one point per
 * line: Va (V), Vg (V), Ia (mA), then optionally mu, rp (Ω), gm (mA/V),
 * as the sheets print them; a '-' leaves a figure out. Back in SI units.
 */
export function parseTypicalCsv(text: string): { typical: TypicalPoint[]; errors: CsvLineError[] } {
  const typical: TypicalPoint[] = [];
  const errors: CsvLineError[] = [];
  String(text).split(/\r?\n/).forEach((raw, k) => {
    const line = raw.trim();
    if (line === '' || line.startsWith('#')) return;
    const cells = line.split(/[,;\t ]+/).filter((c) => c !== '');
    if (k === 0 && cells.some((c) => /[a-z]/i.test(c) && c !== '-')) return; // a header line
    if (cells.length < 3 || cells.length > 6) return void errors.push({ line: k + 1, message: `expected 3 to 6 values (Va, Vg, Ia mA, mu, rp Ω, gm mA/V), found ${cells.length}` });
    const nums = cells.map((c) => (c === '-' ? undefined : Number(c)));
    const bad = nums.findIndex((v, i) => v !== undefined && !Number.isFinite(v) || (v === undefined && i < 3));
    if (bad >= 0) return void errors.push({ line: k + 1, message: `“${cells[bad]!.slice(0, 20)}” is not a number` });
    const [va, vg, ia, mu, rp, gm] = nums as [number, number, number, number?, number?, number?];
    if (!(va > 0)) return void errors.push({ line: k + 1, message: `plate voltage must be above 0 V (got ${va})` });
    if (!(ia > 0)) return void errors.push({ line: k + 1, message: `plate current must be above 0 mA (got ${ia})` });
    if ([mu, rp, gm].some((v) => v !== undefined && !(v > 0))) return void errors.push({ line: k + 1, message: 'mu, rp and gm must be above 0' });
    typical.push({ va, vg, ia: milli(ia), ...(mu !== undefined ? { mu } : {}), ...(rp !== undefined ? { rp } : {}), ...(gm !== undefined ? { gm: milli(gm) } : {}), source: 'entered by the user' });
  });
  return { typical, errors };
}
