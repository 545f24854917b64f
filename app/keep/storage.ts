import { readDesignFile, writeDesignFile, type DesignDocument } from './designFile';

/**
 * The designs kept in this browser: an autosave of the current one (with its
 * undo history, bounded) and a shelf of named ones, as design-file JSON in
 * localStorage. Storage may be absent, full or damaged: every call says
 * whether it worked, so the bench can tell the user, and nothing throws.
 */
const AUTOSAVE = 'quiescent.autosave';
const HISTORY = 'quiescent.history';
const SHELF = 'quiescent.shelf';
/** Where an autosave that could not be read is set aside, so a later Quiescent (or the user) may still recover it. */
export const DAMAGED_AUTOSAVE = 'quiescent.autosave.damaged';

/** Undo steps kept across a reload (each a design file of a few kB). */
export const KEPT_HISTORY_STEPS = 50;

function store(): Storage | null {
  try {
    return globalThis.localStorage ?? null;
  } catch {
    return null;
  }
}

function put(key: string, text: string): boolean {
  try {
    const s = store();
    if (!s) return false;
    s.setItem(key, text);
    return true;
  } catch {
    return false; // full (QuotaExceededError) or blocked
  }
}

function get(key: string): string | null {
  try {
    return store()?.getItem(key) ?? null;
  } catch {
    return null;
  }
}

/** Saves the design; false when the browser would not store it. */
export function autosave(doc: DesignDocument): boolean {
  return put(AUTOSAVE, writeDesignFile(doc));
}

export type Restored = { readonly kind: 'none' } | { readonly kind: 'ok'; readonly doc: DesignDocument } | { readonly kind: 'damaged'; readonly message: string };

/** The autosaved design; a damaged one is set aside under DAMAGED_AUTOSAVE and its problem named. */
export function restoreAutosave(): Restored {
  const text = get(AUTOSAVE);
  if (!text) return { kind: 'none' };
  const r = readDesignFile(text);
  if (r.ok) return { kind: 'ok', doc: r.doc };
  put(DAMAGED_AUTOSAVE, text);
  return { kind: 'damaged', message: r.message.replace(/ Nothing was opened\.$/, '') };
}

/** The undo history beside the autosave: the last KEPT_HISTORY_STEPS each way, as design files. */
export function saveHistory(past: readonly DesignDocument[], future: readonly DesignDocument[]): boolean {
  const file = (d: DesignDocument) => writeDesignFile(d);
  return put(HISTORY, JSON.stringify({ past: past.slice(-KEPT_HISTORY_STEPS).map(file), future: future.slice(-KEPT_HISTORY_STEPS).map(file) }));
}

/** The kept undo history; steps that no longer read (a tube since removed) are dropped. */
export function restoreHistory(): { past: DesignDocument[]; future: DesignDocument[] } {
  const empty = { past: [], future: [] };
  const text = get(HISTORY);
  if (!text) return empty;
  try {
    const raw = JSON.parse(text) as { past?: unknown; future?: unknown };
    const docs = (list: unknown) =>
      (Array.isArray(list) ? list : []).flatMap((t) => {
        const r = typeof t === 'string' ? readDesignFile(t) : null;
        return r?.ok ? [r.doc] : [];
      });
    return { past: docs(raw.past), future: docs(raw.future) };
  } catch {
    return empty;
  }
}

/**
 * The shelf as a Map from name to design-file text. Names are data, never
 * keys of a plain object: "__proto__" or "constructor" is a name like any other.
 */
function readShelf(): Map<string, string> {
  try {
    const raw = JSON.parse(get(SHELF) ?? '[]') as unknown;
    // Written as a list of [name, file] pairs; earlier versions wrote a plain object.
    const pairs: unknown[] = Array.isArray(raw) ? raw : typeof raw === 'object' && raw !== null ? Object.entries(raw) : [];
    return new Map(pairs.filter((p): p is [string, string] => Array.isArray(p) && typeof p[0] === 'string' && typeof p[1] === 'string'));
  } catch {
    return new Map();
  }
}

function writeShelf(shelf: Map<string, string>): boolean {
  return put(SHELF, JSON.stringify([...shelf.entries()]));
}

export function shelfNames(): string[] {
  return [...readShelf().keys()].sort((a, b) => a.localeCompare(b));
}

/** Keeps a design under a name; false when the browser would not store it. */
export function putOnShelf(name: string, doc: DesignDocument): boolean {
  const shelf = readShelf();
  shelf.set(name, writeDesignFile(doc));
  return writeShelf(shelf);
}

export function takeFromShelf(name: string): DesignDocument | null {
  const text = readShelf().get(name);
  if (!text) return null;
  const r = readDesignFile(text);
  return r.ok ? r.doc : null;
}

export function removeFromShelf(name: string): boolean {
  const shelf = readShelf();
  shelf.delete(name);
  return writeShelf(shelf);
}
