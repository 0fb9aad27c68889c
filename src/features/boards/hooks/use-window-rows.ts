import { useLayoutEffect, useRef, useState } from 'react';
import { useWindowVirtualizer } from '@tanstack/react-virtual';

/** Rows from which a board's chips and table draw only those near the view (a demo board draws all). */
export const VIRTUAL_FROM_ROWS = 120;

/**
 * A long list of rows drawn only near the window's view (TanStack Virtual, the window scrolling): a board of
 * 2,000 swatches through 4 looks is 8,000 chips, which a browser lays out slowly on every change. Rows are
 * measured as they are drawn (their heights vary with the merge notes), estimated at `estimatePx` before.
 * `on` is false for short lists, which draw every row as before (and stay findable by the page's search).
 */
export function useWindowRows<T extends HTMLElement>(count: number, estimatePx: number) {
  const ref = useRef<T | null>(null);
  const on = count > VIRTUAL_FROM_ROWS;
  const [scrollMargin, setScrollMargin] = useState(0);
  // where the list starts on the page: again whenever the page's layout changes (a list above folds open)
  useLayoutEffect(() => {
    const el = ref.current;
    if (!on || !el) return;
    const measure = () => setScrollMargin(Math.round(el.getBoundingClientRect().top + window.scrollY));
    measure();
    const seen = new ResizeObserver(measure);
    seen.observe(document.body);
    return () => seen.disconnect();
  }, [on]);
  const virtualizer = useWindowVirtualizer({ count: on ? count : 0, estimateSize: () => estimatePx, overscan: 6, scrollMargin });
  return { ref, on, virtualizer, items: virtualizer.getVirtualItems(), totalPx: virtualizer.getTotalSize(), scrollMargin };
}
