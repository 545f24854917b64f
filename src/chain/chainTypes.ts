import type { ChainNoise } from './chainNoise';
import type { OutputDesign } from '../output/outputDesign';
import type { PushPullDesign } from '../pushpull/pushPullDesign';
import type { OutputTube } from '../output/outputTube';
import type { StageFinding } from '../stage/stageFindings';
import type { TubeLike } from '../tube/types';
import type { Level } from '../signal/levels';

/**
 * An amplifier as a chain of stages, input jack to speaker. SI units
 * throughout. Each stage names how its grid is fed from the output before it
 * (the source, for the first stage): through a coupling capacitor into a grid
 * leak, or directly (the grid at the previous output's DC voltage).
 */
export type Coupling = CapacitorCoupling | DirectCoupling;

export interface CapacitorCoupling {
  readonly kind: 'capacitor';
  /** Coupling capacitor, F. */
  readonly cc: number;
  /** Grid leak to ground (or to the stage's own bias), Ω. */
  readonly rg: number;
}

export interface DirectCoupling {
  readonly kind: 'direct';
}

/** A common-cathode triode stage: plate resistor, cathode resistor (bypassed or not) and/or a fixed grid bias. */
export interface CommonCathodeLink {
  readonly kind: 'common-cathode';
  readonly tube: TubeLike;
  /** The supply node at the top of Ra, V. */
  readonly bplus: number;
  readonly ra: number;
  readonly rk: number;
  readonly bypassed: boolean;
  /** Cathode bypass capacitor, F; absent with `bypassed` means an ideal one. */
  readonly ck?: number;
  /** Fixed grid bias to ground through the grid leak, V (capacitor coupling only); default 0. */
  readonly vbias?: number;
  /** DC potential of the heater to ground, V; default 0. */
  readonly heaterVolts?: number;
  /** Grid stopper, Ω, between the grid leak and the grid (at the socket); default 0, none. */
  readonly rstopper?: number;
  /**
   * A volume control in place of the grid leak (capacitor coupling only):
   * the leak is the pot's track and the grid hangs from its wiper, which
   * passes this share of the track's signal, above 0 up to 1 (full); absent,
   * the leak is a fixed resistor.
   */
  readonly volume?: number;
  readonly coupling: Coupling;
}

/** A cathode follower: plate at its B+, output at the cathode across Rk. */
export interface FollowerLink {
  readonly kind: 'follower';
  readonly tube: TubeLike;
  readonly bplus: number;
  readonly rk: number;
  /** Grid DC voltage to ground with capacitor coupling (a divider or bias supply through the grid leak), V; default 0. */
  readonly vbias?: number;
  readonly heaterVolts?: number;
  /** Grid stopper, Ω, between what feeds the grid (the coupling's leak, or the plate before) and the grid, at the socket; default 0, none. */
  readonly rstopper?: number;
  readonly coupling: Coupling;
}

/** A single-ended, transformer-coupled output stage (the parts of OutputDesign; its grid resistor is the coupling's grid leak). */
export interface SingleEndedLink extends Omit<OutputDesign, 'tubeId' | 'rg'> {
  readonly kind: 'single-ended-output';
  readonly tube: OutputTube;
  /** Cathode bypass capacitor, F (cathode bias); absent means an ideal one. */
  readonly ck?: number;
  readonly coupling: Coupling;
}

/**
 * A split-load (cathodyne) phase splitter: one triode, its plate load Ra to
 * B+ and its cathode load Rk to ground. The chain goes on from the plate
 * (inverted); the cathode's output, in phase, drives the push-pull stage's
 * other grid. Its grid sits at the plate before it (direct coupling) or at
 * `vbias` through its leak (a divider).
 */
export interface SplitLoadLink {
  readonly kind: 'split-load';
  readonly tube: TubeLike;
  readonly bplus: number;
  readonly ra: number;
  readonly rk: number;
  /** Grid DC voltage to ground with capacitor coupling, V; default 0. */
  readonly vbias?: number;
  readonly heaterVolts?: number;
  /** Grid stopper, Ω, between what feeds the grid (the coupling's leak, or the plate before) and the grid, at the socket; default 0, none. */
  readonly rstopper?: number;
  readonly coupling: Coupling;
}

/**
 * A long-tailed pair phase splitter: two triodes with plate resistors Ra
 * (and Ra2 for the second, to trim the balance), cathodes joined into a
 * shared bias resistor Rk over a tail resistor to ground, the second grid at
 * signal ground through a capacitor, both grids at one DC voltage. The chain
 * goes on from the first plate (inverted); the second plate's output, in
 * phase, drives the push-pull stage's other grid.
 */
export interface LongTailedPairLink {
  readonly kind: 'long-tailed-pair';
  readonly tube: TubeLike;
  readonly bplus: number;
  readonly ra: number;
  /** The second plate's resistor, Ω; default Ra. */
  readonly ra2?: number;
  readonly rk: number;
  readonly rtail: number;
  /** The held (second) grid's leak to the first grid's DC, Ω, when the first is direct-coupled; it carries no signal, so only the parts list reads it. */
  readonly heldGridLeak?: number;
  /** Both grids' DC voltage with capacitor coupling, V; default 0. */
  readonly vbias?: number;
  readonly heaterVolts?: number;
  /** Grid stopper, Ω, at the first (driven) grid's socket, between what feeds it and the grid; default 0, none. */
  readonly rstopper?: number;
  readonly coupling: Coupling;
}

