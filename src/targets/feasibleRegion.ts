import { fail, type Result } from '../result';
import { checkNumber, checkTube, LIMITS } from '../stage/checkInput';
import { plateExtent, type PlateExtent } from '../stage/plateExtent';
import { evaluatePoint, UNREACHABLE, type RegionStage } from './evaluatePoint';
import { activeTargets, targetsProblem, type TargetName, type Targets } from './targets';

export interface RegionGrid {
  /** Points across (plate to cathode voltage) and up (plate current); default 60 × 40. */
  readonly nx?: number;
  readonly ny?: number;
  /** The window to cover, as the chart's; default the tube's plate extent at this B+. */
  readonly extent?: PlateExtent;
}

export interface RegionBest {
  readonly i: number;
  readonly j: number;
  readonly ra: number;
  readonly rk: number;
  /** The smallest margin there: ≥ 0 when every target holds. */
  readonly score: number;
  /** Its weakest target (the one that misses, when none holds), or null with no targets set. */
  readonly weakest: TargetName | null;
  readonly margins: Partial<Record<TargetName, number>>;
}

export interface FeasibleRegion {
  /** Cell centres: plate to cathode voltage (the chart's plate axis), V, and plate current, A. */
  readonly va: readonly number[];
  readonly ia: readonly number[];
  /** inside[i][j] for va[i], ia[j]: every target holds there. */
  readonly inside: readonly (readonly boolean[])[];
  /** failing[i][j]: the targets that fail there ('unreachable' where no cathode-biased stage on this B+ sits). */
  readonly failing: readonly (readonly (readonly string[])[])[];
  /** Ra and Rk at each point, Ω (0 where unreachable). */
  readonly ra: readonly (readonly number[])[];
  readonly rk: readonly (readonly number[])[];
  /** The point that meets the targets best (the largest smallest margin), or null when no point is reachable. */
  readonly best: RegionBest | null;
  /** Where no point holds: the target that fails at the most reachable points, and at what share of them. */
  readonly excludesMost: { readonly target: TargetName; readonly share: number } | null;
}

const MAX_CELLS = 200 * 200;

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
    targetsProblem(targets);
  if (problem) return problem;
  const nx = grid?.nx ?? 60;
  const ny = grid?.ny ?? 40;
  if (!(Number.isInteger(nx) && Number.isInteger(ny) && nx >= 2 && ny >= 2 && nx * ny <= MAX_CELLS)) return fail('invalid-input', `The grid must be whole numbers of points, at least 2 each way and at most ${MAX_CELLS} in all`, 'grid');
  const ext = grid?.extent ?? plateExtent(stage.tube, stage.bplus);
  if (!(ext.vmax > 0 && ext.iaMax > 0 && Number.isFinite(ext.vmax) && Number.isFinite(ext.iaMax))) return fail('invalid-input', 'The range to cover must have a positive voltage and current', 'grid.extent');
  const active = activeTargets(targets);
  const va = Array.from({ length: nx }, (_, i) => ((i + 0.5) * ext.vmax) / nx);
  const ia = Array.from({ length: ny }, (_, j) => ((j + 0.5) * ext.iaMax) / ny);
  const inside: boolean[][] = [];
  const failing: string[][][] = [];
  const ras: number[][] = [];
  const rks: number[][] = [];
  let best: RegionBest | null = null;
  const fails = new Map<TargetName, number>();
  let reachable = 0;
  for (let i = 0; i < nx; i++) {
    inside.push([]);
    failing.push([]);
    ras.push([]);
    rks.push([]);
    for (let j = 0; j < ny; j++) {
      const v = evaluatePoint(stage, targets, active, va[i]!, ia[j]!);
      const out = v.failing;
      inside[i]!.push(out.length === 0);
      failing[i]!.push(out as string[]);
      ras[i]!.push(v.ra);
      rks[i]!.push(v.rk);
      if (out[0] === UNREACHABLE) continue;
      reachable++;
      for (const k of out) fails.set(k as TargetName, (fails.get(k as TargetName) ?? 0) + 1);
      if (!best || v.score > best.score) best = { i, j, ra: v.ra, rk: v.rk, score: v.score, weakest: weakestOf(v.margins, active), margins: v.margins };
    }
  }
  let excludesMost: FeasibleRegion['excludesMost'] = null;
  if (best && best.score < 0) {
    for (const [target, n] of fails) if (!excludesMost || n / reachable > excludesMost.share) excludesMost = { target, share: n / reachable };
  }
  return { ok: true, va, ia, inside, failing, ra: ras, rk: rks, best, excludesMost };
}

/** The target with the smallest margin, or null with none set. */
export function weakestOf(margins: Partial<Record<TargetName, number>>, active: readonly TargetName[]): TargetName | null {
  let weakest: TargetName | null = null;
  for (const k of active) if (weakest === null || margins[k]! < margins[weakest]!) weakest = k;
  return weakest;
}
