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
  readonly stages: readonly {
    readonly linear: LinearStage;
    /** A capacitor coupling into its grid leak; with `volume` below 1 the leak is a pot's track and the grid hangs from its wiper. */
    readonly coupling: { readonly cc: number; readonly rg: number; readonly volume?: number } | null;
    readonly gin?: number;
    /** Grid stopper, Ω, between the coupling (its leak) and the grid; absent or 0: none. */
    readonly stopper?: number;
  }[];
  /** Load on the last output, Ω (Infinity: none). */
  readonly rl: number;
  /** The load's coupling capacitor, F; null or absent: ideal (the output is then the last stage's own node). */
  readonly loadCc?: number | null;
  /** Global feedback from the output to the first stage's cathode, when the network carries it. */
  readonly feedback?: FeedbackPath;
  /** The B+ supply's filter ladder, when the network carries it: each stage's plate load returns to its node, not to signal ground. */
  readonly supply?: SupplyLadder;
}

/**
 * The supply as the signal sees it: the reservoir behind the rectifier's
 * and winding's source resistance, each node's capacitor to ground, and the
 * series element (a resistor, or a choke's inductance with its resistance)
 * from each node to the next. Each stage's plate load (its transformer's
 * primary, a long-tailed pair's second plate load, a follower's plate)
 * returns to the node feeding it, so a stage's signal current develops a
 * voltage there that reaches every stage on the ladder: the amplifier's low
 * end as built, and the loop through the supply that motorboats. A
 * push-pull pair's half circuit keeps its centre tap at signal ground (its
 * difference current does not flow there). A single-ended stage's screen
 * that moves with a node (LinearStage.screen) follows it: an ultralinear
 * tap the plate's node, a pentode's screens the node feeding them straight.
 */
export interface SupplyLadder {
  /** The reservoir's source resistance to signal ground, Ω (Infinity: none). */
  readonly sourceOhms: number;
  /** Each node's capacitor, F, the reservoir first. */
  readonly caps: readonly number[];
  /** The series element from node k to node k + 1: resistance, Ω, and inductance, H (0 for a resistor). */
  readonly links: readonly { readonly r: number; readonly l: number }[];
  /** The node feeding each stage's plate. */
  readonly feeds: readonly number[];
  /** A choke input: the choke between the rectifier and the reservoir, in series with the source. */
  readonly choke?: { readonly r: number; readonly l: number };
  /** A bleeder across the reservoir, Ω (AmplifierOnSupply.bleederOhms). */
  readonly bleederOhms?: number;
  /** The node feeding each stage's pentode screens straight (AmplifierOnSupply.screenFeeds), or null: an ultralinear tap moves with the plate's node instead. */
  readonly screens?: readonly (number | null)[];
}

/**
 * Rf (with a capacitor across it, or none) from the output's far end to the
 * first stage's cathode, whose own resistor is then `rk` alone. 'broken':
 * the loop opened at the output, Rf driven from its own 1 V source and the
 * input at rest, so the response is the loop's transmission; 'closed': Rf's
 * end follows the output times `polarity` (the secondary's leads; its
 * loading by Rf, thousands of times the speaker, is left out).
 */
export interface FeedbackPath {
  readonly rk: number;
  readonly rf: number;
  readonly cf: number | null;
  readonly mode: 'broken' | 'closed';
  readonly polarity: 1 | -1;
}

/** Admittance standing in for an ideal short: far above any other in the network, yet finite for the solver. */
const SHORT = 1e9;

const conductance = (r: number): number => (r === 0 ? SHORT : Number.isFinite(r) ? 1 / r : 0);

/** |vout / vsource| at one frequency; scratch arrays are passed in so a sweep allocates once. */
export function chainGainAt(net: ChainNetwork, freqHz: number, scratch = scratchFor(net)): number {
  const v = chainResponseAt(net, freqHz, scratch);
  return v === null ? 0 : cabs(v);
}

/**
 * Nodes beyond the source and each stage's three: two for each output
 * transformer given its inductances (either side of the magnetising one),
 * a long-tailed pair's second plate, a push-pull pair's second grid
 * behind a stage with a second output, and the grid leak's top before a
 * capacitor-coupled grid's stopper.
 */
