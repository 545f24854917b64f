import { illinois } from '../numeric/illinois';
import { solveInstant, THD_HARMONICS, type Instant } from './outputSignal';
import type { OutputSolution } from './solveOutput';

/**
 * An output stage's transfer from grid to winding, solved once at evenly
 * spaced grid excursions and read between them by a natural cubic spline
 * (the textbook construction: continuous second derivatives, a tridiagonal
 * system for them). A cycle at any drive up to the span is then a few
 * multiplications per sample instead of a root of the circuit per sample:
 * what makes a whole plane of output stages (the targets' region) cheap.
 * The circuit is memoryless at audio frequencies (an ideal transformer, a
 * bypassed or fixed bias), so the winding's voltage at an instant depends on
 * the grid's voltage at that instant alone; that is what lets one curve
 * serve every drive. A single-ended primary's magnetising current is the one
 * state it keeps, settled by the drive (steadyState.ts): its transfer is
 * solved at three magnetising currents (`settling`) and each cycle reads its
 * own between them.
 */
export interface GridTransfer {
  /** The nodes cover grid excursions from −span to +span about the bias, V. */
  readonly span: number;
  /** The winding's signal voltage at each node, V. */
  readonly winding: Float64Array;
  /** The current each node's instant draws (the charted current, or the lower of a pair's), A. */
  readonly current: Float64Array;
  /** The reflected load the winding drives, Ω: power is the fundamental's square over twice it. */
  readonly load: number;
  readonly windingCurve: Float64Array;
  readonly currentCurve: Float64Array;
  /** A single-ended primary's transfer at three magnetising currents; absent for a pair, whose matched halves' shifts cancel. */
  readonly settling?: SettlingTransfer;
}

/**
 * A single-ended stage's coupled current M and charted current at each node,
 * solved with the magnetising current at idle less `step`, at idle, and at
 * idle plus `step`: M at any magnetising current between is the quadratic
 * through the three, and the cycle's steady state is where M's average over
 * the cycle equals it (a quadratic's root).
 */
export interface SettlingTransfer {
  /** The idle magnetising current, A. */
  readonly idle: number;
  readonly step: number;
  /** The primary impedance, Ω: the winding's voltage is Z·(M − magnetising current). */
  readonly z: number;
  readonly coupled: readonly [Spline, Spline, Spline];
  readonly current: readonly [Spline, Spline, Spline];
}

/** Values at evenly spaced nodes and their natural spline's second derivatives. */
export interface Spline {
  readonly y: Float64Array;
  readonly curve: Float64Array;
}

/** Nodes per transfer: 33 put a node every 1/16 of the bias, close enough that a cycle's THD agrees with the direct solve to a small fraction of itself (tests/output/gridTransfer.test.ts). */
export const TRANSFER_NODES = 33;
/** Samples per cycle read from the spline: 32 resolve the 2nd to 10th harmonics THD counts without aliasing. */
export const TRANSFER_SAMPLES = 32;

/** Second derivatives of the natural cubic spline through evenly spaced values (the Thomas algorithm on its tridiagonal system). */
function splineCurve(y: Float64Array, h: number): Float64Array {
  const n = y.length;
  const m = new Float64Array(n);
  if (n < 3) return m;
  const c = new Float64Array(n);
  const d = new Float64Array(n);
  for (let i = 1; i < n - 1; i++) {
    const rhs = (6 * (y[i + 1]! - 2 * y[i]! + y[i - 1]!)) / (h * h);
    const denom = 4 - (i > 1 ? c[i - 1]! : 0);
    c[i] = 1 / denom;
    d[i] = (rhs - (i > 1 ? d[i - 1]! : 0)) / denom;
  }
  for (let i = n - 2; i >= 1; i--) m[i] = d[i]! - c[i]! * (i < n - 2 ? m[i + 1]! : 0);
  return m;
}

/**
 * The transfer from a function that solves one instant: `solve(x)` returns
 * the winding's voltage and leaves the current in `out`. With `odd` (a
 * matched pair, whose halves trade places when the drive changes sign) only
 * the nodes from 0 up are solved: w(−x) = −w(x), the current the same.
 */
