import type { MeterPlan, OutputMeterPlan } from './meterPlan';
import type { OutputPlan } from './outputPlan';
import { analyzeStage, MAX_FAMILY_CURVES, type ChainLink, type FollowerCoupling, type Failure, type PlateExtent, type PreferredSeries, type StageAnalysis, type StageDesign, type TubeRecord } from '../../src/index';
import type { TubeRegistry } from './tubeRegistry';
import type { SupplyPlan } from './supplyPlan';
import { heaterField, type HeaterChoice } from './heaterChoice';
import type { TargetPlan } from './targetPlan';
import { loadAfterBench, type StagePlan } from './stagePlans';
import { benchSource } from './amplifierChain';
import { volumeShare } from './volumeShare';

/** The design as the bench holds it: what the user chose, in SI units. */
export interface BenchDesign {
  readonly tubeId: string;
  readonly bplus: number;
  readonly ra: number;
  readonly rk: number;
  readonly bypassed: boolean;
  /** Next-stage load, Ω; Infinity for none. */
  readonly rl: number;
  /** Preferred-value series resistors snap to when a drag ends. */
  readonly series: PreferredSeries;
  readonly snap: boolean;
  /** Source impedance driving the grid, Ω. */
  readonly rsource: number;
  /** Input coupling capacitor, F; null for direct coupling. */
  readonly cin: number | null;
  /** Grid leak, Ω. */
  readonly rg: number;
  /** Grid stopper at the socket, Ω; 0 for none. */
  readonly rstopper: number;
  /** A volume control in Rg's place (Rg its track, the grid on its wiper): its setting, dB below full; null for a fixed Rg. */
  readonly volume: number | null;
  /** The supply node feeding this stage when the amplifier runs on its supply (0 the reservoir); absent: the voltage stages' node (supply.feeds.voltage). */
  readonly node?: number;
  /** Cathode bypass capacitor, F (used when bypassed); null for an ideal one. */
  readonly ck: number | null;
  /** Output coupling capacitor into RL, F; null for an ideal one. */
  readonly cout: number | null;
  /** Output level the distortion figures are taken at, V rms. */
  readonly levelRms: number;
  /** The THD whose output level is shown (a fraction; 0.05, the 5 % published resistance-coupled tables use). */
  readonly thdLimit: number;
  readonly stage2: Stage2Design;
  /** The voltage stages before the one on the bench, input first (see stagePlans.ts). */
  readonly before: readonly StagePlan[];
  /** The voltage stages after the bench's stage and its follower, up to the output stage. */
  readonly after: readonly StagePlan[];
  /** Which stage the bench shows: the resistance-coupled voltage stage, its follower, or the transformer-coupled output stage. */
  readonly stageKind: StageKind;
  readonly output: OutputPlan;
  /**
   * The voltage stages drive the output stage: one amplifier from input to
   * speaker. RL is then the output grid's resistor (the two are kept equal)
   * and Cout the capacitor coupling into it.
   */
  readonly drivesOutput: boolean;
  /** The B+ supply, solved with the amplifier when it is on. */
  readonly supply: SupplyPlan;
  /** How the small tubes' heaters are fed (AC winding or DC supply) and each type's wiring. */
  readonly heaters: HeaterChoice;
  /** Global negative feedback: the resistor from the speaker to the first stage's cathode, Ω; null for none. */
  readonly feedbackRf: number | null;
  /** A phase-lead capacitor across Rf, F, or null. */
  readonly feedbackCf: number | null;
  /** What the builder asks of the voltage stage on the bench; the plate chart shades where it all holds. */
  readonly targets: TargetPlan;
  /** What the builder asks of its cathode follower, kept apart (a follower's Zout and gain are not a gain stage's). */
  readonly followerTargets: TargetPlan;
  /**
   * What the builder asks of the output stage, kept apart: a power stage's
   * output impedance (at the speaker), dissipation and swing are not a
   * voltage stage's, and a target set for one must not empty the other's chart.
   */
  readonly outputTargets: TargetPlan;
  /** The builder's meter readings on stages of the amplifier as built (meterPlan.ts); absent: none. */
  readonly readings?: readonly MeterPlan[];
  /** The builder's meter readings on the output tubes as built (meterPlan.ts); absent: none. */
  readonly outputReadings?: readonly OutputMeterPlan[];
}

