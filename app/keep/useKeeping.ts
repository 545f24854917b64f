import { useEffect } from 'react';
import type { WorkbenchState, WorkbenchStore } from '../store/workbenchStore';
import type { DesignDocument } from './designFile';
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

/** Opens the autosaved design and its undo history (true when it did); says so when it could not be read. */
function openLastDesign(store: WorkbenchStore): boolean {
  const s = store.getState();
  const saved = restoreAutosave();
  if (saved.kind === 'damaged') {
    s.setKeepNote({ kind: 'error', text: `Your last design could not be read (${saved.message}); the bench opened on the demo. The damaged copy is kept in this browser under “${DAMAGED_AUTOSAVE}”.` });
  }
  if (saved.kind !== 'ok') return false;
  const failure = s.loadDocument(saved.doc);
  if (failure) {
    s.setKeepNote({ kind: 'error', text: `Your last design could not run (${failure.message}); the bench opened on the demo.` });
    return false;
  }
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
function openLink(store: WorkbenchStore, hash: string, atStart: boolean): void {
  const link = readShareFragment(hash);
  // Opening the demo, or a design that did not run, is not an undo step.
  if (atStart && !openLastDesign(store)) store.setState({ past: [], future: [] });
  if (!link) return;
  const s = store.getState();
  if (!link.ok) return s.setKeepNote({ kind: 'error', text: link.message });
  const failure = s.loadDocument(link.doc);
  s.setKeepNote(failure ? { kind: 'error', text: `The shared design could not run: ${failure.message}. The bench kept your last design.` } : { kind: 'ok', text: `Opened the shared design “${link.doc.title}”.` });
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
    openLink(store, globalThis.location?.hash ?? '', true);

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
    const onHash = () => openLink(store, globalThis.location.hash, false);
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
      unsubscribe();
      flush();
      window.removeEventListener('keydown', onKey);
      window.removeEventListener('pagehide', flush);
      window.removeEventListener('hashchange', onHash);
      document.removeEventListener('visibilitychange', onVisibility);
    };
  }, [store]);
}
