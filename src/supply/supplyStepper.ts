import type { DropLaw } from './rectifierLaw';
import { rectifierCurrent } from './rectifierLaw';
import type { SupplyDesign } from './supplyTypes';

/**
 * One backward-Euler step of the supply at a time (stiff-stable: the
 * rectifier's pulses are far shorter than the filter's time constants), on
 * the ladder's node voltages and choke currents, with the rectifier's law at
 * the reservoir (a diode or a tube plate) solved by Newton inside each step.
 * The ladder is a chain, so each Newton iteration is one tridiagonal solve.
 * The transformer is a sine source behind its winding resistance (no
 * leakage inductance), full-wave rectified (half-wave: the positive half
 * only); the loads draw constant currents.
 *
 * The state (what the next step needs from the last) is every node voltage,
 * the current in each L–C section, and the input choke's current: `stateSize`
 * numbers, read and written with `readState`/`writeState` so the periodic
 * steady state can be found by shooting.
 */
export interface SupplyStepper {
  readonly nodes: number;
  readonly stateSize: number;
  /** Node voltages now, V (live: the next step overwrites them). */
  readonly v: Float64Array;
  readonly caps: readonly number[];
  /** The rectifier's current into the filter at the last step, A. */
  inflow(): number;
  step(t: number, h: number): void;
  readState(out: Float64Array): void;
  writeState(x: ArrayLike<number>): void;
  /** What one unit of each state entry is worth when judging convergence: volts for voltages, amperes for currents. */
  readonly scale: Float64Array;
}

export function supplyStepper(d: SupplyDesign, law: DropLaw): SupplyStepper {
  const n = d.sections.length + 1;
  const caps = [d.input.c, ...d.sections.map((s) => s.c)];
  const peak = Math.SQRT2 * d.secondaryRms;
  const omega = 2 * Math.PI * d.mainsHz;
  const rw = d.windingOhms;
  const halfWave = d.rectifier.kind === 'silicon-half-wave';
  const choke = d.input.kind === 'choke' ? d.input : null;
  const inductive = d.sections.map((s, i) => (s.kind === 'lc' ? i + 1 : -1)).filter((k) => k > 0);
  const stateSize = n + inductive.length + (choke ? 1 : 0);
  const totalLoad = d.loads.reduce((a, b) => a + b, 0);

  // State: node voltages, section currents (into node k from k−1; an R–C section's follows its voltages), the input choke's current.
  const v = new Float64Array(n);
  const iSec = new Float64Array(n);
  let iChoke = 0;
  let inflow = 0;

  // Scratch for the tridiagonal solve.
  const lower = new Float64Array(n);
  const diag = new Float64Array(n);
  const upper = new Float64Array(n);
  const rhs = new Float64Array(n);
  const g = new Float64Array(n); // section conductances (index k: between k−1 and k)
  const a = new Float64Array(n); // section current sources
  const next = new Float64Array(n);

  /** Current into node 0 from the rectifier (through the input choke if any) for node-0 voltage v0, with its slope. */
  const inflowAt = (e: number, v0: number, h: number): { i: number; di: number } => {
    if (!choke) return rectifierCurrent(law, e, v0, rw);
    // Backward Euler on the choke: j = a0 + g0·(vr − v0), vr = e − rw·j − drop(j) while the rectifier conducts (j > 0).
    const g0 = 1 / (choke.l / h + choke.rdc);
    const a0 = (choke.l / h) * iChoke * g0;
    const push = a0 + g0 * (e - v0);
    if (!(push > 0)) return { i: 0, di: 0 };
    let lo = 0;
    let hi = push;
    let j = Math.min(iChoke > 0 ? iChoke : push, push);
    for (let k = 0; k < 60; k++) {
      const f = j * (1 + g0 * rw) + g0 * law.drop(j) - push;
      if (f > 0) hi = j;
      else lo = j;
      const nextJ = j - f / (1 + g0 * rw + g0 * law.slope(j));
      const stepJ = nextJ > lo && nextJ < hi ? nextJ : 0.5 * (lo + hi);
      if (Math.abs(stepJ - j) <= 1e-13 + 1e-11 * j) {
        j = stepJ;
        break;
      }
      j = stepJ;
    }
    return { i: j, di: -g0 / (1 + g0 * rw + g0 * law.slope(j)) };
  };

  const step = (t: number, h: number): void => {
    const s = Math.sin(omega * t);
    const e = peak * (halfWave ? Math.max(s, 0) : Math.abs(s));
    for (let k = 1; k < n; k++) {
      const s = d.sections[k - 1]!;
      if (s.kind === 'rc') {
        g[k] = 1 / s.r;
        a[k] = 0;
      } else {
        g[k] = 1 / (s.l / h + s.rdc);
        a[k] = (s.l / h) * iSec[k]! * g[k]!;
      }
    }
    let guess = v[0]!;
    for (let iter = 0; iter < 30; iter++) {
      const flow = inflowAt(e, guess, h);
      for (let k = 0; k < n; k++) {
        const gIn = k > 0 ? g[k]! : 0;
        const gOut = k + 1 < n ? g[k + 1]! : 0;
        lower[k] = -gIn;
        upper[k] = -gOut;
        diag[k] = caps[k]! / h + gIn + gOut;
        rhs[k] = (caps[k]! / h) * v[k]! + (k > 0 ? a[k]! : 0) - (k + 1 < n ? a[k + 1]! : 0) - d.loads[k]!;
      }
      diag[0] = diag[0]! - flow.di;
      rhs[0] = rhs[0]! + flow.i - flow.di * guess;
      // Thomas algorithm: the matrix is diagonally dominant (every conductance and C/h positive).
      for (let k = 1; k < n; k++) {
        const m = lower[k]! / diag[k - 1]!;
        diag[k] = diag[k]! - m * upper[k - 1]!;
        rhs[k] = rhs[k]! - m * rhs[k - 1]!;
      }
      next[n - 1] = rhs[n - 1]! / diag[n - 1]!;
      for (let k = n - 2; k >= 0; k--) next[k] = (rhs[k]! - upper[k]! * next[k + 1]!) / diag[k]!;
      const moved = Math.abs(next[0]! - guess);
      guess = next[0]!;
      if (moved <= 1e-10 * peak) break;
    }
    const flow = inflowAt(e, next[0]!, h);
    inflow = flow.i;
    if (choke) iChoke = flow.i;
    for (let k = 1; k < n; k++) iSec[k] = a[k]! + g[k]! * (next[k - 1]! - next[k]!);
    v.set(next);
  };

  const scale = new Float64Array(stateSize);
  scale.fill(peak, 0, n);
  scale.fill(Math.max(totalLoad, 1e-3), n);

  return {
    nodes: n,
    stateSize,
    v,
    caps,
    inflow: () => inflow,
    step,
    scale,
    readState(out) {
      out.set(v);
      inductive.forEach((k, j) => (out[n + j] = iSec[k]!));
      if (choke) out[stateSize - 1] = iChoke;
    },
    writeState(x) {
      for (let k = 0; k < n; k++) v[k] = x[k]!;
      for (let k = 1; k < n; k++) {
        const s = d.sections[k - 1]!;
        // An R–C section's current is Ohm's law on its voltages; an L–C section's is state.
        iSec[k] = s.kind === 'rc' ? (v[k - 1]! - v[k]!) / s.r : 0;
      }
      inductive.forEach((k, j) => (iSec[k] = x[n + j]!));
      if (choke) iChoke = x[stateSize - 1]!;
    },
  };
}
