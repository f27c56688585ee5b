import { createColumnHelper, tableFeatures, useTable } from '@tanstack/react-table';
import { useEffect, useRef, useState, type ClipboardEvent, type KeyboardEvent } from 'react';
import { Link } from 'react-router-dom';
import type { Wire, WireEnd } from '#shared/schemas/harness.schema.ts';
import { endText, type EndOption } from '../lib/end-options.ts';
import {
  WIRE_COLUMNS,
  WIRE_COLUMN_HEADERS,
  WIRE_COLUMN_WIDTHS,
  cellChange,
  cellText,
  withEnd,
  type WireColumnId,
} from '../lib/wire-cells.ts';
import { pastePatches, type WirePatch } from '../lib/wire-paste.ts';
import { CellEditor, CellValue, type Leave } from './wire-cell.tsx';

const features = tableFeatures({});
const helper = createColumnHelper<typeof features, Wire>();
const columns = helper.columns(
  WIRE_COLUMNS.map((id) =>
    helper.accessor((w) => cellText(w, id), { id, header: WIRE_COLUMN_HEADERS[id] }),
  ),
);
const getRowId = (w: Wire) => String(w.id);

interface WiresGridProps {
  wires: Wire[];
  options: readonly EndOption[];
  byKey: ReadonlyMap<string, EndOption>;
  readOnly: boolean;
  onText: (wire: Wire, col: WireColumnId, text: string) => void;
  onEnd: (wire: Wire, col: 'endA' | 'endB', end: WireEnd) => void;
  onDelete: (wire: Wire) => void;
  /** Several cells at once (paste, fill down): one patch per wire, and what could not be read. */
  onPatches: (patches: Array<{ wire: Wire; patch: WirePatch }>, problems: string[]) => void;
  onUndo: () => void;
  circuitHref: (wire: Wire) => string | null;
  /** The row to put the cursor on (a wire just added). */
  focusWireId: number | null;
}

interface WireSort {
  col: WireColumnId;
  desc: boolean;
  /** Wire ids in the order the sort gave when it was taken. */
  order: number[];
}

const NUMERIC: ReadonlySet<WireColumnId> = new Set(['size', 'length']);

/** Wire ids sorted by what a column shows; empty cells last either way. */
function sortedIds(
  wires: readonly Wire[],
  col: WireColumnId,
  desc: boolean,
  byKey: ReadonlyMap<string, EndOption>,
): number[] {
  const shown = (w: Wire) =>
    col === 'endA' || col === 'endB'
      ? endText(w.ends[col === 'endA' ? 0 : 1], byKey)
      : cellText(w, col);
  const keyed = wires.map((w) => ({ id: w.id, text: shown(w) }));
  const sign = desc ? -1 : 1;
  keyed.sort((a, b) => {
    if (!a.text || !b.text) return a.text ? -1 : b.text ? 1 : 0;
    const order = NUMERIC.has(col)
      ? Number(a.text) - Number(b.text)
      : a.text.localeCompare(b.text, undefined, { numeric: true, sensitivity: 'base' });
    return sign * order;
  });
  return keyed.map((k) => k.id);
}

/** The wires in a held order; wires added since come after, as listed. */
function inOrder(wires: readonly Wire[], order: readonly number[]): Wire[] {
  const at = new Map(order.map((id, i) => [id, i]));
  return wires
    .map((w, i) => ({ w, i, at: at.get(w.id) ?? order.length + i }))
    .sort((a, b) => a.at - b.at)
    .map((x) => x.w);
}

interface Cursor {
  row: number;
  col: number;
}

/**
 * The wire list as a grid: arrows move, Enter or typing edits, Enter saves and goes down, Tab
 * saves and goes right, Escape leaves the cell as it was.
 */
