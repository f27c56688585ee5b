import { memo, type MouseEvent, type ReactNode } from 'react';
import type { SizeUnit } from '#shared/schemas/workshop.schema.ts';
import { isEditableColumn } from '../lib/cell-values.ts';
import { isPinColumn, SELECT_COLUMN } from '../lib/columns.ts';
import type { PinRow } from '../lib/rows.ts';
import { CellContent } from './cell-content.tsx';

export const ROW_HEIGHT = 40;
export const HEADER_HEIGHT = 40;

export interface ColumnLayout {
  id: string;
  header: string;
  width: number;
  /** Offset from the row's start. */
  left: number;
  sticky: boolean;
}

export interface CellError {
  text: string;
  message: string;
}

/**
 * A row's cells (or headings) left to right, those of the leading pinned columns in one sticky
 * box: one layer per row for the pinned cells rather than one per cell, which the browser
 * composites on every frame.
 */
export function pinnedAndRest(
  columns: readonly ColumnLayout[],
  draw: (column: ColumnLayout, index: number) => ReactNode,
): ReactNode {
  const first = columns.findIndex((c) => !c.sticky);
  const pinned = first === -1 ? columns.length : first;
  return (
    <>
      {pinned > 0 ? (
        <div className="sticky left-0 z-10 flex shrink-0">
          {columns.slice(0, pinned).map((column, i) => draw(column, i))}
        </div>
      ) : null}
      {columns.slice(pinned).map((column, i) => draw(column, i + pinned))}
    </>
  );
}

export const cellDomId = (gridId: string, pinId: number, columnId: string) =>
  `${gridId}-p${pinId}-${columnId}`;

interface GridRowProps {
  gridId: string;
  pinRow: PinRow;
  rowIndex: number;
  top: number;
  columns: ColumnLayout[];
  width: number;
  selected: boolean;
  /** Index of the focused column when this row holds the focused cell, else -1. */
  activeColumn: number;
  /** Columns of this row inside the selected range, or null. */
  rangeColumns: { left: number; right: number } | null;
  editingColumn: number;
  editor: ReactNode;
  errors: Map<string, CellError> | undefined;
  readOnly: boolean;
  unit: SizeUnit;
  onCellMouseDown: (row: number, column: number, event: MouseEvent) => void;
  onCellDoubleClick: (row: number, column: number) => void;
  onToggleSelected: (row: number, event: MouseEvent<HTMLInputElement>) => void;
}

/**
 * One pin as a grid row: fixed height, absolutely placed by the virtualizer. Memoised: moving the
 * focus redraws two rows, an edit redraws the rows it changed.
 */
export const GridRow = memo(function GridRow({
  gridId,
  pinRow,
  rowIndex,
  top,
  columns,
  width,
  selected,
  activeColumn,
  rangeColumns,
  editingColumn,
  editor,
  errors,
  readOnly,
  unit,
  onCellMouseDown,
  onCellDoubleClick,
  onToggleSelected,
}: GridRowProps) {
  const cell = (column: ColumnLayout, c: number) => {
    const active = c === activeColumn;
    const inRange = rangeColumns !== null && c >= rangeColumns.left && c <= rangeColumns.right;
    const error = errors?.get(column.id);
    const editing = c === editingColumn;
    return (
      <div
        key={column.id}
        id={cellDomId(gridId, pinRow.pin.id, column.id)}
        role="gridcell"
        data-column={column.id}
        aria-colindex={c + 1}
        aria-selected={inRange || undefined}
        aria-invalid={error ? true : undefined}
        aria-readonly={readOnly || !isEditableColumn(column.id) || undefined}
        title={error ? `${error.text}: ${error.message}` : undefined}
        onMouseDown={(e) => onCellMouseDown(rowIndex, c, e)}
        onDoubleClick={() => onCellDoubleClick(rowIndex, c)}
        className={[
          'relative flex shrink-0 items-center overflow-visible border-r border-rule/50 px-2 text-[0.875rem]',
          column.sticky && !inRange ? (selected ? 'bg-paper-sunk' : 'bg-paper-raised') : '',
          inRange ? 'bg-[color-mix(in_srgb,var(--color-focus)_12%,var(--color-paper-raised))]' : '',
          error ? 'bg-fault-wash' : '',
          active
            ? 'shadow-[inset_0_0_0_2px_var(--color-rule-strong)] group-focus-within:shadow-[inset_0_0_0_2px_var(--color-focus)]'
            : '',
        ].join(' ')}
        style={{ width: column.width }}
      >
        {editing ? (
          editor
        ) : error ? (
          <span className="flex min-w-0 flex-col leading-tight text-fault">
            <span className="truncate font-mono text-[0.8125rem]">
              <span aria-hidden>✕ </span>
              {error.text || '(empty)'}
            </span>
            <span className="truncate text-[0.6875rem]">{error.message}</span>
          </span>
        ) : column.id === SELECT_COLUMN ? (
          <input
            type="checkbox"
            tabIndex={-1}
            checked={selected}
            aria-label={`Select ${pinRow.name}`}
            onMouseDown={(e) => e.preventDefault()}
            onChange={() => undefined}
            onClick={(e) => onToggleSelected(rowIndex, e)}
            className="mx-auto size-4 accent-ink"
          />
        ) : isPinColumn(column.id) ? (
          <span className="flex min-w-0 items-center overflow-hidden whitespace-nowrap">
            <CellContent row={pinRow} column={column.id} unit={unit} />
          </span>
        ) : null}
      </div>
    );
  };
  return (
    <div
      role="row"
      aria-rowindex={rowIndex + 2}
      aria-selected={readOnly ? undefined : selected}
      data-pin={pinRow.name}
      className={`absolute left-0 flex border-b border-rule/70 ${selected ? 'bg-paper-sunk' : 'bg-paper-raised'}`}
      style={{
        width,
        height: ROW_HEIGHT,
        top,
        zIndex: editingColumn >= 0 ? 20 : undefined,
      }}
    >
      {pinnedAndRest(columns, cell)}
    </div>
  );
});
