import { fitTriode, parseCurveCsv, parseTypicalCsv, plateFamily, type CsvLineError, type PlateCurve, type TriodeFit, type TypicalPoint } from '../../src/index';

/** What a fit of pasted points gives the bench: the points read, line errors, the fit, and its curves for drawing over them. */
export interface FitOutcome {
  readonly points: readonly { va: number; vg: number; ia: number }[];
  readonly typical: readonly TypicalPoint[];
  readonly lineErrors: readonly CsvLineError[];
  readonly fit: ({ ok: true } & TriodeFit) | { ok: false; message: string };
  readonly curves: readonly PlateCurve[];
}

/**
 * Reads the points box and the typical-figures box and fits Koren's law to
 * them: plain data in, plain data out, so it runs the same in a Web Worker
 * (off the page's thread) or, where there are no workers, in place.
 */
export function fitJob(csv: string, typicalCsv: string, onProgress?: (done: number, of: number) => void): FitOutcome {
  const { points, errors } = parseCurveCsv(csv);
  const typ = parseTypicalCsv(typicalCsv);
  const lineErrors = [...errors, ...typ.errors.map((e) => ({ ...e, message: `typical figures: ${e.message}` }))];
  const fit = fitTriode(points, { typical: typ.typical, ...(onProgress ? { onProgress } : {}) });
  const grids = [...new Set([...points, ...typ.typical].map((p) => p.vg))].sort((a, b) => b - a).slice(0, 24);
  const vmax = Math.max(1, ...[...points, ...typ.typical].slice(0, 20_000).map((p) => p.va)) * 1.15;
  const curves = fit.ok ? plateFamily({ kind: 'triode-model', params: fit.params, gridResistance: 2000 }, grids, vmax, 80) : [];
  return { points, typical: typ.typical, lineErrors, fit, curves };
}
