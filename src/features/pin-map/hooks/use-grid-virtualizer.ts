import {
  defaultRangeExtractor,
  useVirtualizer,
  type Rect,
  type Virtualizer,
} from '@tanstack/react-virtual';
import type { RefObject } from 'react';
import { HEADER_HEIGHT, ROW_HEIGHT } from '../components/grid-row.tsx';

/** The grid's height as its class gives it (`h-[min(68vh,760px)]`), known without a layout. */
const cssGridHeight = () => Math.round(Math.min(window.innerHeight * 0.68, 760));

/**
 * The grid's box from ResizeObserver reports only. The virtualiser's own observer reads
 * clientWidth/clientHeight when the grid mounts, which forces the browser to lay out everything
 * drawn so far (the connector faces above the grid) in the middle of the first render; a
 * ResizeObserver reports after the browser's own layout, for free. Until then the CSS height.
 */
function observeGridRect(instance: Virtualizer<HTMLDivElement, Element>, cb: (rect: Rect) => void) {
  const el = instance.scrollElement;
  if (!el || typeof ResizeObserver === 'undefined') return;
  const observer = new ResizeObserver(([entry]) => {
    if (!entry) return;
    cb({
      width: Math.round(entry.contentRect.width),
      height: Math.round(entry.contentRect.height),
    });
  });
  observer.observe(el);
  return () => observer.disconnect();
}

/**
 * Draws only the pin rows in view. `keepRows` stay drawn when scrolled away (the row being edited
 * and the focused row), so the editor keeps its text and the grid's active descendant stays in the
 * page.
 */
export function useGridVirtualizer({
  count,
  scrollRef,
  keepRows,
  rowKey,
}: {
  count: number;
  scrollRef: RefObject<HTMLDivElement | null>;
  keepRows: Array<number | undefined>;
  rowKey: (index: number) => number;
}) {
  // No React Compiler in this build; the virtualizer is read during render on purpose.
  // eslint-disable-next-line react-hooks/incompatible-library
  return useVirtualizer({
    count,
    rangeExtractor: (range) => {
      const keep = keepRows.filter(
        (i): i is number => i !== undefined && (i < range.startIndex || i > range.endIndex),
      );
      const indexes = defaultRangeExtractor(range);
      return keep.length ? [...new Set([...indexes, ...keep])].sort((a, b) => a - b) : indexes;
    },
    getScrollElement: () => scrollRef.current,
    observeElementRect: observeGridRect,
    initialRect: { width: 0, height: cssGridHeight() },
    estimateSize: () => ROW_HEIGHT,
    overscan: 12,
    scrollMargin: HEADER_HEIGHT,
    scrollPaddingStart: HEADER_HEIGHT,
    getItemKey: rowKey,
  });
}

/**
 * Scrolls the grid to a row, unless `align` is 'auto' and the row is already wholly in view below
 * the sticky headings: the virtualiser starts a scroll even then and follows it up over the next
 * frames, each one a redraw of the page. Read from the virtualiser's own state, no layout.
 */
export function scrollToRow(
  virtualizer: Virtualizer<HTMLDivElement, Element>,
  index: number,
  align: 'auto' | 'center',
) {
  const row = virtualizer.measurementsCache[index];
  const offset = virtualizer.scrollOffset;
  const height = virtualizer.scrollRect?.height;
  const inView =
    row !== undefined &&
    offset != null &&
    !!height &&
    row.start >= offset + HEADER_HEIGHT &&
    row.end <= offset + height;
  if (align === 'auto' && inView) return;
  virtualizer.scrollToIndex(index, { align });
}
