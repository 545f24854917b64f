import type { Failure, Result } from '../result';
import type { Capacitances } from '../tube/types';
import type { Finding } from '../stage/ratingBands';
import type { ChainStage } from './chainTypes';

/**
 * The stage linearised at its operating point, for the chain's nodal
 * analysis: a current source gm·vgk and rp between plate and cathode, the
 * interelectrode capacitances, and the parts from plate and cathode to
 * signal ground.
 */
export interface LinearStage {
  readonly gm: number;
  readonly rp: number;
  /** Plate to signal ground, Ω; 0 when the plate is at signal ground (a follower's, on its B+). */
  readonly plateLoad: number;
  /** Cathode to ground, Ω; 0 when the cathode is grounded. */
  readonly rk: number;
  /** A real bypass capacitor across Rk, F, or null. */
  readonly ck: number | null;
  /** An ideal bypass: the cathode at signal ground. */
  readonly cathodeGrounded: boolean;
  /** Transconductance of current that enters the cathode but not the plate's load (a screen's, fed from its own supply or the tap), S; 0 for a triode. */
  readonly gScreen: number;
  /**
   * A screen whose voltage moves with a node (an ultralinear tap, with the
   * plate's supply node; a pentode's screen on a node of its own): its
   * voltage is (1 − x)·vS + x·vp, vS that node's, and of its current the
   * share x couples as the plate's (through the tap's turns) and the rest is
   * drawn from the node. The slopes a pentode's currents take on it, S:
   * `plateByScreen` the plate current's, `screenByPlate`, `screenByScreen`
   * the screen current's on the plate and on its own voltage. gm, rp and
   * gScreen stand for the node held at signal ground with the cathode;
   * these carry the rest. Absent: the screen at signal ground.
   */
  readonly screen?: { readonly x: number; readonly plateByScreen: number; readonly screenByPlate: number; readonly screenByScreen: number };
  readonly caps: Capacitances;
  /** Where the signal leaves the stage. */
  readonly output: 'plate' | 'cathode';
  /** Output voltage over the output node's voltage: 1, or an output transformer's turns ratio (secondary over primary). */
  readonly outputScale: number;
  /**
   * An output transformer with its inductances given: in place of the plate
   * load, the primary's resistance, then its leakage split either side of its
   * magnetising inductance (the coupled windings' T), into the reflected
   * load; the output is the reflected load's voltage times `scale`. Absent:
   * the transformer is ideal and `plateLoad` and `outputScale` stand.
   */
  readonly winding?: LinearWinding | null;
  /** A phase splitter's second output, in antiphase: a split-load's cathode, or a long-tailed pair's second plate. */
  readonly output2?: 'cathode' | 'second';
  /**
   * A long-tailed pair's second triode, its grid at signal ground and its
   * cathode the first's (the node `rk`, then the tail alone, runs from):
   * driven by the cathode, its plate the second output.
   */
  readonly second?: { readonly gm: number; readonly rp: number; readonly plateLoad: number };
  /**
   * A push-pull pair, in its half circuit: where the stage before gives a
   * second output, the second tube's grid follows it through its own
   * coupling and each grid moves the plate by half the transconductance
   * (the plates in antiphase, as a centre-tapped primary holds them);
   * otherwise the first grid alone, with the whole of it. `gm` is then the
   * transconductance that gives the stage's midband gain with both grids
   * driven as its splitter drives them.
   */
  readonly pair?: { readonly gm: number };
}

/** An output transformer in the linear network, each value as the stage's plate sees it (a push-pull pair's halved for its half circuit). */
export interface LinearWinding {
  readonly rSeries: number;
  readonly reflected: number;
  /** Magnetising inductance, H, or null (ideal). */
  readonly lm: number | null;
  /** Leakage inductance, H, or null (none). */
  readonly ll: number | null;
  readonly scale: number;
}

/** One instant of the stage's large-signal response, written in place (the chain solves thousands a waveform). */
export interface LinkSample {
  /** Output less its quiescent value, V. */
  vout: number;
  vgk: number;
  /** The current whose fall marks cutoff (plate current; the primary's for an output stage), A. */
  ia: number;
  /** A phase splitter's second output (in antiphase to `vout`) less its quiescent value, V; 0 for other stages. */
  vout2: number;
}

/** A transformer primary's magnetising current as the chain settles it, A. */
export interface MagnetisingState {
  /** The current the next sample is solved with. */
  value: number;
  /** The last sample's coupled current. */
  coupled: number;
  /** A first guess for the next sample's coupled current (the same instant's in the last trial), or undefined. */
  near: number | undefined;
  /** Its value at idle. */
  readonly idle: number;
  /** Where the last cycle settled it: the next cycle's first guess. */
  guess: number;
  /** Set while the chain reads only the grid's swing (a settled cycle's first pass): `sample` then writes `vgk` alone. */
  gridOnly: boolean;
  /** How closely a cycle's average must meet it. */
  readonly tol: number;
}

