import { bracketedRoot } from '../numeric/bracketedRoot';
import { fail, type Failure, type Result } from '../result';
import { checkDrive, checkOutputTube, checkSamples } from '../output/checkOutput';
import { harmonicAmplitudes } from '../signal/fft';
import { checkPushPull } from './pushPullDesign';
import { emptyCurrents, type StageCurrents } from '../output/electrodes';
import { OUTPUT_SAMPLES, THD_HARMONICS } from '../output/outputSignal';
import { plateOf, type PushPullSolution } from './solvePushPull';

/**
 * Below this share of its idle current a tube is taken as cut off, its
 * partner then working alone into Raa/4 (this project's threshold: Koren's
 * law never quite reaches zero, and an ultralinear screen rising with the
 * swing keeps a few percent flowing in a tube that has stopped sharing the
 * load).
 */
export const PUSH_PULL_CUTOFF_SHARE = 0.1;

/** The pair driven by a sine of peak `drive` on each grid, in antiphase. */
export interface PushPullDrive {
  readonly drive: number;
  /** Power into the reflected load (the speaker) at the fundamental, W. */
  readonly power: number;
  /** Total harmonic distortion of the voltage the speaker gets, 2nd to 10th, fraction. */
  readonly thd: number;
  /** Harmonic amplitudes relative to the fundamental: index 2 is H2, … up to 10. */
  readonly harmonics: readonly number[];
  /** True when either tube's current falls to cutoff (PUSH_PULL_CUTOFF_SHARE of its idle) somewhere in the cycle: class AB. */
  readonly classAB: boolean;
  /** Each tube's plate and screen dissipation averaged over the cycle, W. */
  readonly plateDissipation: readonly [number, number];
  readonly screenDissipation: readonly [number, number];
  /** The average current the stage draws from the supply (both cathodes), A. */
  readonly supplyCurrent: number;
  /** Lowest plate voltage either tube reaches, V. */
  readonly vpkMin: number;
  /** The winding's signal voltage (each half of the primary) over the cycle, V. */
  readonly winding: Float64Array;
}

/** The pair at one instant, reused sample after sample: `solve` writes both tubes' currents into c1, c2 and their plates into v1, v2. */
export interface PushPullInstant {
  readonly c1: StageCurrents;
  readonly c2: StageCurrents;
  v1: number;
  v2: number;
  /** The winding's signal voltage (each half) with the grids at g1 and g2 to their cathode, V. */
  solve(g1: number, g2: number): number;
}

/**
 * One instant of the pair: each half of the primary carries the winding's
 * signal w with opposite sign (the centre tap at the supply), and the ideal
 * transformer sets w from the net coupled current, w = (Raa/4)·((M1 − M2) −
 * (M1q − M2q)). The residual rises with w, so a bracketed root finds it.
 */
export function pushPullInstant(s: PushPullSolution): PushPullInstant {
  const { supply, feed } = s;
  const rHalf = s.design.rPrimary / 2;
  const quarter = s.design.raa / 4;
  const offset = s.idle[0].mmf - s.idle[1].mmf;
  const out: PushPullInstant = {
    c1: emptyCurrents(),
    c2: emptyCurrents(),
    v1: 0,
    v2: 0,
    solve(g1, g2) {
      const residual = (w: number) => {
        out.v1 = plateOf(s.tube, feed, supply, w, rHalf, g1, out.c1);
        out.v2 = plateOf(s.tube2, feed, supply, -w, rHalf, g2, out.c2);
        return w - quarter * (out.c1.mmf - out.c2.mmf - offset);
      };
      // Secant steps from the last instant's answer (a sine's next point is near it); the residual rises with w, so
      // a step that does not settle within a few tries hands over to the bracketed root over the whole range.
      const tol = 1e-9 * supply;
      let x0 = last;
      let f0 = residual(x0);
      if (Math.abs(f0) > tol) {
        let x1 = x0 + Math.max(1e-3, 1e-4 * supply);
        let f1 = residual(x1);
        let settled = false;
        for (let k = 0; k < 12 && !settled; k++) {
          const slope = (f1 - f0) / (x1 - x0);
          if (!(slope > 0) || !Number.isFinite(slope)) break;
          const x2 = Math.min(Math.max(x1 - f1 / slope, -supply), supply);
          x0 = x1;
          f0 = f1;
          x1 = x2;
          f1 = residual(x1);
          settled = Math.abs(f1) <= tol;
        }
        last = settled ? x1 : bracketedRoot(residual, -supply, supply, 1e-12 * supply).x;
      }
      residual(last);
      return last;
    },
  };
  let last = 0;
  return out;
}

/**
 * Composite characteristics, instant by instant: at each point of a cycle
 * the grids sit at Vgk ± v, each half of the primary carries the winding's
 * signal w with opposite sign (the centre tap at the supply), and the ideal
 * transformer sets w from the net coupled current: w = (Raa/4)·((M1 − M2) −
 * (M1q − M2q)), Raa/4 being what each half reflects while both conduct. The
 * residual rises with w (tube 1's plate falls as tube 2's rises), so a
 * bracketed root finds the one w; a coherent FFT of w gives the power and
 * harmonics, the screen and plate products the dissipations.
 */
