import type { FollowerCoupling } from '../../src/index';
import type { BenchDesign } from './analysis';

/**
 * The amplifier's voltage stages, input to output, as the bench holds them:
 * the stage on the bench is the design's own fields (tube, B+, Ra, Rk, …,
 * with its follower as `stage2`), and the stages before and after it wait in
 * `before` and `after` with every value they need. Putting another stage on
 * the bench moves the cut, never copies a stage, so there is one place for
 * each value and undo, autosave, files and links carry the whole chain.
 *
 * A cathode follower rides with the gain stage whose plate it is
 * direct-coupled to, as that stage's `stage2`; putting the follower on the
 * bench puts that gain stage there and shows the follower (`stageKind`).
 */
export type StagePlan = GainPlan | FollowerPlan;

/** A common-cathode gain stage off the bench. */
export interface GainPlan {
  readonly kind: 'common-cathode';
  readonly tubeId: string;
  /** The supply node at the top of Ra, V. */
  readonly bplus: number;
  readonly ra: number;
  readonly rk: number;
  readonly bypassed: boolean;
  /** Cathode bypass capacitor, F; null for an ideal one. */
  readonly ck: number | null;
  /** Coupling capacitor from the output before it, F; null only for the first stage: direct from the source. */
  readonly cc: number | null;
  /** Grid leak, Ω. */
  readonly rg: number;
  /** Grid stopper at the socket, Ω; 0 or absent: none. */
  readonly rstopper?: number;
  /** A volume control in Rg's place: its setting, dB below full; null or absent: a fixed Rg. */
  readonly volume?: number | null;
  /** The supply node feeding it when the amplifier runs on its supply (0 the reservoir); absent: the voltage stages' node (supply.feeds.voltage). */
  readonly node?: number;
}

/**
 * A cathode follower after the plate of the gain stage before it, on that
 * stage's B+: direct-coupled (its grid at that plate), or through a coupling
 * capacitor into its own grid leak, its grid held at `coupling.vbias`.
 */
export interface FollowerPlan {
  readonly kind: 'follower';
  readonly tubeId: string;
  readonly rk: number;
  /** Absent: direct-coupled. */
  readonly coupling?: FollowerCoupling;
  /** Grid stopper at the socket, Ω; 0 or absent: none. */
  readonly rstopper?: number;
}

/**
 * A new capacitor-coupled follower's coupling (common practice: 100 nF into
 * 1 MΩ, a corner of 1.6 Hz; the grid at half its B+, so the cathode, which
 * sits just above it, can swing about as far either way).
 */
export const followerCouplingFor = (bplus: number): FollowerCoupling => ({ cc: NEW_STAGE_CC, rg: 1e6, vbias: Math.round(bplus / 2) });

/** The most voltage stages an amplifier holds (the chain's limit of 8, one kept for the output stage). */
export const MAX_VOLTAGE_STAGES = 7;

/**
 * A coupling capacitor the older designs left ideal (a second gain stage
 * before version 3 had no box for it): the largest the Cc box accepts, 1 F,
 * so it adds no corner a builder could hear (0.2 µHz into 1 MΩ).
 */
export const IDEAL_CC = 1;

/** A new stage's coupling capacitor and grid leak (common practice: 100 nF into 470 kΩ, a corner of 3.4 Hz). */
export const NEW_STAGE_CC = 100e-9;
export const NEW_STAGE_RG = 470e3;

/** The stage on the bench as a plan. */
export function benchPlan(d: BenchDesign): GainPlan {
  return { kind: 'common-cathode', tubeId: d.tubeId, bplus: d.bplus, ra: d.ra, rk: d.rk, bypassed: d.bypassed, ck: d.ck, cc: d.cin, rg: d.rg, ...(d.rstopper ? { rstopper: d.rstopper } : {}), ...(d.volume !== null ? { volume: d.volume } : {}), ...(d.node !== undefined ? { node: d.node } : {}) };
}

/** The bench stage's second stage as plans: its follower, or a gain stage kept from a design before version 3. */
function stage2Plans(d: BenchDesign): StagePlan[] {
  const s2 = d.stage2;
  if (s2.kind === 'follower') return [{ kind: 'follower', tubeId: s2.tubeId, rk: s2.rk, ...(s2.coupling ? { coupling: s2.coupling } : {}), ...(s2.rstopper ? { rstopper: s2.rstopper } : {}) }];
  if (s2.kind === 'common-cathode') return [{ kind: 'common-cathode', tubeId: s2.tubeId, bplus: d.bplus, ra: s2.ra, rk: s2.rk, bypassed: true, ck: null, cc: IDEAL_CC, rg: s2.rg }];
  return [];
}

