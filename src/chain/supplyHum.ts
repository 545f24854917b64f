import { volumeOf } from './volumeOf';
import { fail, type Result } from '../result';
import { shown } from '../shown';
import { solveOutput, type OutputSolution } from '../output/solveOutput';
import { CATHODE_BYPASS_CORNER_HZ } from '../output/outputParts';
import { screenConductance, screenFeedPlan, type ScreenFeedPlan } from '../output/screenFeed';
import { smallSignalAt } from '../tube/triode';
import { recordOf } from '../tube/types';
import { korenPentodeInto } from '../tube/pentode';
import { pushPullInstant } from '../pushpull/pushPullDrive';
import { solvePushPull, type PushPullSolution } from '../pushpull/solvePushPull';
import { solveLinear } from '../numeric/solveLinear';
import type { ChainInput, ChainResult, ChainStage, LongTailedPairLink, PushPullLink, SingleEndedLink, SplitLoadLink } from './chainTypes';
import { designOf } from './singleEndedKind';
import { pairDesignOf } from './pushPullKind';
import { checkChain } from './prepareAmplifier';

/**
 * How each stage's B+ ripple reaches the amplifier's output, per volt of
 * ripple: signed (in phase with the ripple, or inverted), at midband (the
 * coupling and bypass capacitors taken as shorts at the ripple's frequency,
 * as they are for 100 or 120 Hz when the band reaches well below it).
 */
export interface SupplyHum {
  /**
   * Output volts per volt of ripple on each stage's B+ (at the speaker for
   * an output stage), its screens held. A push-pull pair's is what its
   * mismatch leaves of the ripple on its centre tap (a matched pair's is
   * nothing); a phase splitter's, the difference its ripple makes between
   * its two outputs (its first plate's ripple on its first grid through
   * Cgp included), as the pair after it answers to it. Null where a
   * stage's own cannot be worked out (a tube past its law's range).
   */
  readonly perVolt: readonly (number | null)[];
  /**
   * A pentode-connected output stage's screens (single-ended, or a pair's
   * through its mismatch): output volts per volt of ripple on the screens
   * themselves (the plate's B+ held), signed; null for every other stage (a
   * triode has none, an ultralinear screen's tap is in perVolt). A screen
   * moves the plate current many times harder than the plate does, so a
   * single-ended stage's screens dominate its share.
   */
  readonly screenPerVolt: readonly (number | null)[];
  /**
   * The share of the ripple on the node feeding the screens that they see
   * (null where screenPerVolt is): 1 fed straight from B+ or from a node of
   * their own (screenFromNode); through their dropper from B+ and its
   * bypass (the parts list's: the bypass for a 10 Hz corner against the
   * dropper beside the screens' own conductance), the RC's magnitude at the
   * ripple's frequency; 0 above B+ on a node no supply here names, taken as
   * clean.
   */
  readonly screenShare: readonly (number | null)[];
}

/** The ripple's frequency for a mains frequency: twice it behind a full-wave rectifier (a centre-tapped winding, a bridge, a full-wave tube), the mains' own behind a half-wave one. */
export const rippleHzOf = (mainsHz: number, halfWave = false) => (halfWave ? mainsHz : 2 * mainsHz);

/** What drives a stage's grid at the ripple's frequency: the output impedance before it (the source's for the first stage), Ω, and that frequency, Hz. */
interface GridDrive {
  readonly before: number;
  readonly rippleHz: number;
}

/** An output stage solved on its own (its winding, screens and the pair's two tubes), once for both its B+ share and its screens'; null for any other stage or one that fails. */
type OutputSolved = { readonly kind: 'single-ended'; readonly solved: OutputSolution } | { readonly kind: 'pair'; readonly solved: PushPullSolution } | null;

