import { volumeProblem } from '../stage/volumeControl';
import { fail, type Result } from '../result';
import { checkNumber, checkTube, LIMITS } from '../stage/checkInput';
import { plateExtent } from '../stage/plateExtent';
import { evaluatePoint, type RegionStage } from './evaluatePoint';
import { gridProblem, scanPlane, type PlaneBest, type PlaneRegion, type RegionGrid } from './planeRegion';
import { activeTargets, targetsProblem, type Targets } from './targets';

export type { RegionGrid } from './planeRegion';
export { weakestOf } from './planeRegion';

export interface RegionBest extends PlaneBest {
  readonly ra: number;
  readonly rk: number;
}

export interface FeasibleRegion extends PlaneRegion {
  /** Ra and Rk at each point, Ω (0 where unreachable). */
  readonly ra: readonly (readonly number[])[];
  readonly rk: readonly (readonly number[])[];
  readonly best: RegionBest | null;
}

/**
 * Where on the plate plane a stage meets every target: each point (Vpk, Ia)
 * is a design (the Ra and Rk that put a cathode-biased stage there on this
 * B+), solved once and judged against every target (evaluatePoint).
 */
export function feasibleRegion(stage: RegionStage, targets: Targets, grid: RegionGrid = {}): Result<FeasibleRegion> {
  if (typeof stage !== 'object' || stage === null) return fail('invalid-input', 'No stage given');
  const problem =
    checkTube(stage.tube) ??
    checkNumber('bplus', 'B+', stage.bplus, 'V', 0, LIMITS.maxVolts, { minExclusive: true }) ??
    checkNumber('rl', 'RL', stage.rl, 'Ω', LIMITS.minOhms, LIMITS.maxOhms, { allowInfinity: true }) ??
    checkNumber('rsource', 'Source impedance', stage.rsource, 'Ω', 0, LIMITS.maxOhms) ??
    (typeof stage.bypassed === 'boolean' ? null : fail('invalid-input', 'Bypass must be on or off', 'bypassed')) ??
    (stage.rg === undefined ? null : checkNumber('rg', 'Rg', stage.rg, 'Ω', LIMITS.minOhms, LIMITS.maxOhms)) ??
    (stage.rstopper === undefined ? null : checkNumber('rstopper', 'Grid stopper (0 for none)', stage.rstopper, 'Ω', 0, LIMITS.maxOhms)) ??
    volumeProblem(stage.volume, true) ??
    (stage.heaterVolts === undefined ? null : checkNumber('heaterVolts', 'Heater potential', stage.heaterVolts, 'V', -LIMITS.maxVolts, LIMITS.maxVolts)) ??
    targetsProblem(targets);
  if (problem) return problem;
  const nx = grid?.nx ?? 60;
  const ny = grid?.ny ?? 40;
  const ext = grid?.extent ?? plateExtent(stage.tube, stage.bplus);
  const bad = gridProblem(nx, ny, ext);
  if (bad) return bad;
  const active = activeTargets(targets);
  const scan = scanPlane(nx, ny, ext, active, (vpk, ia) => evaluatePoint(stage, targets, active, vpk, ia));
  const { cells, bestCell, ...region } = scan;
  return {
    ok: true,
    ...region,
    ra: cells.map((column) => column.map((v) => v.ra)),
    rk: cells.map((column) => column.map((v) => v.rk)),
    best: region.best && bestCell ? { ...region.best, ra: bestCell.ra, rk: bestCell.rk } : null,
  };
}
