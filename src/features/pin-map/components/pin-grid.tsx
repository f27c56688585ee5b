import {
  useTable,
  type ColumnVisibilityState,
  type OnChangeFn,
  type RowSelectionState,
} from '@tanstack/react-table';
import {
  defaultRangeExtractor,
  useVirtualizer,
  type Rect,
  type Virtualizer,
} from '@tanstack/react-virtual';
import {
  useEffect,
  useEffectEvent,
  useId,
  useImperativeHandle,
  useMemo,
  useRef,
  useState,
  type KeyboardEvent,
  type MouseEvent,
  type Ref,
} from 'react';
import type { PinEditing } from '../hooks/use-pin-editing.ts';
import { useStableHandler } from '../hooks/use-stable-handler.ts';
import {
  isEditableColumn,
  parseCell,
  type CellContext,
  type EditableColumnId,
} from '../lib/cell-values.ts';
import { parseClipboardBlock, toClipboardText } from '../lib/clipboard.ts';
import { cellText, columnHeader, isPinColumn, SELECT_COLUMN } from '../lib/columns.ts';
import { editorKind, editorOptions } from '../lib/editor-options.ts';
import {
  moveFocus,
  moveForKey,
  rangeBetween,
  type GridPosition,
  type Move,
} from '../lib/navigation.ts';
import {
  changedFields,
  planClear,
  planFillDown,
  planPaste,
  type CellProblem,
  type CellRange,
} from '../lib/pin-edits.ts';
import type { PinRow } from '../lib/rows.ts';
import { CellEditor, type EditorMove } from './cell-editor.tsx';
import { columnLayout, pinGridColumns, pinGridFeatures } from './grid-columns.ts';
import { focusHeading, GridHeader } from './grid-header.tsx';
import { cellDomId, GridRow, HEADER_HEIGHT, ROW_HEIGHT, type CellError } from './grid-row.tsx';

export interface PinGridHandle {
  /** Shows the pin's row, focuses its cell in the current column and scrolls to it. */
  focusPin: (pinId: number) => void;
}

interface CellKey {
  pinId: number;
  columnId: string;
}

interface EditState extends CellKey {
  columnId: EditableColumnId;
  initialText: string;
  fresh: boolean;
  dropUp: boolean;
}

const getRowId = (row: PinRow) => String(row.pin.id);

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

const EDITOR_MOVES: Record<Exclude<EditorMove, 'stay'>, Move> = {
  down: 'down',
  up: 'up',
  right: 'next',
  left: 'previous',
};

interface PinGridProps {
  /** The rows to show, already filtered. */
  rows: PinRow[];
  ctx: CellContext;
  readOnly: boolean;
  rowSelection: RowSelectionState;
  onRowSelectionChange: OnChangeFn<RowSelectionState>;
  columnVisibility: ColumnVisibilityState;
  onColumnVisibilityChange: OnChangeFn<ColumnVisibilityState>;
  editing: PinEditing;
  /** Id of the text that explains the grid's keys. */
  describedBy?: string;
  ref?: Ref<PinGridHandle>;
}

/**
 * The pin grid: a spreadsheet-like table of pins, moved through by keyboard, edited cell by cell,
 * pasted into and filled down. Only the rows in view are drawn, so a thousand pins scroll freely.
 */
