import { bracketedRoot } from '../numeric/bracketedRoot';
import { illinois } from '../numeric/illinois';
import { harmonicAmplitudes } from '../signal/fft';
import { emptyCurrents, stageCurrentsInto } from './electrodes';
import { settleCycle } from './steadyState';
import type { OutputSolution } from './solveOutput';

/**
 * Large-signal behaviour of a single-ended output stage along its AC load.
 * The grid is driven by a sine of peak `drive` about the bias (which holds:
 * fixed bias, or a fully bypassed cathode resistor). The winding is an ideal
 * transformer reflecting Zpri in parallel with the primary's inductance,
 * whose magnetising current Mm is steady over a cycle; the winding's signal
 * voltage is w = Zpri·(M − Mm), M being the coupled current, and the plate
 * sits at supply − w − Ip·Rpri. For each of n points of one cycle M is the
 * root of that circuit and the tube's law (Brent's method; bracketed, so it
 * cannot diverge). Under a sustained drive Mm settles at the cycle's average
 * M (steadyState.ts), where the figures are read, as a data sheet's are, with
 * the drive held; a coherent FFT of w, the voltage the speaker gets, gives
 * power and harmonics.
 */
export const OUTPUT_SAMPLES = 128;
/**
 * Points per cycle in the sweeps, which solve hundreds of cycles. The law is
 * smooth, so harmonics past the 30th are negligible: 64 points agree with
 * 1024 to four digits in power and THD on the EL34 in all three connections
 * at 1, 3 and 10 kΩ (measured while choosing it).
 */
export const SWEEP_SAMPLES = 64;
/** Harmonics counted in THD (2nd to 10th). */
export const THD_HARMONICS = 10;
/** The primary current is taken as cut off below this share of its idle value (this project's threshold). */
export const CUTOFF_SHARE = 0.02;

export interface DriveResult {
  /** Peak grid drive, V. */
  readonly drive: number;
  /** Power into the reflected load (the speaker) at the fundamental, W. */
  readonly power: number;
  /** Total harmonic distortion of the voltage the speaker gets, fraction. */
  readonly thd: number;
  /** Harmonic amplitudes relative to the fundamental: index 2 is H2, … up to 10. */
  readonly harmonics: readonly number[];
  readonly vpkMin: number;
  readonly vpkMax: number;
  readonly ipMin: number;
  readonly ipMax: number;
  /** Shift of the average primary current from idle under this drive, A. */
  readonly dcShift: number;
  /** The magnetising current the drive settles at, A (the cycle's average coupled current; its idle value at no drive). */
  readonly magnetising: number;
}

export interface Waveform {
  readonly vpk: Float64Array;
  readonly ip: Float64Array;
  /** The winding's signal voltage, the secondary's wave scaled by the turns ratio. */
  readonly winding: Float64Array;
  /** The magnetising current the cycle is solved with, A. */
  readonly magnetising: number;
}

/** One instant on the AC load. */
export interface Instant {
  vpk: number;
  ip: number;
  winding: number;
  /** The coupled current, A. */
  m: number;
}

/**
 * The circuit at one grid voltage: the coupled current M where the tube's law
 * and the load agree. The residual rises with M in every connection (for an
 * ultralinear screen, Koren's screen current depends on the grids only, so
 * the plate current follows from M directly).
 */
const c = emptyCurrents();

export function solveInstant(s: OutputSolution, vgk: number, zPrimary: number, out: Instant, near?: number, magnetising = s.op.mmf): void {
  const { supply, feed } = s.op;
  const mq = magnetising;
  const rp = s.design.rPrimary;
  const tap = feed.kind === 'tap' ? feed.fraction : 0;
  let vpk = 0;
  let ip = 0;
  const residual = (m: number) => {
    const w = zPrimary * (m - mq);
    if (tap > 0) {
      stageCurrentsInto(s.tube, feed, supply, vgk, c, w);
      const ia = m - tap * c.ig2;
      vpk = supply - w - ia * rp;
      stageCurrentsInto(s.tube, feed, vpk, vgk, c, w);
      ip = c.ip;
      return ia - c.ia;
    }
    vpk = supply - w - m * rp;
    stageCurrentsInto(s.tube, feed, vpk, vgk, c, w);
    ip = c.ip;
    return m - c.ip;
  };
  let hi = mq + supply / zPrimary;
  if (tap > 0) {
    stageCurrentsInto(s.tube, feed, supply, vgk, c, 0);
    hi += tap * c.ig2;
  }
  // A narrow warm-started bracket was tried and measured slower (350 against 250 µs a cycle). Secant steps from a
  // neighbouring instant's answer (`near`) settle in three or four laws where the bracket takes a dozen; a step
  // that leaves the bracket or does not settle hands over to it.
  const tol = 1e-12 + hi * 1e-9;
  const m = (near !== undefined ? secantFrom(residual, near, hi, tol) : null) ?? bracketedRoot(residual, 0, hi, tol).x;
  residual(m);
  out.vpk = vpk;
  out.ip = ip;
  out.winding = zPrimary * (m - mq);
  out.m = m;
}