function outputSolved(s: ChainStage): OutputSolved {
  if (s.kind === 'single-ended-output') {
    const solved = solveOutput(s.tube, designOf(s));
    return solved.ok ? { kind: 'single-ended', solved } : null;
  }
  if (s.kind === 'push-pull-output') {
    const solved = solvePushPull(s.tube, pairDesignOf(s));
    return solved.ok ? { kind: 'pair', solved } : null;
  }
  return null;
}

/** What a stage's output node does per volt on its B+, before the stages after it. */
function injection(s: ChainStage, solved: ChainResult['stages'][number], load: number, drive: GridDrive, out: OutputSolved): number | null {
  const par = (a: number, b: number) => (Number.isFinite(b) ? (a * b) / (a + b) : a);
  if (s.kind === 'common-cathode' || s.kind === 'follower') {
    const { mu, rp } = smallSignalAt(s.tube, solved.op.va - solved.op.vk, solved.op.vgk);
    if (!Number.isFinite(rp)) return 0;
    if (s.kind === 'follower') {
      // Grid held, plate moved by the ripple: vk·(rp/Rk' + μ + 1) = vr, Rk' the cathode resistor beside the load.
      const rk = par(s.rk, load);
      return rk / (rp + (mu + 1) * rk);
    }
    // The ripple in series with Ra; the plate's other way to ground is the tube (with an unbypassed Rk, rp + (μ+1)·Rk) beside the load.
    const down = par(rp + (s.bypassed || s.rk === 0 ? 0 : (mu + 1) * s.rk), load);
    return down / (s.ra + down);
  }
  if (s.kind === 'single-ended-output') return out?.kind === 'single-ended' ? outputInjection(s, out.solved, 'bplus') : null;
  if (s.kind === 'push-pull-output') return out?.kind === 'pair' ? pairInjection(s, out.solved, 'bplus') : null;
  if (s.kind === 'split-load' || s.kind === 'long-tailed-pair') return splitterInjection(s, solved, load, drive);
  return null;
}

/**
 * A phase splitter's own share, as the signal on its first output that the
 * pair after it answers to alike: its grids held (the divider's decoupling
 * holds a capacitor-coupled grid's reference, and a long-tailed pair's
 * second grid has its capacitor), the ripple on its B+, each output loaded
 * by the pair's grid leak. Each triode is linear about its operating point
 * (μ, rp); the plate, cathode and tail nodes by Kirchhoff's current law. A
 * pair after it takes the difference of its two grids (its even response
 * cancels), so the ripple's outputs (r1, r2) act as r1 − r2 over 1 − a,
 * where a is the splitter's own second-over-first output for a grid signal.
 *
 * The first grid is held only through what drives it, so the first plate's
 * ripple also reaches it through the plate-to-grid capacitance: a divider
 * of Cgp against the grid's drive at the ripple's frequency (the output
 * before it through the coupling capacitor, beside the grid leak), which
 * the splitter then amplifies as a signal, d1 at its first output (its
 * second answers a·d1, so the pair sees d1 times it). That share is in
 * quadrature with the resistive one (Cgp's current leads the ripple by
 * 90°): a long-tailed pair with equal plates has no other, and its hum is
 * all of it. The second grid's capacitor holds it; a split-load's plate
 * ripple reaches its grid the same way, a part in ten thousand of its own.
 */
