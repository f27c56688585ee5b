/** Moving the focused cell of the grid by keyboard, spreadsheet fashion. */

export interface GridPosition {
  row: number;
  column: number;
}

export interface GridSize {
  rows: number;
  columns: number;
  /** Rows in one screenful, for Page Up and Page Down. */
  pageRows: number;
}

export type Move =
  | 'up'
  | 'down'
  | 'left'
  | 'right'
  | 'next'
  | 'previous'
  | 'rowStart'
  | 'rowEnd'
  | 'gridStart'
  | 'gridEnd'
  | 'pageUp'
  | 'pageDown';

const clamp = (n: number, max: number) => Math.min(Math.max(n, 0), Math.max(max, 0));

/**
 * The cell a move lands on. "next" and "previous" (Tab, Shift+Tab) wrap to the next or previous
 * row; past the last or first cell they give null, so Tab can leave the grid.
 */
export function moveFocus(at: GridPosition, move: Move, size: GridSize): GridPosition | null {
  const lastRow = size.rows - 1;
  const lastColumn = size.columns - 1;
  switch (move) {
    case 'up':
      return { row: clamp(at.row - 1, lastRow), column: at.column };
    case 'down':
      return { row: clamp(at.row + 1, lastRow), column: at.column };
    case 'left':
      return { row: at.row, column: clamp(at.column - 1, lastColumn) };
    case 'right':
      return { row: at.row, column: clamp(at.column + 1, lastColumn) };
    case 'next':
      if (at.column < lastColumn) return { row: at.row, column: at.column + 1 };
      return at.row < lastRow ? { row: at.row + 1, column: 0 } : null;
    case 'previous':
      if (at.column > 0) return { row: at.row, column: at.column - 1 };
      return at.row > 0 ? { row: at.row - 1, column: lastColumn } : null;
    case 'rowStart':
      return { row: at.row, column: 0 };
    case 'rowEnd':
      return { row: at.row, column: Math.max(lastColumn, 0) };
    case 'gridStart':
      return { row: 0, column: at.column };
    case 'gridEnd':
      return { row: Math.max(lastRow, 0), column: at.column };
    case 'pageUp':
      return { row: clamp(at.row - size.pageRows, lastRow), column: at.column };
    case 'pageDown':
      return { row: clamp(at.row + size.pageRows, lastRow), column: at.column };
  }
}

/** The move a key asks for, or null for keys that do not move the focus. */
export function moveForKey(key: string, mods: { shift: boolean; ctrl: boolean }): Move | null {
  switch (key) {
    case 'ArrowUp':
      return 'up';
    case 'ArrowDown':
      return 'down';
    case 'ArrowLeft':
      return 'left';
    case 'ArrowRight':
      return 'right';
    case 'Tab':
      return mods.shift ? 'previous' : 'next';
    case 'Home':
      return mods.ctrl ? 'gridStart' : 'rowStart';
    case 'End':
      return mods.ctrl ? 'gridEnd' : 'rowEnd';
    case 'PageUp':
      return 'pageUp';
    case 'PageDown':
      return 'pageDown';
    default:
      return null;
  }
}

/** The rectangle between two cells, inclusive. */
export function rangeBetween(a: GridPosition, b: GridPosition) {
  return {
    top: Math.min(a.row, b.row),
    bottom: Math.max(a.row, b.row),
    left: Math.min(a.column, b.column),
    right: Math.max(a.column, b.column),
  };
}