function extraNodes(net: ChainNetwork): number {
  let extra = (net.feedback ? 1 : 0) + (loadCoupled(net) ? 1 : 0) + (net.supply?.caps.length ?? 0);
  net.stages.forEach(({ linear, stopper, coupling }, i) => {
    if (stopper !== undefined && stopper > 0 && coupling !== null) extra += 1;
    if (potted(coupling)) extra += 1;
    if (linear.winding) extra += 2;
    if (linear.second) extra += 1;
    if (linear.pair && i > 0 && net.stages[i - 1]!.linear.output2) extra += 1;
  });
  return extra;
}

/** Whether a coupling's leak is a pot turned below full: its top then has a node of its own. */
const potted = (c: ChainNetwork['stages'][number]['coupling']): boolean => c !== null && c.volume !== undefined && c.volume < 1;

/** Whether the load hangs on its own node behind a real coupling capacitor (with no load, the capacitor carries nothing). */
const loadCoupled = (net: ChainNetwork): boolean => net.loadCc != null && Number.isFinite(net.rl);

/** The node count of the network's equations. */
const nodeCount = (net: ChainNetwork): number => 1 + 3 * net.stages.length + extraNodes(net);

/** An impedance r + jωl as an admittance, for stamping. */
function seriesRl(r: number, l: number, omega: number): [number, number] {
  const x = omega * l;
  const d = r * r + x * x;
  return d === 0 ? [SHORT, 0] : [r / d, -x / d];
}

/**
 * A noise current's place in the network: between nodes `a` and `b` (−1:
 * ground), its one-sided power spectral density `psd`, A²/Hz. Every
 * physical resistance gives 4kT·Re(Y) (Nyquist); a tube's plate current
 * its equivalent noise resistance's voltage times gm.
 */
export interface NoiseCurrent {
  readonly a: number;
  readonly b: number;
  readonly psd: number;
}

/** Boltzmann's constant times a room temperature of 290 K (the IEEE noise reference), J. */
export const KT = 1.380649e-23 * 290;

/**
 * A triode's equivalent noise resistance at the grid, Ω, over its gm: 2.5/gm
 * (the shot noise of its plate current, space-charge limited; Valley and
 * Wallman, Vacuum Tube Amplifiers, ch. 12, from memory). A pentode's partition
 * noise is left out: it matters only at an output stage, far below the first
 * stage's noise amplified.
 */
export const TRIODE_NOISE_RESISTANCE_GM = 2.5;

/** The network's equations at one frequency, filled into `scratch`; where the output sits, its scale, and the row an equation holds (not Kirchhoff's). */
interface Filled {
  readonly n: number;
  readonly out: number;
  /** The node the output is measured from (−1: ground): a transformer's primary returned to a supply node floats with it. */
  readonly outRef: number;
  readonly scale: number;
  readonly equationRow: number;
  /** The supply's nodes (SupplyLadder), the first and how many; none without it. */
  readonly supplyNodes: { readonly start: number; readonly count: number };
}

/** vout / vsource at one frequency as [re, im] (the output's phase against the source's), or null when the network cannot be solved. */
export function chainResponseAt(net: ChainNetwork, freqHz: number, scratch = scratchFor(net)): [number, number] | null {
  const f = fillChain(net, freqHz, scratch, null);
  const { xr, xi } = scratch;
  if (!csolveFlat(scratch.re, scratch.im, f.n, xr, xi)) return null;
  const [rr, ri] = f.outRef < 0 ? [0, 0] : [xr[f.outRef]!, xi[f.outRef]!];
  return [(xr[f.out]! - rr) * f.scale, (xi[f.out]! - ri) * f.scale];
}