/** Secant steps on a rising residual from `x0`, within [0, hi]; null when they leave it or do not settle in 8 steps. */
function secantFrom(residual: (m: number) => number, x0: number, hi: number, tol: number): number | null {
  let a = x0;
  let fa = residual(a);
  let b = a + Math.max(tol * 100, Math.abs(a) * 1e-6);
  let fb = residual(b);
  for (let k = 0; k < 8; k++) {
    const slope = (fb - fa) / (b - a);
    if (!(slope > 0) || !Number.isFinite(slope)) return null;
    const c = b - fb / slope;
    if (!(c >= 0 && c <= hi)) return null;
    if (Math.abs(c - b) <= tol) return c;
    a = b;
    fa = fb;
    b = c;
    fb = residual(b);
  }
  return null;
}

/** The magnetising current is settled to this share of the instants' bracket (M's span): a part in 10⁷, far under a figure's last digit. */
export const SETTLE_TOL = 1e-7;

/**
 * One cycle at a drive in its steady state (settleCycle), written into the
 * arrays given; its magnetising current returned.
 */
function steadyCycle(s: OutputSolution, drive: number, zPrimary: number, vpk: Float64Array, ip: Float64Array, winding: Float64Array, guess = s.op.mmf): number {
  const n = vpk.length;
  const at: Instant = { vpk: 0, ip: 0, winding: 0, m: 0 };
  const solveAt = (k: number, mm: number, near: number | undefined) => {
    solveInstant(s, s.op.vgk + drive * Math.sin((2 * Math.PI * k) / n), zPrimary, at, near, mm);
    vpk[k] = at.vpk;
    ip[k] = at.ip;
    winding[k] = at.winding;
    return at.m;
  };
  const copy = (from: number, to: number) => {
    vpk[to] = vpk[from]!;
    ip[to] = ip[from]!;
    winding[to] = winding[from]!;
  };
  return settleCycle(n, solveAt, s.op.mmf, SETTLE_TOL * (s.op.mmf + s.op.supply / zPrimary), guess, n % 4 === 0 ? copy : undefined);
}

export function waveform(s: OutputSolution, drive: number, zPrimary = s.design.zPrimary, n = OUTPUT_SAMPLES, guess?: number): Waveform {
  const vpk = new Float64Array(n);
  const ip = new Float64Array(n);
  const winding = new Float64Array(n);
  const magnetising = steadyCycle(s, drive, zPrimary, vpk, ip, winding, guess);
  return { vpk, ip, winding, magnetising };
}

export function atDrive(s: OutputSolution, drive: number, zPrimary = s.design.zPrimary, n = OUTPUT_SAMPLES, guess?: number): DriveResult {
  return driveResultOf(s, drive, zPrimary, waveform(s, drive, zPrimary, n, guess));
}

/** Power, harmonics and extremes of a cycle already solved. */
function driveResultOf(s: OutputSolution, drive: number, zPrimary: number, w: Waveform): DriveResult {
  const n = w.vpk.length;
  const h = harmonicAmplitudes(w.winding, THD_HARMONICS);
  const v1 = h[1] ?? 0;
  const rel = h.map((a, k) => (k < 2 || v1 === 0 ? 0 : a / v1));
  let sum = 0;
  for (let k = 2; k < rel.length; k++) sum += rel[k]! * rel[k]!;
  let vMin = Infinity, vMax = -Infinity, iMin = Infinity, iMax = -Infinity, iSum = 0;
  for (let k = 0; k < n; k++) {
    vMin = Math.min(vMin, w.vpk[k]!);
    vMax = Math.max(vMax, w.vpk[k]!);
    iMin = Math.min(iMin, w.ip[k]!);
    iMax = Math.max(iMax, w.ip[k]!);
    iSum += w.ip[k]!;
  }
  return {
    drive,
    power: (v1 * v1) / (2 * zPrimary),
    thd: Math.sqrt(sum),
    harmonics: rel,
    vpkMin: vMin,
    vpkMax: vMax,
    ipMin: iMin,
    ipMax: iMax,
    dcShift: iSum / n - s.op.ip,
    magnetising: w.magnetising,
  };
}

