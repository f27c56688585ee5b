import type { KeyboardEvent } from 'react';
import { moveFocus, moveForKey, type GridPosition } from '../lib/navigation.ts';

/** What the grid's keys act on. */
export interface GridKeyTarget {
  rows: number;
  columns: number;
  /** The focused cell, or null before one is. */
  active: GridPosition | null;
  /** The focused cell, or where the focus would start. */
  here: GridPosition;
  hasRange: boolean;
  /** Whether the cell at `here` is a row's checkbox. */
  onCheckbox: boolean;
  visibleRows: () => number;
  undo: () => void;
  fillDown: () => void;
  selectAll: () => void;
  /** Up from the first row: to the column's heading, where Enter sorts. */
  toHeading: (column: number) => void;
  moveTo: (pos: GridPosition, extend: boolean) => void;
  startEdit: (pos: GridPosition, typed?: string) => void;
  dropRange: () => void;
  clearCells: () => void;
  toggleRow: (row: number, shiftKey: boolean) => void;
}

/** The spreadsheet keys: moves, Enter/F2 to edit, typing to replace, Delete, Ctrl+Z/D/A. */
export function handleGridKey(event: KeyboardEvent<HTMLDivElement>, grid: GridKeyTarget) {
  const mod = event.ctrlKey || event.metaKey;
  const { here, active } = grid;
  const key = event.key.toLowerCase();
  if (mod && !event.altKey && key.length === 1) {
    if (key === 'z' && !event.shiftKey) {
      event.preventDefault();
      grid.undo();
    } else if (key === 'd') {
      event.preventDefault();
      grid.fillDown();
    } else if (key === 'a') {
      event.preventDefault();
      grid.selectAll();
    }
    // Ctrl+C and Ctrl+V go on to the copy and paste events.
    return;
  }
  const move = moveForKey(event.key, { shift: event.shiftKey, ctrl: mod });
  if (move) {
    if (move === 'up' && active?.row === 0 && !event.shiftKey) {
      event.preventDefault();
      grid.toHeading(active.column);
      return;
    }
    const next = active
      ? moveFocus(active, move, {
          rows: grid.rows,
          columns: grid.columns,
          pageRows: grid.visibleRows(),
        })
      : here;
    // Tab past the last cell (or Shift+Tab before the first) leaves the grid.
    if (!next) return;
    event.preventDefault();
    grid.moveTo(next, event.shiftKey && move !== 'next' && move !== 'previous');
    return;
  }
  switch (event.key) {
    case 'Enter':
    case 'F2':
      event.preventDefault();
      return grid.startEdit(here);
    case 'Escape':
      if (grid.hasRange) {
        event.preventDefault();
        grid.dropRange();
      }
      return;
    case 'Delete':
    case 'Backspace':
      event.preventDefault();
      return grid.clearCells();
    case ' ':
      if (grid.onCheckbox) {
        event.preventDefault();
        return grid.toggleRow(here.row, event.shiftKey);
      }
  }
  if (event.key.length === 1 && !mod && !event.altKey) {
    event.preventDefault();
    grid.startEdit(here, event.key);
  }
}