/** Fills the equations; with `noise`, each physical resistance's and each tube's noise current is recorded as it is stamped. */
export function fillChain(net: ChainNetwork, freqHz: number, scratch: ReturnType<typeof scratchFor>, noise: NoiseCurrent[] | null): Filled {
  const n = nodeCount(net);
  const w = n + 1;
  const { re, im } = scratch;
  re.fill(0);
  im.fill(0);
  const add = (r: number, c: number, g: number, b: number) => {
    re[r * w + c] = re[r * w + c]! + g;
    im[r * w + c] = im[r * w + c]! + b;
  };
  // A current gm·(v(plus) − v(minus)) from node `from` to node `to` (−1: ground, whose voltage is 0 and row is none).
  const transconductance = (from: number, to: number, gm: number, plus: number, minus: number) => {
    for (const [row, sign] of [[from, 1], [to, -1]] as const) {
      if (row < 0) continue;
      if (plus >= 0) add(row, plus, sign * gm, 0);
      if (minus >= 0) add(row, minus, -sign * gm, 0);
    }
  };
  const stamp = (a: number, b: number, g: number, bi: number) => {
    add(a, a, g, bi);
    if (b >= 0) {
      add(b, b, g, bi);
      add(a, b, -g, -bi);
      add(b, a, -g, -bi);
    }
  };
  // A physical resistance (with any reactance in series or across it): stamped, and with `noise` its thermal noise
  // recorded. A tube's plate current noise, plate to cathode: gm times its equivalent noise resistance's voltage.
  // (Made only for a noise solve: the band's hundred-odd solves make no closures they do not use.)
  const resistor = noise
    ? (a: number, b: number, g: number, bi: number) => {
        stamp(a, b, g, bi);
        if (g > 0 && g < SHORT) noise.push({ a, b, psd: 4 * KT * g });
      }
    : stamp;
  const tubeNoise = noise
    ? (p: number, k: number, gm: number) => {
        if (gm > 0) noise.push({ a: p, b: k, psd: 4 * KT * TRIODE_NOISE_RESISTANCE_GM * gm });
      }
    : null;
  const omega = 2 * Math.PI * freqHz;
  const gs = conductance(net.rsource);
  resistor(0, -1, gs, 0);
  const fb = net.feedback;
  // The 1 V source's current through its impedance; with the loop broken, the source is at rest and Rf's end is driven instead.
  re[0 * w + n] = fb?.mode === 'broken' ? 0 : gs;
  const fNode = fb ? n - 1 : -1;
  if (fb) resistor(fNode, 3, 1 / fb.rf, fb.cf === null ? 0 : omega * fb.cf);
  let previous = 0;
  let previous2: number | null = null;
  let scale = 1;
  let outRef = -1;
  let spare = 1 + 3 * net.stages.length;
  // The supply's nodes first among the spare ones: the reservoir behind its source, each node's capacitor, the ladder.
  const ladder = net.supply;
  const supplyBase = spare;
  if (ladder) {
    spare += ladder.caps.length;
    if (Number.isFinite(ladder.sourceOhms)) resistor(supplyBase, -1, ...seriesRl(ladder.sourceOhms + (ladder.choke?.r ?? 0), ladder.choke?.l ?? 0, omega));
    ladder.caps.forEach((c, k) => stamp(supplyBase + k, -1, 0, omega * c));
    if (ladder.bleederOhms !== undefined) stamp(supplyBase, -1, 1 / ladder.bleederOhms, 0);
    ladder.links.forEach((link, k) => resistor(supplyBase + k, supplyBase + k + 1, ...seriesRl(link.r, link.l, omega)));
  }
  // Where stage i's plate load returns: its supply node, or signal ground.
  const returnOf = (i: number): number => (ladder ? supplyBase + ladder.feeds[i]! : -1);
  net.stages.forEach(({ linear: s, coupling, gin, stopper }, i) => {
    const [g, p, k] = [1 + 3 * i, 2 + 3 * i, 3 + 3 * i];
    // The grid's current's slope at its bias, grid to cathode (it depends on Vgk alone).
    if (gin !== undefined && gin > 0) stamp(g, k, gin, 0);
    const couple = (from: number, to: number) => {
      if (coupling === null) stamp(from, to, SHORT, 0);
      else if (potted(coupling)) {
        // The capacitor into the pot's top; the track above the wiper to it, the track below to ground.
        const top = spare++;
        const a = coupling.volume!;
        stamp(from, top, 0, omega * coupling.cc);
        resistor(top, to, 1 / ((1 - a) * coupling.rg), 0);
        resistor(to, -1, 1 / (a * coupling.rg), 0);
      } else {
        stamp(from, to, 0, omega * coupling.cc);
        resistor(to, -1, 1 / coupling.rg, 0);
      }
    };
    if (stopper !== undefined && stopper > 0) {
      // The coupling (and its leak) end at the stopper's far side, the grid behind it; direct-coupled, the stopper
      // hangs from the output before.
      const x = coupling === null ? previous : spare++;
      if (coupling !== null) couple(previous, x);
      resistor(x, g, 1 / stopper, 0);
    } else couple(previous, g);
    const g2 = s.pair && previous2 !== null ? spare++ : null;
    if (g2 !== null) couple(previous2!, g2);
    const wdg = s.winding;
    if (wdg) {
      // Plate → primary resistance and half the leakage → magnetising inductance to signal ground → the other half → reflected load.
      const [m, x] = [spare, spare + 1];
      spare += 2;
      const half = (wdg.ll ?? 0) / 2;
      resistor(p, m, ...seriesRl(wdg.rSeries, half, omega));
      // The primary's far end is its supply node (a pair's centre tap stays at signal ground: see SupplyLadder).
      const b = s.pair ? -1 : returnOf(i);
      if (wdg.lm !== null) stamp(m, b, ...seriesRl(0, wdg.lm, omega));
      stamp(m, x, ...seriesRl(0, half, omega));
      resistor(x, b, conductance(wdg.reflected), 0);
    } else resistor(p, s.pair ? -1 : returnOf(i), conductance(s.plateLoad), 0);
    const rk = fb && i === 0 ? fb.rk : s.rk;
    resistor(k, -1, s.cathodeGrounded ? SHORT : conductance(rk), s.ck === null ? 0 : omega * s.ck);
    stamp(p, k, 1 / s.rp, omega * s.caps.cpk);
    tubeNoise?.(p, k, s.gm);
    stamp(g, k, 0, omega * s.caps.cgk);
    if (g2 === null) {
      stamp(g, p, 0, omega * s.caps.cgp);
      // gm·(vg − vk) flows from plate to cathode inside the tube.
      add(p, g, s.gm, 0);
      add(p, k, -s.gm, 0);
      add(k, g, -s.gm, 0);
      add(k, k, s.gm, 0);
    } else {
      // The pair's half circuit, its cathode at signal ground: the plate's row is half the difference of the two plates'
      // (the second at −v), so each grid drives it by gm/2, and each Cgp loads it by half, from its own grid.
      const b = omega * s.caps.cgp;
      stamp(g2, k, 0, omega * s.caps.cgk);
      add(g, g, 0, b);
      add(g, p, 0, -b);
      add(g2, g2, 0, b);
      add(g2, p, 0, b);
      add(p, p, 0, b);
      const gm = s.pair!.gm;
      add(p, g, gm / 2, -b / 2);
      add(p, g2, -gm / 2, b / 2);
    }
    // A screen's current enters the cathode from its supply: signal ground, or the node a screen that moves with one
    // draws it from (below).
    add(k, g, -s.gScreen, 0);
    add(k, k, s.gScreen, 0);
    if (s.screen && !s.pair) {
      // A screen that moves with a node S (an ultralinear tap with the plate's node; a pentode's own node): its voltage
      // is (1 − x)·vS + x·vp. The plate's current takes (1 − x)(b + x·d)·vSk more; the screen's share not coupled,
      // (1 − x)·ig2, is drawn from S: its grid term (gScreen, above), (1 − x)(c + x·d)·vpk and (1 − x)²·d·vSk.
      const { x, plateByScreen: b, screenByPlate: c, screenByScreen: d } = s.screen;
      const node = x > 0 ? returnOf(i) : ladder?.screens?.[i];
      const sNode = node === null || node === undefined ? -1 : x > 0 ? node : supplyBase + node;
      transconductance(p, k, (1 - x) * (b + x * d), sNode, k);
      if (sNode >= 0) transconductance(sNode, -1, s.gScreen, g, k);
      transconductance(sNode, k, (1 - x) * (c + x * d), p, k);
      transconductance(sNode, k, (1 - x) * (1 - x) * d, sNode, k);
    }
    // A long-tailed pair's second triode: grid at signal ground, so gm·(0 − vk) from its plate to the shared cathode.
    const p2 = s.second ? spare++ : null;
    if (s.second && p2 !== null) {
      resistor(p2, returnOf(i), conductance(s.second.plateLoad), 0);
      stamp(p2, -1, 0, omega * s.caps.cgp);
      stamp(p2, k, 1 / s.second.rp, omega * s.caps.cpk);
      stamp(k, -1, 0, omega * s.caps.cgk);
      add(p2, k, -s.second.gm, 0);
      tubeNoise?.(p2, k, s.second.gm);
      add(k, k, s.second.gm, 0);
    }
    previous = wdg ? spare - 1 : s.output === 'plate' ? p : k;
    previous2 = s.output2 === 'cathode' ? k : s.output2 === 'second' && p2 !== null ? p2 : null;
    scale = wdg ? wdg.scale : s.outputScale;
    // A transformer's secondary gives the voltage across its primary (outputScale is its turns ratio): measured from
    // the supply node the primary returns to (signal ground without the supply, or for a pair's centre tap).
    outRef = wdg || s.outputScale !== 1 ? (s.pair ? -1 : returnOf(i)) : -1;
  });
  if (loadCoupled(net)) {
    // The load's node is the last before the feedback node's (which, with the loop's figures, comes last).
    const l = fb ? n - 2 : n - 1;
    stamp(previous, l, 0, omega * net.loadCc!);
    previous = l;
  }
  resistor(previous, outRef, conductance(net.rl === Infinity ? Infinity : net.rl), 0);
  if (fb) {
    // Rf's end is held by a source, its row that source's equation: 1 V with the loop broken, else the output times the
    // secondary's sense. (Written as an equation, not as a huge conductance to a source: that would swamp the grid's
    // microsiemens in the elimination.)
    for (let c = 0; c <= n; c++) {
      re[fNode * w + c] = 0;
      im[fNode * w + c] = 0;
    }
    re[fNode * w + fNode] = 1;
    if (fb.mode === 'broken') re[fNode * w + n] = 1;
    else {
      re[fNode * w + previous] = -fb.polarity * scale;
      if (outRef >= 0) re[fNode * w + outRef] = fb.polarity * scale;
    }
  }
  return { n, out: previous, outRef, scale, equationRow: fNode, supplyNodes: { start: supplyBase, count: ladder ? ladder.caps.length : 0 } };
}

