/**
 * The pages of a worksheet: size and margins, the header drawn on every new page, the DRAFT marks,
 * page breaks, the footers written once the page count is known, and the cooperative pauses that
 * keep a long layout from holding the event loop.
 */
import type { ConversionSnapshot } from '#shared/schemas/snapshot.schema.ts';
import { formatDateTime, shortHash, statusLabel, type WorksheetMeta } from './meta.ts';
import { baselineOf, cleanText, INK, TextKit, type Line, type TextStyle } from './text.ts';

/** Portrait page sizes in points. */
export const PAGE_SIZES = {
  A4: [595.28, 841.89],
  Letter: [612, 792],
} as const;

/** Half an inch all round: inside what office and workshop printers can print. */
export const MARGIN = 36;
const HEADER_HEIGHT = 44;
const FOOTER_HEIGHT = 22;

export const MUTED = '#444444';
export const RULE = '#8a8a8a';

export class WorksheetTimeoutError extends Error {
  constructor(ms: number) {
    super(`The worksheet took longer than ${ms} ms to lay out.`);
    this.name = 'WorksheetTimeoutError';
  }
}

export interface SheetOptions {
  /** Give up after this long (the layout pauses often, so the check runs often). */
  deadlineMs?: number;
  /** Longest stretch of layout work between pauses for the event loop. */
  sliceMs?: number;
}

export interface SectionMark {
  title: string;
  page: number;
}

export class Sheet {
  readonly text: TextKit;
  readonly pageWidth: number;
  readonly pageHeight: number;
  readonly left = MARGIN;
  readonly right: number;
  readonly contentWidth: number;
  readonly top = MARGIN + HEADER_HEIGHT + 10;
  readonly bottom: number;
  y = 0;
  pages = 0;
  readonly sections: SectionMark[] = [];
  private readonly started = performance.now();
  private lastPause = performance.now();
  private readonly deadlineMs: number;
  private readonly sliceMs: number;

  constructor(
    readonly doc: PDFKit.PDFDocument,
    readonly snapshot: ConversionSnapshot,
    readonly meta: WorksheetMeta,
    options: SheetOptions = {},
  ) {
    this.text = new TextKit(doc);
    const [w, h] = PAGE_SIZES[meta.paperSize];
    this.pageWidth = w;
    this.pageHeight = h;
    this.right = w - MARGIN;
    this.contentWidth = this.right - this.left;
    this.bottom = h - MARGIN - FOOTER_HEIGHT;
    this.deadlineMs = options.deadlineMs ?? 20_000;
    this.sliceMs = options.sliceMs ?? 15;
  }

  get isDraft(): boolean {
    return this.meta.revision === null;
  }

  /** Height left on this page. */
  get room(): number {
    return this.bottom - this.y;
  }

  /** Height of a page's content area. */
  get bodyHeight(): number {
    return this.bottom - this.top;
  }

  addPage(): void {
    this.doc.addPage({
      size: [this.pageWidth, this.pageHeight],
      margins: { top: MARGIN, bottom: MARGIN, left: MARGIN, right: MARGIN },
    });
    this.pages += 1;
    this.drawWatermark();
    this.drawHeader();
    this.y = this.top;
  }

  /** Starts a new page unless `height` still fits on this one. */
  ensure(height: number): void {
    if (this.pages === 0 || height > this.room) this.addPage();
  }

  /** Marks where a section starts, for the contents on page 1. */
  section(title: string): void {
    this.sections.push({ title, page: this.pages });
  }

  /**
   * Yields to the event loop when this stretch of work has run longer than the slice, and stops
   * the whole layout once it runs past the deadline.
   */
  async pause(): Promise<void> {
    const now = performance.now();
    if (now - this.started > this.deadlineMs) throw new WorksheetTimeoutError(this.deadlineMs);
    if (now - this.lastPause < this.sliceMs) return;
    await new Promise<void>((resolve) => setImmediate(resolve));
    this.lastPause = performance.now();
  }

  /** One line of text at the top y, cut with "…" to the width; returns the width it took. */
  line(
    text: string,
    x: number,
    topY: number,
    style: TextStyle,
    width: number,
    align: 'left' | 'right' | 'center' = 'left',
  ): number {
    const line = this.fit(text, style, width);
    this.text.drawLine(line, x, baselineOf(topY, style), style, width, align);
    return line.width;
  }

  /** The text as one line prints it, cut with "…" to the width. */
  private fit(text: string, style: TextStyle, width: number): Line {
    return this.text.fit(cleanText(text, { singleLine: true, maxChars: 500 }), style, width);
  }

  private statusText(): string {
    const revision = this.meta.revision;
    return revision ? `Revision ${revision.number} · ${statusLabel(revision.status)}` : 'DRAFT';
  }

