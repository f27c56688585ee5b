/**
 * Blocks of cells on the clipboard, as spreadsheets write them: tab between cells, a line break
 * between rows, and cells holding a tab, line break or quote wrapped in double quotes with inner
 * quotes doubled.
 */
import Papa from 'papaparse';

/** Splits clipboard text into rows of cells. A trailing line break does not make an extra row. */
export function parseClipboardBlock(text: string): string[][] {
  if (text === '') return [];
  const parsed = Papa.parse<string[]>(text, { delimiter: '\t', quoteChar: '"', escapeChar: '"' });
  // A stray quote in a cell that is not quoted (12" cable) throws the quoting off; spreadsheets
  // never write that, so read such text as plain tab-separated lines instead.
  const quoteTrouble = parsed.errors.some((e) => e.type === 'Quotes');
  const rows = quoteTrouble
    ? text.split(/\r\n|\n|\r/).map((line) => line.split('\t'))
    : parsed.data.map((row) => row.map(String));
  const last = rows.at(-1);
  if (rows.length > 0 && last && last.length === 1 && last[0] === '') rows.pop();
  return rows;
}

const needsQuotes = /[\t\r\n"]/;

/** Writes rows of cells as a spreadsheet would, so a copy from the grid pastes back unchanged. */
export function toClipboardText(rows: readonly (readonly string[])[]): string {
  return rows
    .map((row) =>
      row
        .map((cell) => (needsQuotes.test(cell) ? `"${cell.replaceAll('"', '""')}"` : cell))
        .join('\t'),
    )
    .join('\r\n');
}

export interface PlacedCell {
  /** Index into the displayed rows. */
  row: number;
  /** Index into the visible columns. */
  column: number;
  text: string;
}

export interface BlockPlacement {
  cells: PlacedCell[];
  /** Rows of the block that fell past the last row of the grid. */
  clippedRows: number;
  /** Columns of the block that fell past the last column of the grid. */
  clippedColumns: number;
}

/**
 * Lays a block onto the grid with its top-left cell at the focused cell, clipping whatever falls
 * past the grid's edge. A short (ragged) row leaves the cells past its end alone.
 */
export function placeBlock(
  block: readonly (readonly string[])[],
  grid: { rowCount: number; columnCount: number; startRow: number; startColumn: number },
): BlockPlacement {
  const cells: PlacedCell[] = [];
  const rowRoom = Math.max(0, grid.rowCount - grid.startRow);
  const columnRoom = Math.max(0, grid.columnCount - grid.startColumn);
  const width = Math.max(0, ...block.map((r) => r.length));
  block.slice(0, rowRoom).forEach((cellsOfRow, r) => {
    cellsOfRow.slice(0, columnRoom).forEach((text, c) => {
      cells.push({ row: grid.startRow + r, column: grid.startColumn + c, text });
    });
  });
  return {
    cells,
    clippedRows: Math.max(0, block.length - rowRoom),
    clippedColumns: Math.max(0, width - columnRoom),
  };
}