function splitterInjection(s: SplitLoadLink | LongTailedPairLink, solved: ChainResult['stages'][number], load: number, drive: GridDrive): number | null {
  const rl = Number.isFinite(load) && load > 0 ? load : 1e15;
  const { op } = solved;
  const a = smallSignalAt(s.tube, op.va - op.vk, op.vgk);
  if (!Number.isFinite(a.rp) || !(a.rp > 0)) return null;
  let outputs: (supply: number, grid: number) => readonly [number, number] | null;
  if (s.kind === 'split-load') {
    // One current through Ra, the tube and Rk: the plate and the cathode are its two outputs.
    outputs = (supply, grid) => {
      const m = [
        [1, -(a.mu + 1), -a.rp],
        [1 / s.ra + 1 / rl, 0, 1],
        [0, 1 / s.rk + 1 / rl, -1],
      ];
      const x = solveLinear(m, [-a.mu * grid, supply / s.ra, 0]);
      return x ? [x[0]!, x[1]!] : null;
    };
  } else {
    // Two triodes on one cathode node over Rk + Rtail; the second's operating point from the tail's current.
    const ra2 = s.ra2 ?? s.ra;
    const ia2 = solved.supplyCurrent - op.ia;
    const b = smallSignalAt(s.tube, s.bplus - ia2 * ra2 - op.vk, op.vgk);
    if (!Number.isFinite(b.rp) || !(b.rp > 0)) return null;
    const tail = s.rk + s.rtail;
    outputs = (supply, grid) => {
      // Unknowns: the two plates, the cathodes, the two plate currents.
      const m = [
        [1, 0, -(a.mu + 1), -a.rp, 0],
        [0, 1, -(b.mu + 1), 0, -b.rp],
        [1 / s.ra + 1 / rl, 0, 0, 1, 0],
        [0, 1 / ra2 + 1 / rl, 0, 0, 1],
        [0, 0, -1 / tail, 1, 1],
      ];
      const x = solveLinear(m, [-a.mu * grid, 0, supply / s.ra, supply / ra2, 0]);
      return x ? [x[0]!, x[1]!] : null;
    };
  }
  const driven = outputs(0, 1);
  const ripple = outputs(1, 0);
  if (!driven || !ripple || driven[0] === 0) return null;
  const antiphase = driven[1] / driven[0];
  const own = (ripple[0] - ripple[1]) / (1 - antiphase);
  const [re, im] = capacitiveGrid(s, ripple[0], drive);
  // The resistive share (real) and the capacitive one (re, im per volt on the grid) times the first output's gain.
  const whole = Math.hypot(own + re * driven[0], im * driven[0]);
  const signed = own < 0 ? -whole : whole;
  return Number.isFinite(signed) ? signed : null;
}

/**
 * The first grid's voltage, [re, im], per volt of ripple for a first plate
 * moving by `plate`: Cgp's admittance jωC against the grid's own to ground,
 * 1/Rg beside the output before it through its coupling capacitor
 * (jωCc / (1 + jωCc·Zbefore)), or that output alone when direct-coupled.
 */
function capacitiveGrid(s: SplitLoadLink | LongTailedPairLink, plate: number, drive: GridDrive): readonly [number, number] {
  const cgp = recordOf(s.tube)?.capacitances.cgp ?? 0;
  if (!(cgp > 0) || !(drive.before >= 0)) return [0, 0];
  const w = 2 * Math.PI * drive.rippleHz;
  // The grid's admittance to ground, g + jb.
  let g: number;
  let b: number;
  if (s.coupling.kind === 'capacitor') {
    const x = w * s.coupling.cc;
    const d = 1 + (x * drive.before) ** 2;
    g = 1 / s.coupling.rg + (x * x * drive.before) / d;
    b = x / d;
  } else {
    if (!(drive.before > 0)) return [0, 0];
    g = 1 / drive.before;
    b = 0;
  }
  // v = plate · jωC / (g + j(b + ωC))
  const bc = w * cgp;
  const den = g * g + (b + bc) ** 2;
  const re = (plate * bc * (b + bc)) / den;
  const im = (plate * bc * g) / den;
  return Number.isFinite(re) && Number.isFinite(im) ? [re, im] : [0, 0];
}

/**
 * A push-pull pair's own share: the ripple on the centre tap (or, `from`
 * 'screen', on pentode-connected screens), the cathodes held, the grids at
 * their bias. The pair is solved at its idle instant with that supply moved
 * a little either way (pushPullInstant, the transformer coupling the two
 * tubes' currents, the core's idle imbalance kept): the winding answers
 * only to what the two tubes do differently, so a matched pair gives
 * nothing and a mismatched one its difference. Read at the speaker, phased
 * as the stage's gain.
 */