export function pushPullDriveOf(s: PushPullSolution, drive: number, n = OUTPUT_SAMPLES): PushPullDrive {
  const { feed, vgk } = s;
  const instant = pushPullInstant(s);
  const { c1, c2 } = instant;
  const tied = feed.kind === 'tied';
  const winding = new Float64Array(n);
  const pa: [number, number] = [0, 0];
  const pg2: [number, number] = [0, 0];
  const floor: [number, number] = [PUSH_PULL_CUTOFF_SHARE * s.idle[0].ip, PUSH_PULL_CUTOFF_SHARE * s.idle[1].ip];
  let ikSum = 0;
  let vMin = Infinity;
  let cutoff = false;
  let v1: number;
  let v2: number;
  for (let k = 0; k < n; k++) {
    const x = drive * Math.sin((2 * Math.PI * k) / n);
    const w = instant.solve(vgk + x, s.vgk2 - x);
    v1 = instant.v1;
    v2 = instant.v2;
    winding[k] = w;
    pa[0] += (v1 * (tied ? c1.ip : c1.ia)) / n;
    pa[1] += (v2 * (tied ? c2.ip : c2.ia)) / n;
    if (!tied) {
      const s1 = feed.kind === 'fixed' ? feed.vg2k : feed.kind === 'tap' ? feed.supply - feed.fraction * w : 0;
      const s2 = feed.kind === 'fixed' ? feed.vg2k : feed.kind === 'tap' ? feed.supply + feed.fraction * w : 0;
      pg2[0] += (s1 * c1.ig2) / n;
      pg2[1] += (s2 * c2.ig2) / n;
    }
    ikSum += (c1.ik + c2.ik) / n;
    vMin = Math.min(vMin, v1, v2);
    if (c1.ip < floor[0] || c2.ip < floor[1]) cutoff = true;
  }
  const h = harmonicAmplitudes(winding, THD_HARMONICS);
  const fundamental = h[1] ?? 0;
  const rel = h.map((a, k) => (k < 2 || fundamental === 0 ? 0 : a / fundamental));
  let sum = 0;
  for (let k = 2; k < rel.length; k++) sum += rel[k]! * rel[k]!;
  return {
    drive,
    power: (fundamental * fundamental) / (2 * (s.design.raa / 4)),
    thd: Math.sqrt(sum),
    harmonics: rel,
    classAB: cutoff,
    plateDissipation: pa,
    screenDissipation: pg2,
    supplyCurrent: ikSum,
    vpkMin: vMin,
    winding,
  };
}

function usableFeed(f: unknown): boolean {
  if (typeof f !== 'object' || f === null) return false;
  const x = f as { kind?: unknown; vg2k?: unknown; fraction?: unknown; supply?: unknown };
  const finite = (v: unknown) => typeof v === 'number' && Number.isFinite(v);
  return x.kind === 'tied' || (x.kind === 'fixed' && finite(x.vg2k)) || (x.kind === 'tap' && finite(x.fraction) && finite(x.supply));
}

/** A solution from solvePushPull that its tube and design still pass, with a usable idle point; null when it is. */
export function checkPushPullSolution(s: PushPullSolution): Failure | null {
  if (typeof s !== 'object' || s === null || (s as { ok?: unknown }).ok !== true) return fail('invalid-input', 'Give a solution from solvePushPull', 'solution');
  const problem = checkPushPull(s.tube, s.design) ?? checkOutputTube(s.tube2);
  if (problem) return problem;
  const finite = (v: unknown) => typeof v === 'number' && Number.isFinite(v);
  const idle = Array.isArray(s.idle) ? s.idle : [];
  // The idle point must be one the design could have: the centre tap at most B+ above the cathode, the grid not above it
  // nor further below it than B+ (a hand-edited solution with a supply of 1e308 V made infinite figures).
  const b = s.design.bplus;
  if (!finite(s.vgk) || !(s.vgk <= 0 && s.vgk >= -b) || !finite(s.vgk2) || !(s.vgk2 <= 0 && s.vgk2 >= -b) || !finite(s.supply) || !(s.supply > 0 && s.supply <= b) || idle.length !== 2 || !idle.every((p) => typeof p === 'object' && p !== null && finite(p.mmf) && finite(p.ip) && p.ip > 0) || !usableFeed(s.feed)) {
    return fail('invalid-input', 'The solution has no usable idle point: solve the stage again', 'solution');
  }
  return null;
}

/** The pair at a drive, its inputs checked first (a solution from solvePushPull, a drive of 0 to 1000 V, samples a power of two). */
export function pushPullAtDrive(s: PushPullSolution, drive: number, samples: number = OUTPUT_SAMPLES): Result<PushPullDrive> {
  const bad = checkPushPullSolution(s) ?? checkDrive(drive) ?? checkSamples(samples);
  return bad ?? { ok: true, ...pushPullDriveOf(s, drive, samples) };
}

/** Both screens' current averaged over a driven cycle, A (each screen's dissipation over its fixed voltage); null unless fed a fixed voltage. */
export function screensAtDrive(s: PushPullSolution, drive: PushPullDrive): number | null {
  const feed = s.feed;
  if (feed.kind !== 'fixed' || !(feed.vg2k > 0)) return null;
  const amps = (drive.screenDissipation[0] + drive.screenDissipation[1]) / feed.vg2k;
  return Number.isFinite(amps) ? amps : null;
}
