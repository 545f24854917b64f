import type { TargetName } from './targets';

/** The costly targets' margins and values at one cell, and whether they were worked out there or read between neighbours. */
export interface CostlyPart {
  readonly margins: Partial<Record<TargetName, number>>;
  readonly values: Partial<Record<TargetName, number | null>>;
  readonly exact: boolean;
}

/** The first lattice: every 4th cell each way (and the last), worked out in full. */
export const FIRST_STRIDE = 4;
/** Corners this near a target's edge (a share of the target) are too near to read between: the cell is worked out. */
export const SAFE_MARGIN = 0.03;

/**
 * The costly part of every cell's verdict over an nx × ny plane, worked out
 * where it matters and read between neighbours where it cannot: first on a
 * lattice of every FIRST_STRIDE-th cell, then halving the stride, each new
 * cell interpolated (bilinearly, margins and values) from the corners of the
 * coarser lattice round it when they agree, target by target, on which side
 * of its edge they lie, each by more than SAFE_MARGIN, and worked out in full
 * otherwise. So the cells along each target's edge are always worked out,
 * and the smooth stretches either side of it cost a few evaluations. A cell
 * `work` cannot place (null: unreachable) is never read between.
 */
export function refinePlane(nx: number, ny: number, targets: readonly TargetName[], work: (i: number, j: number) => CostlyPart | null): (CostlyPart | null)[][] {
  const done: (CostlyPart | null | undefined)[][] = Array.from({ length: nx }, () => new Array<CostlyPart | null | undefined>(ny).fill(undefined));
  const on = (k: number, n: number, s: number) => k % s === 0 || k === n - 1;
  for (let i = 0; i < nx; i++) for (let j = 0; j < ny; j++) if (on(i, nx, FIRST_STRIDE) && on(j, ny, FIRST_STRIDE)) done[i]![j] = work(i, j);
  for (let s = FIRST_STRIDE / 2; s >= 1; s /= 2) {
    for (let i = 0; i < nx; i++) {
      if (!on(i, nx, s)) continue;
      for (let j = 0; j < ny; j++) {
        if (!on(j, ny, s) || done[i]![j] !== undefined) continue;
        done[i]![j] = readBetween(done, i, j, 2 * s, nx, ny, targets) ?? work(i, j);
      }
    }
  }
  return done.map((column) => column.map((c) => c ?? null));
}

/** The cell read between the corners of the coarser lattice (stride `s2`) round it, or null when they do not all agree clearly. */
function readBetween(done: readonly (readonly (CostlyPart | null | undefined)[])[], i: number, j: number, s2: number, nx: number, ny: number, targets: readonly TargetName[]): CostlyPart | null {
  const i0 = i - (i % s2);
  const j0 = j - (j % s2);
  const i1 = i % s2 === 0 ? i0 : Math.min(i0 + s2, nx - 1);
  const j1 = j % s2 === 0 ? j0 : Math.min(j0 + s2, ny - 1);
  const corners = [done[i0]![j0], done[i1]![j0], done[i0]![j1], done[i1]![j1]];
  if (corners.some((c) => !c)) return null;
  const c = corners as CostlyPart[];
  for (const k of targets) {
    const m = c.map((x) => x.margins[k]!);
    if (!(m.every((x) => x >= SAFE_MARGIN) || m.every((x) => x <= -SAFE_MARGIN))) return null;
  }
  const u = i1 === i0 ? 0 : (i - i0) / (i1 - i0);
  const v = j1 === j0 ? 0 : (j - j0) / (j1 - j0);
  const w = [(1 - u) * (1 - v), u * (1 - v), (1 - u) * v, u * v];
  const margins: Partial<Record<TargetName, number>> = {};
  const values: Partial<Record<TargetName, number | null>> = {};
  for (const k of targets) {
    margins[k] = c.reduce((sum, x, n) => sum + w[n]! * x.margins[k]!, 0);
    const vals = c.map((x) => x.values[k]);
    values[k] = vals.some((x) => x === null || x === undefined) ? null : vals.reduce<number>((sum, x, n) => sum + w[n]! * x!, 0);
  }
  return { margins, values, exact: false };
}
