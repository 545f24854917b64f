import {
  findOutputTube,
  globalFeedback,
  solveAmplifier,
  stagesInPlaceProblem,
  STAGE_KIND_LABELS,
  type AmplifierAtLevel,
  type ChainInput,
  type ChainResult,
  type ChainStage,
  type Failure,
  type GlobalFeedback,
  type Result,
  type TubeRecord,
} from '../../src/index';
import type { TubeRegistry } from './tubeRegistry';
import { volumeShare } from './volumeShare';
import { heaterField } from './heaterChoice';
import type { BenchDesign } from './analysis';
import { drivesPair, pushPullDesignOf } from './outputPlan';
import { outputPlaced } from './heaterSharing';
import { bplusOfStage, IDEAL_CC, voltageStages, type StagePlan } from './stagePlans';

/** A stage as the chain strip names it. */
export interface ChainCardName {
  readonly title: string;
  readonly tube: string;
  /** Which bench shows the stage's chart and values. */
  readonly bench: 'voltage' | 'output';
  /** The stage's place among the voltage stages (voltageStages), or null for the splitter and the output stage. */
  readonly voltageIndex: number | null;
  /** What the stage is to the amplifier: a voltage stage, the phase splitter before a pair, or the output stage. */
  readonly role: 'voltage' | 'splitter' | 'output';
}

/** Each stage's role as the strip and the supply name it. */
export const ROLE_NAME = { voltage: 'Voltage stages', splitter: 'Phase splitter', output: 'Output stage' } as const;

/**
 * A failure of the whole amplifier in the strip's words: the model names a
 * stage by its place ("Stage 4: …"), the strip calls the splitter and the
 * output stage by what they are, so the message says "Phase splitter
 * (12AU7): …" where the builder looks for it.
 */
export function namedAsCards(f: Failure, names: readonly ChainCardName[]): Failure {
  const at = /^stages\.(\d+)(\.|$)/.exec(f.field ?? '');
  const name = at ? names[Number(at[1])] : undefined;
  const prefix = at ? `Stage ${Number(at[1]) + 1}: ` : '';
  if (!name || name.role === 'voltage' || !f.message.startsWith(prefix)) return f;
  return { ...f, message: `${ROLE_NAME[name.role]} (${name.tube}): ${f.message.slice(prefix.length)}` };
}

type Tubes = { ok: true; tubes: TubeRecord[] } | (Failure & { stage: number });

/** Each voltage stage's tube, or which stage names one this browser does not know. */
function tubesOf(list: readonly StagePlan[], registry: TubeRegistry): Tubes {
  const tubes: TubeRecord[] = [];
  for (const [i, p] of list.entries()) {
    const tube = registry.lookup(p.tubeId);
    if (!tube) return { ok: false, reason: 'invalid-tube', message: `Stage ${i + 1}: no tube called “${p.tubeId}” in the library or among your own`, stage: i };
    tubes.push(tube);
  }
  return { ok: true, tubes };
}

/** The model's chain stages for voltage plans (their tubes looked up), their heaters as `heater` holds them (heaterField). */
function chainStagesOf(list: readonly StagePlan[], tubes: readonly TubeRecord[], heater: { heaterVolts?: number }): ChainStage[] {
  return list.map((p, i): ChainStage => {
    const tube = tubes[i]!;
    if (p.kind === 'follower') {
      const c = p.coupling;
      const coupling = c ? { vbias: c.vbias, coupling: { kind: 'capacitor' as const, cc: c.cc, rg: c.rg } } : { coupling: { kind: 'direct' as const } };
      return { kind: 'follower', tube, bplus: bplusOfStage(list, i), rk: p.rk, ...coupling, ...(p.rstopper ? { rstopper: p.rstopper } : {}), ...heater };
    }
    return {
      kind: 'common-cathode', tube, bplus: p.bplus, ra: p.ra, rk: p.rk, bypassed: p.bypassed,
      ...(p.bypassed && p.ck !== null && p.rk > 0 ? { ck: p.ck } : {}),
      ...(p.rstopper ? { rstopper: p.rstopper } : {}),
      ...(p.volume != null && p.cc !== null ? { volume: volumeShare(p.volume) } : {}),
      ...heater,
      coupling: p.cc === null ? { kind: 'direct' } : { kind: 'capacitor', cc: p.cc, rg: p.rg },
    };
  });
}