/** Every voltage stage, input to output. */
export function voltageStages(d: BenchDesign): StagePlan[] {
  return [...d.before, benchPlan(d), ...stage2Plans(d), ...d.after];
}

/** Where the bench's stage sits among the voltage stages. */
export const benchIndex = (d: BenchDesign) => d.before.length;

/** The B+ a stage runs on: its own, or for a follower that of the gain stage it follows. */
export function bplusOfStage(list: readonly StagePlan[], i: number): number {
  for (let k = i; k >= 0; k--) {
    const p = list[k]!;
    if (p.kind === 'common-cathode') return p.bplus;
  }
  return 0;
}

/** The gain stage at or before `i`: the one whose bench shows stage i. */
export function gainIndexOf(list: readonly StagePlan[], i: number): number {
  for (let k = Math.min(i, list.length - 1); k >= 0; k--) if (list[k]!.kind === 'common-cathode') return k;
  return 0;
}

/**
 * The design with the voltage stages `list` and gain stage `k` on the bench.
 * A follower right after it becomes its `stage2`; the second stage's other
 * values are kept for when one is added again.
 */
export function withStagesOnBench(d: BenchDesign, list: readonly StagePlan[], k: number): BenchDesign {
  const on = list[k];
  if (!on || on.kind !== 'common-cathode') return d;
  const next = list[k + 1];
  const follows = next?.kind === 'follower';
  return {
    ...d,
    tubeId: on.tubeId,
    bplus: on.bplus,
    ra: on.ra,
    rk: on.rk,
    bypassed: on.bypassed,
    ck: on.ck,
    cin: on.cc,
    rg: on.rg,
    rstopper: on.rstopper ?? 0,
    volume: on.volume ?? null,
    node: on.node,
    stage2: follows ? { ...d.stage2, kind: 'follower', tubeId: next.tubeId, rk: next.rk, coupling: next.coupling, rstopper: next.rstopper } : { ...d.stage2, kind: 'none' },
    before: list.slice(0, k),
    after: list.slice(k + (follows ? 2 : 1)),
  };
}

/** A block: a gain stage and the follower riding with it, as start index and length. */
function blockAt(list: readonly StagePlan[], i: number): { start: number; length: number } {
  const start = gainIndexOf(list, i);
  return { start, length: list[start + 1]?.kind === 'follower' ? 2 : 1 };
}

/** Puts voltage stage i on the bench: a gain stage, or a follower (on its own curves, its gain stage riding under it). */
export function selectStage(d: BenchDesign, i: number): BenchDesign {
  const list = voltageStages(d);
  return { ...withStagesOnBench(d, list, gainIndexOf(list, i)), stageKind: list[i]?.kind === 'follower' ? 'follower' : 'voltage' };
}

/** The same chain with the bench's follower held as its `stage2` (a file may list it first in `after`). */
export const normalized = (d: BenchDesign) => withStagesOnBench(d, voltageStages(d), benchIndex(d));

/** The first stage may be direct-coupled to the source; every later gain stage needs a coupling capacitor. */
function coupled(list: StagePlan[]): StagePlan[] {
  return list.map((p, i) => (i > 0 && p.kind === 'common-cathode' && p.cc === null ? { ...p, cc: NEW_STAGE_CC } : p));
}

/**
 * A new gain stage after stage i's block (after its follower), on the bench:
 * the same tube, B+ and parts as the stage before it, capacitor-coupled.
 */
export function addGainStage(d: BenchDesign, i: number): BenchDesign | null {
  const list = voltageStages(d);
  if (list.length >= MAX_VOLTAGE_STAGES) return null;
  const b = blockAt(list, i);
  const model = list[b.start] as GainPlan;
  const fresh: GainPlan = { ...model, cc: NEW_STAGE_CC, rg: NEW_STAGE_RG };
  const at = b.start + b.length;
  return { ...withStagesOnBench(d, [...list.slice(0, at), fresh, ...list.slice(at)], at), stageKind: 'voltage' };
}

/** True when gain stage i has room for a follower (none yet, and the chain not full). */
export function canAddFollower(list: readonly StagePlan[], i: number): boolean {
  return list[i]?.kind === 'common-cathode' && list[i + 1]?.kind !== 'follower' && list.length < MAX_VOLTAGE_STAGES;
}

/**
 * Removes stage i. A gain stage takes its follower with it (a follower needs
 * the plate before it); the last gain stage cannot go. The bench shows the
 * stage that took its place.
 */
