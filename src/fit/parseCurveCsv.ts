import type { CurvePoint } from './fitTriode';

/**
 * Plate-curve points pasted as text, one per line: plate voltage (V), grid
 * voltage (V), plate current (mA), separated by commas, semicolons, tabs or
 * spaces. Currents are in milliamps because that is how curve sheets are
 * read; the points come back in SI units (A). A header line and blank or
 * '#' comment lines are skipped. Every bad line is reported by its number.
 */
/** milli-units to SI, rounded to 15 significant digits (11.8 / 1000 is 0.011800000000000001 in binary). */
export const milli = (x: number) => Number((x / 1e3).toPrecision(15));

export interface CsvLineError {
  readonly line: number;
  readonly message: string;
}

export function parseCurveCsv(text: string): { points: CurvePoint[]; errors: CsvLineError[] } {
  const points: CurvePoint[] = [];
  const errors: CsvLineError[] = [];
  const lines = String(text).split(/\r?\n/);
  lines.forEach((raw, k) => {
    const line = raw.trim();
    const n = k + 1;
    if (line === '' || line.startsWith('#')) return;
    const cells = line.split(/[,;\t ]+/).filter((c) => c !== '');
    if (k === 0 && cells.some((c) => /[a-df-z]/i.test(c))) return; // a header line
    if (cells.length !== 3) {
      errors.push({ line: n, message: `expected 3 numbers (Va V, Vg V, Ia mA), found ${cells.length}` });
      return;
    }
    const [va, vg, ia] = cells.map(Number) as [number, number, number];
    const bad = cells.findIndex((c) => !Number.isFinite(Number(c)));
    if (bad >= 0) {
      errors.push({ line: n, message: `“${cells[bad]!.slice(0, 20)}” is not a number` });
      return;
    }
    if (!(va > 0)) return void errors.push({ line: n, message: `plate voltage must be above 0 V (got ${va})` });
    if (ia < 0) return void errors.push({ line: n, message: `plate current cannot be negative (got ${ia} mA)` });
    if (vg > 0) return void errors.push({ line: n, message: `grid voltage above 0 V (${vg}) is outside what the model fits` });
    points.push({ va, vg, ia: milli(ia) });
  });
  return { points, errors };
}
