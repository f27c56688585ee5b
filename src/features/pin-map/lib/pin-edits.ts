/**
 * Turning grid actions (paste, fill down, clear) into pin edits: one set of changes per pin, with
 * unchanged values dropped, or a list of the cells that cannot take their value.
 */
import type { Pin, PinChanges, PinFields } from '#shared/schemas/pin-map.schema.ts';
import { type CellContext, isEditableColumn, parseCell } from './cell-values.ts';
import { type PinColumnId, CLEARABLE_COLUMNS, COLUMN_FIELDS, cellText } from './columns.ts';
import { placeBlock } from './clipboard.ts';
import type { PinRow } from './rows.ts';

/** The changes to one pin. */
export interface PinEdit {
  id: number;
  set: PinChanges;
}

/** A cell that cannot take the value offered, named as a person would find it. */
export interface CellProblem {
  pinId: number;
  /** "E1-5" */
  pin: string;
  columnId: PinColumnId;
  text: string;
  message: string;
}

export type EditPlan =
  | { ok: true; edits: PinEdit[]; cellCount: number; clippedRows: number; clippedColumns: number }
  | { ok: false; problems: CellProblem[] };

/** Only the fields whose value differs from the pin's; an empty object when nothing changes. */
export function changedFields(pin: Pin, set: PinChanges): PinChanges {
  const changed: Record<string, unknown> = {};
  for (const [key, value] of Object.entries(set)) {
    if (value !== undefined && pin[key as keyof PinFields] !== value) changed[key] = value;
  }
  return changed as PinChanges;
}

/** Merges per-cell changes into one edit per pin, in first-seen order, dropping no-ops. */
function collect(rows: Map<number, PinRow>, parts: Array<{ id: number; set: PinChanges }>) {
  const merged = new Map<number, PinChanges>();
  for (const part of parts) merged.set(part.id, { ...merged.get(part.id), ...part.set });
  const edits: PinEdit[] = [];
  for (const [id, set] of merged) {
    const changed = changedFields(rows.get(id)!.pin, set);
    if (Object.keys(changed).length) edits.push({ id, set: changed });
  }
  return edits;
}

export interface GridTarget {
  /** The rows in display order (after filter and sort). */
  rows: readonly PinRow[];
  /** The visible columns in display order; ids that are not pin columns (the checkbox) are skipped. */
  columns: readonly string[];
  startRow: number;
  startColumn: number;
}

/**
 * Plans a paste: each cell of the block goes through its column's parser. Any bad cell refuses the
 * whole paste. A read-only column (connector, cavity) accepts only the value it already shows, so a
 * block copied out of the grid pastes back in.
 */
export function planPaste(
  block: readonly (readonly string[])[],
  target: GridTarget,
  ctx: CellContext,
): EditPlan {
  const placement = placeBlock(block, {
    rowCount: target.rows.length,
    columnCount: target.columns.length,
    startRow: target.startRow,
    startColumn: target.startColumn,
  });
  const problems: CellProblem[] = [];
  const parts: Array<{ id: number; set: PinChanges }> = [];
  for (const cell of placement.cells) {
    const row = target.rows[cell.row]!;
    const columnId = target.columns[cell.column]!;
    if (columnId === 'select') continue;
    const id = columnId as PinColumnId;
    if (!isEditableColumn(id)) {
      if (cell.text.trim() !== cellText(row, id, ctx.sizeUnit)) {
        problems.push({
          pinId: row.pin.id,
          pin: row.name,
          columnId: id,
          text: cell.text,
          message: `${id === 'cavity' ? 'the cavity' : 'the connector'} cannot be changed by pasting`,
        });
      }
      continue;
    }
    const parsed = parseCell(id, cell.text, ctx, row.pin.id);
    if (parsed.ok) parts.push({ id: row.pin.id, set: parsed.set });
    else
      problems.push({
        pinId: row.pin.id,
        pin: row.name,
        columnId: id,
        text: cell.text,
        message: parsed.error,
      });
  }
  if (problems.length) return { ok: false, problems };
  const byId = new Map(target.rows.map((r) => [r.pin.id, r]));
  return {
    ok: true,
    edits: collect(byId, parts),
    cellCount: placement.cells.length,
    clippedRows: placement.clippedRows,
    clippedColumns: placement.clippedColumns,
  };
}

