import { findTube, type TubeRecord } from '../../src/index';

/**
 * Every tube the bench can use: the library's and the user's own. The store
 * holds one and replaces it (never changes it) when the user's tubes change,
 * so each user record is built once per change (app/keep builds and keeps
 * them), never per look-up: a drag looks tubes up every frame.
 */
export interface TubeRegistry {
  /** The user's tubes, in the order kept. */
  readonly user: readonly TubeRecord[];
  /** A tube by its id: the library's first, then the user's. */
  readonly lookup: (id: string) => TubeRecord | undefined;
}

export function tubeRegistry(user: readonly TubeRecord[]): TubeRegistry {
  const byId = new Map(user.map((t) => [t.id, t]));
  return { user, lookup: (id) => findTube(id) ?? byId.get(id) };
}

/** The library alone (no tubes of the user's): what a design file's names are read against before the store has its own. */
export const LIBRARY_TUBES = tubeRegistry([]);