function pairInjection(s: PushPullLink, solved: PushPullSolution, from: 'bplus' | 'screen'): number | null {
  const feed = solved.feed;
  if (from === 'screen' && feed.kind !== 'fixed') return null;
  const h = 1e-3 * Math.max(1, solved.supply);
  const winding = (dv: number) => {
    const moved: PushPullSolution =
      from === 'screen' && feed.kind === 'fixed'
        ? { ...solved, feed: { ...feed, vg2k: feed.vg2k + dv } }
        : { ...solved, supply: solved.supply + dv, feed: feed.kind === 'tap' ? { ...feed, supply: feed.supply + dv } : feed };
    return pushPullInstant(moved).solve(solved.vgk, solved.vgk2);
  };
  const ratio = Math.sqrt(s.speakerOhms / (s.raa / 4));
  const perVolt = (-(winding(h) - winding(-h)) / (2 * h)) * ratio;
  return Number.isFinite(perVolt) ? perVolt : null;
}

/**
 * An output stage's own share: the ripple on the primary's B+ end, the
 * cathode at AC ground. The tube's currents are linear about the operating
 * point (plate and screen conductances, taken numerically from its law with
 * the screen held); the winding's voltage w is the coupled current (the
 * plate's, plus an ultralinear screen's through the tap's share of the
 * turns) times the reflected load; the plate sits at the ripple less w and
 * the DC resistance's drop; the screen at the plate (triode-connected), at
 * the tap (the ripple less the tap's share of w), or on its own supply,
 * held (pentode: `from` 'screen' moves it instead, the primary's B+ end
 * held). The speaker gets w through the turns ratio, plate-phased as the
 * stage's gain (the plate end falls against the B+ end: negative).
 */
function outputInjection(s: SingleEndedLink, solved: OutputSolution, from: 'bplus' | 'screen'): number | null {
  const tube = s.tube;
  const { op } = solved;
  const zp = s.zPrimary;
  const n = Math.sqrt(zp / s.speakerOhms);
  if (tube.law.kind === 'triode') {
    if (!Number.isFinite(op.rp)) return 0;
    return -(zp / (zp + s.rPrimary + op.rp)) / n;
  }
  const params = tube.law.params;
  const feed = op.feed;
  const vs0 = feed.kind === 'fixed' ? feed.vg2k : feed.kind === 'tied' ? op.vpk : feed.supply;
  const at = { ia: 0, ig2: 0 };
  const currents = (vp: number, vs: number) => {
    korenPentodeInto(params, vp, op.vgk, vs, at);
    return [at.ia, at.ig2] as const;
  };
  const h = 1e-3 * Math.max(1, op.vpk);
  const [iaP, ig2P] = currents(op.vpk + h, vs0);
  const [iaM, ig2M] = currents(op.vpk - h, vs0);
  const [iaS, ig2S] = currents(op.vpk, vs0 + h);
  const [iaT, ig2T] = currents(op.vpk, vs0 - h);
  const ga = (iaP - iaM) / (2 * h);
  const ga2 = (ig2P - ig2M) / (2 * h);
  const gs = (iaS - iaT) / (2 * h);
  const gs2 = (ig2S - ig2T) / (2 * h);
  // Each current as A·vp + B·w + C (per volt of ripple), by where the screen sits.
  const f = feed.kind === 'tap' ? feed.fraction : 0;
  // A pentode's screen moves by the volt when it carries the ripple (`from` 'screen'), else it is held.
  const moved = from === 'screen' ? 1 : 0;
  const ia = feed.kind === 'tied' ? [ga + gs, 0, 0] : feed.kind === 'tap' ? [ga, -f * gs, gs] : [ga, 0, moved * gs];
  const ig2 = feed.kind === 'tied' ? [ga2 + gs2, 0, 0] : feed.kind === 'tap' ? [ga2, -f * gs2, gs2] : [ga2, 0, moved * gs2];
  // The winding couples the plate's current and an ultralinear screen's share; the DC resistance carries the charted current.
  const [m1, m2] = feed.kind === 'tied' ? [1, 1] : [1, f];
  const [p1, p2] = feed.kind === 'tied' ? [1, 1] : [1, 0];
  const mix = (a: number, b: number, k: number) => a * ia[k]! + b * ig2[k]!;
  // w − Zp·mmf = 0 and vp + w + Rdc·ip = the B+ end's ripple (1, or 0 while the screen carries it), solved for w.
  const a11 = -zp * mix(m1, m2, 0), a12 = 1 - zp * mix(m1, m2, 1), b1 = zp * mix(m1, m2, 2);
  const a21 = 1 + s.rPrimary * mix(p1, p2, 0), a22 = 1 + s.rPrimary * mix(p1, p2, 1), b2 = (from === 'bplus' ? 1 : 0) - s.rPrimary * mix(p1, p2, 2);
  const det = a11 * a22 - a12 * a21;
  if (!(Math.abs(det) > 0)) return null;
  const w = (a11 * b2 - a21 * b1) / det;
  return -w / n;
}

