import { fail, type Failure, type Result } from '../result';
import { solveSupply } from '../supply/solveSupply';
import { supplyNear, supplyTangent, type SupplyTangent } from '../supply/supplyTangent';
import type { SupplyDesign, SupplySolution } from '../supply/supplyTypes';
import type { ChainInput, ChainResult, ChainStage } from './chainTypes';
import { prepareAmplifier, solveStagesInPlace } from './prepareAmplifier';
import { amplifierOf } from './solveAmplifier';
import type { SolvedLink } from './stageKind';
import { SCREEN_FROM_BPLUS_VOLTS } from '../output/screenFeed';
import { bleederOhmsProblem } from '../supply/bleeder';

export interface AmplifierOnSupply {
  readonly amplifier: ChainInput;
  readonly supply: SupplyDesign;
  /** The supply node feeding each stage's B+ (0 the reservoir, then one per section). */
  readonly feeds: readonly number[];
  /**
   * For each stage, the node feeding its screens straight, or null: only a
   * pentode-connected output stage's (single-ended or a pair) may have one.
   * Those screens are then solved at that node's voltage, their idle
   * current is drawn from it instead of the plates' node, and the stage's
   * parts and findings take them as fed from it (screenFromNode). At full
   * power the node carries their average at the clean limit. Absent: every
   * screen hangs from its plates' node, as designed.
   */
  readonly screenFeeds?: readonly (number | null)[];
  /** Identical channels on the one supply (2 for stereo): each node carries every channel's stages. Default 1. */
  readonly channels?: number;
  /**
   * A bleeder across the reservoir, Ω (bleederForSupply): it draws the
   * reservoir's voltage over its resistance, one more load at node 1, so the
   * B+, ripple and the transformer's current carry it. Absent: none.
   */
  readonly bleederOhms?: number;
  /**
   * Every node's voltage in a nearby solution (the last steady state, as
   * while a stage is dragged), V: the first round starts there instead of at
   * the stages' own B+, so a small change settles in a round or two. Ignored
   * unless it gives one finite positive voltage per node.
   */
  readonly start?: readonly number[];
  /**
   * The last steady state's tangent (from a solve asked `keepTangent`): the
   * supply is then taken along it instead of integrated, while the loads stay
   * near where it was taken (a drag's frames), and solved in full otherwise.
   */
  readonly around?: SupplyTangent;
  /** Answer the tangent at the solution too, for the frames that follow (one more transient solve per node). */
  readonly keepTangent?: boolean;
}

export interface AmplifierOnSupplyResult {
  readonly amplifier: ChainResult;
  readonly supply: SupplySolution;
  /** Each stage's B+ as the amplifier was solved at: its node's voltage under the whole amplifier's current (`supply.nodes[feed].dc`) within 10 mV, V. */
  readonly bplus: readonly number[];
  /** Each stage's screen voltage as solved where a node feeds its screens (`screenFeeds`; that node's voltage within 10 mV), V; null elsewhere. */
  readonly screenVolts: readonly (number | null)[];
  /** The current drawn at each node (every channel's stages, plus the supply's own loads and the bleeder's at node 1), A. */
  readonly loads: readonly number[];
  /** The bleeder's current at the reservoir's voltage, A (0 without one). */
  readonly bleederAmps: number;
  /**
   * With an output stage driven to its clean limit (its average current then
   * differs from idle), every node's DC voltage and load: the sag at full
   * power, the stages' operating points left where they idle. Null when no
   * stage reports a full-power current.
   */
  readonly atFullPower: { readonly volts: readonly number[]; readonly loads: readonly number[] } | null;
  readonly iterations: number;
  /** How the supply was solved: integrated to its steady state, or taken along the last one's tangent. */
  readonly supplyBy: 'transient' | 'tangent';
  /** The tangent at this solution, when asked (`keepTangent`). */
  readonly tangent?: SupplyTangent;
}

/** Agreement asked between a node's voltage and the B+ its stages were solved at, V. */
const VOLT_TOL = 0.01;
const MAX_ITERATIONS = 30;
/** The least a node may give a stage, V: below it the supply cannot be said to feed the amplifier. */
const MIN_NODE_VOLTS = 1;