/** The bench's design as one amplifier: every voltage stage, and the output stage when driven. */
export function chainInputOf(d: BenchDesign, registry: TubeRegistry): { input: ChainInput; names: ChainCardName[] } | null {
  const list = voltageStages(d);
  const found = tubesOf(list, registry);
  if (!found.ok) return null;
  const heater = heaterField(d.heaters);
  const stages = chainStagesOf(list, found.tubes, heater);
  const names: ChainCardName[] = list.map((p, i) => ({ title: `Stage ${i + 1}`, tube: found.tubes[i]!.id, bench: 'voltage', voltageIndex: i, role: 'voltage' }));
  const outputTube = d.drivesOutput ? findOutputTube(d.output.tubeId) : undefined;
  if (outputTube && d.output.pair === 'push-pull') {
    // The splitter is fed from the last voltage stage through Cout into its leak; its outputs drive the pair's grids.
    const sp = d.output.splitter;
    const splitterTube = registry.lookup(sp.tubeId);
    if (!splitterTube) return null;
    // Direct: the grid sits at the last plate's voltage (no leak, no divider); else through Cout into its leak, held at vgrid.
    const direct = sp.coupling === 'direct';
    const into = direct ? { kind: 'direct' as const } : { kind: 'capacitor' as const, cc: d.cout ?? IDEAL_CC, rg: sp.rg };
    const grid = direct ? {} : { vbias: sp.vgrid };
    stages.push(
      sp.kind === 'split-load'
        ? { kind: 'split-load', tube: splitterTube, bplus: sp.bplus, ra: sp.ra, rk: sp.rk, ...grid, ...(sp.rstopper ? { rstopper: sp.rstopper } : {}), ...heater, coupling: into }
        : { kind: 'long-tailed-pair', tube: splitterTube, bplus: sp.bplus, ra: sp.ra, ra2: sp.ra2, rk: sp.rk, rtail: sp.rtail, heldGridLeak: sp.rg, ...grid, ...(sp.rstopper ? { rstopper: sp.rstopper } : {}), ...heater, coupling: into },
    );
    names.push({ title: 'Splitter', tube: splitterTube.id, bench: 'output', voltageIndex: null, role: 'splitter' });
    const { tubeId: _id, rg, ...parts } = pushPullDesignOf(outputPlaced(d, d.output, registry));
    stages.push({ ...parts, kind: 'push-pull-output', tube: outputTube, coupling: { kind: 'capacitor', cc: sp.cc, rg } });
    names.push({ title: 'Output', tube: outputTube.id, bench: 'output', voltageIndex: null, role: 'output' });
  } else if (outputTube) {
    const { tubeId: _id, rg, pair: _pair, raa: _raa, mismatch: _mismatch, idleMismatch: _idle, splitter: _sp, ...parts } = outputPlaced(d, d.output, registry);
    stages.push({ ...parts, kind: 'single-ended-output', tube: outputTube, coupling: { kind: 'capacitor', cc: d.cout ?? IDEAL_CC, rg } });
    names.push({ title: 'Output', tube: outputTube.id, bench: 'output', voltageIndex: null, role: 'output' });
  }
  // The last voltage stage drives RL through Cout (none: an ideal capacitor): its corner with the load is the amplifier's.
  const load = !outputTube && Number.isFinite(d.rl) ? { load: { rl: d.rl, ...(d.cout !== null ? { cc: d.cout } : {}) } } : {};
  return { input: { source: { rsource: d.rsource }, stages, ...load }, names };
}

/**
 * Why a change cannot stand because the phase splitter before a driven pair
 * could not run after it (its grid driven positive, its plate below its
 * cathode), named as the strip names it; null when it runs or the change
 * leaves it alone. It is solved in its place in the amplifier (the pair's
 * grid leak its load; direct-coupled, the last plate's DC its grid), about a
 * millisecond, and only when its own values, its load or (direct-coupled) the
 * voltage stages feeding its grid changed.
 */
