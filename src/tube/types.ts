/**
 * Koren's triode parameters (N. Koren, "Improved vacuum tube models for SPICE
 * simulations", Glass Audio vol. 8 no. 5/6, 1996). All dimensionless except
 * kvb, in V², and kg1, which sets the current scale (A⁻¹·V^ex).
 */
export interface KorenTriodeParams {
  /** Amplification factor, > 0. */
  readonly mu: number;
  /** Exponent of the 3/2-power law as fitted, physical range about 1.1 to 1.8. */
  readonly ex: number;
  /** Current scale; plate current is 2·E1^ex / kg1. */
  readonly kg1: number;
  /** Shapes the knee near cutoff (V⁻¹·V, dimensionless in Koren's form). */
  readonly kp: number;
  /** Bends the curves at low plate voltage, in V². */
  readonly kvb: number;
}

/** A triode model usable wherever a library tube is. */
export interface TriodeModel {
  readonly kind: 'triode-model';
  readonly params: KorenTriodeParams;
  /**
   * Grid-to-cathode resistance of the positive-grid region in Ω, used by the
   * grid-current law (see tube/gridCurrent.ts). Koren's table gives
   * 2 kΩ for small-signal triodes and 1 kΩ for power triodes.
   */
  readonly gridResistance: number;
}

export type HeaterWiring = 'parallel' | 'series' | 'single';

export interface HeaterOption {
  readonly wiring: HeaterWiring;
  readonly volts: number;
  readonly amps: number;
  readonly source?: string;
}

export interface TubeRatings {
  /** Maximum DC plate voltage, V. */
  readonly maxPlateVoltage: number;
  /** Maximum plate dissipation per section, W. */
  readonly maxPlateDissipation: number;
  /**
   * Maximum heater–cathode voltage, V, with the cathode positive to the heater
   * (or either polarity where the sheet gives one figure); null for directly
   * heated tubes (the filament is the cathode).
   */
  readonly maxHeaterCathodeVoltage: number | null;
  /** The rating with the cathode negative to the heater, V, where the sheet rates that polarity apart. */
  readonly maxHeaterCathodeVoltageCathodeNegative?: number;
  /** Maximum grid-circuit resistance with cathode bias, Ω, where the datasheet gives one. */
  readonly maxGridResistanceCathodeBias?: number;
  /** Maximum grid-circuit resistance with fixed bias, Ω, where the datasheet gives one. */
  readonly maxGridResistanceFixedBias?: number;
  /** Maximum cathode current, A, where the datasheet gives one. */
  readonly maxCathodeCurrent?: number;
  /** Where the ratings come from, with the rating system where known. */
  readonly source: string;
}

/** Interelectrode capacitances in farads (unshielded where the sheet gives both). */
export interface Capacitances {
  readonly cgk: number;
  readonly cgp: number;
  readonly cpk: number;
  readonly source: string;
}

/** A datasheet's typical operating point. SI units; mu, rp and gm where published. */
export interface TypicalPoint {
  readonly va: number;
  readonly vg: number;
  readonly ia: number;
  readonly mu?: number;
  readonly rp?: number;
  readonly gm?: number;
  readonly source: string;
}

/** How the Koren parameters were obtained, and how well they reproduce the typical points. */
export interface FitProvenance {
  readonly method: string;
  /** RMS of the relative errors over every published figure (Ia, mu, rp, gm at each typical point), in %. */
  readonly rmsPercent: number;
  /** The worst single figure, e.g. "rp at 100 V/-1 V: +12.3 %". */
  readonly worst: string;
  /** The other candidate that was weighed, with its own RMS, when there was one. */
  readonly rejected?: string;
  /** Over the points read from the plate curves (`TubeRecord.curves`), when the fit used them: RMS of the current's relative errors, %, and the worst point. */
  readonly curveRmsPercent?: number;
  readonly curveWorst?: string;
}

/** Points read from a tube's published plate-curve family, and whose reading they are. */
export interface CurveReadings {
  /** The sheet, and who read the points off it. */
  readonly source: string;
  readonly points: readonly { readonly va: number; readonly vg: number; readonly ia: number }[];
}

export interface TubeRecord {
  readonly kind: 'tube';
  readonly id: string;
  readonly description: string;
  readonly model: TriodeModel;
  readonly fit: FitProvenance;
  readonly directlyHeated: boolean;
  /** Triode sections in one envelope (2 for a twin triode); 1 when absent. Two stages can share a twin's envelope and heater. */
  readonly sections?: 1 | 2;
  readonly heaters: readonly HeaterOption[];
  readonly ratings: TubeRatings;
  readonly capacitances: Capacitances;
  readonly typical: readonly TypicalPoint[];
  /** Points read from its published plate curves, where the fit used them (#18: fits to whole curves, not one point). */
  readonly curves?: CurveReadings;
  /** True for tubes a user made (custom fits); library tubes are false. */
  readonly userMade?: boolean;
}

/** Anything a solver accepts as "the tube": a library record or a bare model. */
export type TubeLike = TubeRecord | TriodeModel;

export function modelOf(tube: TubeLike): TriodeModel {
  return tube.kind === 'triode-model' ? tube : tube.model;
}

export function recordOf(tube: TubeLike): TubeRecord | null {
  return tube.kind === 'triode-model' ? null : tube;
}
