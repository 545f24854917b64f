import { useEffect } from 'react';
import type { WorkbenchState, WorkbenchStore } from '../store/workbenchStore';
import type { DesignDocument } from './designFile';
import { loadCustomTubes } from './customTubes';
import { openDocument, withNote } from './openDocument';
import { readShareFragment } from './shareLink';
import { autosave, restoreAutosave, restoreHistory, saveHistory, DAMAGED_AUTOSAVE } from './storage';

/** Autosave waits this long after the last change, ms; leaving the page saves at once. */
const AUTOSAVE_DELAY_MS = 400;

const SAVE_FAILED = 'This browser would not keep your latest change (its storage is full or blocked). Save a design file to keep it; the bench keeps working.';

/**
 * The design worth keeping now: during a drag, the one from before it (a
 * reload mid-drag never restores a half-moved, unsnapped point).
 */
function keptDocument(s: WorkbenchState): DesignDocument {
  return { title: s.title, design: s.dragging && s.dragStart ? s.dragStart : s.design };
}

/**
 * A design opened with stand-ins for tubes not known yet: the user's own
 * tubes load asynchronously, so once they have, it is opened again as saved
 * (unless the user has changed the design meanwhile).
 */
interface Waiting {
  readonly doc: DesignDocument;
  readonly shown: WorkbenchState['design'];
  readonly what: string;
}
/** What one mounted bench is waiting on (kept per bench, never module-wide). */
interface Opening {
  readonly store: WorkbenchStore;
  waiting: Waiting | null;
}

function open(o: Opening, doc: DesignDocument, what: string): ReturnType<typeof openDocument> {
  const opened = openDocument(o.store, doc);
  if (!opened.failure && opened.note) o.waiting = { doc, shown: o.store.getState().design, what };
  return opened;
}

/** Once the user's tubes have loaded: a design waiting for one of them opens as saved. */
function reopenWaiting({ store, ...o }: Opening): void {
  const w = o.waiting;
  if (!w || store.getState().design !== w.shown) return;
  const { past, future } = store.getState();
  const opened = openDocument(store, w.doc);
  store.setState({ past, future }); // the stand-in was never the user's step
  if (!opened.failure && !opened.note) store.getState().setKeepNote({ kind: 'ok', text: `Opened ${w.what} with your own tube.` });
}

/** Opens the autosaved design and its undo history (true when it did); says so when it could not be read. */
function openLastDesign(o: Opening): boolean {
  const { store } = o;
  const s = store.getState();
  const saved = restoreAutosave();
  if (saved.kind === 'damaged') {
    s.setKeepNote({ kind: 'error', text: `Your last design could not be read (${saved.message}); the bench opened on the demo. The damaged copy is kept in this browser under “${DAMAGED_AUTOSAVE}”.` });
  }
  if (saved.kind !== 'ok') return false;
  const opened = open(o, saved.doc, 'your last design');
  if (opened.failure) {
    s.setKeepNote({ kind: 'error', text: `Your last design could not run (${opened.failure.message}); the bench opened on the demo.` });
    return false;
  }
  if (opened.note) s.setKeepNote({ kind: 'error', text: opened.note });
  // The undo history kept with it, in place of the step that opening just recorded.
  const history = restoreHistory();
  store.setState({ past: history.past, future: history.future });
  return true;
}

/**
 * Opens a design link from the address. A link that is refused, or whose
 * design cannot run, leaves the design that was open (at start-up: the last
 * one) and says why.
 */
function openLink(o: Opening, hash: string, atStart: boolean): void {
  const { store } = o;
  const link = readShareFragment(hash);
  // Opening the demo, or a design that did not run, is not an undo step.
  if (atStart && !openLastDesign(o)) store.setState({ past: [], future: [] });
  if (!link) return;
  const s = store.getState();
  if (!link.ok) return s.setKeepNote({ kind: 'error', text: link.message });
  const opened = open(o, link.doc, `the shared design “${link.doc.title}”`);
  s.setKeepNote(
    opened.failure
      ? { kind: 'error', text: `The shared design could not run: ${opened.failure.message}. The bench kept your last design.` }
      : { kind: opened.note ? 'error' : 'ok', text: withNote(`Opened the shared design “${link.doc.title}”.`, opened.note) },
  );
}

/**
 * Nothing the user made is lost: on start the bench opens a shared link if
 * the address carries one (and any link pasted later), else the autosaved
 * design with its undo history; every change is saved again shortly after,
 * and at once when the page is hidden or left; Ctrl+Z / Ctrl+Shift+Z (and
 * Ctrl+Y) undo and redo design changes, except inside a text box, where the
 * box's own undo applies.
 */
export function useKeeping(store: WorkbenchStore): void {
  useEffect(() => {
    const opening: Opening = { store, waiting: null };
    openLink(opening, globalThis.location?.hash ?? '', true);
    let live = true;
    void loadCustomTubes().then((problems) => {
      if (!live) return;
      store.getState().refreshTubes();
      if (problems.length > 0) {
        const list = `${problems.slice(0, 5).join('; ')}${problems.length > 5 ? `; and ${problems.length - 5} more` : ''}`;
        store.getState().setKeepNote({ kind: 'error', text: `Some of your kept tubes could not be read, and the others loaded: ${list}.` });
      }
      reopenWaiting(opening);
      opening.waiting = null;
    });

    let timer: ReturnType<typeof setTimeout> | undefined;
    let warned = false;
    const save = () => {
      clearTimeout(timer);
      timer = undefined;
      const s = store.getState();
      const ok = autosave(keptDocument(s)) && saveHistory(s.past, s.future);
      if (!ok && !warned) s.setKeepNote({ kind: 'error', text: SAVE_FAILED });
      warned = !ok;
    };
    const unsubscribe = store.subscribe((now, prev) => {
      if (now.design === prev.design && now.title === prev.title && now.past === prev.past) return;
      if (now.dragging) return; // the drag's end is the change worth keeping
      clearTimeout(timer);
      timer = setTimeout(save, AUTOSAVE_DELAY_MS);
    });
    const flush = () => {
      if (timer !== undefined || store.getState().dragging) save();
    };
    const onVisibility = () => {
      if (document.visibilityState === 'hidden') flush();
    };
    const onHash = () => openLink(opening, globalThis.location.hash, false);
    const onKey = (e: KeyboardEvent) => {
      if (!(e.ctrlKey || e.metaKey)) return;
      const target = e.target as HTMLElement | null;
      if (target && (target.tagName === 'INPUT' || target.tagName === 'TEXTAREA') && (target as HTMLInputElement).type !== 'checkbox') return;
      const key = e.key.toLowerCase();
      if (key === 'z' && !e.shiftKey) {
        e.preventDefault();
        store.getState().undo();
      } else if ((key === 'z' && e.shiftKey) || key === 'y') {
        e.preventDefault();
        store.getState().redo();
      }
    };
    window.addEventListener('keydown', onKey);
    window.addEventListener('pagehide', flush);
    window.addEventListener('hashchange', onHash);
    document.addEventListener('visibilitychange', onVisibility);
    return () => {
      live = false;
      unsubscribe();
      flush();
      window.removeEventListener('keydown', onKey);
      window.removeEventListener('pagehide', flush);
      window.removeEventListener('hashchange', onHash);
      document.removeEventListener('visibilitychange', onVisibility);
    };
  }, [store]);
}
