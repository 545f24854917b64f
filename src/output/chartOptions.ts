import { checkCount, checkNumber } from '../stage/checkInput';
import { MAX_FAMILY_CURVES } from '../stage/planeSeries';
import type { PlateExtent } from '../stage/plateExtent';
import type { Failure } from '../result';

/** An output stage's chart window and curve count as an analysis is asked for them: the first unusable one, or null. */
export function chartOptionsProblem(extent: PlateExtent | undefined, maxCurves: number): Failure | null {
  return (
    checkNumber('extent', 'Chart width', extent?.vmax, 'V', 1, 20_000) ??
    checkNumber('extent', 'Chart height', extent?.iaMax, 'A', 1e-6, 100) ??
    checkCount('maxCurves', 'Plate curves', maxCurves, 1, MAX_FAMILY_CURVES)
  );
}
