import {
  useTable,
  type ColumnVisibilityState,
  type OnChangeFn,
  type RowSelectionState,
} from '@tanstack/react-table';
import { useMemo } from 'react';
import { columnLayout, pinGridColumns, pinGridFeatures } from '../components/grid-columns.ts';
import { SELECT_COLUMN } from '../lib/columns.ts';
import type { PinRow } from '../lib/rows.ts';
import type { SizeUnit } from '#shared/schemas/workshop.schema.ts';

const getRowId = (row: PinRow) => String(row.pin.id);

/**
 * The grid's table: its rows in the order shown and its visible columns laid out left to right
 * (the checkbox column hidden from those who cannot change pins).
 */
export interface PinTableOptions {
  /** The rows to show, already filtered. */
  rows: PinRow[];
  unit: SizeUnit;
  readOnly: boolean;
  rowSelection: RowSelectionState;
  onRowSelectionChange: OnChangeFn<RowSelectionState>;
  columnVisibility: ColumnVisibilityState;
  onColumnVisibilityChange: OnChangeFn<ColumnVisibilityState>;
}

export function usePinTable({
  rows,
  unit,
  readOnly,
  rowSelection,
  onRowSelectionChange,
  columnVisibility,
  onColumnVisibilityChange,
}: PinTableOptions) {
  const columns = useMemo(() => pinGridColumns(unit), [unit]);
  const visibility = useMemo(
    () => (readOnly ? { ...columnVisibility, [SELECT_COLUMN]: false } : columnVisibility),
    [readOnly, columnVisibility],
  );
  const table = useTable({
    features: pinGridFeatures,
    columns,
    data: rows,
    getRowId,
    state: { rowSelection, columnVisibility: visibility },
    onRowSelectionChange,
    onColumnVisibilityChange,
    enableRowSelection: !readOnly,
  });

  const displayed = table.getRowModel().rows;
  const shownRows = useMemo(() => displayed.map((r) => r.original), [displayed]);
  const rowIndexOf = useMemo(() => new Map(shownRows.map((r, i) => [r.pin.id, i])), [shownRows]);

  const visibleIds = table
    .getVisibleLeafColumns()
    .map((c) => c.id)
    .join(' ');
  const layout = useMemo(() => columnLayout(visibleIds.split(' '), unit), [visibleIds, unit]);
  const columnIds = useMemo(() => layout.map((c) => c.id), [layout]);
  const last = layout.at(-1);
  const width = last ? last.left + last.width : 0;
  const stickyWidth = layout.filter((c) => c.sticky).reduce((sum, c) => sum + c.width, 0);

  return { table, displayed, shownRows, rowIndexOf, layout, columnIds, width, stickyWidth };
}