/** A rectangle of displayed rows and visible columns, inclusive. */
export interface CellRange {
  top: number;
  bottom: number;
  left: number;
  right: number;
}

/**
 * Plans a fill down: the top cell of each column of the range is copied into the cells below it.
 * A range one row high copies from the row above instead, as spreadsheets do.
 */
export function planFillDown(
  rows: readonly PinRow[],
  columns: readonly string[],
  range: CellRange,
): EditPlan {
  const top = range.top === range.bottom ? range.top - 1 : range.top;
  const first = range.top === range.bottom ? range.top : range.top + 1;
  if (top < 0 || first > range.bottom)
    return { ok: true, edits: [], cellCount: 0, clippedRows: 0, clippedColumns: 0 };
  const source = rows[top]!.pin;
  const parts: Array<{ id: number; set: PinChanges }> = [];
  const problems: CellProblem[] = [];
  let cellCount = 0;
  for (let c = range.left; c <= range.right; c++) {
    const id = columns[c];
    if (!id || !isEditableColumn(id)) continue;
    const set = Object.fromEntries(COLUMN_FIELDS[id].map((f) => [f, source[f]])) as PinChanges;
    for (let r = first; r <= range.bottom; r++) {
      const row = rows[r]!;
      cellCount++;
      if (set.destinationPinId != null && set.destinationPinId === row.pin.id) {
        problems.push({
          pinId: row.pin.id,
          pin: row.name,
          columnId: id,
          text: rows[top]!.linkedDestination,
          message: 'a pin cannot be its own destination',
        });
        continue;
      }
      parts.push({ id: row.pin.id, set });
    }
  }
  if (problems.length) return { ok: false, problems };
  const byId = new Map(rows.map((r) => [r.pin.id, r]));
  return { ok: true, edits: collect(byId, parts), cellCount, clippedRows: 0, clippedColumns: 0 };
}

/**
 * Plans typing over a range: the one text goes through each editable cell's parser, as if typed
 * into every cell of the range. Any cell that refuses it refuses the whole fill.
 */
export function planFill(
  rows: readonly PinRow[],
  columns: readonly string[],
  range: CellRange,
  text: string,
  ctx: CellContext,
): EditPlan {
  const parts: Array<{ id: number; set: PinChanges }> = [];
  const problems: CellProblem[] = [];
  let cellCount = 0;
  for (let c = range.left; c <= range.right; c++) {
    const id = columns[c];
    if (!id || !isEditableColumn(id)) continue;
    for (let r = range.top; r <= range.bottom; r++) {
      const row = rows[r]!;
      cellCount++;
      const parsed = parseCell(id, text, ctx, row.pin.id);
      if (parsed.ok) parts.push({ id: row.pin.id, set: parsed.set });
      else
        problems.push({
          pinId: row.pin.id,
          pin: row.name,
          columnId: id,
          text,
          message: parsed.error,
        });
    }
  }
  if (problems.length) return { ok: false, problems };
  const byId = new Map(rows.map((r) => [r.pin.id, r]));
  return { ok: true, edits: collect(byId, parts), cellCount, clippedRows: 0, clippedColumns: 0 };
}

/** Plans emptying the cells of a range (Delete); choice columns keep their value. */
export function planClear(
  rows: readonly PinRow[],
  columns: readonly string[],
  range: CellRange,
  ctx: CellContext,
): PinEdit[] {
  const parts: Array<{ id: number; set: PinChanges }> = [];
  for (let c = range.left; c <= range.right; c++) {
    const id = columns[c];
    if (!id || !isEditableColumn(id) || !CLEARABLE_COLUMNS.has(id)) continue;
    for (let r = range.top; r <= range.bottom; r++) {
      const row = rows[r]!;
      const parsed = parseCell(id, '', ctx, row.pin.id);
      if (parsed.ok) parts.push({ id: row.pin.id, set: parsed.set });
    }
  }
  const byId = new Map(rows.map((r) => [r.pin.id, r]));
  return collect(byId, parts);
}
