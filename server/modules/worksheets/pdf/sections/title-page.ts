/**
 * Page 1: what this sheet is (draft or which revision), the sign-off, the summary of the plan, the
 * cautions, and the contents (page numbers filled in once every page exists).
 */
import { BENCH_ORDER, DISPOSITION_INFO } from '#shared/domain/dispositions.ts';
import { fuseColour } from '#shared/domain/electrical/fuses.ts';
import { CONNECTOR_SIDE_LABELS } from '#shared/schemas/pin-map.schema.ts';
import { drawDispositionGlyph, drawWarningSign, drawWriteLine } from '../marks.ts';
import { formatDateTime, statusLabel } from '../meta.ts';
import {
  AIRBAG_CAUTION,
  ECU_PROBING_CAUTION,
  FUEL_PUMP_CUTOFF_CAUTION,
  INSULATION_TEST_CAUTION,
  REGULATED_CIRCUITS_CAUTION,
} from '#shared/domain/safety.ts';
import { dispositionCounts, type PlanIndex } from '../plan.ts';
import { RULE, type Sheet } from '../sheet.ts';
import { baselineOf, cleanText, INK, LINE_HEIGHT, type Line, type TextStyle } from '../text.ts';
import { BODY, count, flow, SMALL } from './common.ts';

export const CAUTIONS = [
  'Disconnect the battery (negative terminal first) before any work on the harness.',
  'Relieve the fuel pressure before opening the fuel system; no sparks or flames near fuel.',
  AIRBAG_CAUTION,
  'Every new feed is fused near its source. A feed without a fuse is a fire risk.',
  ECU_PROBING_CAUTION,
  INSULATION_TEST_CAUTION,
  FUEL_PUMP_CUTOFF_CAUTION,
  REGULATED_CIRCUITS_CAUTION,
  'Test every circuit before first power-up: continuity end to end, no short to ground, and the reading written on this sheet.',
  'Local codes and licensed practice prevail over this sheet and over Loomwright’s checks.',
];

const LABEL: TextStyle = { face: 'semibold', size: 8.5 };

function box(sheet: Sheet, x: number, y: number, w: number, h: number, weight = 0.8): void {
  sheet.doc.save();
  sheet.doc.rect(x, y, w, h).lineWidth(weight).strokeColor(INK).stroke();
  sheet.doc.restore();
}

/** What this print is, in one sentence a technician cannot misread. */
function standing(sheet: Sheet): string {
  const revision = sheet.meta.revision;
  if (!revision) {
    return 'DRAFT: the plan as it stands now, not frozen and not signed off. Use it to check the plan; do the bench work from a signed-off revision.';
  }
  if (revision.signOff) {
    return `Revision ${revision.number}, signed off. This sheet prints the frozen plan the reviewer signed: work from it.`;
  }
  return `Revision ${revision.number}, ${statusLabel(revision.status)}: frozen but not signed off yet. Do not start bench work until it is signed off.`;
}

/** Room for the sign-off rows; a sealed sign-off also prints its key. */
function signOffHeight(sheet: Sheet): number {
  return sheet.meta.revision?.signOff?.seal ? 120 : 92;
}

/** Reviewer's sign-off beside the bench record; blank lines to fill in by hand where unsigned. */
function drawSignOff(sheet: Sheet): void {
  const gap = 12;
  const w = (sheet.contentWidth - gap) / 2;
  const top = sheet.y;
  const height = signOffHeight(sheet);
  const revision = sheet.meta.revision;
  const signOff = revision?.signOff ?? null;
  const inner = w - 16;

  const blankLines = (x: number, labels: string[]) => {
    labels.forEach((label, i) => {
      const y = top + 26 + i * 21;
      sheet.line(label, x + 8, y, BODY, 60);
      drawWriteLine(sheet.doc, x + 70, x + w - 8, y + 11);
    });
  };

  box(sheet, sheet.left, top, w, height);
  sheet.line('Reviewer sign-off', sheet.left + 8, top + 7, LABEL, inner);
  if (signOff && revision) {
    let y = top + 24;
    const row = (label: string, value: string, style: TextStyle = BODY) => {
      sheet.line(label, sheet.left + 8, y, SMALL, 60);
      // One line each, the hash at most two: the box has a fixed height.
      const lines = sheet.text.wrap(
        cleanText(value, { maxChars: 160, singleLine: true }),
        style,
        w - 78,
      );
      lines.slice(0, 2).forEach((line, i) => {
        const top = y + i * style.size * LINE_HEIGHT;
        sheet.text.drawLine(line, sheet.left + 70, baselineOf(top, style), style, w - 78);
      });
      y += Math.max(Math.min(lines.length, 2) * style.size * LINE_HEIGHT, 11) + 2;
    };
    row('Reviewer', signOff.reviewerName);
    row('Signed', formatDateTime(signOff.signedAt));
    row('Content hash', signOff.hash, { face: 'mono', size: 6.5 });
    if (signOff.seal) {
      // Checked against the seal before printing; the key lets anyone check it again.
      row('Seal key', `Ed25519 ${signOff.seal.publicKey}`, { face: 'mono', size: 6.5 });
      row('Key print', signOff.seal.fingerprint, { face: 'mono', size: 6.5 });
    }
    if (signOff.hash !== revision.hash) {
      sheet.line(
        'The signed hash does not match this content: do not use this sheet.',
        sheet.left + 8,
        y,
        { face: 'bold', size: 8 },
        inner,
      );
    }
  } else {
    blankLines(sheet.left, ['Reviewer', 'Date', 'Signature']);
  }

  const bx = sheet.left + w + gap;
  box(sheet, bx, top, w, height);
  sheet.line('Bench work done and tested', bx + 8, top + 7, LABEL, inner);
  blankLines(bx, ['Technician', 'Date', 'Signature']);
  sheet.y = top + height + 12;
}

