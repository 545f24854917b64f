/**
 * A transformer-coupled plate's steady state under a sustained drive. The
 * primary's inductance carries the magnetising current, steady over a cycle
 * at audio frequencies; in the periodic steady state the inductance's voltage
 * averages to zero over each cycle (Faraday's law: a net volt-second would
 * ramp its current without end). So the winding's signal voltage averages to
 * zero, and the magnetising current is the cycle's average coupled current:
 * when the law's curvature raises the average current under drive, the
 * magnetising current rises with it and the plate swings about its supply
 * again. `cycleMean(mm)` is the coupled current averaged over one cycle
 * solved with magnetising current mm; the steady state is the mm it returns.
 *
 * g(mm) = cycleMean(mm) − mm falls with slope in [−1, 0): each instant's
 * coupled current rises with mm by Z/(rp + Z + Rpri) of it, a share under
 * one, and not at all where the tube is cut off. So the root is unique, a
 * fixed-point step mm + g(mm) moves towards it without passing it, and the
 * secant steps taken from there converge in a few cycles.
 */
export const SETTLE_ITERATIONS = 30;

export function settleMagnetising(cycleMean: (mm: number) => number, idle: number, tol: number): number {
  let a = idle;
  let ga = cycleMean(a) - a;
  if (!(Math.abs(ga) > tol)) return a;
  let b = Math.max(0, a + ga);
  let gb = cycleMean(b) - b;
  for (let k = 0; k < SETTLE_ITERATIONS && Math.abs(gb) > tol; k++) {
    const slope = (gb - ga) / (b - a);
    // A secant step where the slope is as the law makes it; otherwise the fixed-point step, which cannot pass the root.
    const next = slope < 0 && slope >= -1.5 ? b - gb / slope : b + gb;
    a = b;
    ga = gb;
    b = Number.isFinite(next) ? Math.max(0, next) : a + ga;
    if (b === a) break;
    gb = cycleMean(b) - b;
  }
  return b;
}

/**
 * Points of a cycle the magnetising current is settled on: the average of a
 * periodic current over 32 evenly spaced points is exact but for its
 * harmonics at multiples of 32, small for these smooth laws (the settled
 * current agrees with 1000 points' within 6e-5 on the EL34 at full drive:
 * 2 ppm as a pentode, 24 ultralinear, 52 triode-connected; checked within
 * 1e-4 in tests/output/steadyState.test.ts).
 */
export const SETTLE_SAMPLES = 32;

/**
 * The points of a sine's cycle of n (a multiple of 4) that differ, in the
 * order solved: from 0 up to the crest, then from the half cycle down to
 * the trough. The rest mirror them (sin θ = sin(π − θ)).
 */
function distinctPoints(n: number): number[] {
  const out: number[] = [];
  for (let k = 0; k <= n / 4; k++) out.push(k);
  for (let k = n / 2; k <= (3 * n) / 4; k++) out.push(k);
  return out;
}

/** The point k mirrors, or k itself at the crest, trough and crossings. */
const mirrorOf = (k: number, n: number) => (k > 0 && k < n / 4 ? n / 2 - k : k > n / 2 && k < (3 * n) / 4 ? (3 * n) / 2 - k : k);

/**
 * One cycle of n points in its steady state. `solveAt(k, mm, near)` solves
 * the k-th point with magnetising current mm (from `near`, a guess at its
 * coupled current) and returns its coupled current, writing whatever the
 * caller keeps. The current is settled on every (n/32)-th point, each
 * trial's points started from the last trial's, then every point solved at
 * it from its neighbour's answer; with n at most 32, or not a multiple of
 * it, on every point (the last trial then is at the current returned).
 * Given `copy(from, to)`, the points are a sine's (the grid's swing at k
 * equals its swing at the mirrored point), so only the distinct ones are
 * solved and `copy` fills in the rest: half the work.
 */
export function settleCycle(n: number, solveAt: (k: number, mm: number, near: number | undefined) => number, idle: number, tol: number, guess = idle, copy?: (from: number, to: number) => void): number {
  const stride = n > SETTLE_SAMPLES && n % SETTLE_SAMPLES === 0 ? n / SETTLE_SAMPLES : 1;
  const count = n / stride;
  const mirrored = copy !== undefined && count % 4 === 0;
  const points = mirrored ? distinctPoints(count) : Array.from({ length: count }, (_, j) => j);
  const weights = points.map((j) => (mirrored && mirrorOf(j, count) !== j ? 2 : 1));
  const coupled = new Float64Array(count);
  let first = true;
  const cycleMean = (mm: number) => {
    let sum = 0;
    for (let i = 0; i < points.length; i++) {
      const j = points[i]!;
      // The first trial starts each point from the one before it (the half cycle's from the start: both at the bias).
      const near = !first ? coupled[j] : i === 0 ? undefined : j === count / 2 && mirrored ? coupled[0] : coupled[points[i - 1]!];
      coupled[j] = solveAt(j * stride, mm, near);
      sum += weights[i]! * coupled[j]!;
    }
    first = false;
    return sum / count;
  };
  const mm = settleMagnetising(cycleMean, guess, tol);
  const fine = mirrored ? distinctPoints(n) : null;
  if (stride > 1) {
    let last = coupled[0];
    for (const k of fine ?? Array.from({ length: n }, (_, k) => k)) {
      const start = k % stride === 0 ? coupled[k / stride] : k === n / 2 ? coupled[0] : last;
      last = solveAt(k, mm, start);
    }
  }
  if (fine && copy) {
    for (const k of fine) {
      const m = mirrorOf(k, n);
      if (m !== k) copy(k, m);
    }
  }
  return mm;
}
