import { useEffect } from 'react';
import type { WorkbenchStore } from '../store/workbenchStore';
import { readShareFragment } from './shareLink';
import { autosave, restoreAutosave } from './storage';

/** Autosave waits this long after the last change, ms. */
const AUTOSAVE_DELAY_MS = 400;

/**
 * Nothing the user made is lost: on start the bench opens a shared link if
 * the address carries one, else the autosaved design; every change is saved
 * again shortly after; Ctrl+Z / Ctrl+Shift+Z (and Ctrl+Y) undo and redo
 * design changes, except inside a text box, where the box's own undo applies.
 */
export function useKeeping(store: WorkbenchStore): void {
  useEffect(() => {
    const s = store.getState();
    const link = readShareFragment(globalThis.location?.hash ?? '');
    if (link?.ok) {
      const failure = s.loadDocument(link.doc);
      s.setKeepNote(failure ? { kind: 'error', text: `The shared design could not run: ${failure.message}` } : { kind: 'ok', text: `Opened the shared design “${link.doc.title}”.` });
    } else if (link) {
      s.setKeepNote({ kind: 'error', text: link.message });
    } else {
      const saved = restoreAutosave();
      if (saved) s.loadDocument(saved);
    }
    store.setState({ past: [], future: [] }); // opening is not an undo step

    let timer: ReturnType<typeof setTimeout> | undefined;
    const unsubscribe = store.subscribe((now, prev) => {
      if (now.design === prev.design && now.title === prev.title) return;
      clearTimeout(timer);
      timer = setTimeout(() => autosave({ title: store.getState().title, design: store.getState().design }), AUTOSAVE_DELAY_MS);
    });
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
    return () => {
      unsubscribe();
      clearTimeout(timer);
      autosave({ title: store.getState().title, design: store.getState().design });
      window.removeEventListener('keydown', onKey);
    };
  }, [store]);
}
