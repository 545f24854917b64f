import type { OutputDesign, PushPullDesign } from '../../src/index';

/** One tube on a gapped transformer, or a pair in antiphase on a centre-tapped one. */
export type OutputPair = 'single-ended' | 'push-pull';

/**
 * The output stage as the design holds it: the single-ended stage's values,
 * plus the push-pull pair's own. Both loads are kept (zPrimary for one
 * tube, raa for the pair) so switching between them loses nothing.
 */
export interface OutputPlan extends OutputDesign {
  readonly pair: OutputPair;
  /** Plate-to-plate load of the pair's transformer, Ω. */
  readonly raa: number;
  /** The second tube's current (and gm) above the first's, a fraction; 0 for a matched pair. */
  readonly mismatch: number;
}

/**
 * What a design without the pair's values (files before them, the single-ended
 * demo) takes: a plate-to-plate load of twice the single-ended primary, the
 * usual step from one tube to a class AB pair of the same type (common
 * practice), and a matched pair.
 */
export function pairDefaults(zPrimary: number): Pick<OutputPlan, 'pair' | 'raa' | 'mismatch'> {
  return { pair: 'single-ended', raa: Number((2 * zPrimary).toPrecision(2)), mismatch: 0 };
}

/** The pair's design for the model: the shared values, its own load and mismatch (the single-ended primary is not its). */
export function pushPullDesignOf(o: OutputPlan): PushPullDesign {
  const { pair: _pair, zPrimary: _z, ...pp } = o;
  return pp;
}
