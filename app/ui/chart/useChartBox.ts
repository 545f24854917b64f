import { useEffect, useState, type RefObject } from 'react';
import { CHART_BOX, type ChartBox } from './plateScales';

/** Height over width of the plate chart: close to a printed curve sheet's proportions. */
const ASPECT = 0.66;

/**
 * The chart's drawing box in CSS pixels, following its container's width, so
 * that text and line widths keep their real size from a 1024 px tablet to a
 * wide monitor instead of shrinking with a scaled viewBox. Falls back to the
 * default box where ResizeObserver is missing (tests, old browsers).
 */
export function useChartBox(container: RefObject<HTMLElement | null>): ChartBox {
  const [box, setBox] = useState<ChartBox>(CHART_BOX);
  useEffect(() => {
    const el = container.current;
    if (!el || typeof ResizeObserver === 'undefined') return;
    const measure = () => {
      const width = Math.round(el.clientWidth);
      if (width < 200) return;
      setBox((b) => (b.width === width ? b : { ...CHART_BOX, width, height: Math.round(width * ASPECT) }));
    };
    measure();
    const ro = new ResizeObserver(measure);
    ro.observe(el);
    return () => ro.disconnect();
  }, [container]);
  return box;
}
