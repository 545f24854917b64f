import type { KorenPentodeParams } from '../tube/pentode';
import type { Capacitances, HeaterOption, TubeRecord } from '../tube/types';

/**
 * How the screen grid is wired:
 * - pentode: screen at a fixed supply voltage;
 * - triode: screen tied to the plate (the two act as one anode);
 * - ultralinear: screen fed from a tap on the output transformer's primary,
 *   so it follows the plate by that fraction of the swing.
 * A power triode has no screen and is always 'triode'.
 */
export type Connection = 'pentode' | 'triode' | 'ultralinear';

export const CONNECTIONS: readonly Connection[] = ['pentode', 'triode', 'ultralinear'];

/** The characteristic law of an output tube: Koren's pentode law, or a library triode. */
export type OutputLaw =
  | { readonly kind: 'pentode'; readonly params: KorenPentodeParams }
  | { readonly kind: 'triode'; readonly tube: TubeRecord };

export interface PowerRatings {
  readonly maxPlateVoltage: number;
  readonly maxPlateDissipation: number;
  /** null for a triode (no screen). */
  readonly maxScreenVoltage: number | null;
  readonly maxScreenDissipation: number | null;
  readonly maxCathodeCurrent?: number;
  /** Cathode positive to the heater (or either polarity); null for a directly heated tube. */
  readonly maxHeaterCathodeVoltage: number | null;
  /** Cathode negative to the heater, where the sheet rates that polarity apart. */
  readonly maxHeaterCathodeVoltageCathodeNegative?: number;
  readonly maxGridResistanceCathodeBias?: number;
  readonly maxGridResistanceFixedBias?: number;
  readonly source: string;
}

/** A datasheet's single-ended class A1 operating example. SI units. */
export interface SingleEndedExample {
  readonly connection: Connection;
  readonly va: number;
  /** Screen voltage (pentode connection only). */
  readonly vg2?: number;
  readonly vg1: number;
  /** Zero-signal plate current, A. */
  readonly ia: number;
  readonly ig2?: number;
  /** Plate load (reflected primary impedance), Ω. */
  readonly load: number;
  /** Output power at full drive (grid to 0 V peak), W. */
  readonly power: number;
  /** Total harmonic distortion at that power, as a fraction. */
  readonly thd: number;
  readonly source: string;
}

export interface OutputTube {
  readonly kind: 'output-tube';
  readonly id: string;
  readonly description: string;
  readonly construction: 'pentode' | 'beam tetrode' | 'power triode';
  readonly law: OutputLaw;
  /** Where the law's constants come from and what they were checked against. */
  readonly lawSource: string;
  readonly heater: HeaterOption;
  readonly ratings: PowerRatings;
  readonly capacitances: Capacitances;
  readonly singleEnded: readonly SingleEndedExample[];
}

export function connectionsOf(tube: OutputTube): readonly Connection[] {
  return tube.law.kind === 'triode' ? ['triode'] : CONNECTIONS;
}

/** Freezes a library record; the spec type checks each field as it is written. */
export function defineOutputTube(spec: Omit<OutputTube, 'kind'>): OutputTube {
  return Object.freeze({ kind: 'output-tube', ...spec });
}