/** Which stage the bench shows: a gain stage, its cathode follower (riding with it as `stage2`), or the output stage. */
export type StageKind = 'voltage' | 'follower' | 'output';

/** The optional second stage: none, a cathode follower, or a capacitor-coupled gain stage. */
export interface Stage2Design {
  readonly kind: 'none' | 'follower' | 'common-cathode';
  readonly tubeId: string;
  readonly ra: number;
  readonly rk: number;
  readonly rg: number;
  /** A follower's coupling capacitor, leak and grid bias; absent (or undefined): direct-coupled to the plate. */
  readonly coupling?: FollowerCoupling;
  /** A follower's grid stopper at its socket, Ω; 0 or absent: none. */
  readonly rstopper?: number;
}

/** Everything the screen shows that the model derives from a design (see analyzeStage). */
export type Analysis = StageAnalysis;

/**
 * The bench's stage analysed by the model (analyzeStage): the store only
 * looks the tubes up and names the stages. `extent` pins the chart window,
 * as while B+ is being dragged; `light` is a drag's frame.
 */
export function analyze(design: BenchDesign, registry: TubeRegistry, prev: Analysis | null, extent?: PlateExtent, light = false, maxCurves = MAX_FAMILY_CURVES): ({ ok: true } & Analysis) | Failure {
  const tube = registry.lookup(design.tubeId);
  if (!tube) return { ok: false, reason: 'invalid-tube', message: `No tube called “${design.tubeId}” in the library or among your own`, field: 'tube' };
  const source = benchSource(design, registry);
  if (!source.ok) return source;
  return analyzeStage(stageDesignOf(design, tube, registry), { second: secondLink(design, registry), levels: { levelRms: design.levelRms, thdLimit: design.thdLimit }, ...(extent ? { extent } : {}), light, maxCurves }, prev);
}

/** The bench's second stage as the model's link: its follower, or a gain stage kept from a design before version 3. */
function secondLink(d: BenchDesign, registry: TubeRegistry): ChainLink | null {
  const s2 = d.stage2;
  const tube = registry.lookup(s2.tubeId);
  if (s2.kind === 'none' || !tube) return null;
  // The second stage drives the next gain stage's grid, or the amplifier's own load.
  const { rl } = loadAfterBench(d);
  if (s2.kind === 'follower') return { kind: 'follower', tube, bplus: d.bplus, rk: s2.rk, rl, ...(s2.coupling ? { coupling: s2.coupling } : {}), ...(s2.rstopper ? { rstopper: s2.rstopper } : {}), ...heaterField(d.heaters) };
  return { kind: 'common-cathode', tube, bplus: d.bplus, ra: s2.ra, rk: s2.rk, rg: s2.rg, bypassed: true, rl };
}

/**
 * The model's stage design for the bench's stage, with its signal parts: fed
 * by the source or the stage before it, loaded by its follower, the next
 * stage's grid, or the amplifier's own load.
 */
export function stageDesignOf(d: BenchDesign, tube: TubeRecord, registry: TubeRegistry): StageDesign & { readonly tube: TubeRecord } {
  // With a second stage, RL and Cout belong to the end of the chain; stage 1 drives stage 2.
  const chained = d.stage2.kind !== 'none';
  const after = loadAfterBench(d);
  const load = !chained ? after.rl : d.stage2.kind === 'follower' ? (d.stage2.coupling?.rg ?? Infinity) : d.stage2.rg;
  const source = benchSource(d, registry);
  return {
    tube,
    bplus: d.bplus,
    ra: d.ra,
    rk: d.rk,
    bypassed: d.bypassed,
    rl: load,
    rg: d.rg,
    rsource: source.ok ? source.ohms : d.rsource,
    ...(d.rstopper ? { rstopper: d.rstopper } : {}),
    // A pot needs the coupling capacitor before it, as in the chain (a stage direct from the source has no leak there).
    ...(d.volume !== null && d.cin !== null ? { volume: volumeShare(d.volume) } : {}),
    ...(d.cin !== null ? { cin: d.cin } : {}),
    ...(d.bypassed && d.ck !== null && d.rk > 0 ? { ck: d.ck } : {}),
    ...(after.cout !== null && !chained ? { cout: after.cout } : {}),
    ...heaterField(d.heaters),
  };
}