export function gridTransfer(span: number, load: number, solve: (x: number, out: { current: number }) => number, nodes = TRANSFER_NODES, odd = false): GridTransfer {
  const winding = new Float64Array(nodes);
  const current = new Float64Array(nodes);
  const out = { current: 0 };
  const h = (2 * span) / (nodes - 1);
  const mid = (nodes - 1) / 2;
  if (odd && Number.isInteger(mid)) {
    for (let k = mid; k < nodes; k++) {
      winding[k] = k === mid ? 0 : solve(-span + k * h, out);
      if (k === mid) solve(0, out);
      current[k] = out.current;
      winding[nodes - 1 - k] = -winding[k]!;
      current[nodes - 1 - k] = current[k]!;
    }
  } else {
    for (let k = 0; k < nodes; k++) {
      winding[k] = solve(-span + k * h, out);
      current[k] = out.current;
    }
  }
  return { span, winding, current, load, windingCurve: splineCurve(winding, h), currentCurve: splineCurve(current, h) };
}

/** The spline's value at grid excursion x (held to the span). */
function readSpline(t: GridTransfer, y: Float64Array, m: Float64Array, x: number): number {
  const n = y.length;
  const h = (2 * t.span) / (n - 1);
  const u = Math.min(Math.max((x + t.span) / h, 0), n - 1);
  const k = Math.min(Math.floor(u), n - 2);
  const b = u - k;
  const a = 1 - b;
  return a * y[k]! + b * y[k + 1]! + (((a * a * a - a) * m[k]! + (b * b * b - b) * m[k + 1]!) * h * h) / 6;
}

const windingAt = (t: GridTransfer, x: number) => readSpline(t, t.winding, t.windingCurve, x);
const splineAt = (t: GridTransfer, s: Spline, x: number) => readSpline(t, s.y, s.curve, x);

/** The quadratic through three values a step apart, at `d` steps from the middle one. */
const between = (lo: number, mid: number, hi: number, d: number) => mid + 0.5 * d * (hi - lo) + 0.5 * d * d * (hi - 2 * mid + lo);

/**
 * The settled shift of the magnetising current from idle at a drive, in
 * steps: the root nearest zero of the cycle's average M (a quadratic in the
 * shift) less the magnetising current. Each sample's three values of M are
 * left in `lows`, `mids`, `highs`.
 */
function settledShift(t: GridTransfer, st: SettlingTransfer, drive: number): number {
  const n = TRANSFER_SAMPLES;
  let a = 0;
  let b = 0;
  let c = 0;
  for (let k = 0; k < n; k++) {
    const x = drive * SINE[k]!;
    const lo = (lows[k] = splineAt(t, st.coupled[0], x));
    const mid = (mids[k] = splineAt(t, st.coupled[1], x));
    const hi = (highs[k] = splineAt(t, st.coupled[2], x));
    a += mid;
    b += 0.5 * (hi - lo);
    c += 0.5 * (hi - 2 * mid + lo);
  }
  // In steps d: a/n + (b/n)·d + (c/n)·d² = (idle + d·step): the average M against the magnetising current.
  const k0 = a / n - st.idle;
  const k1 = b / n - st.step;
  const k2 = c / n;
  // k1 < 0 (M rises with the magnetising current by less than it does); the root nearest zero, in the stable form.
  const disc = k1 * k1 - 4 * k2 * k0;
  if (Math.abs(k2) < 1e-300 || !(disc >= 0)) return k1 !== 0 ? -k0 / k1 : 0;
  return (-2 * k0) / (k1 - Math.sqrt(disc));
}

const lows = new Float64Array(TRANSFER_SAMPLES);
const mids = new Float64Array(TRANSFER_SAMPLES);
const highs = new Float64Array(TRANSFER_SAMPLES);

/** The charted current at grid excursion x: in a single-ended stage's steady state at peak drive `drive`. */
export function currentAt(t: GridTransfer, x: number, drive = Math.abs(x)): number {
  const st = t.settling;
  if (!st) return readSpline(t, t.current, t.currentCurve, x);
  const d = settledShift(t, st, drive);
  return between(splineAt(t, st.current[0], x), splineAt(t, st.current[1], x), splineAt(t, st.current[2], x), d);
}