  /**
   * Workshop, conversion, donor → vehicle on the left; printed date, status and content hash on the
   * right. Each left line gets the width its right-hand neighbour leaves.
   */
  private drawHeader(): void {
    const { doc, snapshot, meta } = this;
    const top = MARGIN;
    const gap = 14;
    const small: TextStyle = { face: 'medium', size: 8, color: MUTED };
    const statusStyle: TextStyle = { face: 'bold', size: 12 };
    const hashStyle: TextStyle = { face: 'mono', size: 8 };
    const maxRight = this.contentWidth * 0.45;
    const fitted = (text: string, style: TextStyle) => this.fit(text, style, maxRight).width;

    const printed = `Bench worksheet · printed ${formatDateTime(meta.printedAt)}`;
    const status = this.statusText();
    const hash = `Content hash ${meta.revision ? shortHash(meta.revision.hash) : 'not frozen'}`;
    const printedWidth = fitted(printed, small);
    const statusWidth = fitted(status, statusStyle) + (this.isDraft ? 14 : 0);
    const hashWidth = fitted(hash, hashStyle);

    this.line(meta.workshopName, this.left, top, small, this.contentWidth - printedWidth - gap);
    this.line(
      snapshot.conversion.name,
      this.left,
      top + 11,
      { face: 'bold', size: 13 },
      this.contentWidth - statusWidth - gap,
    );
    this.line(
      `${snapshot.conversion.donorEngine} → ${snapshot.conversion.receivingVehicle}`,
      this.left,
      top + 29,
      { face: 'regular', size: 8 },
      this.contentWidth - hashWidth - gap,
    );

    this.line(printed, this.right - maxRight, top, small, maxRight, 'right');
    if (this.isDraft) {
      // A black banner with white letters: unmistakable, and it survives photocopying.
      doc.save();
      doc
        .rect(this.right - statusWidth, top + 11, statusWidth, 17)
        .fillColor(INK)
        .fill();
      doc.restore();
      this.line(
        status,
        this.right - statusWidth,
        top + 12.5,
        { ...statusStyle, color: '#ffffff' },
        statusWidth,
        'center',
      );
    } else {
      this.line(status, this.right - maxRight, top + 12.5, statusStyle, maxRight, 'right');
    }
    this.line(hash, this.right - maxRight, top + 29, hashStyle, maxRight, 'right');
    doc.save();
    doc
      .moveTo(this.left, top + HEADER_HEIGHT)
      .lineTo(this.right, top + HEADER_HEIGHT)
      .lineWidth(1)
      .strokeColor(INK)
      .stroke();
    doc.restore();
  }

  /** DRAFT (or NOT SIGNED OFF for a revision awaiting review) across the page, very light. */
  private drawWatermark(): void {
    const revision = this.meta.revision;
    const word = revision === null ? 'DRAFT' : revision.signOff === null ? 'NOT SIGNED OFF' : null;
    if (!word) return;
    const { doc } = this;
    const size = word.length > 6 ? 64 : 120;
    const width = this.text.width('bold', size, word);
    const cx = this.pageWidth / 2;
    const cy = this.pageHeight / 2;
    doc.save();
    doc.rotate(-40, { origin: [cx, cy] });
    doc.fillOpacity(0.06);
    doc
      .font('bold')
      .fontSize(size)
      .fillColor(INK)
      .text(word, cx - width / 2, cy + size * 0.35, { lineBreak: false, baseline: 'alphabetic' });
    doc.restore();
  }

  /** "page X of Y" and the status on every page; call once all pages exist. */
  drawFooters(): void {
    const { doc } = this;
    const range = doc.bufferedPageRange();
    const total = range.count;
    const y = this.pageHeight - MARGIN - 13;
    const style: TextStyle = { face: 'regular', size: 8, color: MUTED };
    const revision = this.meta.revision;
    const left = revision
      ? `Loomwright bench worksheet · revision ${revision.number} · ${shortHash(revision.hash)}`
      : 'Loomwright bench worksheet · DRAFT: not signed off, for checking the plan';
    for (let i = 0; i < total; i++) {
      doc.switchToPage(range.start + i);
      doc.save();
      doc
        .moveTo(this.left, y - 5)
        .lineTo(this.right, y - 5)
        .lineWidth(0.5)
        .strokeColor(RULE)
        .stroke();
      doc.restore();
      this.line(left, this.left, y, style, this.contentWidth * 0.75);
      this.line(
        `page ${i + 1} of ${total}`,
        this.right - this.contentWidth * 0.2,
        y,
        { ...style, face: 'semibold', color: INK },
        this.contentWidth * 0.2,
        'right',
      );
    }
  }
}
