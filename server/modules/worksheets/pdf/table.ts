/**
 * Tables that break across pages with their header row repeated. Every cell wraps inside its column;
 * a row that fits on a fresh page is never split, a row taller than a page continues on the next.
 */
import { MUTED, RULE, type Sheet } from './sheet.ts';
import { baselineOf, cleanText, INK, LINE_HEIGHT, type Line, type TextStyle } from './text.ts';

export interface Column {
  title: string;
  /** Fixed width in points; columns without one share what is left by `flex`. */
  width?: number;
  flex?: number;
  align?: 'left' | 'right' | 'center';
}

/** A mark drawn before the first line of a cell's text (a glyph or a swatch). */
export interface Lead {
  width: number;
  height: number;
  draw: (doc: PDFKit.PDFDocument, x: number, y: number) => void;
}

export interface Cell {
  /** Printed bold above the text, wrapping the same way. */
  title?: string;
  text?: string;
  style?: Partial<TextStyle>;
  align?: 'left' | 'right' | 'center';
  lead?: Lead | null;
  /** Vector content for the whole cell (hand-fill boxes), drawn where the row starts. */
  paint?: (doc: PDFKit.PDFDocument, x: number, y: number, width: number, height: number) => void;
}

export interface Row {
  cells: Cell[];
  /** One cell across columns `from` to `to` (inclusive); the whole table when `true`. */
  span?: boolean | { from: number; to: number };
  /** False to run this row into the next one (a pin and its note). */
  ruleBelow?: boolean;
  shade?: boolean;
  minHeight?: number;
}

export interface TableSpec {
  columns: Column[];
  rows: Row[];
  /** Printed above the repeated header on each following page. */
  continued: string;
  style?: TextStyle;
  headerStyle?: TextStyle;
  minRowHeight?: number;
  /** Shade every other row, to keep the eye on a long row. */
  zebra?: boolean;
}

const PAD_X = 3;
const PAD_Y = 3.5;
const LEAD_GAP = 3;
const ZEBRA = '#f0f0f0';
const HEADER_FILL = '#e2e2e2';

interface LaidLine {
  line: Line;
  style: TextStyle;
}

interface LaidCell {
  cell: Cell;
  lines: LaidLine[];
  style: TextStyle;
}

interface LaidRow {
  row: Row;
  cells: LaidCell[];
  lineHeight: number;
  lineCount: number;
  height: number;
}

/** Column widths that fill `total`: fixed ones as given, the rest shared by flex. */
export function columnWidths(columns: Column[], total: number): number[] {
  const fixed = columns.reduce((s, c) => s + (c.width ?? 0), 0);
  const flex = columns.reduce((s, c) => s + (c.width === undefined ? (c.flex ?? 1) : 0), 0);
  const spare = Math.max(0, total - fixed);
  const widths = columns.map((c) => c.width ?? (spare * (c.flex ?? 1)) / (flex || 1));
  // Never wider than the content box, whatever the fixed widths add up to.
  const sum = widths.reduce((s, w) => s + w, 0);
  return sum > total ? widths.map((w) => (w * total) / sum) : widths;
}