/** The supply too weak for the stages: which node gives out, under what current, and what to change. */
function cannotDeliver(volts: readonly number[], feeds: readonly number[], loads: readonly number[]): Failure {
  const k = feeds.reduce((worst, f) => (volts[f]! < volts[worst]! ? f : worst), feeds[0]!);
  const amps = loads[k] ?? 0;
  return fail(
    'supply-too-low',
    `The supply cannot deliver the stages' current: node ${k + 1} falls to ${volts[k]!.toFixed(1)} V${amps > 0 ? ` under ${(amps * 1e3).toFixed(1)} mA` : ''}. Raise the secondary's voltage, lower the filter's resistances, or feed fewer stages from that node.`,
    'secondaryRms',
  );
}

/** The first screen feed that cannot be used: one per stage, each null or a node, and a node only for a pentode-connected output stage's screens. */
function screenFeedsProblem(screenFeeds: unknown, stages: readonly ChainStage[], nodes: number): Failure | null {
  if (!Array.isArray(screenFeeds) || screenFeeds.length !== stages.length) return fail('invalid-input', `Give the screens' node (or none) for each of the ${stages.length} stages`, 'screenFeeds');
  for (let i = 0; i < stages.length; i++) {
    const k: unknown = screenFeeds[i];
    if (k === null || k === undefined) continue;
    if (!(Number.isInteger(k) && (k as number) >= 0 && (k as number) < Math.max(nodes, 1))) return fail('invalid-input', `Name the screens' supply node (1 to ${Math.max(nodes, 1)}) for stage ${i + 1}, or none`, 'screenFeeds');
    const s = stages[i]!;
    const screened = (s.kind === 'single-ended-output' || s.kind === 'push-pull-output') && s.connection === 'pentode';
    if (!screened) return fail('invalid-input', `Stage ${i + 1} has no screens of its own to feed: only a pentode-connected output stage's take a node`, 'screenFeeds');
  }
  return null;
}

/**
 * The amplifier as its supply places it: each stage at its B+, and screens
 * on a node of their own at their voltage, marked as fed from it (no
 * dropper). What the rounds solve, and what the hum is read on.
 */
export function placedOnSupply(amplifier: ChainInput, bplus: readonly number[], screenVolts: readonly (number | null)[]): ChainInput {
  return {
    ...amplifier,
    stages: amplifier.stages.map((s, i) => {
      const atNode = { ...s, bplus: bplus[i] ?? s.bplus };
      const vs = screenVolts[i];
      if (!('screenVolts' in atNode)) return atNode;
      if (typeof vs === 'number') return { ...atNode, screenVolts: vs, screenFromNode: true };
      // Screens designed at the plates' B+ are wired to it: they follow it to the node's voltage (held at the designed
      // volts, a node a volt or two under them would read as a supply above B+ that nobody named).
      return Math.abs(atNode.screenVolts - s.bplus) <= SCREEN_FROM_BPLUS_VOLTS ? { ...atNode, screenVolts: atNode.bplus } : atNode;
    }),
  };
}

/** Channels one supply may feed (a multichannel amplifier beyond this has more than one supply). */
export const MAX_CHANNELS = 8;

/**
 * The amplifier and its supply as one solution: each stage draws its current
 * from its node, and its operating point is solved at the voltage that node
 * delivers under all the currents drawn from the supply. Fixed-point
 * iteration: solve the stages at the nodes' voltages, hand their currents
 * (plus the supply's own `loads`, for anything else it feeds) to the supply,
 * repeat until no node moves by more than 10 mV. The currents fall as the
 * voltages do, so the iteration contracts.
 */
export function solveOnSupply(input: AmplifierOnSupply): Result<AmplifierOnSupplyResult> {
  const rounds = solveOnSupplyInRounds(input);
  for (;;) {
    const r = rounds.next();
    if (r.done) return r.value;
  }
}