const LISTED = 6;

/**
 * Pins by disposition and the contents on the left; connectors, feeds and checks on the right.
 * Returns where the contents go: their page numbers are known only once every page exists.
 */
function drawSummary(sheet: Sheet, index: PlanIndex, sectionTitles: string[]): ContentsSlot {
  const { snapshot, meta } = sheet;
  const counts = dispositionCounts(snapshot);
  const colGap = 24;
  const leftW = Math.min(230, sheet.contentWidth * 0.42);
  const rightW = sheet.contentWidth - leftW - colGap;
  const rightX = sheet.left + leftW + colGap;
  const top = sheet.y;
  const lh = BODY.size * LINE_HEIGHT + 1.5;

  // Left: pins by disposition, with the glyphs the face and tables use; then the contents.
  sheet.line(`Pins by disposition (${snapshot.pins.length})`, sheet.left, top, LABEL, leftW);
  let y = top + 15;
  for (const d of BENCH_ORDER) {
    drawDispositionGlyph(sheet.doc, d, sheet.left + 1, y + 1.3, 8.5);
    sheet.line(DISPOSITION_INFO[d].label, sheet.left + 15, y, BODY, leftW - 50);
    sheet.line(
      String(counts[d]),
      sheet.left + leftW - 34,
      y,
      { ...BODY, face: 'semibold' },
      30,
      'right',
    );
    y += lh;
  }
  y += 8;
  sheet.line('In this worksheet', sheet.left, y, LABEL, leftW);
  y += 15;
  // As many sections as the page holds below the rest of page 1 (a plan of very many connectors).
  const contentsLh = BODY.size * LINE_HEIGHT;
  const room = Math.max(
    1,
    Math.floor((sheet.bottom - cautionsHeight(cautionLines(sheet)) - 12 - y) / contentsLh),
  );
  const titles =
    sectionTitles.length <= room
      ? sectionTitles
      : [
          ...sectionTitles.slice(0, room - 1),
          `and ${sectionTitles.length - room + 1} more sections`,
        ];
  const slot: ContentsSlot = { page: sheet.pages, x: sheet.left, y, width: leftW, titles };
  const leftBottom = y + titles.length * contentsLh;

  // Right: connectors, feeds, findings.
  y = top;
  const list = (title: string, lines: string[], total: number) => {
    sheet.line(title, rightX, y, LABEL, rightW);
    y += 15;
    for (const line of lines.slice(0, LISTED)) {
      sheet.line(line, rightX, y, BODY, rightW);
      y += lh;
    }
    if (total > LISTED) {
      sheet.line(`and ${total - LISTED} more`, rightX, y, SMALL, rightW);
      y += lh;
    }
    y += 6;
  };
  list(
    `Connectors (${snapshot.connectors.length})`,
    snapshot.connectors.slice(0, LISTED).map((c) => {
      const pins = index.pinsByConnector.get(c.id)?.length ?? 0;
      return `${c.label} · ${CONNECTOR_SIDE_LABELS[c.side] ?? c.side} · ${pins} pins on ${c.rows} × ${c.columns}`;
    }),
    snapshot.connectors.length,
  );
  list(
    `New fused feeds (${snapshot.feeds.length})`,
    snapshot.feeds.slice(0, LISTED).map((f) => {
      const fuse = f.fuseA == null ? 'NO FUSE' : `${f.fuseA} A ${fuseColour(f.fuseA) ?? 'fuse'}`;
      return `${f.name} · ${fuse}${f.relay ? ' · relay' : ''}`;
    }),
    snapshot.feeds.length,
  );
  const severities = (s: string) => meta.findings.filter((f) => f.severity === s).length;
  const errors = severities('error');
  sheet.line('Checks', rightX, y, LABEL, rightW);
  y += 15;
  sheet.line(
    `${count(errors, 'error')}, ${count(severities('warning'), 'warning')}, ${count(severities('note'), 'note')}`,
    rightX,
    y,
    errors ? { ...BODY, face: 'bold' } : BODY,
    rightW,
  );
  y += lh;
  sheet.y = Math.max(leftBottom, y) + 12;
  return slot;
}

