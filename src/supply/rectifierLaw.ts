import type { Rectifier } from './supplyTypes';
import { findRectifierTube, perveanceOf } from './rectifierTubes';

/**
 * A silicon rectifier diode: Shockley's law with a series resistance, the
 * constants of the widely published SPICE model of the 1N4007 (IS 7.03 nA,
 * N 1.808, RS 0.034 Ω; from memory), used for every silicon rectifier here.
 */
export const SILICON = { is: 7.03e-9, n: 1.808, rs: 0.034 } as const;
const VT_300K = 0.025852; // kT/q at 300 K, V

/**
 * The rectifier's voltage drop at a current: the diodes in the path (two for
 * a bridge) or a tube plate by Child–Langmuir, V = (I/k)^(2/3). Monotone
 * rising from 0 at 0 A.
 */
export type DropLaw = {
  readonly drop: (i: number) => number;
  readonly slope: (i: number) => number;
} & (
  /** A tube: its Child–Langmuir perveance, so the current is solved in the drop voltage (smooth there). */
  | { readonly kind: 'tube'; readonly perveance: number }
  /** Silicon: the diodes in the path, so the current is solved in the junction voltage (convex there). */
  | { readonly kind: 'silicon'; readonly diodes: number }
);

export function dropLaw(r: Rectifier): DropLaw | null {
  if (r.kind === 'tube') {
    const t = findRectifierTube(r.tubeId);
    if (!t) return null;
    const k = perveanceOf(t);
    return {
      drop: (i) => (i <= 0 ? 0 : Math.pow(i / k, 2 / 3)),
      slope: (i) => (i <= 1e-12 ? 1e6 : (2 / 3) * Math.pow(i / k, -1 / 3) / k),
      kind: 'tube',
      perveance: k,
    };
  }
  const diodes = r.kind === 'silicon-bridge' ? 2 : 1;
  const nvt = SILICON.n * VT_300K;
  return {
    drop: (i) => (i <= 0 ? 0 : diodes * (nvt * Math.log1p(i / SILICON.is) + i * SILICON.rs)),
    slope: (i) => diodes * (nvt / (Math.max(i, 0) + SILICON.is) + SILICON.rs),
    kind: 'silicon',
    diodes,
  };
}

/**
 * The rectifier's current into a node held at `v` (after the winding's
 * resistance `rw`) when the rectified secondary stands at `e`: the one root of
 * e − v = i·rw + drop(i), or 0 when e ≤ v, with its derivative with respect
 * to v for the caller's Newton.
 */
export function rectifierCurrent(law: DropLaw, e: number, v: number, rw: number): { i: number; di: number } {
  const head = e - v;
  if (!(head > 0)) return { i: 0, di: 0 };
  return law.kind === 'tube' ? tubeCurrent(law.perveance, head, rw) : siliconCurrent(law.diodes, head, rw);
}

/**
 * A tube plate's current for a head of `head` volts behind `rw`: solved in
 * the tube's drop u, where u + rw·k·u^1.5 = head is smooth and convex, so
 * Newton from u = head falls monotonically onto the root (in the current,
 * the law's infinite slope at 0 A slows Newton to bisection).
 */
function tubeCurrent(k: number, head: number, rw: number): { i: number; di: number } {
  let u = head;
  for (let n = 0; n < 50; n++) {
    const root = Math.sqrt(u);
    const f = u + rw * k * u * root - head;
    const next = Math.max(u - f / (1 + 1.5 * rw * k * root), 0);
    if (Math.abs(next - u) <= 1e-12 * head) {
      u = next;
      break;
    }
    u = next;
  }
  const root = Math.sqrt(u);
  const di = (1.5 * k * root) / (1 + 1.5 * rw * k * root); // d i / d head
  return { i: k * u * root, di: -di };
}

/**
 * Silicon diodes' current for a head of `head` volts behind `rw`: solved in
 * each junction's voltage u, where d·u + R·Is·(e^(u/nVt) − 1) = head (R the
 * winding and the diodes' series resistance) is convex; Newton from the u at
 * which R alone would carry the head falls monotonically onto the root, and
 * the exponential never overflows.
 */
function siliconCurrent(diodes: number, head: number, rw: number): { i: number; di: number } {
  const nvt = SILICON.n * VT_300K;
  const r = rw + diodes * SILICON.rs;
  let u = nvt * Math.log1p(head / (Math.max(r, 1e-6) * SILICON.is));
  for (let n = 0; n < 60; n++) {
    const ex = Math.exp(u / nvt);
    const f = diodes * u + r * SILICON.is * (ex - 1) - head;
    const next = u - f / (diodes + (r * SILICON.is * ex) / nvt);
    if (Math.abs(next - u) <= 1e-13 * Math.max(1, Math.abs(u))) {
      u = next;
      break;
    }
    u = next;
  }
  const ex = Math.exp(u / nvt);
  const gd = (SILICON.is * ex) / nvt; // d i / d u
  return { i: SILICON.is * (ex - 1), di: -gd / (diodes + r * gd) };
}
