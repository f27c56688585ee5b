/**
 * What the grid writes: one cell's text, and fill down, clear, paste and copy over many cells. Each
 * plans its edits first and writes nothing when a cell refuses its value.
 */
import type { PinEditing } from '../hooks/use-pin-editing.ts';
import type { CellErrors } from '../hooks/use-cell-errors.ts';
import { parseCell, type CellContext, type EditableColumnId } from '../lib/cell-values.ts';
import { parseClipboardBlock, toClipboardText } from '../lib/clipboard.ts';
import { cellText, columnHeader, isPinColumn } from '../lib/columns.ts';
import type { GridPosition } from '../lib/navigation.ts';
import {
  changedFields,
  planClear,
  planFill,
  planFillDown,
  planPaste,
  type CellProblem,
  type CellRange,
} from '../lib/pin-edits.ts';
import type { PinRow } from '../lib/rows.ts';

export interface GridCommandDeps {
  rows: PinRow[];
  columnIds: string[];
  ctx: CellContext;
  readOnly: boolean;
  editing: PinEditing;
  errors: CellErrors;
}

const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? '' : 's'}`;

export function gridCommands({ rows, columnIds, ctx, readOnly, editing, errors }: GridCommandDeps) {
  const unit = ctx.sizeUnit;

  function reportProblems(what: string, problems: CellProblem[]) {
    errors.show(problems);
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

  function fillDown(target: CellRange | null) {
    if (readOnly) return refuseReadOnly();
    if (!target) return;
    const plan = planFillDown(rows, columnIds, target);
    if (!plan.ok) return reportProblems('filled down', plan.problems);
    if (plan.edits.length === 0) {
      editing.notify({
        tone: 'info',
        title: 'Nothing to fill: the cells below already hold the top cell’s value.',
      });
      return;
    }
    errors.clearAll();
    editing.write(plan.edits, `fill down over ${plural(plan.edits.length, 'pin')}`, 'batch');
  }

  function clearCells(target: CellRange | null) {
    if (readOnly) return refuseReadOnly();
    if (!target) return;
    const edits = planClear(rows, columnIds, target, ctx);
    if (edits.length === 0) return;
    const single = target.top === target.bottom && target.left === target.right;
    const row = rows[target.top]!;
    const columnId = columnIds[target.left]!;
    editing.write(
      edits,
      single && isPinColumn(columnId)
        ? `clearing ${columnHeader(columnId, unit).toLowerCase()} of ${row.name}`
        : `clearing of cells in ${edits.length} pins`,
    );
  }

  /** Pastes a block from `start`; returns the corner cells of the block pasted, to mark it. */
  function paste(
    text: string,
    start: GridPosition,
  ): { start: GridPosition; end: GridPosition } | null {
    if (readOnly) {
      refuseReadOnly();
      return null;
    }
    const block = parseClipboardBlock(text);
    if (block.length === 0 || rows.length === 0) return null;
    const plan = planPaste(
      block,
      { rows, columns: columnIds, startRow: start.row, startColumn: start.column },
      ctx,
    );
    if (!plan.ok) {
      reportProblems('pasted', plan.problems);
      return null;
    }
    errors.clearAll();
    const height = Math.min(block.length, rows.length - start.row);
    const breadth = Math.min(
      Math.max(...block.map((r) => r.length)),
      columnIds.length - start.column,
    );
    const end = { row: start.row + height - 1, column: start.column + Math.max(breadth, 1) - 1 };
    if (plan.edits.length) {
      editing.write(plan.edits, `paste into ${plural(plan.edits.length, 'pin')}`, 'batch');
    }
    const clipped = [
      plan.clippedRows ? plural(plan.clippedRows, 'row') : '',
      plan.clippedColumns ? plural(plan.clippedColumns, 'column') : '',
    ].filter(Boolean);
    if (clipped.length) {
      editing.notify({
        tone: 'caution',
        title: `The block ran past the edge of the grid: ${clipped.join(' and ')} left out.`,
      });
    } else if (plan.edits.length === 0) {
      editing.notify({ tone: 'info', title: 'The pasted values are already there.' });
    }
    return { start, end };
  }

  /** The range as text for the clipboard, tab-separated. */
  function copy(target: CellRange): string {
    const block: string[][] = [];
    for (let r = target.top; r <= target.bottom; r++) {
      const row = rows[r]!;
      const cells: string[] = [];
      for (let c = target.left; c <= target.right; c++) {
        const id = columnIds[c]!;
        // The checkbox column copies as an empty cell, so the block pastes back in line.
        cells.push(isPinColumn(id) ? cellText(row, id, unit) : '');
      }
      block.push(cells);
    }
    return toClipboardText(block);
  }

  /** Saves one cell's text; returns why it cannot be saved, or null. */
  function saveCell(row: PinRow, columnId: EditableColumnId, text: string): string | null {
    const parsed = parseCell(columnId, text, ctx, row.pin.id);
    if (!parsed.ok) return parsed.error;
    errors.clear(row.pin.id, columnId);
    const set = changedFields(row.pin, parsed.set);
    if (Object.keys(set).length) {
      editing.write(
        [{ id: row.pin.id, set }],
        `${columnHeader(columnId, unit).toLowerCase()} of ${row.name}`,
      );
    }
    return null;
  }

  /**
   * Typing over a range: the text goes into every editable cell of it, written as one batch (one
   * undo step). Returns why it cannot be saved, or null.
   */
  function fillCells(target: CellRange, text: string): string | null {
    if (readOnly) {
      refuseReadOnly();
      return null;
    }
    const plan = planFill(rows, columnIds, target, text, ctx);
    if (!plan.ok) {
      reportProblems('filled', plan.problems);
      const first = plan.problems[0]!;
      return plan.problems.length === 1
        ? `${first.pin}: ${first.message}`
        : `${plan.problems.length} cells do not take this value (${first.pin}: ${first.message})`;
    }
    errors.clearAll();
    if (plan.edits.length) {
      editing.write(
        plan.edits,
        `typing over ${plural(plan.cellCount, 'cell')} in ${plural(plan.edits.length, 'pin')}`,
        'batch',
      );
    }
    return null;
  }

  return { saveCell, fillCells, reportProblems, refuseReadOnly, fillDown, clearCells, paste, copy };
}

export type GridCommands = ReturnType<typeof gridCommands>;