export interface TransferCycle {
  readonly drive: number;
  /** Power into the reflected load at the fundamental, W. */
  readonly power: number;
  /** THD of the winding's voltage, 2nd to 10th, a fraction. */
  readonly thd: number;
}

const wave = new Float64Array(TRANSFER_SAMPLES);
/** sin and cos of every harmonic THD counts at every sample of the cycle, worked out once: a cycle is then sums of products. */
const SINE = Float64Array.from({ length: TRANSFER_SAMPLES }, (_, k) => Math.sin((2 * Math.PI * k) / TRANSFER_SAMPLES));
const BASIS_COS = Float64Array.from({ length: (THD_HARMONICS + 1) * TRANSFER_SAMPLES }, (_, i) => Math.cos((2 * Math.PI * Math.floor(i / TRANSFER_SAMPLES) * (i % TRANSFER_SAMPLES)) / TRANSFER_SAMPLES));
const BASIS_SIN = Float64Array.from({ length: (THD_HARMONICS + 1) * TRANSFER_SAMPLES }, (_, i) => Math.sin((2 * Math.PI * Math.floor(i / TRANSFER_SAMPLES) * (i % TRANSFER_SAMPLES)) / TRANSFER_SAMPLES));

/**
 * One cycle at peak drive `drive` read from the transfer: its power and THD.
 * Each harmonic by its own discrete Fourier sum (ten of them over 32 samples
 * cost less than the FFT's twiddles; the same sums harmonicAmplitudes makes).
 */
export function cycleAt(t: GridTransfer, drive: number): TransferCycle {
  // A grid already at 0 V has no swing: no signal (its spline, over no span, has no steps to read).
  if (!(t.span > 0)) return { drive: 0, power: 0, thd: 0 };
  const n = TRANSFER_SAMPLES;
  const st = t.settling;
  if (st) {
    const d = settledShift(t, st, drive);
    const mm = st.idle + d * st.step;
    for (let k = 0; k < n; k++) wave[k] = st.z * (between(lows[k]!, mids[k]!, highs[k]!, d) - mm);
  } else {
    for (let k = 0; k < n; k++) wave[k] = windingAt(t, drive * SINE[k]!);
  }
  let v1 = 0;
  let sum = 0;
  for (let h = 1; h <= THD_HARMONICS; h++) {
    let re = 0;
    let im = 0;
    const row = h * n;
    for (let k = 0; k < n; k++) {
      re += wave[k]! * BASIS_COS[row + k]!;
      im += wave[k]! * BASIS_SIN[row + k]!;
    }
    const amp = (2 * Math.hypot(re, im)) / n;
    if (h === 1) v1 = amp;
    else sum += amp * amp;
  }
  return { drive, power: (v1 * v1) / (2 * t.load), thd: v1 > 0 ? Math.sqrt(sum) / v1 : 0 };
}

/** Coarse steps the drive is scanned in before a crossing is refined (as the output bench's own power at a distortion limit). */
const SCAN_STEPS = 4;

/**
 * The most power with THD at most `limit` and the drive at most the span (the
 * grid at 0 V): THD scanned upward and its first crossing refined, as
 * powerAtDistortion does on the direct solve.
 */
export function powerWithin(t: GridTransfer, limit: number): TransferCycle {
  let prev: TransferCycle | null = null;
  for (let k = 1; k <= SCAN_STEPS; k++) {
    const r = cycleAt(t, (t.span * k) / SCAN_STEPS);
    if (r.thd > limit) {
      let last = r;
      illinois((a) => (last = cycleAt(t, a)).thd - limit, prev?.drive ?? 0, r.drive, limit * 1e-3, { fa: (prev?.thd ?? 0) - limit, fb: r.thd - limit });
      return last;
    }
    prev = r;
  }
  return prev ?? cycleAt(t, t.span);
}

/** Drive levels a pair's sweep judges its distortion limit on (as the pair's own figures do). */
const PAIR_LEVELS = 16;

/**
 * The most power with THD within `limit` for a pair: the highest of the
 * swept levels within it, then bisection up to the next, as the pair's own
 * figures read it (a pair deep in class AB distorts most at low levels, so
 * the first crossing from below would say nothing of its full power). Null
 * when THD is over the limit at every level.
 */
