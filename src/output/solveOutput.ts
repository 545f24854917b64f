import { bracketedRoot } from '../numeric/bracketedRoot';
import { fail, type Result } from '../result';
import { emptyCurrents, screenFeedOf, screenVoltage, stageCurrentsInto, type ScreenFeed } from './electrodes';
import { checkOutputInput } from './checkOutput';
import { effectiveConnection, type OutputDesign } from './outputDesign';
import type { Connection, OutputTube } from './outputTube';
import { korenPentodeInto, type KorenPentodeParams } from '../tube/pentode';

/** Below this cathode current the tube is taken as cut off, A (the same 1 µA as the voltage stage). */
export const OUTPUT_CUTOFF_A = 1e-6;

export interface OutputPoint {
  readonly connection: Connection;
  /** Plate to cathode, V. */
  readonly vpk: number;
  /** Charted current (plate, plus screen when tied), A; the primary's DC resistance carries it. */
  readonly ip: number;
  /** The current the transformer couples (ip, plus the tap's share of an ultralinear screen's), A. */
  readonly mmf: number;
  readonly ia: number;
  readonly ig2: number;
  readonly ik: number;
  readonly vgk: number;
  /** Cathode to ground, V. */
  readonly vk: number;
  /** Screen to cathode, V (equals vpk when tied). */
  readonly vg2k: number;
  /** Primary's B+ end to cathode, V. */
  readonly supply: number;
  /** Plate dissipation, W (plate and screen together when tied). */
  readonly pa: number;
  /** Screen dissipation, W. */
  readonly pg2: number;
  /** Small-signal plate resistance for this connection, Ω (the screen follows as wired). */
  readonly rp: number;
  /** Transconductance of the primary current, S. */
  readonly gm: number;
  readonly mu: number;
  /** Fixed bias: the grid supply, V. Cathode bias: the cathode resistor, Ω. */
  readonly rk: number | null;
  readonly feed: ScreenFeed;
}

export interface OutputSolution {
  readonly tube: OutputTube;
  readonly design: OutputDesign;
  readonly op: OutputPoint;
}

const VOLT_TOL = 1e-9;

function feedFor(tube: OutputTube, d: OutputDesign, vk: number): ScreenFeed {
  return screenFeedOf(effectiveConnection(d, tube), d.screenVolts - vk, d.ulTap, d.bplus - vk);
}

/**
 * Plate voltage where the primary's DC drop closes the loop:
 * Vpk + Ip(Vpk)·Rpri = supply. At DC the winding itself drops nothing, so an
 * ultralinear tap sits at the supply.
 */
function plateVoltage(tube: OutputTube, feed: ScreenFeed, rPrimary: number, supply: number, vgk: number): number {
  if (rPrimary === 0) return supply;
  const c = emptyCurrents();
  const r = bracketedRoot((v) => {
    stageCurrentsInto(tube, feed, v, vgk, c, 0);
    return v + c.ip * rPrimary - supply;
  }, 0, supply, VOLT_TOL * supply);
  return r.x;
}

function pointAt(tube: OutputTube, d: OutputDesign, vk: number, vgk: number, knownPlate?: number): OutputPoint {
  const supply = d.bplus - vk;
  const feed = feedFor(tube, d, vk);
  const vpk = knownPlate ?? plateVoltage(tube, feed, d.rPrimary, supply, vgk);
  const c = emptyCurrents();
  stageCurrentsInto(tube, feed, vpk, vgk, c, 0);
  const vg2k = tube.law.kind === 'triode' ? 0 : screenVoltage(feed, vpk, 0);
  const slopes = slopesAt(tube, feed, vpk, vgk, d.rPrimary);
  const tied = feed.kind === 'tied';
  return {
    connection: effectiveConnection(d, tube),
    vpk,
    ip: c.ip,
    mmf: c.mmf,
    ia: c.ia,
    ig2: c.ig2,
    ik: c.ik,
    vgk,
    vk,
    vg2k,
    supply,
    pa: vpk * (tied ? c.ip : c.ia),
    pg2: tied ? 0 : vg2k * c.ig2,
    rp: slopes.rp,
    gm: slopes.gm,
    mu: slopes.gm * slopes.rp,
    rk: d.bias === 'cathode' ? d.rk : null,
    feed,
  };
}

