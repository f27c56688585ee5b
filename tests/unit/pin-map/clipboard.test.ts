import { describe, expect, it } from 'vitest';
import {
  parseClipboardBlock,
  placeBlock,
  toClipboardText,
} from '../../../src/features/pin-map/lib/clipboard.ts';

describe('reading a block copied from a spreadsheet', () => {
  it('splits cells on tabs and rows on line breaks', () => {
    expect(parseClipboardBlock('Injector 5\tBU/WH\t0.75\nInjector 6\tBU/RD\t0.75')).toEqual([
      ['Injector 5', 'BU/WH', '0.75'],
      ['Injector 6', 'BU/RD', '0.75'],
    ]);
  });

  it('reads Windows line breaks (CRLF) the same', () => {
    expect(parseClipboardBlock('a\tb\r\nc\td\r\n')).toEqual([
      ['a', 'b'],
      ['c', 'd'],
    ]);
  });

  it('does not make a row of the trailing line break spreadsheets add', () => {
    expect(parseClipboardBlock('keep\n')).toEqual([['keep']]);
    expect(parseClipboardBlock('keep\r\n')).toEqual([['keep']]);
  });

  it('keeps tabs, line breaks and doubled quotes inside quoted cells', () => {
    const text = '"Coil\tfeed"\t"two\nlines"\t"the ""12 V"" feed"\r\nplain\tx\ty\r\n';
    expect(parseClipboardBlock(text)).toEqual([
      ['Coil\tfeed', 'two\nlines', 'the "12 V" feed'],
      ['plain', 'x', 'y'],
    ]);
  });

  it('keeps empty cells and ragged rows as they are', () => {
    expect(parseClipboardBlock('a\t\tc\nd\ne\tf')).toEqual([['a', '', 'c'], ['d'], ['e', 'f']]);
  });

  it('reads a single value with no tab or line break as one cell', () => {
    expect(parseClipboardBlock('bu/wh')).toEqual([['bu/wh']]);
  });

  it('gives no rows for an empty clipboard', () => {
    expect(parseClipboardBlock('')).toEqual([]);
  });

  it('reads a stray quote in an unquoted cell as plain text', () => {
    expect(parseClipboardBlock('12" loom\tx\nnext\ty')).toEqual([
      ['12" loom', 'x'],
      ['next', 'y'],
    ]);
  });

  it('writes cells back so they read the same', () => {
    const rows = [
      ['Coil\tfeed', 'two\nlines', 'the "12 V" feed'],
      ['plain', '', 'y'],
    ];
    expect(parseClipboardBlock(toClipboardText(rows))).toEqual(rows);
  });
});

describe('laying a block onto the grid from the focused cell', () => {
  const grid = { rowCount: 5, columnCount: 4, startRow: 1, startColumn: 2 };

  it('places each cell relative to the focused cell', () => {
    const placed = placeBlock(
      [
        ['a', 'b'],
        ['c', 'd'],
      ],
      grid,
    );
    expect(placed.cells).toEqual([
      { row: 1, column: 2, text: 'a' },
      { row: 1, column: 3, text: 'b' },
      { row: 2, column: 2, text: 'c' },
      { row: 2, column: 3, text: 'd' },
    ]);
    expect(placed.clippedRows).toBe(0);
    expect(placed.clippedColumns).toBe(0);
  });

  it('clips rows and columns that fall past the edge, and counts them', () => {
    const block = Array.from({ length: 6 }, (_, r) => ['1', '2', '3'].map((c) => `${r}${c}`));
    const placed = placeBlock(block, grid);
    expect(placed.cells).toHaveLength(4 * 2);
    expect(placed.cells.every((c) => c.row < 5 && c.column < 4)).toBe(true);
    expect(placed.clippedRows).toBe(2);
    expect(placed.clippedColumns).toBe(1);
  });

  it('leaves cells past the end of a short row alone', () => {
    const placed = placeBlock([['a', 'b'], ['c']], grid);
    expect(placed.cells.map((c) => c.text)).toEqual(['a', 'b', 'c']);
  });

  it('places nothing when the focus sits past the last row', () => {
    const placed = placeBlock([['a']], { ...grid, startRow: 5 });
    expect(placed.cells).toEqual([]);
    expect(placed.clippedRows).toBe(1);
  });
});
