import { triode } from './triode';
import type { FitProvenance, KorenTriodeParams, TubeRecord } from './types';

/** What a library file states about one tube; defineTube turns it into a record. */
export interface TubeSpec extends Omit<TubeRecord, 'kind' | 'model'> {
  readonly params: KorenTriodeParams;
  /** Ω; Koren's table gives 2 kΩ for small-signal and 1 kΩ for power triodes. */
  readonly gridResistance: number;
  readonly fit: FitProvenance;
}

export function defineTube(spec: TubeSpec): TubeRecord {
  const { params, gridResistance, ...rest } = spec;
  return Object.freeze({ kind: 'tube', model: triode(params, gridResistance), ...rest });
}