/**
 * rp and gm by central differences (the screen follows the plate as wired).
 * An ultralinear stage is read as the transformer sees it (tapSlopes): its
 * screen follows the winding, not the plate, and its screen current couples
 * through the tap's share of the turns. Taken on the plate current alone,
 * as the other connections are, its output impedance read 15 % high against
 * ngspice (EL34 on a 43 % tap; tests/spice/globalFeedback.spice.test.ts).
 */
export function slopesAt(tube: OutputTube, feed: ScreenFeed, vpk: number, vgk: number, rPrimary: number): { rp: number; gm: number } {
  if (feed.kind === 'tap' && tube.law.kind === 'pentode') return tapSlopes(tube.law.params, feed.fraction, vpk, vgk, screenVoltage(feed, vpk, 0), rPrimary);
  const h = Math.max(1e-3, vpk * 1e-5);
  const c = emptyCurrents();
  const at = (v: number, g: number) => {
    stageCurrentsInto(tube, feed, v, g, c);
    return c.ip;
  };
  const ga = (at(vpk + h, vgk) - at(vpk - h, vgk)) / (2 * h);
  const gm = (at(vpk, vgk + h) - at(vpk, vgk - h)) / (2 * h);
  return { rp: ga > 0 ? 1 / ga : Infinity, gm: Math.max(0, gm) };
}

/**
 * An ultralinear stage's slopes at its winding. With the plate Vpk = S − w − R·ia
 * (w the winding's voltage, R the primary's resistance in the plate lead) and
 * the screen Vg2 = S − x·w (x the tap's share), a change dw moves the plate
 * current by dia = −(a + b·x)/(1 + a·R)·dw and the screen's by
 * dig2 = −c·(dw + R·dia) − d·x·dw, where a, b are ∂ia/∂Vpk, ∂ia/∂Vg2 and
 * c, d the screen current's. The transformer couples ia + x·ig2, so the
 * winding sees the conductance G = −(dia + x·dig2)/dw; rp is 1/G − R (the
 * stage's output impedance stays (rp + R)·n²). gm is that current's slope
 * on the grid, the plate and screen held.
 */
function tapSlopes(p: KorenPentodeParams, x: number, vpk: number, vgk: number, vg2: number, r: number): { rp: number; gm: number } {
  const { a, b, c, d, gmA, gm2 } = pentodePartials(p, vpk, vgk, vg2);
  const dia = -(a + b * x) / (1 + a * r);
  const dig2 = -c * (1 + r * dia) - d * x;
  const g = -(dia + x * dig2);
  const gm = Math.max(0, gmA + x * gm2);
  const rp = g > 0 ? 1 / g - r : -1;
  if (Number.isFinite(rp) && rp > 0) return { rp, gm };
  // With a primary resistance near the load itself the screen's coupling brings 1/G under R and the split into
  // rp + R no longer holds: the tube's own slope as wired then, R left out (the same formulas with R = 0).
  const own = a + b * x + x * (c + d * x);
  return { rp: own > 0 && Number.isFinite(1 / own) ? 1 / own : Infinity, gm };
}

/**
 * The stage whose bias and B+ were found for a point (biasForPoint): its
 * plate and grid are known, so the quiescent point is built there without
 * solving the loops again. A whole plane of designs (the targets' region)
 * is built this way; solveOutput on the same design finds the same point.
 */
export function outputSolutionAt(tube: OutputTube, design: OutputDesign, vpk: number, vgk: number): Result<OutputSolution> {
  const problem = checkOutputInput(tube, design);
  if (problem) return problem;
  const op = pointAt(tube, design, design.bias === 'cathode' ? -vgk : 0, vgk, vpk);
  if (!(op.ik > OUTPUT_CUTOFF_A) || !(op.vpk > 0.5)) return fail('cutoff', `The ${tube.id} cannot idle there`, 'bias');
  return { ok: true, tube, design, op };
}