/**
 * A pentode-connected output stage's screens: what their ripple does at the
 * output (per volt on them), and the share of the B+ ripple that reaches
 * them by their feed (screenFeedPlan): all of it straight from B+; through
 * the dropper R with its bypass C to ground, the screens' own conductance g
 * beside C, |1/(1 + R·g + jωRC)| = 1/((1 + R·g)·√(1 + (f/fc)²)) with fc the
 * bypass's corner against R ∥ 1/g (the parts list's rule, its capacitor at
 * the corner exactly: a larger preferred one only filters more); none from
 * a node of their own.
 */
function screenPath(s: ChainStage, rippleHz: number, out: OutputSolved): { perVolt: number; share: number } | null {
  if ((s.kind !== 'single-ended-output' && s.kind !== 'push-pull-output') || s.connection !== 'pentode') return null;
  let perVolt: number | null;
  let plan: ScreenFeedPlan;
  let g: number;
  if (s.kind === 'single-ended-output') {
    if (out?.kind !== 'single-ended') return null;
    const solved = out.solved;
    const { op } = solved;
    perVolt = outputInjection(s, solved, 'screen');
    plan = screenFeedPlan(s.bplus, s.screenVolts, op.ig2, s.screenFromNode);
    g = op.feed.kind === 'fixed' ? screenConductance(s.tube, op.feed.vg2k, op.vpk, op.vgk) : 0;
  } else {
    if (out?.kind !== 'pair') return null;
    const solved = out.solved;
    const feed = solved.feed;
    if (feed.kind !== 'fixed') return null;
    const [one, two] = solved.idle;
    perVolt = pairInjection(s, solved, 'screen');
    plan = screenFeedPlan(s.bplus, s.screenVolts, one.ig2 + two.ig2, s.screenFromNode);
    g = screenConductance(solved.tube, feed.vg2k, one.vpk, solved.vgk) + screenConductance(solved.tube2, feed.vg2k, two.vpk, solved.vgk2);
  }
  if (perVolt === null || !Number.isFinite(perVolt)) return null;
  return { perVolt, share: screenShareOf(plan, g, rippleHz, s.screenFromNode === true) };
}

/** The share of their feed node's ripple the screens see (SupplyHum.screenShare) for their feed plan and conductance g. */
function screenShareOf(plan: ScreenFeedPlan, g: number, rippleHz: number, fromNode: boolean): number {
  if (plan.kind === 'from-bplus') return 1;
  // Straight from the node the supply names for them; one above B+ that it does not model is taken as clean.
  if (plan.kind === 'own-node') return fromNode ? 1 : 0;
  const share = 1 / ((1 + plan.ohms * g) * Math.hypot(1, rippleHz / CATHODE_BYPASS_CORNER_HZ));
  return Number.isFinite(share) ? share : 0;
}