export function highestWithin(t: GridTransfer, limit: number): TransferCycle | null {
  let within: TransferCycle | null = null;
  let above: TransferCycle | null = null;
  for (let k = 1; k <= PAIR_LEVELS; k++) {
    const r = cycleAt(t, (t.span * k) / PAIR_LEVELS);
    if (r.thd <= limit) {
      within = r;
      above = null;
    } else if (within && !above) above = r;
  }
  if (!within || !above) return within;
  let lo = within;
  let hi = above.drive;
  for (let k = 0; k < 40 && hi - lo.drive > 1e-4 * t.span; k++) {
    const mid = cycleAt(t, 0.5 * (lo.drive + hi));
    if (mid.thd <= limit) lo = mid;
    else hi = mid.drive;
  }
  return lo;
}

/**
 * The cycle that gives `power` (the drive found by the Illinois method, power
 * rising with drive), or null when even the full span gives less: then the
 * most it gives, as `short`.
 */
export function cycleForPower(t: GridTransfer, power: number): { readonly at: TransferCycle | null; readonly most: number } {
  const top = cycleAt(t, t.span);
  if (top.power < power) return { at: null, most: top.power };
  let last = top;
  illinois((a) => (last = cycleAt(t, a)).power - power, 0, t.span, power * 1e-4, { fa: -power, fb: top.power - power });
  return { at: last, most: top.power };
}

/** The least drive at which the current at the grid's most negative instant falls to `floor`, or null if it stays above it within the span. */
export function driveToFloor(t: GridTransfer, floor: number): number | null {
  if (currentAt(t, -t.span) >= floor) return null;
  return illinois((a) => currentAt(t, -a) - floor, 0, t.span, Math.max(1e-12, floor * 1e-3));
}

/**
 * The magnetising current's step either side of idle in a single-ended
 * transfer, as a share of it. Measured while choosing it, on the 300B of
 * tests/output/gridTransfer.test.ts at its 5 % THD crossing: the quadratic
 * read THD within 0.05 % of the direct solve at 0.2, 0.4 % at 0.3, 1.6 % at
 * 0.5. A full drive's shift (up to 0.3 of idle on the EL34 and the 300B
 * there) is read a step and a half out, within those checks.
 */
export const SETTLING_STEP = 0.2;

/**
 * A single-ended stage's transfer, from a fully negative swing to the grid at
 * 0 V, at the three magnetising currents: each node solved from its
 * neighbour's answer, each level's nodes from the level before's.
 */
export function singleEndedTransfer(s: OutputSolution, nodes = TRANSFER_NODES): GridTransfer {
  const at: Instant = { vpk: 0, ip: 0, winding: 0, m: 0 };
  const z = s.design.zPrimary;
  const span = Math.max(0, -s.op.vgk);
  const h = (2 * span) / (nodes - 1);
  const idle = s.op.mmf;
  const step = SETTLING_STEP * idle;
  const levels = [idle - step, idle, idle + step];
  const coupled = levels.map(() => new Float64Array(nodes));
  const current = levels.map(() => new Float64Array(nodes));
  for (let j = 0; j < 3; j++) {
    for (let k = 0; k < nodes; k++) {
      // From the level before's answer at this node, or along the line through this level's last two.
      const near = j > 0 ? coupled[j - 1]![k] : k === 0 ? undefined : k === 1 ? coupled[j]![0] : Math.max(0, 2 * coupled[j]![k - 1]! - coupled[j]![k - 2]!);
      solveInstant(s, s.op.vgk - span + k * h, z, at, near, levels[j]);
      coupled[j]![k] = at.m;
      current[j]![k] = at.ip;
    }
  }
  const spline = (y: Float64Array): Spline => ({ y, curve: splineCurve(y, h) });
  const idleTransfer = gridTransfer(span, z, (x, out) => {
    const k = h > 0 ? Math.round((x + span) / h) : 0;
    out.current = current[1]![k]!;
    return z * (coupled[1]![k]! - idle);
  }, nodes);
  return {
    ...idleTransfer,
    settling: {
      idle,
      step,
      z,
      coupled: [spline(coupled[0]!), spline(coupled[1]!), spline(coupled[2]!)],
      current: [spline(current[0]!), spline(current[1]!), spline(current[2]!)],
    },
  };
}