export function scratchFor(net: ChainNetwork) {
  const n = nodeCount(net);
  return { re: new Float64Array(n * (n + 1)), im: new Float64Array(n * (n + 1)), xr: new Float64Array(n), xi: new Float64Array(n) };
}

const LO_HZ = 0.01;
const HI_HZ = 1e8;
const PER_DECADE = 8;

/** The reference of the band's edges: 1 kHz, the usual reference frequency of audio response measurements (common practice). */
export const REFERENCE_HZ = 1000;

/**
 * The −3 dB points against the gain at 1 kHz: the response on a log grid
 * from 0.01 Hz to 100 MHz, walked out from 1 kHz each way to the first
 * sample below 1/√2 of it, the crossing refined by bisection in log
 * frequency. Null where the response stays up to the grid's end (a chain
 * with no capacitor rolls off no low frequencies). Referred to 1 kHz, not
 * to the response's highest point: an output transformer's leakage
 * resonating with the plate's capacitance can rise above midband far
 * beyond the band, and the band's edges are still read against midband.
 */
export function chainCorners(net: ChainNetwork): { lowHz: number | null; highHz: number | null; midbandGain: number } {
  const scratch = scratchFor(net);
  const decades = Math.log10(HI_HZ / LO_HZ);
  const count = Math.round(decades * PER_DECADE) + 1;
  const freqs = Array.from({ length: count }, (_, k) => LO_HZ * Math.pow(10, k / PER_DECADE));
  // Solved only where the walk out from 1 kHz reaches: a band's edges are found without the decades beyond them.
  const solved = new Float64Array(count).fill(Number.NaN);
  const magAt = (k: number): number => {
    if (Number.isNaN(solved[k]!)) solved[k] = chainGainAt(net, freqs[k]!, scratch);
    return solved[k]!;
  };
  const mid = Math.round(Math.log10(REFERENCE_HZ / LO_HZ) * PER_DECADE);
  const ref = magAt(mid);
  const level = ref / Math.SQRT2;
  const refine = (loF: number, hiF: number, risingAtHi: boolean): number => {
    let a = Math.log(loF);
    let b = Math.log(hiF);
    // 28 halvings of an eighth of a decade: the edge to a part in 10⁹, far finer than any figure shows.
    for (let k = 0; k < 28; k++) {
      const m = 0.5 * (a + b);
      const above = chainGainAt(net, Math.exp(m), scratch) >= level;
      if (above === risingAtHi) b = m;
      else a = m;
    }
    return Math.exp(0.5 * (a + b));
  };
  let lowHz: number | null = null;
  for (let k = mid; k > 0; k--) {
    if (magAt(k - 1) < level) {
      lowHz = refine(freqs[k - 1]!, freqs[k]!, true);
      break;
    }
  }
  let highHz: number | null = null;
  for (let k = mid; k < count - 1; k++) {
    if (magAt(k + 1) < level) {
      highHz = refine(freqs[k]!, freqs[k + 1]!, false);
      break;
    }
  }
  return { lowHz, highHz, midbandGain: ref };
}
