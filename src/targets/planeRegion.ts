import { fail, type Failure } from '../result';
import type { PlateExtent } from '../stage/plateExtent';
import { UNREACHABLE, type PointVerdict } from './evaluatePoint';
import type { TargetName } from './targets';

export interface RegionGrid {
  /** Points across (plate to cathode voltage) and up (plate current); default 60 × 40. */
  readonly nx?: number;
  readonly ny?: number;
  /** The window to cover, as the chart's; default the tube's plate extent. */
  readonly extent?: PlateExtent;
}

/** The point of a region that meets the targets best. */
export interface PlaneBest {
  readonly i: number;
  readonly j: number;
  /** The smallest margin there: ≥ 0 when every target holds. */
  readonly score: number;
  /** Its weakest target (the one that misses, when none holds), or null with no targets set. */
  readonly weakest: TargetName | null;
  readonly margins: Partial<Record<TargetName, number>>;
}

/** Where on the plate plane a stage meets its targets, whatever its kind: what the chart hatches and the drag keeps to. */
export interface PlaneRegion {
  /** Cell centres: plate to cathode voltage (the chart's plate axis), V, and plate current, A. */
  readonly va: readonly number[];
  readonly ia: readonly number[];
  /** inside[i][j] for va[i], ia[j]: every target holds there. */
  readonly inside: readonly (readonly boolean[])[];
  /** failing[i][j]: the targets that fail there ('unreachable' where no design of this kind sits). */
  readonly failing: readonly (readonly (readonly string[])[])[];
  /** The point that meets the targets best (the largest smallest margin), or null when no point is reachable. */
  readonly best: PlaneBest | null;
  /** Where no point holds: the target that fails at the most reachable points, and at what share of them. */
  readonly excludesMost: { readonly target: TargetName; readonly share: number } | null;
}

const MAX_CELLS = 200 * 200;

/** The grid's size checked: whole numbers of points, at least 2 each way, at most MAX_CELLS in all; with the window to cover. */
export function gridProblem(nx: number, ny: number, ext: PlateExtent): Failure | null {
  if (!(Number.isInteger(nx) && Number.isInteger(ny) && nx >= 2 && ny >= 2 && nx * ny <= MAX_CELLS)) return fail('invalid-input', `The grid must be whole numbers of points, at least 2 each way and at most ${MAX_CELLS} in all`, 'grid');
  if (!(ext.vmax > 0 && ext.iaMax > 0 && Number.isFinite(ext.vmax) && Number.isFinite(ext.iaMax))) return fail('invalid-input', 'The range to cover must have a positive voltage and current', 'grid.extent');
  return null;
}

/**
 * Every cell centre of the window judged by `judge` (each one a design of the
 * stage's kind put at that point): the cells in and out, the targets failing
 * in each, the best cell, and where nothing holds the target that shuts out
 * the most. Each cell's verdict is kept for the kind's own extras (its parts).
 */
export function scanPlane<V extends PointVerdict>(nx: number, ny: number, ext: PlateExtent, active: readonly TargetName[], judge: (vpk: number, ia: number) => V): PlaneRegion & { readonly cells: readonly (readonly V[])[]; readonly bestCell: V | null } {
  const { va, ia } = planeAxes(nx, ny, ext);
  return summarizePlane(va, ia, va.map((v) => ia.map((i) => judge(v, i))), active);
}

/** The cell centres of a window split nx × ny: plate to cathode voltage, V, and plate current, A. */
export function planeAxes(nx: number, ny: number, ext: PlateExtent): { readonly va: number[]; readonly ia: number[] } {
  return { va: Array.from({ length: nx }, (_, i) => ((i + 0.5) * ext.vmax) / nx), ia: Array.from({ length: ny }, (_, j) => ((j + 0.5) * ext.iaMax) / ny) };
}

/** A region from every cell's verdict (cells[i][j] for va[i], ia[j]): in or out, what fails, the best cell and what shuts the plane out. */
export function summarizePlane<V extends PointVerdict>(va: readonly number[], ia: readonly number[], cells: readonly (readonly V[])[], active: readonly TargetName[]): PlaneRegion & { readonly cells: readonly (readonly V[])[]; readonly bestCell: V | null } {
  const inside: boolean[][] = [];
  const failing: string[][][] = [];
  let best: PlaneBest | null = null;
  let bestCell: V | null = null;
  const fails = new Map<TargetName, number>();
  let reachable = 0;
  for (let i = 0; i < va.length; i++) {
    inside.push([]);
    failing.push([]);
    for (let j = 0; j < ia.length; j++) {
      const v = cells[i]![j]!;
      const out = v.failing;
      inside[i]!.push(out.length === 0);
      failing[i]!.push(out as string[]);
      if (out[0] === UNREACHABLE) continue;
      reachable++;
      for (const k of out) fails.set(k as TargetName, (fails.get(k as TargetName) ?? 0) + 1);
      if (!best || v.score > best.score) {
        best = { i, j, score: v.score, weakest: weakestOf(v.margins, active), margins: v.margins };
        bestCell = v;
      }
    }
  }
  let excludesMost: PlaneRegion['excludesMost'] = null;
  if (best && best.score < 0) {
    for (const [target, n] of fails) if (!excludesMost || n / reachable > excludesMost.share) excludesMost = { target, share: n / reachable };
  }
  return { va, ia, inside, failing, best, excludesMost, cells, bestCell };
}

/** The target with the smallest margin, or null with none set. */
export function weakestOf(margins: Partial<Record<TargetName, number>>, active: readonly TargetName[]): TargetName | null {
  let weakest: TargetName | null = null;
  for (const k of active) if (weakest === null || margins[k]! < margins[weakest]!) weakest = k;
  return weakest;
}

/** A ranking's first look at each tube: a coarse region, 16 × 12 points. */
export const RANK_GRID = { nx: 16, ny: 12 } as const;
/** Then a finer search of 7 × 7 points over the best coarse cell. */
const RANK_FINE = 7;

/**
 * The best point over a coarse region's best cell: a RANK_FINE × RANK_FINE
 * search of the cell, each point judged in full; the cell's centre (with
 * its own verdict, `start`) when no point beats it. Null with no best cell.
 */
export function searchAroundBest<V extends PointVerdict>(region: PlaneRegion, ext: PlateExtent, start: V, judge: (vpk: number, ia: number) => V): { readonly vpk: number; readonly ia: number; readonly verdict: V } | null {
  if (!region.best) return null;
  const dv = ext.vmax / region.va.length;
  const di = ext.iaMax / region.ia.length;
  const centre = { vpk: region.va[region.best.i]!, ia: region.ia[region.best.j]! };
  let top = { ...centre, verdict: start };
  for (let a = 0; a < RANK_FINE; a++) {
    for (let b = 0; b < RANK_FINE; b++) {
      const vpk = centre.vpk + dv * ((a + 0.5) / RANK_FINE - 0.5);
      const ia = centre.ia + di * ((b + 0.5) / RANK_FINE - 0.5);
      const v = judge(vpk, ia);
      if (v.failing[0] !== UNREACHABLE && v.score > top.verdict.score) top = { vpk, ia, verdict: v };
    }
  }
  return top;
}