/**
 * Each stage's B+ ripple as it reaches the output (SupplyHum): its own
 * injection at its output node, the stage loaded by the next one's input
 * (its grid leak, or nothing for a direct-coupled grid) or the amplifier's
 * load, then carried by every later stage's midband gain. `mainsHz` sets
 * the ripple's frequency (twice it; the mains' own with `halfWave`), at
 * which a screen dropper's bypass is read.
 */
export function supplyHum(chain: ChainInput, solved: ChainResult, mainsHz = 50, halfWave = false): Result<SupplyHum> {
  if (typeof chain !== 'object' || chain === null || !Array.isArray(chain.stages) || typeof solved !== 'object' || solved === null || !Array.isArray(solved.stages)) {
    return fail('invalid-input', 'Give the amplifier and its solution');
  }
  const problem = checkChain(chain);
  if (problem) return problem;
  if (!(typeof mainsHz === 'number' && mainsHz >= 1 && mainsHz <= 1000)) return fail('invalid-input', `The mains frequency must be from 1 Hz to 1 kHz (got ${shown(mainsHz)})`, 'mainsHz');
  const rippleHz = rippleHzOf(mainsHz, halfWave === true);
  if (chain.stages.length !== solved.stages.length) return fail('invalid-input', `The solution has ${solved.stages.length} stages for an amplifier of ${chain.stages.length}`);
  const finite = (x: unknown) => typeof x === 'number' && Number.isFinite(x);
  const usable = solved.stages.every((st) => typeof st === 'object' && st !== null && finite(st.gain) && typeof st.op === 'object' && st.op !== null && finite(st.op.va) && finite(st.op.vk) && finite(st.op.vgk) && (st.zin === null || typeof st.zin === 'number'));
  if (!usable) return fail('invalid-input', 'Every solved stage must give its operating point, gain and input impedance');
  const n = chain.stages.length;
  const carriedFrom = (k: number, own: number | null) => {
    if (own === null || !Number.isFinite(own)) return null;
    let carried = own;
    // Into each later grid through its volume control's wiper (1 for none), then by its gain.
    for (let j = k + 1; j < n; j++) carried *= volumeOf(chain.stages[j]!) * solved.stages[j]!.gain;
    return Number.isFinite(carried) ? carried : null;
  };
  const outputs = chain.stages.map(outputSolved);
  const perVolt = chain.stages.map((s, k) => {
    const next = solved.stages[k + 1];
    const load = next ? (next.zin ?? Infinity) : (chain.load?.rl ?? Infinity);
    const before = k === 0 ? chain.source.rsource : solved.stages[k - 1]!.zout;
    return carriedFrom(k, injection(s, solved.stages[k]!, load, { before, rippleHz }, outputs[k]!));
  });
  const screens = chain.stages.map((s, k) => screenPath(s, rippleHz, outputs[k]!));
  const screenPerVolt = screens.map((p, k) => (p ? carriedFrom(k, p.perVolt) : null));
  return { ok: true, perVolt, screenPerVolt, screenShare: screens.map((p, k) => (p && screenPerVolt[k] !== null ? p.share : null)) };
}

export interface HumAtOutput {
  /** Each stage's share at the output, V rms (null where its injection is not modelled), its screens' included. */
  readonly volts: readonly (number | null)[];
  /** Of each share, the part that comes through a pentode output stage's screens, V rms; null for a stage without them. */
  readonly screens: readonly (number | null)[];
  /**
   * The hum at the output, V rms, at most: the shares added as if in phase.
   * The ripples at different nodes are not (each filter section turns its
   * phase, and a screen's bypass turns its share by up to 90°), so the real
   * sum is at or under this bound.
   */
  readonly bound: number;
}

