import { createStore, del, get, set, type UseStore } from 'idb-keyval';

/**
 * Where the user's tubes are kept: IndexedDB (through idb-keyval, a small,
 * well-kept wrapper), whose quota is a share of the disk rather than
 * localStorage's few megabytes. Tubes kept in localStorage by earlier
 * versions move across on the first load. Where IndexedDB is missing (some
 * private modes) localStorage serves as before.
 *
 * This module stores raw records; reading them (and naming the ones that do
 * not read) is the caller's.
 */
export const LEGACY_KEY = 'quiescent.custom-tubes';
const DB_KEY = 'custom-tubes';

let idb: UseStore | null | undefined;
function database(): UseStore | null {
  if (idb === undefined) idb = typeof indexedDB === 'undefined' ? null : createStore('quiescent', 'kept');
  return idb;
}

function legacyText(): string | null {
  try {
    return globalThis.localStorage?.getItem(LEGACY_KEY) ?? null;
  } catch {
    return null;
  }
}

/** The kept records as stored (a list of raw objects), and the legacy file's text when that is where they are. */
export async function loadKept(): Promise<{ records: unknown[] } | { legacy: string } | { none: true }> {
  // localStorage holds tubes only until IndexedDB has taken them (an earlier
  // version's, or a save IndexedDB refused): when present they are the latest.
  const text = legacyText();
  if (text) return { legacy: text };
  const db = database();
  if (db) {
    try {
      const records = await get<unknown>(DB_KEY, db);
      if (Array.isArray(records)) return { records };
    } catch {
      /* unreadable database: fall through to what localStorage has */
    }
  }
  return { none: true };
}

/** Stores the records; true when the browser kept them. Moves off localStorage once IndexedDB holds them. */
export async function saveKept(records: readonly unknown[]): Promise<boolean> {
  const db = database();
  if (db) {
    try {
      await set(DB_KEY, records, db);
      try {
        globalThis.localStorage?.removeItem(LEGACY_KEY);
      } catch {
        /* nothing to move off */
      }
      return true;
    } catch {
      /* quota or a blocked database: try localStorage */
    }
  }
  try {
    globalThis.localStorage?.setItem(LEGACY_KEY, JSON.stringify({ format: 'quiescent-tubes', version: 1, tubes: records }));
    return true;
  } catch {
    return false;
  }
}

/** Test hook: forget everything kept. */
export async function clearKept(): Promise<void> {
  const db = database();
  if (db) await del(DB_KEY, db).catch(() => undefined);
  try {
    globalThis.localStorage?.removeItem(LEGACY_KEY);
  } catch {
    /* nothing kept */
  }
}
