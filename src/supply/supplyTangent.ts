import { fail, type Result } from '../result';
import { checkSupply } from './checkSupply';
import { solveSupply } from './solveSupply';
import { supplyFindings } from './supplyFindings';
import type { SupplyDesign, SupplyNode, SupplySolution } from './supplyTypes';

/**
 * A solved supply and how its figures move with the current drawn at each
 * node: the first-order expansion a drag uses between two transient solves.
 * While a stage is dragged, its current changes by a few per cent; the
 * supply's answer to that is smooth (the rectifier's conduction angle moves
 * a little), so a straight line through the last steady state gives the
 * nodes to a fraction of a volt in microseconds, where a transient solve
 * takes about ten milliseconds. The release solves the supply again in full.
 */
export interface SupplyTangent {
  /** The loads the supply was solved at, A (reservoir first). */
  readonly loads: readonly number[];
  readonly at: SupplySolution;
  /** slopes[k]: each figure's change per ampere more drawn at node k (FIGURES order, then four per node). */
  readonly slopes: readonly (readonly number[])[];
}

/** The figures that follow the loads: the supply's own, then each node's (dc, ripple pp, ripple rms, capacitor ripple). */
const SUPPLY_FIGURES = ['rectifierPeak', 'rectifierRms', 'conductionDegrees', 'secondaryRmsCurrent', 'secondaryVa'] as const;
const NODE_FIGURES = ['dc', 'ripplePp', 'rippleRms', 'capacitorRippleRms'] as const;

function figuresOf(s: SupplySolution): number[] {
  return [...SUPPLY_FIGURES.map((f) => s[f]), ...s.nodes.flatMap((n) => NODE_FIGURES.map((f) => n?.[f]))];
}

/** The step each node's load is nudged by to read the slopes: a fiftieth of the whole current, at least 0.5 mA. */
function nudgeOf(loads: readonly number[]): number {
  return Math.max(0.02 * loads.reduce((a, b) => a + b, 0), 5e-4);
}

/**
 * The tangent at a solved supply: one more transient solve per node (each
 * warm from the solved nodes), with that node's load nudged. Forward
 * differences: the nudge is small against a drag's change, and the curvature
 * it leaves out is what `nearbyLoads` bounds.
 */
export function supplyTangent(design: SupplyDesign, at: SupplySolution): Result<SupplyTangent> {
  if (!Array.isArray(design?.loads) || !Array.isArray(at?.nodes) || design.loads.length !== at.nodes.length) return fail('invalid-input', 'Give the supply its loads, one per node, as it was solved', 'loads');
  const base = figuresOf(at);
  if (!base.every(finite)) return fail('invalid-input', 'Give the solved supply the tangent is taken at (its figures are not all numbers)', 'supply');
  const start = at.nodes.map((n) => n.dc);
  const slopes: number[][] = [];
  const step = nudgeOf(design.loads);
  for (let k = 0; k < design.loads.length; k++) {
    const loads = design.loads.map((a, j) => (j === k ? a + step : a));
    const nudged = solveSupply({ ...design, loads }, { start });
    if (!nudged.ok) return nudged;
    slopes.push(figuresOf(nudged).map((x, i) => (x - base[i]!) / step));
  }
  return { ok: true, loads: [...design.loads], at, slopes };
}

const finite = (x: unknown): x is number => typeof x === 'number' && Number.isFinite(x);

/** A solution and slopes of the shape supplyTangent answers (one in a file or a message may not be). */
function wellFormed(t: SupplyTangent): boolean {
  const size = SUPPLY_FIGURES.length + NODE_FIGURES.length * (t?.loads?.length ?? 0);
  return (
    Array.isArray(t?.loads) && t.loads.every(finite) && Array.isArray(t.at?.nodes) && t.at.nodes.length === t.loads.length && figuresOf(t.at).every(finite) &&
    Array.isArray(t.slopes) && t.slopes.length === t.loads.length && t.slopes.every((s) => Array.isArray(s) && s.length === size && s.every(finite)) &&
    Array.isArray(t.at.wave?.t) && Array.isArray(t.at.wave.rectifierAmps) && Array.isArray(t.at.wave.reservoirVolts)
  );
}

/** How far from the tangent's loads its line is trusted: each node within a quarter of the whole current (and 5 mA) of where it was taken. */
export function nearbyLoads(tangent: SupplyTangent, loads: readonly number[]): boolean {
  if (!wellFormed(tangent) || !Array.isArray(loads) || loads.length !== tangent.loads.length || !loads.every((a) => finite(a) && a >= 0)) return false;
  const reach = 0.25 * tangent.loads.reduce((a, b) => a + b, 0) + 5e-3;
  return loads.every((a, k) => Math.abs(a - tangent.loads[k]!) <= reach);
}

/**
 * The supply at other loads, from its tangent: every figure moved along its
 * slopes, the ratings checked again at the new figures. The waveform is the
 * tangent's, its reservoir voltage shifted by the node's DC change and its
 * current scaled with the peak (its shape changes little over a nearby load).
 * A failure when the loads are not nearby (solve the supply in full).
 */
export function supplyNear(design: SupplyDesign, tangent: SupplyTangent, loads: readonly number[]): Result<SupplySolution> {
  const problem = checkSupply({ ...design, loads });
  if (problem) return problem;
  if (!nearbyLoads(tangent, loads)) return fail('unreachable', 'These loads are too far from the last solved supply for its tangent: solve it in full', 'loads');
  const at = tangent.at;
  const x = figuresOf(at);
  loads.forEach((a, k) => {
    const d = a - tangent.loads[k]!;
    tangent.slopes[k]!.forEach((s, i) => (x[i] = x[i]! + s * d));
  });
  const pos = (v: number) => Math.max(v, 0);
  const [rectifierPeak, rectifierRms, conductionDegrees, secondaryRmsCurrent, secondaryVa] = x.slice(0, SUPPLY_FIGURES.length).map(pos) as [number, number, number, number, number];
  const nodes: SupplyNode[] = at.nodes.map((_, m) => {
    const o = SUPPLY_FIGURES.length + m * NODE_FIGURES.length;
    return { dc: pos(x[o]!), ripplePp: pos(x[o + 1]!), rippleRms: pos(x[o + 2]!), capacitorRippleRms: pos(x[o + 3]!) };
  });
  const shift = nodes[0]!.dc - at.nodes[0]!.dc;
  const scale = at.rectifierPeak > 0 ? rectifierPeak / at.rectifierPeak : 1;
  const total = loads.reduce((a, b) => a + b, 0);
  const critical = at.criticalInductance !== null && total > 0 && at.nodes[0]!.dc > 0 ? (at.criticalInductance * tangent.loads.reduce((a, b) => a + b, 0) * nodes[0]!.dc) / (total * at.nodes[0]!.dc) : at.criticalInductance;
  const solution: SupplySolution = {
    ...at,
    nodes,
    rectifierPeak,
    rectifierRms,
    conductionDegrees: Math.min(conductionDegrees, 180),
    secondaryRmsCurrent,
    secondaryVa,
    criticalInductance: critical,
    wave: { t: at.wave.t, rectifierAmps: at.wave.rectifierAmps.map((i) => i * scale), reservoirVolts: at.wave.reservoirVolts.map((v) => v + shift) },
    findings: [],
  };
  return { ok: true, ...solution, findings: supplyFindings({ ...design, loads }, solution) };
}