/**
 * A cathode-biased stage with its cathode held at `vk` (its grid at 0 V DC
 * through the leak, so Vgk = −vk): what its bypass holds it at once a
 * sustained drive has moved it (settledCathode).
 */
export function outputWithCathodeAt(s: OutputSolution, vk: number): Result<OutputSolution> {
  const op = pointAt(s.tube, s.design, vk, -vk);
  if (!(op.ik > OUTPUT_CUTOFF_A) || !(op.vpk > 0.5)) return fail('cutoff', `The ${s.tube.id} is cut off with its cathode at ${vk.toPrecision(3)} V`, 'rk');
  return { ok: true, tube: s.tube, design: s.design, op };
}

/**
 * The quiescent point of a single-ended output stage. Fixed bias: the grid
 * sits at the bias supply and the plate where the primary's DC drop closes
 * the loop. Cathode bias: Brent's method on the cathode voltage, with that
 * loop solved inside for each trial (Vk = Ik·Rk, Ik taking in the screen).
 */
export function solveOutput(tube: OutputTube, design: OutputDesign): Result<OutputSolution> {
  const problem = checkOutputInput(tube, design);
  if (problem) return problem;
  let op: OutputPoint;
  if (design.bias === 'fixed') {
    op = pointAt(tube, design, 0, design.vg);
  } else {
    // Each trial needs only the cathode current: the full point (with its slopes) is built once, at the root.
    const c = emptyCurrents();
    const excess = (vk: number) => {
      const feed = feedFor(tube, design, vk);
      const vpk = plateVoltage(tube, feed, design.rPrimary, design.bplus - vk, -vk);
      stageCurrentsInto(tube, feed, vpk, -vk, c, 0);
      return c.ik * design.rk - vk;
    };
    const r = bracketedRoot(excess, 0, design.bplus, VOLT_TOL * design.bplus);
    if (!r.converged && Math.abs(excess(r.x)) > 1e-6 * design.bplus) return fail('no-convergence', 'The cathode-bias loop did not settle; try another Rk', 'rk');
    op = pointAt(tube, design, r.x, -r.x);
  }
  if (!(op.ik > OUTPUT_CUTOFF_A)) {
    return fail('cutoff', design.bias === 'fixed' ? `The ${tube.id} is cut off at ${design.vg} V grid bias: make the bias less negative` : `The ${tube.id} is cut off with this Rk`, design.bias === 'fixed' ? 'vg' : 'rk');
  }
  if (!(op.vpk > 0.5)) return fail('supply-too-low', 'The primary\'s DC drop leaves no voltage on the plate: lower its DC resistance or raise B+', 'rPrimary');
  return { ok: true, tube, design, op };
}

/**
 * A pentode's currents' slopes at one point, by central differences: a, b
 * the plate current's on the plate and the screen voltage, c, d the screen
 * current's, gmA and gm2 each one's on the grid (S).
 */
export function pentodePartials(p: KorenPentodeParams, vpk: number, vgk: number, vg2: number): { a: number; b: number; c: number; d: number; gmA: number; gm2: number } {
  const e = { ia: 0, ig2: 0 };
  const at = (va: number, g1: number, g2: number) => {
    korenPentodeInto(p, va, g1, g2, e);
    return [e.ia, e.ig2] as const;
  };
  const diff = (f: (s: number) => readonly [number, number], step: number) => {
    const [ia1, ig1] = f(step);
    const [ia0, ig0] = f(-step);
    return [(ia1 - ia0) / (2 * step), (ig1 - ig0) / (2 * step)] as const;
  };
  const [a, c] = diff((s) => at(vpk + s, vgk, vg2), Math.max(1e-3, vpk * 1e-5));
  const [b, d] = diff((s) => at(vpk, vgk, vg2 + s), Math.max(1e-3, vg2 * 1e-5));
  const [gmA, gm2] = diff((s) => at(vpk, vgk + s, vg2), 1e-3);
  return { a, b, c, d, gmA, gm2 };
}
