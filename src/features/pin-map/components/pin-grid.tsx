import {
  useId,
  useImperativeHandle,
  useRef,
  useState,
  type KeyboardEvent,
  type MouseEvent,
  type ReactNode,
  type Ref,
} from 'react';
import { useCellErrors } from '../hooks/use-cell-errors.ts';
import { useDocumentClipboard } from '../hooks/use-document-clipboard.ts';
import { useGridCursor, type CellKey } from '../hooks/use-grid-cursor.ts';
import { scrollToRow, useGridVirtualizer } from '../hooks/use-grid-virtualizer.ts';
import { usePinTable, type PinTableOptions } from '../hooks/use-pin-table.ts';
import type { PinEditing } from '../hooks/use-pin-editing.ts';
import { useStableHandler } from '../hooks/use-stable-handler.ts';
import { isEditableColumn, type CellContext, type EditableColumnId } from '../lib/cell-values.ts';
import { cellText, SELECT_COLUMN } from '../lib/columns.ts';
import { editorKind, editorListWidth, editorOptions } from '../lib/editor-options.ts';
import { moveFocus, type GridPosition, type Move } from '../lib/navigation.ts';
import type { CellRange } from '../lib/pin-edits.ts';
import type { PinRow } from '../lib/rows.ts';
import { CellEditor, type EditorMove } from './cell-editor.tsx';
import { gridCommands } from './grid-commands.ts';
import { focusHeading, GridHeader } from './grid-header.tsx';
import { handleGridKey } from './grid-keys.ts';
import { cellDomId, GridRow, HEADER_HEIGHT, ROW_HEIGHT } from './grid-row.tsx';

export interface PinGridHandle {
  /** Shows the pin's row, focuses its cell in the current column and scrolls to it. */
  focusPin: (pinId: number) => void;
}

interface EditState extends CellKey {
  columnId: EditableColumnId;
  initialText: string;
  fresh: boolean;
  dropUp: boolean;
  /** Typing started over a range of cells: the text fills all of them. */
  fill: CellRange | null;
}

const EDITOR_MOVES: Record<Exclude<EditorMove, 'stay'>, Move> = {
  down: 'down',
  up: 'up',
  right: 'next',
  left: 'previous',
};

interface PinGridProps extends Omit<PinTableOptions, 'unit'> {
  ctx: CellContext;
  editing: PinEditing;
  /** Id of the text that explains the grid's keys. */
  describedBy?: string;
  ref?: Ref<PinGridHandle>;
  /**
   * What to show under the grid for the pin the cursor is on (a link to its circuit). Drawn by
   * the grid itself, so moving the cursor redraws the grid and not the whole pin map.
   */
  renderActivePin?: (row: PinRow) => ReactNode;
}

/**
 * The pin grid: a spreadsheet-like table of pins, moved through by keyboard, edited cell by cell,
 * pasted into and filled down. Only the rows in view are drawn, so a thousand pins scroll freely.
 */
