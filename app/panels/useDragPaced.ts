import { useEffect, useRef, useState } from 'react';
import { useWorkbench } from '../store/StoreProvider';

/**
 * While a drag is on, how often a table of many figures is refreshed, ms.
 * 2.5 times a second is readable (numbers changing sixty times a second are
 * not) and keeps the table's layout out of nineteen frames in twenty; at
 * release the table shows the final values at once.
 */
export const DRAG_TABLE_INTERVAL_MS = 400;

/** The value, refreshed at most every `ms` while a drag is on, and at once otherwise. */
export function useDragPaced<T>(value: T, ms = DRAG_TABLE_INTERVAL_MS): T {
  const dragging = useWorkbench((s) => s.dragging !== null);
  const [shown, setShown] = useState(value);
  const last = useRef(-Infinity);
  // Between drags the shown value keeps up (React's adjust-state-while-rendering pattern), so a new drag starts from it.
  if (!dragging && shown !== value) setShown(value);
  useEffect(() => {
    if (!dragging) return;
    const wait = last.current + ms - performance.now();
    const show = () => {
      last.current = performance.now();
      setShown(value);
    };
    if (wait <= 0) {
      show();
      return;
    }
    const timer = setTimeout(show, wait);
    return () => clearTimeout(timer);
  }, [value, dragging, ms]);
  return dragging ? shown : value;
}