export type DriveLimit = 'grid current' | 'cutoff';

export interface CleanLimit {
  /** Peak drive at which the grid reaches 0 V (onset of grid current), V. */
  readonly gridCurrentDrive: number;
  /** Peak drive at which the primary current falls to cutoff, V; null if it does not before grid current. */
  readonly cutoffDrive: number | null;
  readonly limitedBy: DriveLimit;
  /** The stage at the smaller of the two drives. */
  readonly at: DriveResult;
  /** The screen's and the cathode's currents averaged over that drive's cycle, A (averageCurrents, read on the cycle already solved). */
  readonly averages: { readonly ig2: number; readonly ik: number };
}

/**
 * Power at the onset of grid current or of cutoff, whichever comes first.
 * The current is lowest at the grid's most negative instant, read there in
 * the steady state of each trial drive (its magnetising current settled on a
 * cycle of `samples` points, each trial's from the last's).
 */
export function cleanLimit(s: OutputSolution, zPrimary = s.design.zPrimary, samples = OUTPUT_SAMPLES): CleanLimit {
  const grid = Math.max(0, -s.op.vgk);
  const floor = CUTOFF_SHARE * s.op.ip;
  const at: Instant = { vpk: 0, ip: 0, winding: 0, m: 0 };
  const [vpk, ip, winding] = [new Float64Array(samples), new Float64Array(samples), new Float64Array(samples)];
  let mm = s.op.mmf;
  let solvedAt = -1;
  const lowest = (a: number) => {
    mm = steadyCycle(s, a, zPrimary, vpk, ip, winding, mm);
    solvedAt = a;
    solveInstant(s, s.op.vgk - a, zPrimary, at, undefined, mm);
    return at.ip - floor;
  };
  let cutoffDrive: number | null = null;
  if (grid > 0 && lowest(grid) < 0) cutoffDrive = illinois(lowest, 0, grid, Math.max(1e-9, floor * 1e-3));
  const drive = cutoffDrive ?? grid;
  // The last trial's cycle is the answer's when it was at that drive (grid current first: always).
  const cycle = solvedAt === drive ? { vpk, ip, winding, magnetising: mm } : waveform(s, drive, zPrimary, samples, mm);
  return { gridCurrentDrive: grid, cutoffDrive, limitedBy: cutoffDrive === null ? 'grid current' : 'cutoff', at: driveResultOf(s, drive, zPrimary, cycle), averages: cycleAverages(s, drive, cycle) };
}

/**
 * The screen's and the cathode's currents averaged over a cycle at a drive
 * (peak grid swing), A: each instant of the steady cycle as the power figures
 * solve it, the tube's laws read there. In a pentode the screen takes more as
 * the plate swings low, so its average rises with drive: what a dropping
 * resistor then drops; the cathode's is what a cathode resistor then drops.
 */
export function averageCurrents(s: OutputSolution, drive: number, samples = SWEEP_SAMPLES): { readonly ig2: number; readonly ik: number } {
  return cycleAverages(s, drive, waveform(s, drive, s.design.zPrimary, samples));
}

/** The screen's and the cathode's currents averaged over a steady cycle already solved at a drive, A. */
function cycleAverages(s: OutputSolution, drive: number, w: Waveform): { readonly ig2: number; readonly ik: number } {
  const samples = w.vpk.length;
  const c = emptyCurrents();
  let ig2 = 0;
  let ik = 0;
  for (let k = 0; k < samples; k++) {
    stageCurrentsInto(s.tube, s.op.feed, w.vpk[k]!, s.op.vgk + drive * Math.sin((2 * Math.PI * k) / samples), c, w.winding[k]!);
    ig2 += c.ig2;
    ik += c.ik;
  }
  return { ig2: ig2 / samples, ik: ik / samples };
}

/** The screen's average current at a drive, A (averageCurrents). */
export const averageScreenCurrent = (s: OutputSolution, drive: number, samples = SWEEP_SAMPLES): number => averageCurrents(s, drive, samples).ig2;
