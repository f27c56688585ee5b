/**
 * Small vector marks: the disposition glyphs (the same SVG paths the screens draw), wire-colour
 * swatches, hand-fill boxes and lines. Drawn as paths, so they never depend on a glyph being in a
 * font, and in black so they survive black-and-white printing.
 */
import { DISPOSITION_INFO, type Disposition } from '#shared/domain/dispositions.ts';
import { colourSwatches } from '#shared/domain/wire-colours.ts';
import { INK } from './text.ts';

/** Draws a disposition glyph (a 10 × 10 SVG path) as a `size`-point square at (x, y). */
export function drawDispositionGlyph(
  doc: PDFKit.PDFDocument,
  disposition: Disposition,
  x: number,
  y: number,
  size: number,
): void {
  const info = DISPOSITION_INFO[disposition];
  const scale = size / 10;
  doc.save();
  doc.translate(x, y).scale(scale);
  doc.path(info.glyph);
  if (info.filled) {
    doc.fillColor(INK).fill();
  } else {
    doc.lineWidth(1.3).lineCap('round').lineJoin('round').strokeColor(INK).stroke();
  }
  doc.restore();
}

/**
 * A wire swatch: the base colour with the stripe as a band through the middle, outlined so a white
 * or yellow wire still shows on white paper. Nothing is drawn for "no colour recorded".
 */
export function drawSwatch(
  doc: PDFKit.PDFDocument,
  colour: string,
  x: number,
  y: number,
  width: number,
  height: number,
): boolean {
  const swatches = colourSwatches(colour);
  if (swatches.length === 0) return false;
  const [base, stripe] = swatches as [string, string | undefined];
  doc.save();
  doc.rect(x, y, width, height).fillColor(base).fill();
  if (stripe) {
    const band = height / 3;
    doc
      .rect(x, y + band, width, band)
      .fillColor(stripe)
      .fill();
  }
  doc.rect(x, y, width, height).lineWidth(0.5).strokeColor(INK).stroke();
  doc.restore();
  return true;
}

/** An empty square to tick by hand. */
export function drawTickBox(doc: PDFKit.PDFDocument, x: number, y: number, size: number): void {
  doc.save();
  doc.rect(x, y, size, size).lineWidth(0.8).strokeColor(INK).stroke();
  doc.restore();
}

/** A line to write on. */
export function drawWriteLine(
  doc: PDFKit.PDFDocument,
  x1: number,
  x2: number,
  y: number,
  weight = 0.6,
): void {
  doc.save();
  doc.moveTo(x1, y).lineTo(x2, y).lineWidth(weight).strokeColor(INK).stroke();
  doc.restore();
}

/** A warning triangle with an exclamation mark, `size` points high. */
export function drawWarningSign(doc: PDFKit.PDFDocument, x: number, y: number, size: number) {
  doc.save();
  doc
    .moveTo(x + size / 2, y)
    .lineTo(x + size, y + size * 0.9)
    .lineTo(x, y + size * 0.9)
    .closePath()
    .lineWidth(1.2)
    .lineJoin('round')
    .strokeColor(INK)
    .stroke();
  doc
    .moveTo(x + size / 2, y + size * 0.3)
    .lineTo(x + size / 2, y + size * 0.6)
    .lineWidth(1.4)
    .lineCap('round')
    .stroke();
  doc
    .circle(x + size / 2, y + size * 0.74, size * 0.05)
    .fillColor(INK)
    .fill();
  doc.restore();
}
