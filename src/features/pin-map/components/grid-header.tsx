import type { ReactTable } from '@tanstack/react-table';
import type { KeyboardEvent } from 'react';
import { SortGlyph } from '@/components/ui/sortable-table.tsx';
import { SELECT_COLUMN } from '../lib/columns.ts';
import type { PinRow } from '../lib/rows.ts';
import type { PinGridFeatures } from './grid-columns.ts';
import { HEADER_HEIGHT, pinnedAndRest, type ColumnLayout } from './grid-row.tsx';

/** The grid's column headings: they stay at the top while the rows scroll under them. */
export function GridHeader({
  table,
  layout,
  width,
  readOnly,
  onLeave,
}: {
  table: ReactTable<PinGridFeatures, PinRow>;
  layout: ColumnLayout[];
  width: number;
  readOnly: boolean;
  /** Arrow Down or Escape from a heading: back to the first row, in that column. */
  onLeave: (columnIndex: number) => void;
}) {
  function onKeyDown(event: KeyboardEvent<HTMLElement>, index: number) {
    event.stopPropagation();
    const step = event.key === 'ArrowLeft' ? -1 : event.key === 'ArrowRight' ? 1 : 0;
    if (step) {
      event.preventDefault();
      const next = layout[Math.min(Math.max(index + step, 0), layout.length - 1)];
      if (next) focusHeading(event.currentTarget, next.id);
    } else if (event.key === 'ArrowDown' || event.key === 'Escape') {
      event.preventDefault();
      onLeave(index);
    }
  }

  const allSelected = table.getIsAllRowsSelected();
  const someSelected = table.getIsSomeRowsSelected() && !allSelected;
  const heading = (c: ColumnLayout, i: number) => {
    const column = table.getColumn(c.id);
    const sorted = column?.getIsSorted() ?? false;
    if (c.id === SELECT_COLUMN) {
      return (
        <div
          key={c.id}
          role="columnheader"
          aria-colindex={i + 1}
          className={`flex shrink-0 items-center justify-center border-r border-rule/60 ${c.sticky ? 'bg-paper-sunk' : ''}`}
          style={{ width: c.width }}
        >
          <input
            type="checkbox"
            tabIndex={-1}
            aria-label="Select every pin shown"
            disabled={readOnly}
            checked={allSelected}
            ref={(el) => {
              if (el) el.indeterminate = someSelected;
            }}
            data-heading={c.id}
            onKeyDown={(e) => onKeyDown(e, i)}
            onMouseDown={(e) => e.preventDefault()}
            onChange={() => undefined}
            onClick={table.getToggleAllRowsSelectedHandler()}
            className="size-4 accent-ink"
          />
        </div>
      );
    }
    return (
      <div
        key={c.id}
        role="columnheader"
        aria-colindex={i + 1}
        aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : undefined}
        className={`flex shrink-0 items-center border-r border-rule/60 px-2 ${c.sticky ? 'bg-paper-sunk' : ''}`}
        style={{ width: c.width }}
      >
        <button
          type="button"
          tabIndex={-1}
          data-heading={c.id}
          onKeyDown={(e) => onKeyDown(e, i)}
          onMouseDown={(e) => e.preventDefault()}
          onClick={column?.getToggleSortingHandler()}
          title={`Sort by ${c.header.toLowerCase()}`}
          className="inline-flex min-w-0 items-center gap-1 text-left text-[0.8125rem] font-semibold text-ink-soft hover:text-ink"
        >
          <span className="truncate">{c.header}</span>
          <SortGlyph sorted={sorted} />
        </button>
      </div>
    );
  };
  return (
    <div role="rowgroup" className="sticky top-0 z-20" style={{ width }}>
      <div
        role="row"
        aria-rowindex={1}
        className="flex border-b border-rule-strong bg-paper-sunk"
        style={{ height: HEADER_HEIGHT, width }}
      >
        {pinnedAndRest(layout, heading)}
      </div>
    </div>
  );
}

/** Focuses the heading control of a column (a sort button, or the select-all checkbox). */
export function focusHeading(within: Element, columnId: string) {
  const grid = within.closest('[role="grid"]') ?? within;
  grid.querySelector<HTMLElement>(`[data-heading="${columnId}"]`)?.focus();
}
