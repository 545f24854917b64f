import { checkCount, checkNumber } from '../stage/checkInput';
import { DENSEST_FAMILY_CURVES, MAX_FAMILY_CURVES } from '../stage/planeSeries';
import type { PlateExtent } from '../stage/plateExtent';
import { fail, type Result } from '../result';
import { outputExtent } from './outputSheet';
import type { OutputTube } from './outputTube';

/** What an output stage's analysis takes besides the design: its chart window and curve count. */
export interface ChartOptions {
  readonly extent?: PlateExtent;
  readonly maxCurves?: number;
}

/**
 * An output analysis's options as given (an object, or left out), with the
 * chart window (the tube's at this B+ unless given) and the curve count
 * checked: the options, window and count to use, or the first unusable one.
 */
export function chartOptionsOf<O extends ChartOptions>(given: O | null | undefined, tube: OutputTube, bplus: number): Result<{ readonly options: O | Record<string, never>; readonly extent: PlateExtent; readonly maxCurves: number }> {
  if (given !== null && given !== undefined && typeof given !== 'object') return fail('invalid-input', 'Analysis options must be an object or left out');
  const options = given ?? {};
  const extent = (options as ChartOptions).extent ?? outputExtent(tube, bplus);
  const maxCurves = (options as ChartOptions).maxCurves ?? MAX_FAMILY_CURVES;
  const problem =
    checkNumber('extent', 'Chart width', extent?.vmax, 'V', 1, 20_000) ??
    checkNumber('extent', 'Chart height', extent?.iaMax, 'A', 1e-6, 100) ??
    checkCount('maxCurves', 'Plate curves', maxCurves, 1, DENSEST_FAMILY_CURVES);
  return problem ?? { ok: true, options, extent, maxCurves };
}
