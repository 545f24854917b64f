import { curveSheet, followerPlane, plateExtent, type CurveSheet, type Failure, type FollowerPlane, type PlateExtent, type Result, type TubeRecord } from '../../src/index';
import type { TubeRegistry } from './tubeRegistry';
import type { Analysis, BenchDesign } from './analysis';
import type { Rival } from './compareSlice';
import { loadAfterBench } from './stagePlans';
import { heaterField } from './heaterChoice';

/**
 * The bench's cathode follower on its own plate curves: what the chart draws
 * and the figures read when the follower is the stage on the bench. Its grid
 * is the gain stage's plate (direct-coupled) or its own bias (capacitor-coupled), its plate is at the same B+,
 * its load the next grid or the amplifier's own.
 */
export interface FollowerBench {
  readonly tube: TubeRecord;
  readonly sheet: CurveSheet;
  readonly plane: FollowerPlane;
  /** The grid's voltage to ground: the plate before it, or its own bias when capacitor-coupled, V. */
  readonly vgrid: number;
  readonly bplus: number;
  /** The most curves its sheet was drawn with (a new count draws it again). */
  readonly maxCurves: number;
}

/** The follower's window, shared with a second tube's when one is compared, so both families use one pair of axes. */
export function followerWindow(d: BenchDesign, registry: TubeRegistry, rival: Rival): PlateExtent | null {
  const own = registry.lookup(d.stage2.tubeId);
  if (!own) return null;
  const e = plateExtent(own, d.bplus);
  const other = rival.on ? registry.lookup(rival.tubeId) : undefined;
  if (!other) return e;
  const r = plateExtent(other, d.bplus);
  return { vmax: Math.max(e.vmax, r.vmax), iaMax: Math.max(e.iaMax, r.iaMax) };
}

function benchOf(d: BenchDesign, a: Analysis, tube: TubeRecord, extent: PlateExtent, prev: FollowerBench | null, maxCurves: number): Result<FollowerBench> {
  // Direct-coupled, the grid is the plate before it; capacitor-coupled, its own bias holds it.
  const vgrid = d.stage2.coupling ? d.stage2.coupling.vbias : a.solution.op.va;
  // Its heaters where the design holds them: the heater–cathode figure reads the cathode against them.
  const plane = followerPlane({ tube, bplus: d.bplus, vgrid, rk: d.stage2.rk, rl: loadAfterBench(d).rl, ...heaterField(d.heaters) }, extent);
  if (!plane.ok) return { ...plane, message: `Follower: ${plane.message}`, field: plane.field === 'rk' ? 'rk2' : 'stage2' };
  const sameSheet = prev && prev.tube === tube && prev.sheet.extent.vmax === extent.vmax && prev.sheet.extent.iaMax === extent.iaMax && prev.maxCurves === maxCurves;
  const sheet = sameSheet ? prev.sheet : curveSheet(tube, d.bplus, extent, maxCurves);
  return { ok: true, tube, sheet, plane, vgrid, bplus: d.bplus, maxCurves };
}

/**
 * The follower on the bench and, when a second tube is compared, the same
 * socket with that tube (same Rk, same grid): null when the follower is not
 * the stage on the bench. `extent` pins the window (while a drag runs).
 */
export function analyzeFollowerBench(
  d: BenchDesign,
  registry: TubeRegistry,
  a: Analysis,
  prev: { readonly bench: FollowerBench | null; readonly rival: Result<FollowerBench> | null },
  rival: Rival,
  maxCurves: number,
  extent?: PlateExtent,
): Result<{ readonly bench: FollowerBench | null; readonly rival: Result<FollowerBench> | null }> {
  if (d.stageKind !== 'follower' || d.stage2.kind !== 'follower') return { ok: true, bench: null, rival: null };
  const tube = registry.lookup(d.stage2.tubeId);
  const window = extent ?? followerWindow(d, registry, rival);
  if (!tube || !window) return { ok: false, reason: 'invalid-tube', message: `No tube called “${d.stage2.tubeId}” for the follower`, field: 'stage2' } satisfies Failure;
  const bench = benchOf(d, a, tube, window, prev.bench, maxCurves);
  if (!bench.ok) return bench;
  const other = rival.on ? registry.lookup(rival.tubeId) : undefined;
  const second = other ? benchOf(d, a, other, bench.sheet.extent, prev.rival?.ok ? prev.rival : null, maxCurves) : null;
  return { ok: true, bench, rival: second };
}
