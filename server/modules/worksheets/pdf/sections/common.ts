/** Pieces several sections use: headings, flowing paragraphs, wire and disposition cells. */
import { DISPOSITION_INFO, type Disposition } from '#shared/domain/dispositions.ts';
import { formatWireSize } from '#shared/domain/wire-sizes.ts';
import type { SizeUnit } from '#shared/schemas/workshop.schema.ts';
import { drawDispositionGlyph, drawSwatch, drawTickBox, drawWriteLine } from '../marks.ts';
import { MUTED, type Sheet } from '../sheet.ts';
import { baselineOf, cleanText, INK, LINE_HEIGHT, type TextStyle } from '../text.ts';
import type { Cell, Lead } from '../table.ts';

export const BODY: TextStyle = { face: 'regular', size: 8.5 };
export const SMALL: TextStyle = { face: 'regular', size: 7.5, color: MUTED };

/** "1 pin", "3 pins". */
export function count(n: number, word: string): string {
  return `${n} ${word}${n === 1 ? '' : 's'}`;
}

/** A section title (and an optional line under it), kept with `keep` points of what follows. */
export function heading(sheet: Sheet, title: string, intro?: string, keep = 80): void {
  const titleStyle: TextStyle = { face: 'bold', size: 13 };
  const introLines = intro ? sheet.text.wrap(cleanText(intro), BODY, sheet.contentWidth) : [];
  sheet.ensure(20 + introLines.length * BODY.size * LINE_HEIGHT + keep);
  sheet.line(title, sheet.left, sheet.y, titleStyle, sheet.contentWidth);
  sheet.y += 19;
  introLines.forEach((line) => {
    sheet.text.drawLine(line, sheet.left, baselineOf(sheet.y, BODY), BODY, sheet.contentWidth);
    sheet.y += BODY.size * LINE_HEIGHT;
  });
  sheet.y += introLines.length ? 5 : 1;
}

/** A paragraph that may run onto the next page, line by line. */
export function flow(
  sheet: Sheet,
  text: string,
  style: TextStyle = BODY,
  indent = 0,
  width = sheet.contentWidth - indent,
): void {
  const lh = style.size * LINE_HEIGHT;
  for (const line of sheet.text.wrap(cleanText(text), style, width)) {
    sheet.ensure(lh);
    sheet.text.drawLine(line, sheet.left + indent, baselineOf(sheet.y, style), style, width);
    sheet.y += lh;
  }
}

/** A bulleted paragraph with its lines hanging clear of the bullet. */
export function bullet(sheet: Sheet, text: string, style: TextStyle = BODY, indent = 0): void {
  const lh = style.size * LINE_HEIGHT;
  sheet.ensure(lh);
  sheet.doc
    .circle(sheet.left + indent + 2, sheet.y + lh / 2, style.size * 0.14)
    .fillColor(style.color ?? INK)
    .fill();
  flow(sheet, text, style, indent + 8);
}

export function glyphLead(disposition: Disposition, size = 8.5): Lead {
  return {
    width: size,
    height: size,
    draw: (doc, x, y) => drawDispositionGlyph(doc, disposition, x, y, size),
  };
}

export function swatchLead(colour: string): Lead | null {
  if (!colour) return null;
  return {
    width: 12,
    height: 7,
    draw: (doc, x, y) => {
      drawSwatch(doc, colour, x, y, 12, 7);
    },
  };
}

export function dispositionCell(disposition: Disposition): Cell {
  return {
    text: DISPOSITION_INFO[disposition].label,
    lead: glyphLead(disposition),
    style: disposition === 'undecided' ? { face: 'bold' } : undefined,
  };
}

/** "BU/WH 0.5 mm²" with the swatch; "not recorded" parts said so. */
export function wireCell(colour: string, sizeMm2: number | null, unit: SizeUnit): Cell {
  const size = sizeMm2 == null ? 'size not recorded' : formatWireSize(sizeMm2, unit);
  return {
    text: `${colour || 'colour not set'} ${size}`,
    lead: swatchLead(colour),
    style: { face: 'mono', size: 7.5 },
  };
}

/** An empty tick box in the middle of the cell's first line. */
export function tickCell(): Cell {
  return {
    paint: (doc, x, y, width) => drawTickBox(doc, x + (width - 9) / 2, y + 4, 9),
  };
}

/** A line to write a reading on, with its unit. */
export function readingCell(unit: string): Cell {
  return {
    paint: (doc, x, y, width, height) => {
      const lineY = y + Math.min(height - 4, 15);
      drawWriteLine(doc, x + 4, x + width - 12, lineY, 0.6);
      doc
        .font('regular')
        .fontSize(8)
        .fillColor(MUTED)
        .text(unit, x + width - 10, lineY - 1, { lineBreak: false, baseline: 'alphabetic' });
    },
  };
}

/** A muted dash for a cell with nothing to fill in. */
export const NOTHING: Cell = { text: '—', align: 'center', style: { color: MUTED } };
