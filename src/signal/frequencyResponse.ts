import { recordOf } from '../tube/types';
import { fail, type Result } from '../result';
import type { StageDesign } from '../stage/stageDesign';
import { solvedStage, type SolvedStage } from './analysisInput';
import { cabs, csolve, type Complex } from './complex';

/**
 * Small-signal response of the stage from the source to the output, by nodal
 * analysis of the linearised circuit at the operating point (the method of
 * any circuit simulator's AC analysis). Nodes: a (after the source
 * impedance), g (grid), p (plate), k (cathode), o (output, across RL). The
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

export function responseAt(s: SolvedStage, freqHz: number): Complex {
  const d = s.checked;
  const { gm, rp } = s.solution;
  const caps = recordOf(d.tube)?.capacitances ?? { cgk: 0, cgp: 0, cpk: 0 };
  const w = 2 * Math.PI * freqHz;
  const jw = (c: number): Complex => [0, w * c];
  const g = (r: number): number => (r === 0 ? SHORT : Number.isFinite(r) ? 1 / r : 0);
  const ySeries = (c: number | null): Complex => (c === null ? [SHORT, 0] : jw(c));
  const yRs = g(d.rsource);
  const yCin = ySeries(d.cin);
  const gRg = d.rg === null ? 0 : 1 / d.rg;
  const yCk: Complex = d.ck !== null ? jw(d.ck) : d.bypassed ? [SHORT, 0] : [0, 0];
  const gRk = d.rk > 0 ? 1 / d.rk : SHORT;
  const yCout = ySeries(d.cout);
  const gRl = g(d.rl);
  const yGk = jw(caps.cgk);
  const yGp = jw(caps.cgp);
  const yPk = jw(caps.cpk);
  const gp = 1 / rp;
  const add = (...xs: Complex[]): Complex => xs.reduce((acc, x) => [acc[0] + x[0], acc[1] + x[1]], [0, 0] as Complex);
  const neg = (x: Complex): Complex => [-x[0], -x[1]];
  const re = (x: number): Complex => [x, 0];
  // Unknowns [a, g, p, k, o]; source vs = 1 V. Rows: KCL, currents leaving each node.
  // Tube current from plate to cathode: i = gm·(vg − vk) + gp·(vp − vk).
  const A: Complex[][] = [
    [add(re(yRs), yCin), neg(yCin), [0, 0], [0, 0], [0, 0]],
    [neg(yCin), add(yCin, re(gRg), yGk, yGp), neg(yGp), neg(yGk), [0, 0]],
    [[0, 0], add(neg(yGp), re(gm)), add(re(g(d.ra)), yCout, yPk, yGp, re(gp)), add(neg(yPk), re(-gm - gp)), neg(yCout)],
    [[0, 0], add(neg(yGk), re(-gm)), add(neg(yPk), re(-gp)), add(re(gRk), yCk, yGk, yPk, re(gm + gp)), [0, 0]],
    [[0, 0], [0, 0], neg(yCout), [0, 0], add(yCout, re(gRl))],
  ];
  const b: Complex[] = [re(yRs), [0, 0], [0, 0], [0, 0], [0, 0]];
  const x = csolve(A, b);
  return x ? x[4]! : [0, 0];
}

function toPoint(freqHz: number, h: Complex): ResponsePoint {
  const mag = cabs(h);
  let phase = (Math.atan2(h[1], h[0]) * 180) / Math.PI;
  if (phase <= -180) phase += 360;
  return { freqHz, magnitudeDb: mag > 0 ? 20 * Math.log10(mag) : -Infinity, phaseDeg: phase };
}

export function responseOf(s: SolvedStage, frequenciesHz: readonly number[]): ResponsePoint[] {
  return frequenciesHz.map((f) => toPoint(f, responseAt(s, f)));
}

/** Log-spaced frequencies, `perDecade` to a decade, from lo to hi inclusive. */
export function logFrequencies(loHz = 1, hiHz = 1e6, perDecade = 20): number[] {
  const n = Math.round(Math.log10(hiHz / loHz) * perDecade);
  return Array.from({ length: n + 1 }, (_, k) => loHz * Math.pow(10, k / perDecade));
}

/** Magnitude (dB) and phase (degrees) of the stage's response at each frequency, source to output. */
export function frequencyResponse(design: StageDesign, frequenciesHz: readonly number[]): Result<{ points: ResponsePoint[]; magnitudeDb: number[]; phaseDeg: number[] }> {
  const s = solvedStage(design);
  if ('ok' in s) return s;
  if (!Array.isArray(frequenciesHz) || frequenciesHz.some((f) => !(typeof f === 'number' && f > 0 && Number.isFinite(f)))) {
    return fail('invalid-input', 'Frequencies must be positive numbers in Hz', 'frequencies');
  }
  const points = responseOf(s, frequenciesHz);
  return { ok: true, points, magnitudeDb: points.map((p) => p.magnitudeDb), phaseDeg: points.map((p) => p.phaseDeg) };
}
