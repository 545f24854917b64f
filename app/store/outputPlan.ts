import type { OutputDesign, PushPullDesign } from '../../src/index';

/** One tube on a gapped transformer, or a pair in antiphase on a centre-tapped one. */
export type OutputPair = 'single-ended' | 'push-pull';

/**
 * The output stage as the design holds it: the single-ended stage's values,
 * plus the push-pull pair's own. Both loads are kept (zPrimary for one
 * tube, raa for the pair) so switching between them loses nothing.
 */
/**
 * The phase splitter that drives a push-pull pair, fed from the last voltage
 * stage through Cout into its grid leak (RL, kept equal to `rg`), its grid
 * held at `vgrid` by a divider behind the leak, each output coupled to a
 * pair grid through `cc`. The values of both kinds are kept, so switching
 * loses nothing.
 */
export interface SplitterPlan {
  readonly kind: 'split-load' | 'long-tailed-pair';
  readonly tubeId: string;
  readonly bplus: number;
  /** Plate resistor (the first plate's, for the long-tailed pair), Ω. */
  readonly ra: number;
  /** The long-tailed pair's second plate resistor, Ω (a little larger trims the balance). */
  readonly ra2: number;
  /** Split-load: the cathode load to ground; long-tailed pair: the shared bias resistor over the tail, Ω. */
  readonly rk: number;
  /** The long-tailed pair's tail resistor to ground, Ω. */
  readonly rtail: number;
  /** The grid's (both grids') DC voltage from the divider, V. */
  readonly vgrid: number;
  /** Grid leak, Ω: the load the last voltage stage drives. */
  readonly rg: number;
  /** Each output's coupling capacitor into a pair grid, F. */
  readonly cc: number;
  /** How its grid is fed: through Cout into its leak (held at `vgrid` by a divider), or direct from the last voltage stage's plate. */
  readonly coupling: 'capacitor' | 'direct';
  /** Its grid stopper at the (driven) grid's socket, Ω; 0 or absent: none. */
  readonly rstopper?: number;
}

export type SplitterKind = SplitterPlan['kind'];

/** Each splitter kind in the builder's words, as every panel, title and list names it. */
const SPLITTER_KIND_WORDS: Record<SplitterKind, string> = { 'split-load': 'split-load', 'long-tailed-pair': 'long-tailed pair' };

/** A splitter by its tube and kind: "12AU7 split-load", "12AU7 long-tailed pair". */
export const splitterName = (sp: Pick<SplitterPlan, 'tubeId' | 'kind'>) => `${sp.tubeId} ${SPLITTER_KIND_WORDS[sp.kind]}`;

/**
 * The splitter a pair starts with (our own values, E12/E24): a 12AU7
 * split-load stage with 22 kΩ plate and cathode loads, its grid at 90 V, fed
 * through 1 MΩ and coupled out through 100 nF; as a long-tailed pair, 33 kΩ
 * and 36 kΩ plates, 470 Ω over a 10 kΩ tail, grids at 60 V.
 */
export const DEFAULT_SPLITTER: SplitterPlan = { kind: 'split-load', tubeId: '12AU7', bplus: 330, ra: 22e3, ra2: 36e3, rk: 22e3, rtail: 10e3, vgrid: 90, rg: 1e6, cc: 100e-9, coupling: 'capacitor' };

/** Each kind's own values where the two differ (switching kinds sets them; both are typical of their kind). */
export const LONG_TAILED_START = { ra: 33e3, ra2: 36e3, rk: 470, rtail: 10e3, vgrid: 60 } as const;
export const SPLIT_LOAD_START = { ra: DEFAULT_SPLITTER.ra, rk: DEFAULT_SPLITTER.rk, vgrid: DEFAULT_SPLITTER.vgrid } as const;

export interface OutputPlan extends OutputDesign {
  readonly pair: OutputPair;
  /** The splitter before the pair (used when the pair is push-pull and driven by the voltage stages). */
  readonly splitter: SplitterPlan;
  /** Plate-to-plate load of the pair's transformer, Ω. */
  readonly raa: number;
  /** The second tube's gm (its current at every voltage) above the first's, a fraction; 0 for a matched pair. */
  readonly mismatch: number;
  /** The second tube's idle current above the first's after the bias, a fraction (0: each side trimmed to the same idle). */
  readonly idleMismatch: number;
}

/**
 * What a design without the pair's values (files before them, the single-ended
 * demo) takes: a plate-to-plate load of twice the single-ended primary, the
 * usual step from one tube to a class AB pair of the same type (common
 * practice), and a matched pair.
 */
export function pairDefaults(zPrimary: number): Pick<OutputPlan, 'pair' | 'raa' | 'mismatch' | 'idleMismatch' | 'splitter'> {
  return { pair: 'single-ended', raa: Number((2 * zPrimary).toPrecision(2)), mismatch: 0, idleMismatch: 0, splitter: DEFAULT_SPLITTER };
}

/** True when the splitter before a driven pair takes its grid straight from the last voltage stage's plate. */
export const splitterDirect = (d: { readonly drivesOutput: boolean; readonly output: OutputPlan }) => drivesPair(d) && d.output.splitter.coupling === 'direct';

/** True when the voltage stages drive a push-pull pair (through its splitter). */
export const drivesPair = (d: { readonly drivesOutput: boolean; readonly output: OutputPlan }) => d.drivesOutput && d.output.pair === 'push-pull';
/** Output tubes in each channel: two for a push-pull pair, one single-ended. */
export const outputTubesPerChannel = (o: OutputPlan) => (o.pair === 'push-pull' ? 2 : 1);

/** The pair's design for the model: the shared values, its own load and mismatch (the single-ended primary is not its). */
export function pushPullDesignOf(o: OutputPlan): PushPullDesign {
  const { pair: _pair, zPrimary: _z, splitter: _s, mismatch, idleMismatch, ...pp } = o;
  return { ...pp, mismatch: { gm: mismatch, idle: idleMismatch } };
}

/** What decides where a driven output stage's screens are fed: the supply's plan, whether the stage is driven, its connection. */
type ScreensFedBy = { readonly supply: { readonly on: boolean; readonly feeds: { readonly screens?: number } }; readonly drivesOutput: boolean; readonly output: OutputPlan };

/**
 * True when the supply feeds the driven output stage's screens from a node
 * of their own: the amplifier is solved on the supply, the stage is
 * pentode-connected, and the plan names that node.
 */
export const screensOnNode = (d: ScreensFedBy) => d.supply.on && d.drivesOutput && d.output.connection === 'pentode' && d.supply.feeds.screens !== undefined;

/** The output design with its screens marked as fed from their node when the supply feeds them (no dropper, no note asking for one). */
export const outputOnSupply = <O extends OutputPlan>(d: ScreensFedBy, output: O): O => (screensOnNode(d) ? { ...output, screenFromNode: true } : output);
