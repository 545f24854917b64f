import type { Rectifier } from './supplyTypes';
import { findRectifierTube, perveanceOf } from './rectifierTubes';

/**
 * A silicon rectifier diode: Shockley's law with a series resistance, the
 * constants of the widely published SPICE model of the 1N4007 (IS 7.03 nA,
 * N 1.808, RS 0.034 Ω; from memory), used for every silicon rectifier here.
 */
export const SILICON = { is: 7.03e-9, n: 1.808, rs: 0.034 } as const;
const VT = 0.025852; // kT/q at 300 K, V

/**
 * The rectifier's voltage drop at a current: the diodes in the path (two for
 * a bridge) or a tube plate by Child–Langmuir, V = (I/k)^(2/3). Monotone
 * rising from 0 at 0 A.
 */
export function dropLaw(r: Rectifier): { drop: (i: number) => number; slope: (i: number) => number } | null {
  if (r.kind === 'tube') {
    const t = findRectifierTube(r.tubeId);
    if (!t) return null;
    const k = perveanceOf(t);
    return {
      drop: (i) => (i <= 0 ? 0 : Math.pow(i / k, 2 / 3)),
      slope: (i) => (i <= 1e-12 ? 1e6 : (2 / 3) * Math.pow(i / k, -1 / 3) / k),
    };
  }
  const diodes = r.kind === 'silicon-bridge' ? 2 : 1;
  const nvt = SILICON.n * VT;
  return {
    drop: (i) => (i <= 0 ? 0 : diodes * (nvt * Math.log1p(i / SILICON.is) + i * SILICON.rs)),
    slope: (i) => diodes * (nvt / (Math.max(i, 0) + SILICON.is) + SILICON.rs),
  };
}

/**
 * The rectifier's current into a node held at `v` (after the winding's
 * resistance `rw`) when the rectified secondary stands at `e`: the one root of
 * e − v = i·rw + drop(i), or 0 when e ≤ v. Newton from a bisection bracket;
 * its derivative with respect to v comes back for the caller's Newton.
 */
export function rectifierCurrent(law: NonNullable<ReturnType<typeof dropLaw>>, e: number, v: number, rw: number): { i: number; di: number } {
  const head = e - v;
  if (!(head > 0)) return { i: 0, di: 0 };
  let lo = 0;
  let hi = head / Math.max(rw, 1e-3);
  let i = Math.min(hi, head / (rw + law.slope(1e-3)));
  for (let k = 0; k < 60; k++) {
    const f = i * rw + law.drop(i) - head;
    if (f > 0) hi = i;
    else lo = i;
    const next = i - f / (rw + law.slope(i));
    const step = next > lo && next < hi ? next : 0.5 * (lo + hi);
    if (Math.abs(step - i) <= 1e-12 + 1e-10 * i) {
      i = step;
      break;
    }
    i = step;
  }
  return { i, di: -1 / (rw + law.slope(i)) };
}