/**
 * A push-pull output stage (the parts of PushPullDesign; each grid's
 * resistor is the coupling's grid leak). It follows a phase splitter: its
 * first grid takes the chain's signal, its second the splitter's other
 * output. Its output is the speaker's voltage, phased as the first plate.
 */
export interface PushPullLink extends Omit<PushPullDesign, 'tubeId' | 'rg'> {
  readonly kind: 'push-pull-output';
  readonly tube: OutputTube;
  readonly coupling: Coupling;
}

export type ChainStage = CommonCathodeLink | FollowerLink | SingleEndedLink | SplitLoadLink | LongTailedPairLink | PushPullLink;

/** Stages with two outputs in antiphase. */
export const SPLITTER_KINDS: readonly StageKindName[] = ['split-load', 'long-tailed-pair'];
/** Stages that drive the speaker, and so come last. */
export const OUTPUT_KINDS: readonly StageKindName[] = ['single-ended-output', 'push-pull-output'];
export type StageKindName = ChainStage['kind'];

export interface ChainInput {
  readonly source: { readonly rsource: number };
  readonly stages: readonly ChainStage[];
  /**
   * A load on the last stage's output, Ω (a line input, say), through its
   * coupling capacitor `cc`, F (an ideal one when absent); none when absent.
   */
  readonly load?: { readonly rl: number; readonly cc?: number };
}

/** What ends a stage's clean swing. */
export type ClipCause = 'grid-current' | 'cutoff';

/**
 * What a meter reads from chassis to each of a stage's electrodes at idle,
 * V: the figures to check at first switch-on. The grid is the cathode plus
 * the grid's bias; a screen (an output tube's) and a second plate (a
 * long-tailed pair's, with its current) are null where the stage has none;
 * a push-pull pair's are its first tube's.
 */
export interface StagePins {
  readonly plate: number;
  readonly cathode: number;
  readonly grid: number;
  readonly screen: number | null;
  readonly plate2: number | null;
  /** The second plate's current, A (a long-tailed pair's second triode); null where there is none. */
  readonly plate2Current: number | null;
}

export interface StageResult {
  readonly kind: StageKindName;
  /** DC operating point: plate and cathode to ground, plate current, grid to cathode (V, V, A, V). */
  readonly op: { readonly va: number; readonly vk: number; readonly ia: number; readonly vgk: number };
  /** DC voltage of the stage's output (plate, or cathode for a follower), V: what a direct-coupled grid after it sits at. */
  readonly outputDc: number;
  /** Each electrode's DC voltage to ground at idle (the figures a meter checks). */
  readonly pins: StagePins;
  /** DC current drawn from the stage's B+ node, A. */
  readonly supplyCurrent: number;
  /** An output stage's average current driven to its own clean limit, A (the supply's full-power load). */
  readonly fullPowerCurrent?: number;
  /** Small-signal midband gain into the load the next stage really presents, signed (an output stage: plate-phased, to the speaker). */
  readonly gain: number;
  /** Midband input impedance at the grid, Ω; null for a direct-coupled grid, which has no leak and draws no current below 0 V. */
  readonly zin: number | null;
  /** Output impedance, Ω (at the speaker for an output stage), the load excluded. */
  readonly zout: number;
  /** The input peak (at the amplifier's input) at which this stage's own swing ends, V, and what ends it; null when it never does within the search. */
  readonly clipsAt: { readonly inputPeak: number; readonly by: ClipCause } | null;
  /** dB between the amplifier's clean limit and this stage's own; 0 for the stage that clips first; null when it never clips. */
  readonly headroomDb: number | null;
  readonly findings: readonly StageFinding[];
}

export interface ChainResult {
  readonly stages: readonly StageResult[];
  /** Overall midband voltage gain from the source's open-circuit voltage to the output, signed. */
  readonly gain: number;
  readonly inverting: boolean;
  /** −3 dB points of the whole chain (every coupling network, bypass, Miller capacitance and the source impedance), Hz; null when flat past 0.01 Hz or 100 MHz. */
  readonly lowHz: number | null;
  readonly highHz: number | null;
  /** The amplifier's own white noise over 20 Hz to 20 kHz (chainNoise): at the output, referred to the source, and A-weighted at the output; null when it cannot be found. */
  readonly noise: ChainNoise | null;
  readonly clipsFirst: { readonly stage: number; readonly by: ClipCause };
  /** The largest clean input peak and the output peak there, V. */
  readonly inputPeak: number;
  readonly outputPeak: number;
  readonly input: Level;
  readonly output: Level;
  /** Power into the speaker at the clean limit (at the fundamental), W, for a chain ending in an output stage; else null. */
  readonly outputPower: number | null;
  /** The speaker's rms voltage at that power (the fundamental's), V; null without an output stage. */
  readonly speakerRms: number | null;
  /** Every stage's findings, each tagged with its stage, most severe first. */
  readonly findings: readonly StageFinding[];
}
