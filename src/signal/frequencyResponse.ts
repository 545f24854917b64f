import { recordOf } from '../tube/types';
import { fail, type Result } from '../result';
import type { StageDesign } from '../stage/stageDesign';
import { solvedStage, type SolvedStage } from './analysisInput';
import { cabs, csolveFlat, type Complex } from './complex';
import { decibelsOf } from './levels';

/**
 * Small-signal response of the stage from the source to the output, by nodal
 * analysis of the linearised circuit at the operating point (the method of
 * any circuit simulator's AC analysis). Nodes: a (after the source
 * impedance), x (the grid leak's top, after Cin; a volume control's wiper),
 * g (grid, behind the grid stopper from x), p (plate), k (cathode), o
 * (output, across RL), t (a volume control's top, after Cin). The
 * tube is a current source gm·vgk with rp across plate–cathode; its
 * interelectrode capacitances Cgk, Cgp and Cpk are in the circuit, so the
 * Miller effect with the source impedance comes out of the equations rather
 * than from an approximation. Parts not given are ideal: a missing coupling
 * capacitor is a short, a missing grid leak an open circuit.
 */
export interface ResponsePoint {
  readonly freqHz: number;
  /** |vout/vsource| in dB. */
  readonly magnitudeDb: number;
  /** Phase of vout/vsource in degrees, (−180, 180]; an inverting stage reads near ±180 at midband. */
  readonly phaseDeg: number;
}

/** Admittance standing in for an ideal short: far above any other in the network, yet finite for the solver. */
const SHORT = 1e9;

/** Node order of the matrix: a, g, p, k, o, x, t. */
const N = 7;
const W = N + 1;

/** The circuit's admittances that do not depend on frequency, and the capacitances that scale with it. */
function networkOf(s: SolvedStage) {
  const d = s.checked;
  const caps = recordOf(d.tube)?.capacitances ?? { cgk: 0, cgp: 0, cpk: 0 };
  const g = (r: number): number => (r === 0 ? SHORT : Number.isFinite(r) ? 1 / r : 0);
  return {
    gm: s.solution.gm,
    gp: 1 / s.solution.rp,
    gRs: g(d.rsource),
    // Behind a volume control below 1: the track below the wiper to ground, and above it to the pot's top (its own node).
    gRg: d.rg === null ? 0 : 1 / (d.rg * d.volume),
    gAbove: d.rg !== null && d.volume < 1 ? 1 / (d.rg * (1 - d.volume)) : null,
    // No stopper: the leak's top is the grid itself (a huge conductance between them would cancel the grid's microsiemens).
    gStopper: d.rstopper > 0 ? 1 / d.rstopper : null,
    gRa: g(d.ra),
    gRk: d.rk > 0 ? 1 / d.rk : SHORT,
    gRl: g(d.rl),
    // Series capacitors: null is an ideal short.
    cin: d.cin,
    cout: d.cout,
    // The bypass: a real capacitor, an ideal short, or nothing.
    ck: d.ck,
    kShort: d.ck === null && d.bypassed,
    cgk: caps.cgk,
    cgp: caps.cgp,
    cpk: caps.cpk,
  };
}

type Network = ReturnType<typeof networkOf>;
const scratch = { re: new Float64Array(N * W), im: new Float64Array(N * W), xr: new Float64Array(N), xi: new Float64Array(N) };

/** Adds the admittance (gr + j·bi) at row r, column c of the flat matrix. */
function add(re: Float64Array, im: Float64Array, r: number, c: number, gr: number, bi: number): void {
  const i = r * W + c;
  re[i] = re[i]! + gr;
  im[i] = im[i]! + bi;
}

/** Admittance y = (gr + j·bi) between nodes r and c (c < 0: ground), stamped as in modified nodal analysis. */
function stamp(re: Float64Array, im: Float64Array, r: number, c: number, gr: number, bi: number): void {
  add(re, im, r, r, gr, bi);
  if (c >= 0) {
    add(re, im, c, c, gr, bi);
    add(re, im, r, c, -gr, -bi);
    add(re, im, c, r, -gr, -bi);
  }
}

const [A, G, P, K, O, X, T] = [0, 1, 2, 3, 4, 5, 6];

/**
 * vout/vsource at one frequency: the nodal equations filled straight into
 * flat arrays and solved in place. (The stamping helpers live at module level:
 * closures made per call cost a measurable share of the full analysis.)
 */