/**
 * The same solve, pausing after each round of stages and supply (each a few
 * tens of milliseconds): a page can run it between frames instead of in a
 * worker, which would carry a second copy of the whole model.
 */
export function* solveOnSupplyInRounds(input: AmplifierOnSupply): Generator<void, Result<AmplifierOnSupplyResult>, void> {
  if (typeof input !== 'object' || input === null) return fail('invalid-input', 'Give the amplifier, its supply and which node feeds each stage');
  const { amplifier, supply, feeds } = input;
  if (typeof supply !== 'object' || supply === null) return fail('invalid-input', 'Give the supply the amplifier runs on', 'supply');
  const channels = input.channels ?? 1;
  if (!Number.isInteger(channels) || channels < 1 || channels > MAX_CHANNELS) return fail('invalid-input', `Give 1 to ${MAX_CHANNELS} channels on the supply`, 'channels');
  const nodes = Array.isArray(supply?.sections) ? supply.sections.length + 1 : 0;
  const stages = Array.isArray(amplifier?.stages) ? amplifier.stages : [];
  if (!Array.isArray(feeds) || feeds.length !== stages.length || !feeds.every((f) => Number.isInteger(f) && f >= 0 && f < Math.max(nodes, 1))) {
    return fail('invalid-input', `Name the supply node (1 to ${Math.max(nodes, 1)}) feeding each of the ${stages.length} stages`, 'feeds');
  }
  const screenFeeds = input.screenFeeds ?? stages.map(() => null);
  const screenProblem = screenFeedsProblem(screenFeeds, stages, nodes);
  if (screenProblem) return screenProblem;
  const bleederOhms = input.bleederOhms;
  const bleederProblem = bleederOhms === undefined ? null : bleederOhmsProblem(bleederOhms);
  if (bleederProblem) return bleederProblem;
  const start = input.start;
  let volts: number[] | null = Array.isArray(start) && start.length === nodes && start.every((v) => typeof v === 'number' && Number.isFinite(v) && v > 0) ? [...start] : null;
  // The bleeder draws the reservoir's voltage (as the last round left it; before any, the highest B+ a stage asks) over
  // its resistance: one more load at node 1, held constant for a round like the stages' currents.
  const bleederAt = (at: readonly number[] | null) => (bleederOhms === undefined ? 0 : (at ? at[0]! : Math.max(0, ...stages.map((s) => (Number.isFinite(s?.bplus) ? s.bplus : 0)))) / bleederOhms);
  let bleederAmps = bleederAt(volts);
  const ownLoads = Array.isArray(supply.loads) ? supply.loads : [];
  const ownAt = () => ownLoads.map((a, k) => (k === 0 ? a + bleederAmps : a));
  let loads: number[] = [];
  const around = input.around && Array.isArray(input.around.loads) && input.around.loads.length === nodes ? input.around : null;
  let byTangent = around !== null;
  // Along the tangent while every round's loads stay near it (supplyNear refuses those that do not); one round that
  // strays solves the supply in full from there on.
  const supplyAt = (at: number[], from: number[] | null) => {
    const near = byTangent ? supplyNear({ ...supply, loads: at }, around!, at) : null;
    if (near?.ok) return near;
    byTangent = false;
    return solveSupply({ ...supply, loads: at }, from ? { start: from } : {});
  };
  for (let iteration = 1; iteration <= MAX_ITERATIONS; iteration++) {
    // A node the stages pulled below the floor (the loads are taken as constant currents for one round) is held
    // there; the stages then draw less, and a supply that can feed them climbs back.
    const bplus = stages.map((s, i) => (volts ? Math.max(volts[feeds[i]!]!, MIN_NODE_VOLTS) : s.bplus));
    const screenVolts = stages.map((s, i) => {
      const k = screenFeeds[i];
      if (k === null || k === undefined || !('screenVolts' in s)) return null;
      return volts ? Math.max(volts[k]!, MIN_NODE_VOLTS) : s.screenVolts;
    });
    // Each round needs only the stages' currents (their operating points, a fifth of the whole solve); the whole
    // amplifier is solved once, at the B+ the rounds agree on.
    const placed = placedOnSupply(amplifier, bplus, screenVolts);
    const inPlace = solveStagesInPlace(placed);
    if (!inPlace.ok) return volts && bplus.some((b) => b <= MIN_NODE_VOLTS) ? cannotDeliver(volts, feeds, loads) : inPlace;
    // Screens on a node of their own draw their current there, and the plates' node the rest.
    const fed = (i: number) => screenFeeds[i] !== null && screenFeeds[i] !== undefined;
    const drawn = (current: (l: SolvedLink) => number, screens: (l: SolvedLink) => number) =>
      ownAt().map((a, k) => a + channels * inPlace.links.reduce((sum, l, i) => sum + (feeds[i] === k ? current(l) - (fed(i) ? screens(l) : 0) : 0) + (screenFeeds[i] === k && fed(i) ? screens(l) : 0), 0));
    const idleScreens = (l: SolvedLink) => l.screenCurrent ?? 0;
    loads = drawn((l) => l.supplyCurrent, idleScreens);
    const solved = supplyAt(loads, volts);
    if (!solved.ok) return solved;
    const next = solved.nodes.map((n) => n.dc);
    const moved = volts ? Math.max(...next.map((v, k) => Math.abs(v - volts![k]!))) : Infinity;
    // The bleeder's current was taken at the reservoir's voltage the supply now gives, and the stages were solved at
    // the nodes it now gives (from the first round when it started from a solution).
    const bleederSettled = bleederOhms === undefined || Math.abs(bleederAmps - bleederAt(next)) * bleederOhms <= VOLT_TOL;
    const settled =
      volts !== null && bleederSettled && Math.max(...bplus.map((b, i) => Math.abs(b - next[feeds[i]!]!)), ...screenVolts.map((v, i) => (v === null ? 0 : Math.abs(v - next[screenFeeds[i]!]!)))) <= VOLT_TOL;
    const done = settled || (moved <= VOLT_TOL / 10 && bleederSettled);
    volts = next;
    if (!done) bleederAmps = bleederAt(next);
    yield;
    if (done) {
      const fedNodes = [...feeds, ...screenFeeds.filter((k): k is number => k !== null && k !== undefined)];
      if (fedNodes.some((f) => next[f]! <= MIN_NODE_VOLTS)) return cannotDeliver(next, fedNodes, loads);
      const chain = amplifierOf(placed, prepareAmplifier(placed, inPlace));
      if (!chain.ok) return chain;
      const { ok: _a, ...amp } = chain;
      const { ok: _s, ...sup } = solved;
      let atFullPower: AmplifierOnSupplyResult['atFullPower'] = null;
      if (inPlace.links.some((l) => l.fullPowerCurrent !== undefined)) {
        const full = drawn((l) => l.fullPowerCurrent ?? l.supplyCurrent, (l) => l.fullPowerScreenCurrent ?? idleScreens(l));
        const near = byTangent ? supplyNear({ ...supply, loads: full }, around!, full) : null;
        const driven = near?.ok ? near : solveSupply({ ...supply, loads: full }, { start: next });
        if (!driven.ok) return driven;
        atFullPower = { volts: driven.nodes.map((n) => n.dc), loads: full };
      }
      const solvedBy = byTangent ? ('tangent' as const) : ('transient' as const);
      const answer = { ok: true as const, amplifier: amp, supply: sup, bplus, screenVolts, loads, bleederAmps, atFullPower, iterations: iteration, supplyBy: solvedBy };
      if (!input.keepTangent) return answer;
      // Along a tangent already, it stays the one to follow: it was taken at a steady state, this answer is on its line.
      if (byTangent) return { ...answer, tangent: around! };
      yield;
      const tangent = supplyTangent({ ...supply, loads }, sup);
      if (!tangent.ok) return tangent;
      const { ok: _t, ...kept } = tangent;
      return { ...answer, tangent: kept };
    }
  }
  return fail('no-convergence', 'The stages and the supply did not agree on the B+ within 30 rounds: check the loads and the filter', 'supply');
}