export function WiresGrid(props: WiresGridProps) {
  const { wires, options, byKey, readOnly, onText, onEnd, onDelete, circuitHref } = props;
  const { onPatches, onUndo } = props;
  const table = useTable({ features, columns, data: wires, getRowId });
  const listed = table.getRowModel().rows.map((r) => r.original);
  // A sort is taken when its header is clicked and then held: a wire edited or added afterwards
  // keeps its place instead of jumping away from the cursor.
  const [sort, setSort] = useState<WireSort | null>(null);
  const rows = sort ? inOrder(listed, sort.order) : listed;
  const sortBy = (col: WireColumnId) => {
    const desc = sort?.col === col && !sort.desc;
    setSort({ col, desc, order: sortedIds(listed, col, desc, byKey) });
  };
  const [cursor, setCursor] = useState<Cursor>({ row: 0, col: 0 });
  const [editing, setEditing] = useState<{ seed: string | null } | null>(null);
  const gridRef = useRef<HTMLTableElement>(null);
  const wantFocus = useRef(false);

  // A wire just added: the cursor goes to its end A (adjusted while rendering, not in an effect).
  const focusWireId = props.focusWireId;
  const [seenFocus, setSeenFocus] = useState<number | null>(null);
  if (focusWireId !== seenFocus) {
    const row = rows.findIndex((w) => w.id === focusWireId);
    if (row >= 0 || focusWireId === null) {
      setSeenFocus(focusWireId);
      if (row >= 0) setCursor({ row, col: WIRE_COLUMNS.indexOf('endA') });
    }
  }

  useEffect(() => {
    if (editing || !wantFocus.current) return;
    wantFocus.current = false;
    gridRef.current
      ?.querySelector<HTMLElement>(`[data-cell="${cursor.row}:${cursor.col}"]`)
      ?.focus();
  }, [cursor, editing]);

  // The wire just added is scrolled into view; focus stays where the person is typing.
  useEffect(() => {
    if (focusWireId === null) return;
    gridRef.current
      ?.querySelector<HTMLElement>(`[data-wire="${focusWireId}"]`)
      ?.scrollIntoView({ block: 'nearest' });
  }, [focusWireId]);

  const last = { row: rows.length - 1, col: WIRE_COLUMNS.length - 1 };
  const move = (row: number, col: number) => {
    wantFocus.current = true;
    setCursor({
      row: Math.max(0, Math.min(last.row, row)),
      col: Math.max(0, Math.min(last.col, col)),
    });
  };
  const leave = (how: Leave) => {
    setEditing(null);
    wantFocus.current = true;
    if (how === 'down') move(cursor.row + 1, cursor.col);
    else if (how === 'right') move(cursor.row, cursor.col + 1);
    else if (how === 'left') move(cursor.row, cursor.col - 1);
    else move(cursor.row, cursor.col);
  };

  const onKeyDown = (e: KeyboardEvent<HTMLTableElement>) => {
    if (editing || e.target instanceof HTMLInputElement || e.target instanceof HTMLSelectElement)
      return;
    if (!(e.target as HTMLElement).dataset.cell) return;
    const { row, col } = cursor;
    const keys: Record<string, () => void> = {
      ArrowDown: () => move(row + 1, col),
      ArrowUp: () => move(row - 1, col),
      ArrowRight: () => move(row, col + 1),
      ArrowLeft: () => move(row, col - 1),
      Home: () => move(e.ctrlKey ? 0 : row, 0),
      End: () => move(e.ctrlKey ? last.row : row, last.col),
      PageDown: () => move(row + 10, col),
      PageUp: () => move(row - 10, col),
    };
    const nav = keys[e.key];
    if (nav) {
      e.preventDefault();
      nav();
      return;
    }
    if (readOnly) return;
    const wire = rows[row];
    const colId = WIRE_COLUMNS[col];
    if (!wire || !colId) return;
    const ctrl = e.ctrlKey || e.metaKey;
    if (ctrl && e.key.toLowerCase() === 'z') {
      e.preventDefault();
      onUndo();
    } else if (ctrl && e.key.toLowerCase() === 'd') {
      e.preventDefault();
      const above = rows[row - 1];
      if (above) onPatches([{ wire, patch: fillFrom(above, wire, colId) }], []);
    } else if (e.key === 'Enter' || e.key === 'F2') {
      e.preventDefault();
      setEditing({ seed: null });
    } else if (
      (e.key === 'Delete' || e.key === 'Backspace') &&
      !['label', 'zone', 'endA', 'endB'].includes(colId)
    ) {
      e.preventDefault();
      onText(wire, colId, '');
    } else if (e.key.length === 1 && !e.ctrlKey && !e.metaKey && !e.altKey && colId !== 'zone') {
      e.preventDefault();
      setEditing({ seed: e.key });
    }
  };

  return (
    <div className="overflow-x-auto rounded-lg border border-rule bg-paper-raised">
      <table
        ref={gridRef}
        role="grid"
        aria-label="Wires of this conversion"
        aria-rowcount={rows.length + 1}
        onKeyDown={onKeyDown}
        onCopy={(e: ClipboardEvent) => {
          const wire = rows[cursor.row];
          const colId = WIRE_COLUMNS[cursor.col];
          if (editing || !wire || !colId) return;
          e.preventDefault();
          e.clipboardData.setData('text/plain', copyText(wire, colId, byKey));
        }}
        onPaste={(e: ClipboardEvent) => {
          if (editing || readOnly) return;
          e.preventDefault();
          const { patches, problems } = pastePatches(
            rows,
            cursor,
            e.clipboardData.getData('text/plain'),
            options,
          );
          onPatches(patches, problems);
        }}
        className="w-full border-collapse text-sm"
      >
        <thead className="border-b border-rule bg-paper-sunk/60">
          <tr>
            {WIRE_COLUMNS.map((id) => (
              <th
                key={id}
                scope="col"
                aria-sort={sort?.col === id ? (sort.desc ? 'descending' : 'ascending') : undefined}
                style={{ minWidth: WIRE_COLUMN_WIDTHS[id] }}
                className={`px-2 py-2 text-left font-semibold ${
                  id === 'label' ? 'sticky left-0 z-10 bg-paper-sunk' : ''
                }`}
              >
                <button
                  type="button"
                  onClick={() => sortBy(id)}
                  className="text-left font-semibold hover:underline"
                  title={`Sort by ${WIRE_COLUMN_HEADERS[id].toLowerCase()}`}
                >
                  {WIRE_COLUMN_HEADERS[id]}
                  {sort?.col === id ? (
                    <span aria-hidden="true">{sort.desc ? ' ▼' : ' ▲'}</span>
                  ) : null}
                </button>
              </th>
            ))}
            <th scope="col" className="px-2 py-2 text-left font-semibold">
              <span className="sr-only">Actions</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {rows.map((wire, r) => (
            <tr key={wire.id} data-wire={wire.id} className="border-b border-rule/70 last:border-0">
              {WIRE_COLUMNS.map((colId, c) => {
                const here = cursor.row === r && cursor.col === c;
                const open = here && editing !== null;
                return (
                  <td
                    key={colId}
                    data-cell={`${r}:${c}`}
                    tabIndex={here && !open ? 0 : -1}
                    aria-selected={here}
                    onClick={() => setCursor({ row: r, col: c })}
                    onDoubleClick={() => {
                      if (readOnly) return;
                      setCursor({ row: r, col: c });
                      setEditing({ seed: null });
                    }}
                    className={`h-10 px-2 py-1 align-middle ${
                      colId === 'label' ? 'sticky left-0 z-10 bg-paper-raised' : ''
                    } ${here ? 'outline outline-2 -outline-offset-2 outline-focus' : ''}`}
                  >
                    {open ? (
                      <CellEditor
                        wire={wire}
                        col={colId}
                        seed={editing.seed}
                        options={options}
                        onText={(text, how) => {
                          if (text !== cellText(wire, colId)) onText(wire, colId, text);
                          leave(how);
                        }}
                        onEnd={(end, how) => {
                          onEnd(wire, colId as 'endA' | 'endB', end);
                          leave(how);
                        }}
                        onCancel={() => leave('stay')}
                      />
                    ) : (
                      <CellValue wire={wire} col={colId} byKey={byKey} />
                    )}
                  </td>
                );
              })}
              <td className="whitespace-nowrap px-2 py-1">
                <RowActions
                  wire={wire}
                  href={circuitHref(wire)}
                  readOnly={readOnly}
                  onDelete={onDelete}
                />
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

function RowActions({
  wire,
  href,
  readOnly,
  onDelete,
}: {
  wire: Wire;
  href: string | null;
  readOnly: boolean;
  onDelete: (wire: Wire) => void;
}) {
  return (
    <span className="flex items-center gap-2">
      {href ? (
        <Link
          to={href}
          aria-label={`Show circuit of ${wire.label}`}
          className="text-copper-deep underline-offset-2 hover:underline"
        >
          Show circuit
        </Link>
      ) : null}
      {readOnly ? null : (
        <button
          type="button"
          aria-label={`Delete ${wire.label}`}
          onClick={() => onDelete(wire)}
          className="rounded px-1.5 text-fault hover:bg-fault-wash"
        >
          Delete
        </button>
      )}
    </span>
  );
}

/** A cell's text as copied: what the grid shows, so it pastes back into the same kind of cell. */
function copyText(wire: Wire, col: WireColumnId, byKey: ReadonlyMap<string, EndOption>) {
  if (col === 'endA' || col === 'endB') return endText(wire.ends[col === 'endA' ? 0 : 1], byKey);
  return cellText(wire, col);
}

/** Fill down: the cell above's value for this wire. */
function fillFrom(above: Wire, wire: Wire, col: WireColumnId): WirePatch {
  if (col === 'endA' || col === 'endB') {
    return { ends: withEnd(wire, col, above.ends[col === 'endA' ? 0 : 1]) };
  }
  const change = cellChange(col, cellText(above, col));
  return change.ok ? change.patch : {};
}
