import { fail, type Result } from '../result';
import { plateExtent } from '../stage/plateExtent';
import { tubeLibrary } from '../tube/library';
import type { TubeRecord } from '../tube/types';
import { evaluatePoint, UNREACHABLE_VERDICT, type RegionStage } from './evaluatePoint';
import { RANK_GRID, searchAroundBest } from './planeRegion';
import { feasibleRegion, weakestOf } from './feasibleRegion';
import { activeTargets, targetsProblem, type TargetName, type Targets } from './targets';

export interface TubeRank {
  readonly tubeId: string;
  /** The parts of its best design, Ω. */
  readonly ra: number;
  readonly rk: number;
  /** Each target's margin there (0 at its edge, positive inside). */
  readonly margins: Partial<Record<TargetName, number>>;
  /** The smallest margin: ≥ 0 when every target holds. */
  readonly score: number;
  /** The target with that margin, or null with no targets set. */
  readonly weakest: TargetName | null;
  /** Where it sits on the plate plane, V and A. */
  readonly vpk: number;
  readonly ia: number;
}

/**
 * Every tube (the library's, or those given) ranked by how well its best
 * design on this B+ and load meets the targets: a coarse region, then a
 * finer search around its best point. Best first, as `ranks` (a Result, so
 * bad targets are a typed failure); a tube no point of which is reachable is
 * left out.
 */
export function rankTubes(targets: Targets, stage: Omit<RegionStage, 'tube'>, tubes: readonly TubeRecord[] = tubeLibrary): Result<{ ranks: TubeRank[] }> {
  if (!Array.isArray(tubes)) return fail('invalid-input', 'Tubes must be a list', 'tubes');
  if (typeof stage !== 'object' || stage === null) return fail('invalid-input', 'No stage given (B+, load, source and bypass)');
  const problem = targetsProblem(targets);
  if (problem) return problem;
  const active = activeTargets(targets);
  const ranks: TubeRank[] = [];
  for (const tube of tubes) {
    const s: RegionStage = { ...stage, tube };
    const ext = plateExtent(tube, stage.bplus);
    const region = feasibleRegion(s, targets, { ...RANK_GRID, extent: ext });
    if (!region.ok) {
      if (region.field === 'tube') continue;
      return region;
    }
    if (!region.best) continue;
    const start = { ...UNREACHABLE_VERDICT, failing: [], ra: region.best.ra, rk: region.best.rk, score: region.best.score, margins: region.best.margins };
    const top = searchAroundBest(region, ext, start, (vpk, ia) => evaluatePoint(s, targets, active, vpk, ia));
    if (!top) continue;
    const v = top.verdict;
    ranks.push({ tubeId: tube.id, vpk: top.vpk, ia: top.ia, ra: v.ra, rk: v.rk, score: v.score, margins: v.margins, weakest: weakestOf(v.margins, active) });
  }
  return { ok: true, ranks: ranks.sort((x, y) => y.score - x.score) };
}