function solveAt(net: Network, freqHz: number): Complex {
  const w = 2 * Math.PI * freqHz;
  const { re, im, xr, xi } = scratch;
  re.fill(0);
  im.fill(0);
  stamp(re, im, A, -1, net.gRs, 0); // source impedance to the (1 V) source: its current enters the right-hand side
  re[A * W + N] = net.gRs;
  const x = net.gStopper === null ? G : X;
  if (net.gStopper === null) stamp(re, im, X, -1, 1, 0); // the unused node, held at 0 V
  else stamp(re, im, X, G, net.gStopper, 0);
  // The coupling feeds the leak's top: the pot's own node when there is one, else the leak's top is x.
  const top = net.gAbove === null ? x : T;
  if (net.gAbove === null) stamp(re, im, T, -1, 1, 0); // the unused node, held at 0 V
  else stamp(re, im, T, x, net.gAbove, 0);
  if (net.cin === null) stamp(re, im, A, top, SHORT, 0);
  else stamp(re, im, A, top, 0, w * net.cin);
  stamp(re, im, x, -1, net.gRg, 0);
  stamp(re, im, G, K, 0, w * net.cgk);
  stamp(re, im, G, P, 0, w * net.cgp);
  stamp(re, im, P, -1, net.gRa, 0);
  stamp(re, im, P, K, net.gp, w * net.cpk);
  if (net.cout === null) stamp(re, im, P, O, SHORT, 0);
  else stamp(re, im, P, O, 0, w * net.cout);
  stamp(re, im, O, -1, net.gRl, 0);
  stamp(re, im, K, -1, net.gRk + (net.kShort ? SHORT : 0), net.ck === null ? 0 : w * net.ck);
  // The controlled source gm·(vg − vk) flows from plate to cathode.
  add(re, im, P, G, net.gm, 0);
  add(re, im, P, K, -net.gm, 0);
  add(re, im, K, G, -net.gm, 0);
  add(re, im, K, K, net.gm, 0);
  return csolveFlat(re, im, N, xr, xi) ? [xr[O]!, xi[O]!] : [0, 0];
}

export function responseAt(s: SolvedStage, freqHz: number): Complex {
  return solveAt(networkOf(s), freqHz);
}

function toPoint(freqHz: number, h: Complex): ResponsePoint {
  const mag = cabs(h);
  let phase = (Math.atan2(h[1], h[0]) * 180) / Math.PI;
  if (phase <= -180) phase += 360;
  return { freqHz, magnitudeDb: decibelsOf(mag), phaseDeg: Number.isFinite(phase) ? phase : 0 };
}

export function responseOf(s: SolvedStage, frequenciesHz: readonly number[]): ResponsePoint[] {
  const net = networkOf(s);
  return frequenciesHz.map((f) => toPoint(f, solveAt(net, f)));
}

/** Log-spaced frequencies, `perDecade` to a decade, from lo to hi inclusive. */
export function logFrequencies(loHz = 1, hiHz = 1e6, perDecade = 20): number[] {
  const usable = (f: unknown): f is number => typeof f === 'number' && Number.isFinite(f) && f > 0;
  // Nothing to space for a bad range or density; at most 100 a decade over 1e-3 … 1e12 Hz.
  if (!usable(loHz) || !usable(hiHz) || !usable(perDecade) || hiHz < loHz || perDecade > 100 || loHz < 1e-3 || hiHz > 1e12) return [];
  const n = Math.round(Math.log10(hiHz / loHz) * perDecade);
  return Array.from({ length: n + 1 }, (_, k) => loHz * Math.pow(10, k / perDecade));
}

/** Most frequencies in one call: a Bode plot needs a few hundred. */
export const MAX_FREQUENCIES = 10_000;

/** Magnitude (dB) and phase (degrees) of the stage's response at each frequency, source to output. A null response reads DB_FLOOR. */
export function frequencyResponse(design: StageDesign, frequenciesHz: readonly number[]): Result<{ points: ResponsePoint[]; magnitudeDb: number[]; phaseDeg: number[] }> {
  const s = solvedStage(design);
  if (!s.ok) return s;
  if (!Array.isArray(frequenciesHz) || frequenciesHz.length > MAX_FREQUENCIES || frequenciesHz.some((f) => !(typeof f === 'number' && f > 0 && Number.isFinite(f)))) {
    return fail('invalid-input', `Frequencies must be a list of at most ${MAX_FREQUENCIES} positive numbers in Hz`, 'frequencies');
  }
  const points = responseOf(s, frequenciesHz);
  return { ok: true, points, magnitudeDb: points.map((p) => p.magnitudeDb), phaseDeg: points.map((p) => p.phaseDeg) };
}