export function removeStage(d: BenchDesign, i: number): BenchDesign | null {
  const list = voltageStages(d);
  const p = list[i];
  if (!p) return null;
  if (p.kind === 'follower') {
    const rest = [...list.slice(0, i), ...list.slice(i + 1)];
    return withStagesOnBench(d, rest, gainIndexOf(rest, i - 1));
  }
  const b = blockAt(list, i);
  const rest = coupled([...list.slice(0, b.start), ...list.slice(b.start + b.length)]);
  if (rest.length === 0) return null;
  return withStagesOnBench(d, rest, gainIndexOf(rest, Math.min(b.start, rest.length - 1)));
}

/** Moves stage i's block one place toward the input (−1) or the output (+1), its follower with it; it stays on the bench. */
export function moveStage(d: BenchDesign, i: number, dir: -1 | 1): BenchDesign | null {
  const list = voltageStages(d);
  const b = blockAt(list, i);
  const block = list.slice(b.start, b.start + b.length);
  if (dir < 0) {
    if (b.start === 0) return null;
    const prev = blockAt(list, b.start - 1);
    const moved = coupled([...list.slice(0, prev.start), ...block, ...list.slice(prev.start, b.start), ...list.slice(b.start + b.length)]);
    return withStagesOnBench(d, moved, prev.start);
  }
  const nextStart = b.start + b.length;
  if (nextStart >= list.length) return null;
  const next = blockAt(list, nextStart);
  const moved = coupled([...list.slice(0, b.start), ...list.slice(nextStart, nextStart + next.length), ...block, ...list.slice(nextStart + next.length)]);
  return withStagesOnBench(d, moved, b.start + next.length);
}

/** The load after the bench's stage (and its follower): the next gain stage's grid through its capacitor, or the amplifier's own RL and Cout. */
export function loadAfterBench(d: BenchDesign): { rl: number; cout: number | null } {
  const next = d.after[0];
  if (next?.kind === 'common-cathode') return { rl: next.rg, cout: next.cc };
  return { rl: d.rl, cout: d.cout };
}

/** The supply node a gain stage hangs from: its own, else the voltage stages'. */
const fedNode = (d: BenchDesign, p: { readonly node?: number | undefined }): number => p.node ?? d.supply.feeds.voltage;

/** The supply node voltage stage i hangs from: its gain stage's (a follower rides on its gain stage's B+). */
export function nodeOfStage(d: BenchDesign, list: readonly StagePlan[], i: number): number {
  const p = list[gainIndexOf(list, i)];
  return fedNode(d, p?.kind === 'common-cathode' ? p : {});
}

/** Every gain stage's B+ set to what its node gives (`voltsAt(node)`; null leaves it as typed). */
export function withNodeBplus(d: BenchDesign, voltsAt: (node: number) => number | null): BenchDesign {
  const set = (p: StagePlan): StagePlan => {
    if (p.kind !== 'common-cathode') return p;
    const v = voltsAt(fedNode(d, p));
    return v === null || v === p.bplus ? p : { ...p, bplus: v };
  };
  const bench = voltsAt(fedNode(d, d));
  return { ...d, ...(bench !== null ? { bplus: bench } : {}), before: d.before.map(set), after: d.after.map(set) };
}

/**
 * The design with gain stage i fed from `node`, held the one way: where every
 * gain stage then shares a node it is the voltage stages' (supply.feeds.voltage)
 * and none keeps its own; otherwise the voltage stages' is the first stage's and
 * a stage carries its own node only where it differs.
 */
export function withStageNode(d: BenchDesign, i: number, node: number): BenchDesign {
  const list = voltageStages(d);
  const k = gainIndexOf(list, i);
  const nodes = list.map((p, j) => (p.kind !== 'common-cathode' ? null : j === k ? node : fedNode(d, p)));
  const gains = nodes.filter((n): n is number => n !== null);
  const shared = gains[0] ?? node;
  const held = (p: StagePlan, j: number): StagePlan => {
    if (p.kind !== 'common-cathode') return p;
    const { node: _old, ...rest } = p;
    return nodes[j] === shared ? rest : { ...rest, node: nodes[j]! };
  };
  const supply = { ...d.supply, feeds: { ...d.supply.feeds, voltage: shared } };
  return withStagesOnBench({ ...d, supply }, list.map(held), benchIndex(d));
}

/** Every gain stage's own node moved by `move` (a filter section removed: the nodes after it shift down). */
export function withStageNodesMoved(d: BenchDesign, move: (node: number) => number): BenchDesign {
  const list = voltageStages(d).map((p) => (p.kind === 'common-cathode' && p.node !== undefined ? { ...p, node: move(p.node) } : p));
  return withStagesOnBench(d, list, benchIndex(d));
}