export function PinGrid({
  ctx,
  editing,
  describedBy,
  ref,
  renderActivePin,
  ...tableOptions
}: PinGridProps) {
  const gridId = `pin-grid-${useId().replace(/[^a-zA-Z0-9]/g, '')}`;
  const unit = ctx.sizeUnit;
  const { readOnly, rowSelection } = tableOptions;
  const { table, displayed, shownRows, rowIndexOf, layout, columnIds, width, stickyWidth } =
    usePinTable({ ...tableOptions, unit });

  const { active, setActive, anchor, setAnchor, activePos, range, keyAt, ...cursor } =
    useGridCursor({ rows: shownRows, columnIds, rowIndexOf });
  const { defaultPosition, currentRange } = cursor;
  const [editState, setEdit] = useState<EditState | null>(null);
  const errors = useCellErrors();
  // An edit whose row went away (filtered out, connector deleted) no longer counts.
  const edit =
    editState && rowIndexOf.has(editState.pinId) && columnIds.includes(editState.columnId)
      ? editState
      : null;

  const scrollRef = useRef<HTMLDivElement>(null);
  const virtualizer = useGridVirtualizer({
    count: displayed.length,
    scrollRef,
    keepRows: [activePos?.row, edit ? rowIndexOf.get(edit.pinId) : undefined],
    rowKey: (index) => shownRows[index]?.pin.id ?? index,
  });

  function focusGrid() {
    scrollRef.current?.focus({ preventScroll: true });
  }

  function scrollToCell(pos: GridPosition, align: 'auto' | 'center' = 'auto') {
    scrollToRow(virtualizer, pos.row, align);
    const el = scrollRef.current;
    const column = layout[pos.column];
    if (!el || !column || column.sticky) return;
    if (column.left < el.scrollLeft + stickyWidth) el.scrollLeft = column.left - stickyWidth;
    else if (column.left + column.width > el.scrollLeft + el.clientWidth)
      el.scrollLeft = column.left + column.width - el.clientWidth;
  }

  function moveTo(pos: GridPosition, extend = false) {
    const key = keyAt(pos);
    if (!key) return;
    if (extend) setAnchor((a) => a ?? active ?? key);
    else setAnchor(null);
    setActive(key);
    scrollToCell(pos);
  }

  const commands = gridCommands({ rows: shownRows, columnIds, ctx, readOnly, editing, errors });

  /** Space on the checkbox column: through the row's own handler, so Shift+Space selects a range. */
  function toggleRow(rowIndex: number, shiftKey = false) {
    const row = displayed[rowIndex];
    if (readOnly || !row) return;
    row.getToggleSelectedHandler()({ target: { checked: !row.getIsSelected() }, shiftKey });
  }

  function startEdit(pos: GridPosition, typed?: string) {
    const row = shownRows[pos.row];
    const columnId = columnIds[pos.column];
    if (!row || !columnId) return;
    if (columnId === SELECT_COLUMN) return toggleRow(pos.row);
    if (!isEditableColumn(columnId)) return;
    if (readOnly) return commands.refuseReadOnly();
    const el = scrollRef.current;
    const rowTop = HEADER_HEIGHT + pos.row * ROW_HEIGHT - (el?.scrollTop ?? 0);
    // Typing over a range of several cells fills the range; Enter or F2 edits one cell.
    const target = typed !== undefined ? currentRange() : null;
    const fill =
      target && (target.top !== target.bottom || target.left !== target.right) ? target : null;
    setActive({ pinId: row.pin.id, columnId });
    if (!fill) setAnchor(null);
    scrollToCell(pos);
    setEdit({
      pinId: row.pin.id,
      columnId,
      initialText: typed ?? cellText(row, columnId, unit),
      fresh: typed !== undefined,
      dropUp: !!el && rowTop > el.clientHeight * 0.55,
      fill,
    });
  }

  function commitEdit(text: string, move: EditorMove): string | null {
    if (!edit) return null;
    const row = shownRows[rowIndexOf.get(edit.pinId) ?? -1];
    if (edit.fill) {
      const problem = commands.fillCells(edit.fill, text);
      if (problem) return problem;
      setAnchor(null);
    } else if (row) {
      const problem = commands.saveCell(row, edit.columnId, text);
      if (problem) return problem;
    }
    setEdit(null);
    focusGrid();
    if (move !== 'stay' && activePos) {
      const size = { rows: displayed.length, columns: columnIds.length, pageRows: 1 };
      const next = moveFocus(activePos, EDITOR_MOVES[move], size);
      if (next) moveTo(next);
    }
    return null;
  }

  function cancelEdit() {
    setEdit(null);
    focusGrid();
  }

  function leaveEdit(text: string | null) {
    const current = edit;
    setEdit(null);
    if (text === null || !current) return;
    if (current.fill) {
      commands.fillCells(current.fill, text);
      setAnchor(null);
      return;
    }
    const row = shownRows[rowIndexOf.get(current.pinId) ?? -1];
    if (!row) return;
    const problem = commands.saveCell(row, current.columnId, text);
    if (problem) errors.add(current.pinId, current.columnId, { text, message: problem });
  }

  useDocumentClipboard(scrollRef, {
    onPaste(event) {
      event.preventDefault();
      const start = activePos ?? defaultPosition();
      const pasted = commands.paste(event.clipboardData?.getData('text/plain') ?? '', start);
      if (!pasted) return;
      // As spreadsheets do: the pasted block stays marked, the focus stays on its first cell.
      setAnchor(keyAt(pasted.end));
      setActive(keyAt(pasted.start));
    },
    onCopy(event) {
      const target = currentRange();
      if (!target) return;
      event.preventDefault();
      event.clipboardData?.setData('text/plain', commands.copy(target));
    },
  });

  function onKeyDown(event: KeyboardEvent<HTMLDivElement>) {
    // Keys on a heading's sort button are that button's; the editor keeps its own keys.
    if (event.target !== event.currentTarget || edit || displayed.length === 0) return;
    const here = activePos ?? defaultPosition();
    handleGridKey(event, {
      rows: displayed.length,
      columns: columnIds.length,
      active: activePos,
      here,
      hasRange: anchor !== null,
      onCheckbox: columnIds[here.column] === SELECT_COLUMN,
      visibleRows: () =>
        Math.max(
          1,
          Math.floor(((scrollRef.current?.clientHeight ?? 400) - HEADER_HEIGHT) / ROW_HEIGHT) - 1,
        ),
      undo: () => (readOnly ? commands.refuseReadOnly() : editing.undo()),
      fillDown: () => commands.fillDown(currentRange()),
      selectAll: () => {
        setAnchor(keyAt({ row: 0, column: 0 }));
        setActive(keyAt({ row: displayed.length - 1, column: columnIds.length - 1 }));
      },
      toHeading: (column) => {
        if (scrollRef.current) focusHeading(scrollRef.current, columnIds[column]!);
      },
      moveTo,
      startEdit,
      dropRange: () => setAnchor(null),
      clearCells: () => commands.clearCells(currentRange()),
      toggleRow,
    });
  }

  function onCellMouseDown(rowIndex: number, column: number, event: MouseEvent) {
    if (event.button !== 0) return;
    const key = keyAt({ row: rowIndex, column });
    if (!key) return;
    if (edit && edit.pinId === key.pinId && edit.columnId === key.columnId) return;
    // Keeps Shift+click from selecting text; the grid takes the focus itself.
    event.preventDefault();
    // Shift+click on a checkbox selects rows, not cells.
    if (event.shiftKey && key.columnId !== SELECT_COLUMN) setAnchor((a) => a ?? active ?? key);
    else setAnchor(null);
    setActive(key);
    focusGrid();
  }

  function onToggleSelected(rowIndex: number, event: MouseEvent<HTMLInputElement>) {
    if (readOnly) return;
    displayed[rowIndex]?.getToggleSelectedHandler()(event);
  }

  // The rows are memoised, so they get handlers that never change and call the latest ones.
  const stableMouseDown = useStableHandler(onCellMouseDown);
  const stableDoubleClick = useStableHandler((r: number, c: number) =>
    startEdit({ row: r, column: c }),
  );
  const stableToggle = useStableHandler(onToggleSelected);

  useImperativeHandle(ref, () => ({
    focusPin(pinId: number) {
      const index = rowIndexOf.get(pinId);
      if (index === undefined) return;
      const column = activePos?.column ?? defaultPosition().column;
      setActive(keyAt({ row: index, column }));
      setAnchor(null);
      scrollRef.current?.scrollIntoView({ block: 'nearest' });
      scrollToCell({ row: index, column }, 'center');
      focusGrid();
    },
  }));

  const editingRow = edit ? rowIndexOf.get(edit.pinId) : undefined;
  const editingColumn = edit ? columnIds.indexOf(edit.columnId) : -1;
  const editingLayout = editingColumn >= 0 ? layout[editingColumn] : undefined;
  const editor =
    edit && editingRow !== undefined && editingLayout ? (
      <CellEditor
        key={`${edit.pinId}-${edit.columnId}`}
        id={`${gridId}-editor`}
        label={`${editingLayout.header} of ${shownRows[editingRow]!.name}`}
        kind={editorKind(edit.columnId)}
        listWidth={editorListWidth(edit.columnId)}
        initialText={edit.initialText}
        fresh={edit.fresh}
        options={(text) => editorOptions(edit.columnId, text, ctx, edit.pinId)}
        width={editingLayout.width}
        dropUp={edit.dropUp}
        onCommit={commitEdit}
        onCancel={cancelEdit}
        onLeave={leaveEdit}
      />
    ) : null;

  const activeDescendant =
    active && activePos && !edit ? cellDomId(gridId, active.pinId, active.columnId) : undefined;

  const activeRow = activePos ? shownRows[activePos.row] : undefined;

  return (
    <>
      <div
        ref={scrollRef}
        role="grid"
        tabIndex={0}
        aria-label="Pins"
        aria-rowcount={displayed.length + 1}
        aria-colcount={layout.length}
        aria-multiselectable={!readOnly || undefined}
        aria-readonly={readOnly || undefined}
        aria-activedescendant={activeDescendant}
        aria-describedby={describedBy}
        onKeyDown={onKeyDown}
        onFocus={(e) => {
          // A click sets the focused cell before the grid takes focus: keep that one.
          if (e.target === e.currentTarget) setActive((a) => a ?? keyAt(defaultPosition()));
        }}
        className="group relative h-[min(68vh,760px)] overflow-auto rounded-lg border border-rule-strong bg-paper-raised outline-none focus-visible:ring-3 focus-visible:ring-focus/40"
      >
        <GridHeader
          table={table}
          layout={layout}
          width={width}
          readOnly={readOnly}
          onLeave={(column) => {
            moveTo({ row: 0, column });
            focusGrid();
          }}
        />
        <div
          role="rowgroup"
          className="relative"
          style={{ height: virtualizer.getTotalSize(), width }}
        >
          {virtualizer.getVirtualItems().map((item) => {
            const row = shownRows[item.index];
            if (!row) return null;
            const isActiveRow = activePos?.row === item.index;
            const inRange = range && item.index >= range.top && item.index <= range.bottom;
            const isEditingRow = editingRow === item.index;
            return (
              <GridRow
                key={row.pin.id}
                gridId={gridId}
                pinRow={row}
                rowIndex={item.index}
                top={item.start - HEADER_HEIGHT}
                columns={layout}
                width={width}
                selected={!!rowSelection[String(row.pin.id)]}
                activeColumn={isActiveRow ? activePos.column : -1}
                rangeColumns={inRange ? { left: range.left, right: range.right } : null}
                editingColumn={isEditingRow ? editingColumn : -1}
                editor={isEditingRow ? editor : null}
                errors={errors.forPin(row.pin.id)}
                readOnly={readOnly}
                unit={unit}
                onCellMouseDown={stableMouseDown}
                onCellDoubleClick={stableDoubleClick}
                onToggleSelected={stableToggle}
              />
            );
          })}
        </div>
        {displayed.length === 0 ? (
          <p className="sticky left-0 px-4 py-8 text-ink-faint">No pins match the filters.</p>
        ) : null}
      </div>
      {activeRow && renderActivePin ? renderActivePin(activeRow) : null}
    </>
  );
}
