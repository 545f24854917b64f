import { useCallback, useRef, useSyncExternalStore } from 'react';
import type { WorkbenchState } from '../../store/workbenchStore';
import { useWorkbenchStore } from '../../store/StoreProvider';

/**
 * While a drag is on, how often a table of many figures is refreshed, ms.
 * 2.5 times a second is readable (numbers changing sixty times a second are
 * not) and keeps the table's layout out of nineteen frames in twenty; at
 * release the table shows the final values at once.
 */
export const DRAG_TABLE_INTERVAL_MS = 400;

export interface PaceOptions<T> {
  /** A change that must show at once even mid-drag (a check turning dangerous). */
  readonly urgent?: (shown: T, next: T) => boolean;
  /** When two selections are the same; `Object.is` unless given. */
  readonly equal?: (a: T, b: T) => boolean;
  readonly ms?: number;
}

/** Same entries in the same order: for selections that gather several store values into one array. */
export const sameEntries = (a: readonly unknown[], b: readonly unknown[]) => a.length === b.length && a.every((v, k) => Object.is(v, b[k]));

/**
 * A store selection that, during a drag, changes at most every `ms` (and at
 * once between drags). The pacing sits in the store subscription itself, so
 * a component that reads only paced values is not rendered at all on the
 * moves in between: a drag pays for the table two or three times a second,
 * not on every frame.
 */
export function useDragPaced<T>(selector: (s: WorkbenchState) => T, options: PaceOptions<T> = {}): T {
  const store = useWorkbenchStore();
  const latest = useRef({ selector, options });
  latest.current = { selector, options };
  const shown = useRef<{ value: T } | null>(null);

  const subscribe = useCallback(
    (notify: () => void) => {
      let timer: ReturnType<typeof setTimeout> | undefined;
      let last = -Infinity;
      const show = () => {
        clearTimeout(timer);
        timer = undefined;
        last = performance.now();
        shown.current = { value: latest.current.selector(store.getState()) };
        notify();
      };
      const follow = (state: WorkbenchState) => {
        const { selector: select, options: opts } = latest.current;
        const next = select(state);
        const current = shown.current;
        if (current && (opts.equal ?? Object.is)(current.value, next)) return;
        if (!current || state.dragging === null || opts.urgent?.(current.value, next)) return show();
        if (timer !== undefined) return;
        const wait = last + (opts.ms ?? DRAG_TABLE_INTERVAL_MS) - performance.now();
        if (wait <= 0) show();
        else timer = setTimeout(show, wait);
      };
      const unsubscribe = store.subscribe(follow);
      follow(store.getState()); // anything that changed between the render and this subscription
      return () => {
        unsubscribe();
        clearTimeout(timer);
      };
    },
    [store],
  );
  const snapshot = () => (shown.current ??= { value: latest.current.selector(store.getState()) }).value;
  return useSyncExternalStore(subscribe, snapshot, snapshot);
}
