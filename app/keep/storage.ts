import { readDesignFile, writeDesignFile, type DesignDocument } from './designFile';

/**
 * The designs kept in this browser: an autosave of the current one and a
 * shelf of named ones, as design-file JSON under two localStorage keys.
 * Storage may be absent or full; then nothing is kept and nothing breaks.
 */
const AUTOSAVE = 'quiescent.autosave';
const SHELF = 'quiescent.shelf';

function store(): Storage | null {
  try {
    return globalThis.localStorage ?? null;
  } catch {
    return null;
  }
}

export function autosave(doc: DesignDocument): void {
  try {
    store()?.setItem(AUTOSAVE, writeDesignFile(doc));
  } catch {
    /* storage full or blocked: the design stays on screen */
  }
}

export function restoreAutosave(): DesignDocument | null {
  const text = store()?.getItem(AUTOSAVE);
  if (!text) return null;
  const r = readDesignFile(text);
  return r.ok ? r.doc : null;
}

function readShelf(): Record<string, string> {
  try {
    const raw = JSON.parse(store()?.getItem(SHELF) ?? '{}') as unknown;
    return typeof raw === 'object' && raw !== null && !Array.isArray(raw) ? (raw as Record<string, string>) : {};
  } catch {
    return {};
  }
}

export function shelfNames(): string[] {
  return Object.keys(readShelf()).sort((a, b) => a.localeCompare(b));
}

export function putOnShelf(name: string, doc: DesignDocument): boolean {
  const shelf = readShelf();
  shelf[name] = writeDesignFile(doc);
  try {
    store()?.setItem(SHELF, JSON.stringify(shelf));
    return true;
  } catch {
    return false;
  }
}

export function takeFromShelf(name: string): DesignDocument | null {
  const text = readShelf()[name];
  if (!text) return null;
  const r = readDesignFile(text);
  return r.ok ? r.doc : null;
}

export function removeFromShelf(name: string): void {
  const shelf = readShelf();
  delete shelf[name];
  try {
    store()?.setItem(SHELF, JSON.stringify(shelf));
  } catch {
    /* nothing to do */
  }
}
