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
 * How a single-ended stage's transfer moves with its magnetising current:
 * the coupled current M and the charted current solved with the magnetising
 * current at idle less `step`, at idle and at idle plus `step`, at every
 * SETTLING_STRIDE-th node (the shift's effect is smooth along the grid), as
 * the two coefficients of the quadratic through the three: M at a shift of
 * d steps is the idle transfer's plus slope·d + curve·d². The cycle's steady
 * state is where M's average over it equals the magnetising current (a
 * quadratic's root).
 */
export interface SettlingTransfer {
  /** The idle magnetising current, A. */
  readonly idle: number;
  readonly step: number;
  /** The primary impedance, Ω: the winding's voltage is Z·(M − magnetising current). */
  readonly z: number;
  /** M's first- and second-order change per step of the magnetising current, A. */
  readonly coupledSlope: Spline;
  readonly coupledCurve: Spline;
  /** The charted current's, A. */
  readonly currentSlope: Spline;
  readonly currentCurve: Spline;
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
  // A span too small to square (a grid a few hundred orders of magnitude from 0 V) is read as straight lines: no curvature to find.
  if (n < 3 || !(h * h > 0)) return m;
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
  // No span to read across (it underflowed): the idle node's value.
  if (!(h > 0)) return y[(n - 1) >> 1]!;
  const u = Math.min(Math.max((x + t.span) / h, 0), n - 1);
  const k = Math.min(Math.floor(u), n - 2);
  const b = u - k;
  const a = 1 - b;
  return a * y[k]! + b * y[k + 1]! + (((a * a * a - a) * m[k]! + (b * b * b - b) * m[k + 1]!) * h * h) / 6;
}

const windingAt = (t: GridTransfer, x: number) => readSpline(t, t.winding, t.windingCurve, x);
const splineAt = (t: GridTransfer, s: Spline, x: number) => readSpline(t, s.y, s.curve, x);

/**
 * The settled shift of the magnetising current from idle at a drive, in
 * steps: the root nearest zero of the cycle's average M (a quadratic in the
 * shift) less the magnetising current. Each sample's M at idle and its two
 * coefficients are left in `mids`, `slopes`, `curves`.
 */
function settledShift(t: GridTransfer, st: SettlingTransfer, drive: number): number {
  const n = TRANSFER_SAMPLES;
  let a = 0;
  let b = 0;
  let c = 0;
  // A sine takes each value twice a cycle (sin θ = sin(π − θ)): each distinct point read once and counted twice.
  for (const k of DISTINCT) {
    const x = drive * SINE[k]!;
    const w = TWICE[k]! ? 2 : 1;
    a += w * (mids[k] = st.idle + windingAt(t, x) / st.z);
    b += w * (slopes[k] = splineAt(t, st.coupledSlope, x));
    c += w * (curves[k] = splineAt(t, st.coupledCurve, x));
  }
  // In steps d: a/n + (b/n)·d + (c/n)·d² = idle + d·step: the average M against the magnetising current.
  const k0 = a / n - st.idle;
  const k1 = b / n - st.step;
  const k2 = c / n;
  // k1 < 0 (M rises with the magnetising current by less than it does); the root nearest zero, in the stable form.
  const disc = k1 * k1 - 4 * k2 * k0;
  if (Math.abs(k2) < 1e-300 || !(disc >= 0)) return k1 !== 0 ? -k0 / k1 : 0;
  return (-2 * k0) / (k1 - Math.sqrt(disc));
}

/** The cycle's distinct points (up to the crest, then from the half cycle down to the trough), and which of them recur. */
const DISTINCT = [...Array.from({ length: TRANSFER_SAMPLES / 4 + 1 }, (_, k) => k), ...Array.from({ length: TRANSFER_SAMPLES / 4 + 1 }, (_, k) => TRANSFER_SAMPLES / 2 + k)];
const mirrorOf = (k: number) => (k > 0 && k < TRANSFER_SAMPLES / 4 ? TRANSFER_SAMPLES / 2 - k : k > TRANSFER_SAMPLES / 2 && k < (3 * TRANSFER_SAMPLES) / 4 ? (3 * TRANSFER_SAMPLES) / 2 - k : k);
const TWICE = Array.from({ length: TRANSFER_SAMPLES }, (_, k) => mirrorOf(k) !== k);
const mids = new Float64Array(TRANSFER_SAMPLES);
const slopes = new Float64Array(TRANSFER_SAMPLES);
const curves = new Float64Array(TRANSFER_SAMPLES);

/** The charted current at grid excursion x: in a single-ended stage's steady state at peak drive `drive`. */
export function currentAt(t: GridTransfer, x: number, drive = Math.abs(x)): number {
  const idle = readSpline(t, t.current, t.currentCurve, x);
  const st = t.settling;
  if (!st) return idle;
  const d = settledShift(t, st, drive);
  return idle + d * splineAt(t, st.currentSlope, x) + d * d * splineAt(t, st.currentCurve, x);
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
    for (const k of DISTINCT) wave[k] = wave[mirrorOf(k)] = st.z * (mids[k]! + d * slopes[k]! + d * d * curves[k]! - mm);
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
 * The shifted levels are solved at every other node (17 of 33): their effect
 * is smooth along the grid. Measured on the four stages of
 * tests/output/gridTransfer.test.ts, power within the 5 % THD limit against
 * the direct solve: every node 0.09 % at most, every other 0.12 %, every
 * fourth 0.78 % (the EL34 triode-connected); the output region's coarse look
 * 76, 54 and 46 ms.
 */
export const SETTLING_STRIDE = 2;

/**
 * A single-ended stage's transfer, from a fully negative swing to the grid at
 * 0 V, and how it moves with the magnetising current: each node solved from
 * its neighbour's answer, the shifted levels' from the idle one's.
 */
export function singleEndedTransfer(s: OutputSolution, nodes = TRANSFER_NODES): GridTransfer {
  const at: Instant = { vpk: 0, ip: 0, winding: 0, m: 0 };
  const z = s.design.zPrimary;
  const span = Math.max(0, -s.op.vgk);
  const idle = s.op.mmf;
  // Each node starts from the line through the last two answers (nodes are evenly spaced).
  let before: number | undefined;
  let last: number | undefined;
  const coupled = new Float64Array(nodes);
  let k = 0;
  const transfer = gridTransfer(span, z, (x, out) => {
    const near = last === undefined ? undefined : before === undefined ? last : Math.max(0, 2 * last - before);
    solveInstant(s, s.op.vgk + x, z, at, near);
    before = last;
    last = at.m;
    coupled[k++] = at.m;
    out.current = at.ip;
    return at.winding;
  }, nodes);
  const stride = (nodes - 1) % SETTLING_STRIDE === 0 ? SETTLING_STRIDE : 1;
  const few = (nodes - 1) / stride + 1;
  const h = (2 * span) / (few - 1);
  const step = SETTLING_STEP * idle;
  const coefficients = () => ({ slope: new Float64Array(few), curve: new Float64Array(few) });
  const m = coefficients();
  const c = coefficients();
  // Each shifted level starts from the idle answer moved by the last node's slope (its first from a third of the step).
  let slope = step / 3;
  for (let j = 0; j < few; j++) {
    const node = j * stride;
    const x = -span + j * h;
    const mid = coupled[node]!;
    solveInstant(s, s.op.vgk + x, z, at, Math.max(0, mid - slope), idle - step);
    const mLo = at.m;
    const iLo = at.ip;
    solveInstant(s, s.op.vgk + x, z, at, mid + slope, idle + step);
    const mHi = at.m;
    const iHi = at.ip;
    slope = 0.5 * (mHi - mLo);
    const iMid = transfer.current[node]!;
    m.slope[j] = 0.5 * (mHi - mLo);
    m.curve[j] = 0.5 * (mHi - 2 * mid + mLo);
    c.slope[j] = 0.5 * (iHi - iLo);
    c.curve[j] = 0.5 * (iHi - 2 * iMid + iLo);
  }
  const spline = (y: Float64Array): Spline => ({ y, curve: splineCurve(y, h) });
  return { ...transfer, settling: { idle, step, z, coupledSlope: spline(m.slope), coupledCurve: spline(m.curve), currentSlope: spline(c.slope), currentCurve: spline(c.curve) } };
}