export function PinGrid({
  rows,
  ctx,
  readOnly,
  rowSelection,
  onRowSelectionChange,
  columnVisibility,
  onColumnVisibilityChange,
  editing,
  describedBy,
  ref,
}: PinGridProps) {
  const gridId = `pin-grid-${useId().replace(/[^a-zA-Z0-9]/g, '')}`;
  const unit = ctx.sizeUnit;
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

  const [active, setActive] = useState<CellKey | null>(null);
  const [anchor, setAnchor] = useState<CellKey | null>(null);
  const [editState, setEdit] = useState<EditState | null>(null);
  const [cellErrors, setCellErrors] = useState<Map<number, Map<string, CellError>>>(
    () => new Map(),
  );
  // An edit whose row went away (filtered out, connector deleted) no longer counts.
  const edit =
    editState && rowIndexOf.has(editState.pinId) && columnIds.includes(editState.columnId)
      ? editState
      : null;

  const positionOf = (key: CellKey | null): GridPosition | null => {
    if (!key) return null;
    const row = rowIndexOf.get(key.pinId);
    const column = columnIds.indexOf(key.columnId);
    return row === undefined || column < 0 ? null : { row, column };
  };
  const activePos = positionOf(active);
  const anchorPos = positionOf(anchor);
  const range: CellRange | null =
    activePos && anchorPos ? rangeBetween(anchorPos, activePos) : null;

  const scrollRef = useRef<HTMLDivElement>(null);
  // No React Compiler in this build; the virtualizer is read during render on purpose.
  // eslint-disable-next-line react-hooks/incompatible-library
  const virtualizer = useVirtualizer({
    count: displayed.length,
    // The row being edited and the focused row stay drawn when scrolled away, so the editor keeps
    // its text and the grid's active descendant stays in the page.
    rangeExtractor: (range) => {
      const keep = [activePos?.row, edit ? rowIndexOf.get(edit.pinId) : undefined].filter(
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
    getItemKey: (index) => shownRows[index]?.pin.id ?? index,
  });

  const keyAt = (pos: GridPosition): CellKey | null => {
    const row = shownRows[pos.row];
    const columnId = columnIds[pos.column];
    return row && columnId ? { pinId: row.pin.id, columnId } : null;
  };

  const defaultPosition = (): GridPosition => ({
    row: 0,
    column: Math.max(0, columnIds.indexOf('function')),
  });

  function focusGrid() {
    scrollRef.current?.focus({ preventScroll: true });
  }

  function scrollToCell(pos: GridPosition, align: 'auto' | 'center' = 'auto') {
    virtualizer.scrollToIndex(pos.row, { align });
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

  function setErrors(problems: CellProblem[]) {
    const next = new Map<number, Map<string, CellError>>();
    for (const p of problems) {
      const row = new Map(next.get(p.pinId));
      row.set(p.columnId, { text: p.text, message: p.message });
      next.set(p.pinId, row);
    }
    setCellErrors(next);
  }

  function clearError(pinId: number, columnId: string) {
    if (!cellErrors.get(pinId)?.has(columnId)) return;
    setCellErrors((old) => {
      const next = new Map(old);
      const row = new Map(next.get(pinId));
      row.delete(columnId);
      if (row.size) next.set(pinId, row);
      else next.delete(pinId);
      return next;
    });
  }

  function reportProblems(what: string, problems: CellProblem[]) {
    setErrors(problems);
    editing.notify({
      tone: 'fault',
      title: `Nothing was ${what}: ${problems.length === 1 ? 'one cell does' : `${problems.length} cells do`} not take ${problems.length === 1 ? 'its value' : 'their values'}.`,
      items: problems
        .slice(0, 12)
        .map((p) => `${p.pin}, ${columnHeader(p.columnId, unit)}: ${p.message}`)
        .concat(problems.length > 12 ? [`…and ${problems.length - 12} more`] : []),
    });
  }

  function refuseReadOnly() {
    editing.notify({
      tone: 'info',
      title: 'The pin map is read-only for your role: you can look, filter and copy, not change.',
    });
  }

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
    if (readOnly) return refuseReadOnly();
    const el = scrollRef.current;
    const rowTop = HEADER_HEIGHT + pos.row * ROW_HEIGHT - (el?.scrollTop ?? 0);
    setActive({ pinId: row.pin.id, columnId });
    setAnchor(null);
    scrollToCell(pos);
    setEdit({
      pinId: row.pin.id,
      columnId,
      initialText: typed ?? cellText(row, columnId, unit),
      fresh: typed !== undefined,
      dropUp: !!el && rowTop > el.clientHeight * 0.55,
    });
  }

  /** Saves one cell's text; returns why it cannot be saved, or null. */
  function saveCell(row: PinRow, columnId: EditableColumnId, text: string): string | null {
    const parsed = parseCell(columnId, text, ctx, row.pin.id);
    if (!parsed.ok) return parsed.error;
    clearError(row.pin.id, columnId);
    const set = changedFields(row.pin, parsed.set);
    if (Object.keys(set).length) {
      editing.write(
        [{ id: row.pin.id, set }],
        `${columnHeader(columnId, unit).toLowerCase()} of ${row.name}`,
      );
    }
    return null;
  }

  function commitEdit(text: string, move: EditorMove): string | null {
    if (!edit) return null;
    const row = shownRows[rowIndexOf.get(edit.pinId) ?? -1];
    if (row) {
      const problem = saveCell(row, edit.columnId, text);
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
    const row = shownRows[rowIndexOf.get(current.pinId) ?? -1];
    if (!row) return;
    const problem = saveCell(row, current.columnId, text);
    if (problem) {
      setCellErrors((old) => {
        const next = new Map(old);
        next.set(
          current.pinId,
          new Map(next.get(current.pinId)).set(current.columnId, { text, message: problem }),
        );
        return next;
      });
    }
  }

  function currentRange(): CellRange | null {
    if (range) return range;
    if (!activePos) return null;
    return rangeBetween(activePos, activePos);
  }

  function fillDown() {
    if (readOnly) return refuseReadOnly();
    const target = currentRange();
    if (!target) return;
    const plan = planFillDown(shownRows, columnIds, target);
    if (!plan.ok) return reportProblems('filled down', plan.problems);
    if (plan.edits.length === 0) {
      editing.notify({
        tone: 'info',
        title: 'Nothing to fill: the cells below already hold the top cell’s value.',
      });
      return;
    }
    setCellErrors(new Map());
    editing.write(
      plan.edits,
      `fill down over ${plan.edits.length} pin${plan.edits.length === 1 ? '' : 's'}`,
      'batch',
    );
  }

  function clearCells() {
    if (readOnly) return refuseReadOnly();
    const target = currentRange();
    if (!target) return;
    const edits = planClear(shownRows, columnIds, target, ctx);
    if (edits.length === 0) return;
    const single = target.top === target.bottom && target.left === target.right;
    const row = shownRows[target.top]!;
    const columnId = columnIds[target.left]!;
    editing.write(
      edits,
      single && isPinColumn(columnId)
        ? `clearing ${columnHeader(columnId, unit).toLowerCase()} of ${row.name}`
        : `clearing of cells in ${edits.length} pins`,
    );
  }

  function onPaste(event: ClipboardEvent) {
    event.preventDefault();
    if (readOnly) return refuseReadOnly();
    const block = parseClipboardBlock(event.clipboardData?.getData('text/plain') ?? '');
    if (block.length === 0 || displayed.length === 0) return;
    const start = activePos ?? defaultPosition();
    const plan = planPaste(
      block,
      { rows: shownRows, columns: columnIds, startRow: start.row, startColumn: start.column },
      ctx,
    );
    if (!plan.ok) return reportProblems('pasted', plan.problems);
    setCellErrors(new Map());
    const height = Math.min(block.length, displayed.length - start.row);
    const breadth = Math.min(
      Math.max(...block.map((r) => r.length)),
      columnIds.length - start.column,
    );
    const end = { row: start.row + height - 1, column: start.column + Math.max(breadth, 1) - 1 };
    // As spreadsheets do: the pasted block stays marked, the focus stays on its first cell.
    setAnchor(keyAt(end));
    setActive(keyAt(start));
    if (plan.edits.length) {
      editing.write(
        plan.edits,
        `paste into ${plan.edits.length} pin${plan.edits.length === 1 ? '' : 's'}`,
        'batch',
      );
    }
    const clipped = [
      plan.clippedRows ? `${plan.clippedRows} row${plan.clippedRows === 1 ? '' : 's'}` : '',
      plan.clippedColumns
        ? `${plan.clippedColumns} column${plan.clippedColumns === 1 ? '' : 's'}`
        : '',
    ].filter(Boolean);
    if (clipped.length) {
      editing.notify({
        tone: 'caution',
        title: `The block ran past the edge of the grid: ${clipped.join(' and ')} left out.`,
      });
    } else if (plan.edits.length === 0) {
      editing.notify({ tone: 'info', title: 'The pasted values are already there.' });
    }
  }

  function onCopy(event: ClipboardEvent) {
    const target = currentRange();
    if (!target) return;
    event.preventDefault();
    const block: string[][] = [];
    for (let r = target.top; r <= target.bottom; r++) {
      const row = shownRows[r]!;
      const cells: string[] = [];
      for (let c = target.left; c <= target.right; c++) {
        const id = columnIds[c]!;
        // The checkbox column copies as an empty cell, so the block pastes back in line.
        cells.push(isPinColumn(id) ? cellText(row, id, unit) : '');
      }
      block.push(cells);
    }
    event.clipboardData?.setData('text/plain', toClipboardText(block));
  }

  // Chromium sends clipboard events to the element holding the text selection, which need not be
  // the focused grid, so they are caught on the document while the grid itself has the focus.
  const onClipboard = useEffectEvent((event: ClipboardEvent) => {
    if (!scrollRef.current || document.activeElement !== scrollRef.current) return;
    if (event.type === 'paste') onPaste(event);
    else onCopy(event);
  });
  useEffect(() => {
    const listener = (event: ClipboardEvent) => onClipboard(event);
    document.addEventListener('paste', listener);
    document.addEventListener('copy', listener);
    return () => {
      document.removeEventListener('paste', listener);
      document.removeEventListener('copy', listener);
    };
  }, []);

  function onKeyDown(event: KeyboardEvent<HTMLDivElement>) {
    // Keys on a heading's sort button are that button's; the editor keeps its own keys.
    if (event.target !== event.currentTarget || edit || displayed.length === 0) return;
    const mod = event.ctrlKey || event.metaKey;
    const here = activePos ?? defaultPosition();
    const key = event.key.toLowerCase();
    if (mod && !event.altKey && key.length === 1) {
      if (key === 'z' && !event.shiftKey) {
        event.preventDefault();
        if (readOnly) refuseReadOnly();
        else editing.undo();
      } else if (key === 'd') {
        event.preventDefault();
        fillDown();
      } else if (key === 'a') {
        event.preventDefault();
        setAnchor(keyAt({ row: 0, column: 0 }));
        setActive(keyAt({ row: displayed.length - 1, column: columnIds.length - 1 }));
      }
      // Ctrl+C and Ctrl+V go on to the copy and paste events.
      return;
    }
    const move = moveForKey(event.key, { shift: event.shiftKey, ctrl: mod });
    if (move) {
      const pageRows = Math.max(
        1,
        Math.floor(((scrollRef.current?.clientHeight ?? 400) - HEADER_HEIGHT) / ROW_HEIGHT) - 1,
      );
      // Up from the first row reaches the headings, where Enter sorts by that column.
      if (move === 'up' && activePos?.row === 0 && !event.shiftKey && scrollRef.current) {
        event.preventDefault();
        focusHeading(scrollRef.current, columnIds[activePos.column]!);
        return;
      }
      const next = activePos
        ? moveFocus(activePos, move, {
            rows: displayed.length,
            columns: columnIds.length,
            pageRows,
          })
        : here;
      // Tab past the last cell (or Shift+Tab before the first) leaves the grid.
      if (!next) return;
      event.preventDefault();
      moveTo(next, event.shiftKey && move !== 'next' && move !== 'previous');
      return;
    }
    switch (event.key) {
      case 'Enter':
      case 'F2':
        event.preventDefault();
        return startEdit(here);
      case 'Escape':
        if (anchor) {
          event.preventDefault();
          setAnchor(null);
        }
        return;
      case 'Delete':
      case 'Backspace':
        event.preventDefault();
        return clearCells();
      case ' ':
        if (columnIds[here.column] === SELECT_COLUMN) {
          event.preventDefault();
          return toggleRow(here.row, event.shiftKey);
        }
    }
    if (event.key.length === 1 && !mod && !event.altKey) {
      event.preventDefault();
      startEdit(here, event.key);
    }
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
        listWidth={
          edit.columnId === 'destination' ? 340 : editorKind(edit.columnId) === 'text' ? 0 : 240
        }
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

  return (
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
              errors={cellErrors.get(row.pin.id)}
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
  );
}