export async function drawTable(sheet: Sheet, spec: TableSpec): Promise<void> {
  const base: TextStyle = spec.style ?? { face: 'regular', size: 8.5 };
  const headerStyle: TextStyle = spec.headerStyle ?? { face: 'semibold', size: 7.5 };
  const widths = columnWidths(spec.columns, sheet.contentWidth);
  const xs = widths.map((_, i) => sheet.left + widths.slice(0, i).reduce((s, w) => s + w, 0));
  const minRow = spec.minRowHeight ?? 0;
  const spanOf = (row: Row) => {
    const first = row.span === true || !row.span ? 0 : row.span.from;
    const last = row.span === true || !row.span ? widths.length - 1 : row.span.to;
    const x = xs[first]!;
    return { first, last, x, width: xs[last]! + widths[last]! - x };
  };

  const layout = (row: Row, styleOf: (cell: Cell) => TextStyle): LaidRow => {
    const spanWidth = row.span ? spanOf(row).width : null;
    const cells = row.cells.map((cell, i) => {
      const style = styleOf(cell);
      const width = spanWidth ?? widths[i]!;
      const textWidth = width - 2 * PAD_X - (cell.lead ? cell.lead.width + LEAD_GAP : 0);
      const lines: LaidLine[] = [];
      const title = cell.title ? cleanText(cell.title) : '';
      if (title) {
        const titleStyle: TextStyle = { ...style, face: 'bold' };
        for (const line of sheet.text.wrap(title, titleStyle, textWidth)) {
          lines.push({ line, style: titleStyle });
        }
      }
      const text = cell.text ? cleanText(cell.text) : '';
      if (text) {
        for (const line of sheet.text.wrap(text, style, textWidth)) lines.push({ line, style });
      }
      return { cell, lines, style };
    });
    const lineHeight = Math.max(
      ...cells.map((c) => c.style.size * LINE_HEIGHT),
      base.size * LINE_HEIGHT,
    );
    const lineCount = Math.max(1, ...cells.map((c) => c.lines.length));
    const height = Math.max(row.minHeight ?? minRow, 2 * PAD_Y + lineCount * lineHeight);
    return { row, cells, lineHeight, lineCount, height };
  };

  const header = layout(
    { cells: spec.columns.map((c) => ({ text: c.title, align: c.align })) },
    () => headerStyle,
  );
  const continuedHeight = 14;

  const drawHeader = (continued: boolean) => {
    if (continued) {
      sheet.line(
        `${spec.continued} (continued)`,
        sheet.left,
        sheet.y,
        { face: 'semibold', size: 8, color: MUTED },
        sheet.contentWidth,
      );
      sheet.y += continuedHeight;
    }
    const { doc } = sheet;
    doc.save();
    doc.rect(sheet.left, sheet.y, sheet.contentWidth, header.height).fillColor(HEADER_FILL).fill();
    doc.restore();
    drawSlice(header, 0, header.lineCount, header.height, false);
    doc.save();
    doc
      .moveTo(sheet.left, sheet.y + header.height)
      .lineTo(sheet.right, sheet.y + header.height)
      .lineWidth(0.9)
      .strokeColor(INK)
      .stroke();
    doc.restore();
    sheet.y += header.height;
  };

  const newPage = () => {
    sheet.addPage();
    drawHeader(true);
  };

  /** Draws lines [from, from + count) of every cell in a band `height` high at sheet.y. */
  const drawSlice = (
    laid: LaidRow,
    from: number,
    count: number,
    height: number,
    shade: boolean,
  ) => {
    const { doc } = sheet;
    const y = sheet.y;
    const span = laid.row.span ? spanOf(laid.row) : null;
    if (shade) {
      doc.save();
      doc.rect(sheet.left, y, sheet.contentWidth, height).fillColor(ZEBRA).fill();
      doc.restore();
    }
    laid.cells.forEach((lc, i) => {
      const x = span ? span.x : xs[i]!;
      const width = span ? span.width : widths[i]!;
      let textX = x + PAD_X;
      let textWidth = width - 2 * PAD_X;
      if (lc.cell.lead) {
        if (from === 0) {
          const leadY = y + PAD_Y + (laid.lineHeight - lc.cell.lead.height) / 2;
          lc.cell.lead.draw(doc, textX, leadY);
        }
        textX += lc.cell.lead.width + LEAD_GAP;
        textWidth -= lc.cell.lead.width + LEAD_GAP;
      }
      if (from === 0 && lc.cell.paint) lc.cell.paint(doc, x, y, width, height);
      // A row continued from the page before repeats its first cell, muted, to say whose row it is.
      if (from > 0 && i === 0 && lc.lines.length <= from && lc.lines[0]) {
        const { line, style } = lc.lines[0];
        const muted = { ...style, color: MUTED };
        sheet.text.drawLine(
          line,
          textX,
          baselineOf(y + PAD_Y, muted),
          muted,
          textWidth,
          lc.cell.align,
        );
      }
      lc.lines.slice(from, from + count).forEach(({ line, style }, k) => {
        const top = y + PAD_Y + k * laid.lineHeight;
        sheet.text.drawLine(line, textX, baselineOf(top, style), style, textWidth, lc.cell.align);
      });
    });
    doc.save();
    // Column lines run along a spanning cell's edges, not across its text.
    const lines = xs.filter((_, k) => k > 0 && !(span && k > span.first && k <= span.last));
    for (const x of lines) doc.moveTo(x, y).lineTo(x, y + height);
    if (lines.length) doc.lineWidth(0.4).strokeColor('#b5b5b5').stroke();
    if (laid.row.ruleBelow !== false) {
      doc
        .moveTo(sheet.left, y + height)
        .lineTo(sheet.right, y + height)
        .lineWidth(0.5)
        .strokeColor(RULE)
        .stroke();
    }
    doc.restore();
  };

  const rows: LaidRow[] = [];
  for (const row of spec.rows) {
    rows.push(layout(row, (cell) => ({ ...base, ...cell.style })));
    await sheet.pause();
  }

  // The header never sits alone at the foot of a page.
  const first = rows[0];
  const keep =
    header.height + Math.min(first?.height ?? 0, 3 * base.size * LINE_HEIGHT + 2 * PAD_Y);
  sheet.ensure(keep);
  drawHeader(false);

  for (const [index, laid] of rows.entries()) {
    const shade = laid.row.shade ?? (spec.zebra === true && index % 2 === 1);
    if (laid.height > sheet.room) {
      const fresh = sheet.bodyHeight - continuedHeight - header.height;
      if (laid.height <= fresh) newPage();
    }
    if (laid.height <= sheet.room) {
      drawSlice(laid, 0, laid.lineCount, laid.height, shade);
      sheet.y += laid.height;
    } else {
      // Taller than a page: as many lines as fit here, the rest on the following pages.
      let from = 0;
      while (from < laid.lineCount) {
        let fit = Math.floor((sheet.room - 2 * PAD_Y) / laid.lineHeight);
        if (fit < 1) {
          newPage();
          fit = Math.max(1, Math.floor((sheet.room - 2 * PAD_Y) / laid.lineHeight));
        }
        const count = Math.min(fit, laid.lineCount - from);
        const height = 2 * PAD_Y + count * laid.lineHeight;
        drawSlice(laid, from, count, height, shade);
        sheet.y += height;
        from += count;
        if (from < laid.lineCount) newPage();
        await sheet.pause();
      }
    }
    await sheet.pause();
  }
}