function cautionLines(sheet: Sheet) {
  return CAUTIONS.map((c) => sheet.text.wrap(c, BODY, sheet.contentWidth - 60));
}

function cautionsHeight(lines: Line[][]): number {
  const lh = BODY.size * LINE_HEIGHT;
  return 26 + lines.reduce((s, l) => s + l.length * lh + 3, 0) + 6;
}

function drawCautions(sheet: Sheet): void {
  const x = sheet.left;
  const w = sheet.contentWidth;
  const textX = x + 40;
  const textW = w - 50;
  const lines = cautionLines(sheet);
  const lh = BODY.size * LINE_HEIGHT;
  const height = cautionsHeight(lines);
  sheet.ensure(height);
  const top = sheet.y;
  sheet.doc.save();
  sheet.doc.rect(x, top, w, height).lineWidth(1.6).strokeColor(INK).stroke();
  sheet.doc.restore();
  drawWarningSign(sheet.doc, x + 10, top + 9, 22);
  sheet.line('Safety: before you start', textX, top + 8, { face: 'bold', size: 10 }, textW);
  let y = top + 26;
  for (const block of lines) {
    sheet.doc
      .circle(textX + 2, y + lh / 2, 1.4)
      .fillColor(INK)
      .fill();
    block.forEach((line, i) => {
      sheet.text.drawLine(line, textX + 10, baselineOf(y + i * lh, BODY), BODY, textW - 10);
    });
    y += block.length * lh + 3;
  }
  sheet.y = top + height + 12;
}

export interface ContentsSlot {
  page: number;
  x: number;
  y: number;
  width: number;
  titles: string[];
}

/** Page 1. Returns where the contents go, for `fillContents` once page numbers are known. */
export async function drawTitlePage(
  sheet: Sheet,
  index: PlanIndex,
  sectionTitles: string[],
): Promise<ContentsSlot> {
  sheet.addPage();
  sheet.section('Summary, sign-off and cautions');
  sheet.line(
    'Bench worksheet',
    sheet.left,
    sheet.y,
    { face: 'bold', size: 20 },
    sheet.contentWidth,
  );
  sheet.y += 28;
  const standingStyle: TextStyle = { face: 'semibold', size: 9.5 };
  sheet.y += sheet.text.paragraph(
    standing(sheet),
    sheet.left,
    sheet.y,
    standingStyle,
    sheet.contentWidth,
  );
  sheet.y += 10;

  await sheet.pause();
  drawSignOff(sheet);
  await sheet.pause();
  const slot = drawSummary(sheet, index, sectionTitles);
  await sheet.pause();
  const notes = cleanText(sheet.snapshot.conversion.notes);
  if (notes) {
    sheet.ensure(30);
    sheet.line('Notes on this conversion', sheet.left, sheet.y, LABEL, sheet.contentWidth);
    sheet.y += 14;
    flow(sheet, notes);
    sheet.y += 10;
  }
  drawCautions(sheet);
  await sheet.pause();
  return slot;
}

/** Writes the contents with page numbers on page 1, once every section has its page. */
export function fillContents(sheet: Sheet, slot: ContentsSlot): void {
  const range = sheet.doc.bufferedPageRange();
  sheet.doc.switchToPage(range.start + slot.page - 1);
  const lh = BODY.size * LINE_HEIGHT;
  const numberWidth = 24;
  const titleRoom = slot.width - numberWidth - 8;
  slot.titles.forEach((title, i) => {
    const mark = sheet.sections.find((s) => s.title === title);
    const y = slot.y + i * lh;
    const titleWidth = sheet.line(title, slot.x, y, BODY, titleRoom);
    if (!mark) return;
    // Dot leader from the title to the page number.
    sheet.doc.save();
    sheet.doc
      .moveTo(slot.x + titleWidth + 4, y + lh - 3)
      .lineTo(slot.x + slot.width - numberWidth, y + lh - 3)
      .dash(0.5, { space: 2.5 })
      .lineWidth(0.6)
      .strokeColor(RULE)
      .stroke();
    sheet.doc.restore();
    sheet.line(
      String(mark.page),
      slot.x + slot.width - numberWidth,
      y,
      { ...BODY, face: 'semibold' },
      numberWidth,
      'right',
    );
  });
}
