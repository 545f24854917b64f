import type { StateCreator, StoreApi } from 'zustand/vanilla';
import type { BenchDesign } from './analysis';
import type { WorkbenchState } from './workbenchStore';

/** One undoable state of the bench: the design and its title. */
export interface Snapshot {
  readonly design: BenchDesign;
  readonly title: string;
}

export interface HistorySlice {
  past: readonly Snapshot[];
  future: readonly Snapshot[];
  undo: () => void;
  redo: () => void;
}

/** Changes closer together than this (typing a value) are one undo step, ms. */
export const COALESCE_MS = 1000;
/** Undo steps kept. */
export const HISTORY_LIMIT = 200;

export const createHistorySlice: StateCreator<WorkbenchState, [], [], HistorySlice> = (set, get) => {
  const restore = (to: Snapshot, from: 'past' | 'future') => {
    const s = get();
    const here: Snapshot = { design: s.design, title: s.title };
    applying = true;
    try {
      if (s.commit(to.design) === null) {
        set({
          title: to.title,
          past: from === 'past' ? s.past.slice(0, -1) : [...s.past, here],
          future: from === 'future' ? s.future.slice(0, -1) : [...s.future, here],
        });
      }
    } finally {
      applying = false;
    }
  };
  return {
    past: [],
    future: [],
    undo: () => {
      const last = get().past.at(-1);
      if (last) restore(last, 'past');
    },
    redo: () => {
      const next = get().future.at(-1);
      if (next) restore(next, 'future');
    },
  };
};

/** True while undo/redo applies a snapshot: those changes are not recorded. */
let applying = false;

/**
 * Records undo steps by watching the store: a drag is one step from where it
 * began; other changes to the design or title are a step each, except that
 * changes within COALESCE_MS of the last merge into it (a value being typed),
 * and the workbench's own following changes (`derived`) are part of the step
 * before them. A whole action of the user's (`step`) is never merged into the
 * change before it.
 */
export function recordHistory(store: StoreApi<WorkbenchState>, now: () => number = Date.now): () => void {
  let gestureStart: Snapshot | null = null;
  let lastPush = -Infinity;
  /** `coalesce`: 'merge' joins a change within COALESCE_MS of the last; 'new' always starts a step that what follows at once may join; 'alone' a step nothing joins. */
  const push = (snap: Snapshot, coalesce: 'merge' | 'new' | 'alone') => {
    const s = store.getState();
    const t = now();
    if (coalesce === 'merge' && t - lastPush < COALESCE_MS && s.past.length > 0) {
      lastPush = t;
      store.setState({ future: [] });
      return;
    }
    lastPush = coalesce === 'alone' ? -Infinity : t;
    store.setState({ past: [...s.past, snap].slice(-HISTORY_LIMIT), future: [] });
  };
  return store.subscribe((s, prev) => {
    if (applying) return;
    if (s.dragging && !prev.dragging) {
      gestureStart = { design: prev.design, title: prev.title };
      return;
    }
    if (s.dragging) return;
    if (!s.dragging && prev.dragging) {
      const start = gestureStart;
      gestureStart = null;
      if (start && start.design !== s.design) push(start, 'alone');
      return;
    }
    const designed = s.design !== prev.design;
    // The workbench following the user's change (CommitOptions.derived) belongs to that change's step, however late.
    if (designed && s.undoStep === 'joins') return;
    if (designed || s.title !== prev.title) push({ design: prev.design, title: prev.title }, designed && s.undoStep === 'own' ? 'new' : 'merge');
  });
}