export function splitterRefusal(next: BenchDesign, prev: BenchDesign, registry: TubeRegistry, voltageChanged: boolean): Failure | null {
  if (!drivesPair(next)) return null;
  const sp = next.output.splitter;
  const touched = sp !== prev.output.splitter || next.output.rg !== prev.output.rg || !drivesPair(prev) || (sp.coupling === 'direct' && voltageChanged);
  if (!touched) return null;
  const chain = chainInputOf(next, registry);
  if (!chain) return null;
  const placed = stagesInPlaceProblem(chain.input);
  if (!placed) return null;
  const at = chain.names.findIndex((n) => n.role === 'splitter');
  return placed.field?.startsWith(`stages.${at}.`) ? namedAsCards(placed, chain.names) : null;
}

const sources = new WeakMap<readonly StagePlan[], { rsource: number; registry: TubeRegistry; result: Result<{ ohms: number }> }>();

/**
 * What drives the bench stage's grid: the amplifier's source for the first
 * stage, else the output impedance of the stage before it (solved with the
 * stages before it, remembered per list, so a drag on the bench never
 * solves them again).
 */
export function benchSource(d: BenchDesign, registry: TubeRegistry): Result<{ ohms: number }> {
  if (d.before.length === 0) return { ok: true, ohms: d.rsource };
  const hit = sources.get(d.before);
  if (hit && hit.rsource === d.rsource && hit.registry === registry) return hit.result;
  const result = solvePrefix(d.before, d.rsource, registry);
  sources.set(d.before, { rsource: d.rsource, registry, result });
  return result;
}

function solvePrefix(before: readonly StagePlan[], rsource: number, registry: TubeRegistry): Result<{ ohms: number }> {
  const found = tubesOf(before, registry);
  if (!found.ok) return found;
  // Only the last one's output impedance is wanted here, which the heaters' potential does not move.
  const r = solveAmplifier({ source: { rsource }, stages: chainStagesOf(before, found.tubes, {}) });
  if (!r.ok) return { ...r, message: `A stage before this one cannot run: ${r.message}` };
  return { ok: true, ohms: r.stages[r.stages.length - 1]!.zout };
}

/** What the chain strip shows: the whole amplifier, and it at a working level (1 W into the speaker, or the bench's output level). */
export interface AmplifierView {
  /** The amplifier as the model was given it. */
  readonly input: ChainInput;
  readonly names: readonly ChainCardName[];
  readonly kinds: readonly string[];
  readonly result: ({ ok: true } & ChainResult) | Failure;
  readonly atLevel: ({ ok: true } & AmplifierAtLevel) | Failure | null;
  /** The level `atLevel` is at, in words ("1 W", "2 V rms"). */
  readonly levelLabel: string;
  /** With global feedback (the design's Rf, the output stage driven): the loop at midband; null without. */
  readonly feedback: Result<GlobalFeedback> | null;
  /** True while a drag or keystroke is in progress: these figures are from before it. */
  readonly stale: boolean;
}

/** One working level: 1 W for a chain ending in the output stage (common practice for sensitivity), else the bench's output level. */
export function analyzeAmplifier(d: BenchDesign, registry: TubeRegistry): AmplifierView | null {
  const chain = chainInputOf(d, registry);
  if (!chain) return null;
  const toSpeaker = d.drivesOutput;
  const solved = solveAmplifier(chain.input, toSpeaker ? { power: 1 } : { outputRms: d.levelRms });
  const result = solved.ok ? solved : namedAsCards(solved, chain.names);
  const atLevel = result.ok ? (result.atLevel ?? null) : null;
  return {
    input: chain.input,
    names: chain.names,
    // A follower's coupling is part of what it is: one on its own bias is not one riding on the plate before it.
    kinds: chain.input.stages.map((s) => `${STAGE_KIND_LABELS[s.kind]}${s.kind === 'follower' && s.coupling.kind === 'capacitor' ? ', capacitor-coupled' : ''}`),
    result,
    atLevel,
    levelLabel: toSpeaker ? '1 W' : `${d.levelRms} V rms`,
    feedback: toSpeaker && d.feedbackRf !== null && result.ok ? globalFeedback(chain.input, d.feedbackRf, { power: 1 }, d.feedbackCf) : null,
    stale: false,
  };
}
