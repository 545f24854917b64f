import { cabs, csolveFlat } from '../signal/complex';
import type { LinearStage } from './stageKind';

/**
 * The whole chain's small-signal response by nodal analysis of its
 * linearised circuit (the method of a circuit simulator's AC analysis): the
 * source behind its impedance, each coupling capacitor into its grid leak or
 * a direct connection, every stage's tube (gm, rp, Cgk, Cgp, Cpk), plate
 * load, cathode resistor and bypass, and the amplifier's load. The Miller
 * effect and each stage's loading of the one before come out of the
 * equations. Nodes: the source's far end, then grid, plate and cathode of
 * each stage.
 */
export interface ChainNetwork {
  readonly rsource: number;
  readonly stages: readonly { readonly linear: LinearStage; readonly coupling: { readonly cc: number; readonly rg: number } | null }[];
  /** Load on the last output, Ω (Infinity: none). */
  readonly rl: number;
}

/** Admittance standing in for an ideal short: far above any other in the network, yet finite for the solver. */
const SHORT = 1e9;

const conductance = (r: number): number => (r === 0 ? SHORT : Number.isFinite(r) ? 1 / r : 0);

/** |vout / vsource| at one frequency; scratch arrays are passed in so a sweep allocates once. */
export function chainGainAt(net: ChainNetwork, freqHz: number, scratch = scratchFor(net)): number {
  const n = 1 + 3 * net.stages.length;
  const w = n + 1;
  const { re, im, xr, xi } = scratch;
  re.fill(0);
  im.fill(0);
  const add = (r: number, c: number, g: number, b: number) => {
    re[r * w + c] = re[r * w + c]! + g;
    im[r * w + c] = im[r * w + c]! + b;
  };
  const stamp = (a: number, b: number, g: number, bi: number) => {
    add(a, a, g, bi);
    if (b >= 0) {
      add(b, b, g, bi);
      add(a, b, -g, -bi);
      add(b, a, -g, -bi);
    }
  };
  const omega = 2 * Math.PI * freqHz;
  const gs = conductance(net.rsource);
  stamp(0, -1, gs, 0);
  re[0 * w + n] = gs; // the 1 V source's current through its impedance
  let previous = 0;
  net.stages.forEach(({ linear: s, coupling }, i) => {
    const [g, p, k] = [1 + 3 * i, 2 + 3 * i, 3 + 3 * i];
    if (coupling === null) stamp(previous, g, SHORT, 0);
    else {
      stamp(previous, g, 0, omega * coupling.cc);
      stamp(g, -1, 1 / coupling.rg, 0);
    }
    stamp(p, -1, conductance(s.plateLoad), 0);
    stamp(k, -1, s.cathodeGrounded ? SHORT : conductance(s.rk), s.ck === null ? 0 : omega * s.ck);
    stamp(p, k, 1 / s.rp, omega * s.caps.cpk);
    stamp(g, k, 0, omega * s.caps.cgk);
    stamp(g, p, 0, omega * s.caps.cgp);
    // gm·(vg − vk) flows from plate to cathode inside the tube.
    add(p, g, s.gm, 0);
    add(p, k, -s.gm, 0);
    add(k, g, -s.gm, 0);
    add(k, k, s.gm, 0);
    // A screen's current enters the cathode from its supply (signal ground, near enough for the cathode's network).
    add(k, g, -s.gScreen, 0);
    add(k, k, s.gScreen, 0);
    previous = s.output === 'plate' ? p : k;
  });
  stamp(previous, -1, conductance(net.rl === Infinity ? Infinity : net.rl), 0);
  if (!csolveFlat(re, im, n, xr, xi)) return 0;
  const last = net.stages[net.stages.length - 1]!.linear;
  return cabs([xr[previous]!, xi[previous]!]) * last.outputScale;
}

export function scratchFor(net: ChainNetwork) {
  const n = 1 + 3 * net.stages.length;
  return { re: new Float64Array(n * (n + 1)), im: new Float64Array(n * (n + 1)), xr: new Float64Array(n), xi: new Float64Array(n) };
}

const LO_HZ = 0.01;
const HI_HZ = 1e8;
const PER_DECADE = 8;

/**
 * The −3 dB points: the response on a log grid from 0.01 Hz to 100 MHz, its
 * flat top as the reference, then each crossing of 1/√2 of it refined by
 * bisection in log frequency. Null where the response stays up to the
 * grid's end (a chain with no capacitor rolls off no low frequencies).
 */
export function chainCorners(net: ChainNetwork): { lowHz: number | null; highHz: number | null; midbandGain: number } {
  const scratch = scratchFor(net);
  const decades = Math.log10(HI_HZ / LO_HZ);
  const count = Math.round(decades * PER_DECADE) + 1;
  const freqs = Array.from({ length: count }, (_, k) => LO_HZ * Math.pow(10, k / PER_DECADE));
  const mags = freqs.map((f) => chainGainAt(net, f, scratch));
  let top = 0;
  for (let k = 1; k < count; k++) if (mags[k]! > mags[top]!) top = k;
  const ref = mags[top]!;
  const level = ref / Math.SQRT2;
  const refine = (loF: number, hiF: number, risingAtHi: boolean): number => {
    let a = Math.log(loF);
    let b = Math.log(hiF);
    for (let k = 0; k < 40; k++) {
      const m = 0.5 * (a + b);
      const above = chainGainAt(net, Math.exp(m), scratch) >= level;
      if (above === risingAtHi) b = m;
      else a = m;
    }
    return Math.exp(0.5 * (a + b));
  };
  let lowHz: number | null = null;
  for (let k = top; k > 0; k--) {
    if (mags[k - 1]! < level) {
      lowHz = refine(freqs[k - 1]!, freqs[k]!, true);
      break;
    }
  }
  let highHz: number | null = null;
  for (let k = top; k < count - 1; k++) {
    if (mags[k + 1]! < level) {
      highHz = refine(freqs[k]!, freqs[k + 1]!, false);
      break;
    }
  }
  return { lowHz, highHz, midbandGain: ref };
}