/** The hum at the output with a fixed-bias single tube's share added: its grid's ripple through the stage, V rms (null: none). */
export interface HumWithBias extends HumAtOutput {
  readonly bias: number | null;
}

/**
 * The hum with the bias rail's share (FixedBiasSupply's humAtSpeaker) added
 * to the bound as if in phase, as the B+ shares are (the rail's ripple is at
 * the mains' frequency and the B+'s usually at twice it, so the real sum is
 * at or under this bound too). Null or a share that is not a finite,
 * not negative voltage adds nothing.
 */
export function withBiasHum(h: HumAtOutput, bias: number | null): Result<HumWithBias> {
  const shares = (x: unknown) => Array.isArray(x) && x.every((v) => v === null || (typeof v === 'number' && Number.isFinite(v)));
  if (typeof h !== 'object' || h === null || typeof h.bound !== 'number' || !Number.isFinite(h.bound) || h.bound < 0 || !shares(h.volts) || !shares(h.screens)) return fail('invalid-input', 'Give the hum at the output');
  const share = typeof bias === 'number' && Number.isFinite(bias) && bias >= 0 ? bias : null;
  const bound = h.bound + (share ?? 0);
  // Two finite figures near the largest double add past it: no hum a meter could show.
  if (!Number.isFinite(bound)) return fail('invalid-input', 'The hum at the output and the bias supply’s share add past any figure: check the supply');
  return { ok: true, volts: h.volts, screens: h.screens, bound, bias: share };
}

/**
 * The hum each stage's ripple gives at the output (its B+'s ripple, V rms,
 * times its share per volt, plus its screens' share of the ripple on the
 * node feeding them times theirs), and their bound. `screenRippleRms` gives
 * that node's ripple for each stage (default: its B+ node's, where screens
 * straight from B+ and a dropper's hang). A hum without screen figures
 * counts none.
 */
export function humAtOutput(hum: SupplyHum, rippleRms: readonly number[], screenRippleRms: readonly number[] = rippleRms): Result<HumAtOutput> {
  if (typeof hum !== 'object' || hum === null || !Array.isArray(hum.perVolt) || !Array.isArray(rippleRms) || rippleRms.length !== hum.perVolt.length) {
    return fail('invalid-input', 'Give one ripple voltage for each stage');
  }
  if (!rippleRms.every((r) => typeof r === 'number' && Number.isFinite(r) && r >= 0)) return fail('invalid-input', 'Every ripple voltage must be finite and not negative');
  if (!(Array.isArray(screenRippleRms) && screenRippleRms.length === rippleRms.length && screenRippleRms.every((r) => typeof r === 'number' && Number.isFinite(r) && r >= 0))) {
    return fail('invalid-input', 'Give one finite, not negative ripple voltage on the screens\' node for each stage');
  }
  const screened = hum.screenPerVolt !== undefined || hum.screenShare !== undefined;
  if (screened && !(Array.isArray(hum.screenPerVolt) && Array.isArray(hum.screenShare) && hum.screenPerVolt.length === rippleRms.length && hum.screenShare.length === rippleRms.length)) {
    return fail('invalid-input', 'Give the screens\' figures for each stage, or none');
  }
  const usable = (x: unknown): x is number => typeof x === 'number' && Number.isFinite(x);
  const screens = screenRippleRms.map((r, k) => {
    const per = screened ? hum.screenPerVolt[k] : null;
    const share = screened ? hum.screenShare[k] : null;
    const v = usable(per) && usable(share) ? Math.abs(per * share) * r : null;
    return v !== null && Number.isFinite(v) ? v : null;
  });
  const volts = hum.perVolt.map((x, k) => {
    const v = usable(x) ? Math.abs(x) * rippleRms[k]! + (screens[k] ?? 0) : null;
    return v !== null && Number.isFinite(v) ? v : null;
  });
  return { ok: true, volts, screens, bound: volts.reduce<number>((a, v) => a + (v ?? 0), 0) };
}