/** A stage solved with the load the next stage puts on it. */
export interface SolvedLink {
  readonly op: { readonly va: number; readonly vk: number; readonly ia: number; readonly vgk: number };
  readonly outputDc: number;
  /** DC current the stage draws from its supply, A (an output stage's screens included). */
  readonly supplyCurrent: number;
  /** DC voltages to ground at idle beyond the op's plate, cathode and grid, V: an output tube's screen, a long-tailed pair's second plate (and its current, A). */
  readonly pins?: { readonly screen?: number; readonly plate2?: number; readonly plate2Current?: number };
  /** A pentode-connected output stage's screens' share of supplyCurrent at idle, A (what a node of their own carries); absent for other stages. */
  readonly screenCurrent?: number;
  /** Their share of fullPowerCurrent, A: the screens' average driven to the stage's clean limit (they take more as the plates swing low). */
  readonly fullPowerScreenCurrent?: number;
  /** For an output stage, the average current it draws driven to its own clean limit (its cathodes', screens included), A (what sags the supply at full power); a voltage stage leaves it out (class A: its average hardly moves). */
  readonly fullPowerCurrent?: number;
  readonly gain: number;
  /** A phase splitter's second output over its first at midband (negative: in antiphase); absent for other stages. */
  readonly antiphase?: number;
  readonly zin: number;
  readonly zout: number;
  /**
   * The stage at a grid swing vin from its bias (midband: the capacitors hold
   * their DC voltages). A push-pull stage also takes `vin2`, the splitter's
   * second output, on its other grid.
   */
  readonly sample: (vin: number, out: LinkSample, vin2?: number) => void;
  /** Below this current the stage is cut off, A. */
  readonly cutoffCurrent: number;
  /**
   * A single-ended output stage's primary, whose magnetising current a
   * sustained drive settles at the cycle's average coupled current
   * (steadyState.ts): `sample` reads the stage with `magnetising.value` and
   * leaves the instant's coupled current in `magnetising.coupled`.
   * ChainSignal.cycle settles it for each cycle and puts it back to idle.
   */
  readonly magnetising?: MagnetisingState;
  /**
   * The grid's swing below its bias at which the stage cuts off, read in the
   * steady state of a sine of that peak (a single-ended output stage's own
   * clean limit); null when grid current comes first. Absent: cutoff is read
   * at the instant, by `cutoffCurrent`.
   */
  readonly cutoffSwing?: number | null;
  /**
   * The grid voltage (to its cathode) where the stage's clean swing ends, V:
   * the onset of grid current for a voltage stage (GRID_CURRENT_ONSET);
   * 0 V for an output stage, whose data-sheet figures are taken with the
   * grid driven to 0 V (class A1). Absent means the onset.
   */
  readonly gridLimit?: number;
  /**
   * The current the stage's signal grid draws at a grid–cathode voltage, A
   * (see gridCurrent): the chain solves it through the impedance driving that
   * grid, so a stage driven past its clean limit compresses as a real one
   * does. Absent for a stage whose grid current the chain does not follow
   * (a push-pull pair's two grids, a long-tailed pair's held second grid).
   */
  readonly gridLaw?: (vgk: number) => number;
  readonly findings: readonly Finding[];
  readonly linear: LinearStage;
}

/** Where a stage sits in the chain: what feeds its grid at DC, and what loads its output at midband. */
export interface LinkEnv {
  /** With direct coupling, the DC voltage of the output before it (0 V for the source); null with a coupling capacitor. */
  readonly gridDc: number | null;
  /** Midband load on the output: the next grid's input impedance, or the amplifier's load, Ω (Infinity for none). */
  readonly load: number;
  /** After a phase splitter: its second output over its first (what the push-pull stage's other grid gets). */
  readonly antiphase?: number;
}

/**
 * What every kind of stage provides to the chain. Push-pull stages and phase
 * splitters join through the same interface.
 */
export interface StageKind<S extends ChainStage> {
  readonly kind: S['kind'];
  /** The stage's design checked on its own: the first field that cannot be used, or null. */
  check(stage: S): Failure | null;
  /** Midband input impedance at the grid, Ω, set by the coupling alone. */
  inputImpedance(stage: S): number;
  solve(stage: S, env: LinkEnv): Result<SolvedLink>;
}
