import { solveLinear } from '../numeric/solveLinear';
import type { SupplyStepper } from './supplyStepper';

/** Newton rounds before shooting gives up (the caller then marches in time instead). */
const MAX_ROUNDS = 12;
/** Converged when the last Newton step moved no entry by more than this share of its scale (35 µV on a 350 V peak). */
const STEP_TOL = 1e-7;
/** The finite-difference nudge to each state entry, as a share of its scale. */
const NUDGE = 1e-6;

export interface Shot {
  /** The state at the start of a period, repeating. */
  readonly state: Float64Array;
  /** Periods of the rectified source integrated to find it. */
  readonly periods: number;
}

/**
 * The supply's periodic steady state by shooting (T. J. Aprille and
 * T. N. Trick, "Steady-state analysis of nonlinear circuits with periodic
 * inputs", Proc. IEEE 60(1), 1972): find the state x that one period of the
 * rectified source (half a mains cycle) brings back to itself, P(x) = x, by
 * Newton's method on P(x) − x with P's Jacobian from finite differences.
 * Marching in time to the same state takes as many periods as the slowest
 * filter section's time constant spans (hundreds of half-cycles behind a
 * 10 kΩ, 22 µF section); shooting takes a few rounds of `stateSize + 1`
 * periods each. Null when it does not converge.
 */
export function shootSteadyState(st: SupplyStepper, start: Float64Array, period: number, steps: number): Shot | null {
  const size = st.stateSize;
  const h = period / steps;
  let periods = 0;
  const run = (from: ArrayLike<number>, out: Float64Array) => {
    st.writeState(from);
    let t = 0;
    for (let k = 0; k < steps; k++) {
      t += h;
      st.step(t, h);
    }
    st.readState(out);
    periods++;
  };
  const x = Float64Array.from(start);
  const px = new Float64Array(size);
  const nudged = new Float64Array(size);
  const out = new Float64Array(size);
  // (I − J)·dx = P(x) − x, with J = ∂P/∂x column by column; J is kept while each step shrinks tenfold (the chord method).
  let a: number[][] | null = null;
  let lastMoved = Infinity;
  for (let round = 0; round < MAX_ROUNDS; round++) {
    run(x, px);
    if (!a) {
      a = Array.from({ length: size }, (_, i) => Array.from({ length: size }, (_, j) => (i === j ? 1 : 0)));
      for (let j = 0; j < size; j++) {
        const dj = NUDGE * st.scale[j]!;
        nudged.set(x);
        nudged[j] = x[j]! + dj;
        run(nudged, out);
        for (let i = 0; i < size; i++) a[i]![j] = a[i]![j]! - (out[i]! - px[i]!) / dj;
      }
    }
    const dx = solveLinear(a, Array.from(px, (p, i) => p - x[i]!));
    if (!dx) return null;
    let moved = 0;
    for (let i = 0; i < size; i++) {
      x[i] = x[i]! + dx[i]!;
      moved = Math.max(moved, Math.abs(dx[i]!) / st.scale[i]!);
    }
    // Node voltages cannot go below ground in a positive supply: a wild first step is pulled back.
    for (let k = 0; k < st.nodes; k++) x[k] = Math.max(x[k]!, 0);
    if (moved <= STEP_TOL) return { state: x, periods };
    if (moved > 0.1 * lastMoved) a = null;
    lastMoved = moved;
  }
  return null;
}
