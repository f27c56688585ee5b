/**
 * A short table of the worksheet's own words and numbers, drawn by pdfkit's built-in `doc.table()`
 * (docs/decisions/0013-worksheet-tables.md). Only for tables that fit on the page they start on and
 * hold no one's typed text: pdfkit's table neither repeats its header nor draws the worksheet's page
 * frame when it breaks to a new page, clips a row taller than a page, and prints a cell in one font
 * with no fallback and no right-to-left ordering. Everything else goes through drawTable.
 */
import { RULE, type Sheet } from './sheet.ts';
import { INK } from './text.ts';
import type { Face } from './fonts.ts';

export interface PlainColumn {
  title: string;
  /** Points; omitted, the column takes what the others leave. */
  width?: number;
  align?: 'left' | 'right';
  /** The face of the column's cells. */
  face?: Face;
}

const HEADER_FILL = '#e2e2e2';
const COLUMN_LINE = '#b5b5b5';
const PADDING = { top: 3.5, bottom: 3.5, left: 3, right: 3 };

export function drawPlainTable(
  sheet: Sheet,
  { columns, rows, rowHeight }: { columns: PlainColumn[]; rows: string[][]; rowHeight: number },
): void {
  // Kept whole on one page: pdfkit's own page break would skip the worksheet's header and footer.
  sheet.ensure(rowHeight * (rows.length + 1) + 2);
  const cell = (text: string, row: number, column: number) => {
    const spec = columns[column]!;
    const header = row === 0;
    return {
      text,
      type: header ? ('TH' as const) : ('TD' as const),
      font: { src: header ? 'semibold' : (spec.face ?? 'regular'), size: header ? 7.5 : 8.5 },
      textColor: INK,
      backgroundColor: header ? HEADER_FILL : undefined,
      align: { x: spec.align ?? 'left', y: 'top' as const },
      padding: PADDING,
      // Each cell draws its own left edge after its own fill, so the header's fill never hides it.
      border: { top: 0, right: 0, left: column > 0 ? 0.4 : 0, bottom: header ? 0.9 : 0.5 },
      borderColor: { left: COLUMN_LINE, bottom: header ? INK : RULE },
    };
  };
  sheet.doc.table({
    position: { x: sheet.left, y: sheet.y },
    maxWidth: sheet.contentWidth,
    columnStyles: columns.map((c) => c.width ?? '*'),
    rowStyles: { minHeight: rowHeight },
    data: [columns.map((c) => c.title), ...rows].map((row, r) =>
      row.map((text, c) => cell(text, r, c)),
    ),
  });
  sheet.y = sheet.doc.y;
}
