/**
 * A connector's face: its cavities in rows × columns, each boxed with its label and the glyph of
 * what happens to it. Cavities with work to do get a heavy box, so the face reads in black and
 * white at arm's length. A face too wide for the page is drawn in bands of columns.
 */
import { BENCH_ORDER, DISPOSITION_INFO, type Disposition } from '#shared/domain/dispositions.ts';
import type { SnapshotConnector, SnapshotPin } from '#shared/schemas/snapshot.schema.ts';
import { drawDispositionGlyph } from './marks.ts';
import { MUTED, type Sheet } from './sheet.ts';
import { baselineOf, cleanText, INK, type TextStyle } from './text.ts';

const MAX_CELL = 34;
const MIN_CELL = 18;
const CELL_HEIGHT = 30;
const GLYPH = 9;
const WORK = new Set<Disposition>(['depin', 'cut', 'extend', 'join', 'undecided']);

function drawCavity(
  sheet: Sheet,
  pin: SnapshotPin | undefined,
  x: number,
  y: number,
  width: number,
): void {
  const { doc } = sheet;
  const w = width - 3;
  const h = CELL_HEIGHT - 3;
  doc.save();
  if (!pin) {
    // A cavity the plan has no row for.
    doc
      .roundedRect(x, y, w, h, 2)
      .dash(1.5, { space: 1.5 })
      .lineWidth(0.5)
      .strokeColor(MUTED)
      .stroke();
    doc.restore();
    return;
  }
  const work = WORK.has(pin.disposition);
  if (pin.disposition === 'empty') {
    doc.roundedRect(x, y, w, h, 2).fillColor('#e6e6e6').fill();
  }
  doc
    .roundedRect(x, y, w, h, 2)
    .lineWidth(work ? 1.4 : 0.5)
    .strokeColor(INK)
    .stroke();
  doc.restore();

  const label = cleanText(pin.cavity, { maxChars: 12, singleLine: true });
  const full = sheet.text.width('monoBold', 1, label);
  const size = Math.max(4.5, Math.min(7.5, (w - 3) / Math.max(full, 0.01)));
  const style: TextStyle = { face: 'monoBold', size, color: INK };
  const line = sheet.text.fit(label, style, w - 2);
  sheet.text.drawLine(line, x + 1, baselineOf(y + 1.5, style), style, w - 2, 'center');
  drawDispositionGlyph(doc, pin.disposition, x + (w - GLYPH) / 2, y + h - GLYPH - 3, GLYPH);
}

/** Draws the face at sheet.y (across pages if it must) and its legend; moves sheet.y below. */
export async function drawFace(
  sheet: Sheet,
  connector: SnapshotConnector,
  pins: SnapshotPin[],
): Promise<void> {
  const rows = Math.max(1, Math.floor(connector.rows));
  const columns = Math.max(1, Math.floor(connector.columns));
  const byPosition = new Map(pins.map((p) => [p.position, p]));
  const cavities = Math.max(connector.cavityCount, ...pins.map((p) => p.position + 1));

  // As many columns as fit at the smallest legible cell, split into equal bands when they do not.
  const fitPerBand = Math.max(1, Math.floor(sheet.contentWidth / MIN_CELL));
  const bands = Math.ceil(columns / fitPerBand);
  const perBand = Math.ceil(columns / bands);
  const cellWidth = Math.min(MAX_CELL, sheet.contentWidth / perBand);
  const note: TextStyle = { face: 'regular', size: 7.5, color: MUTED };

  for (let band = 0; band < bands; band++) {
    const firstColumn = band * perBand;
    const lastColumn = Math.min(columns, firstColumn + perBand) - 1;
    const bandWidth = (lastColumn - firstColumn + 1) * cellWidth;
    const x0 = sheet.left + (sheet.contentWidth - bandWidth) / 2;
    if (bands > 1) {
      sheet.ensure(12 + CELL_HEIGHT);
      sheet.line(
        `Columns ${firstColumn + 1}–${lastColumn + 1} of ${columns}`,
        sheet.left,
        sheet.y,
        note,
        sheet.contentWidth,
      );
      sheet.y += 12;
    }
    for (let r = 0; r < rows; r++) {
      const firstPosition = r * columns + firstColumn;
      if (firstPosition >= cavities) break;
      if (CELL_HEIGHT > sheet.room) {
        sheet.addPage();
        sheet.line(
          `${connector.label} face (continued)`,
          sheet.left,
          sheet.y,
          note,
          sheet.contentWidth,
        );
        sheet.y += 12;
      }
      for (let c = firstColumn; c <= lastColumn; c++) {
        const position = r * columns + c;
        if (position >= cavities) break;
        drawCavity(
          sheet,
          byPosition.get(position),
          x0 + (c - firstColumn) * cellWidth,
          sheet.y,
          cellWidth,
        );
      }
      sheet.y += CELL_HEIGHT;
      await sheet.pause();
    }
    sheet.y += 4;
  }

  sheet.y += 2;
  drawLegend(sheet, pins);
}

/** Glyph, word and count for each disposition on this connector, in bench order. */
function drawLegend(sheet: Sheet, pins: SnapshotPin[]): void {
  const counts = new Map<Disposition, number>();
  for (const p of pins) counts.set(p.disposition, (counts.get(p.disposition) ?? 0) + 1);
  const style: TextStyle = { face: 'regular', size: 8 };
  const items = BENCH_ORDER.filter((d) => counts.has(d)).map((d) => ({
    disposition: d,
    text: `${DISPOSITION_INFO[d].label} ${counts.get(d)}`,
  }));
  const gap = 14;
  let x = sheet.left;
  sheet.ensure(14);
  for (const item of items) {
    // A point to spare: the line is measured word by word when it is drawn.
    const width = 13 + sheet.text.width(style.face, style.size, item.text);
    if (x + width > sheet.right) {
      x = sheet.left;
      sheet.y += 13;
      sheet.ensure(14);
    }
    drawDispositionGlyph(sheet.doc, item.disposition, x, sheet.y + 1.5, 8.5);
    sheet.line(item.text, x + 12, sheet.y, style, Math.min(width - 12, sheet.right - x - 12));
    x += width + gap;
  }
  sheet.y += 14;
}
