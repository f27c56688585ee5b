/**
 * The fonts shipped in fonts/, embedded (and subset) in every worksheet: Inter for running text,
 * JetBrains Mono for cavities, colour codes and hashes, Noto Sans Arabic for right-to-left text a
 * user typed. pdfkit's built-in fonts are WinAnsi only, so they are never used.
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import PDFDocument from 'pdfkit';

export const FACES = {
  regular: 'Inter-Regular.otf',
  medium: 'Inter-Medium.otf',
  semibold: 'Inter-SemiBold.otf',
  bold: 'Inter-Bold.otf',
  mono: 'JetBrainsMono-Regular.ttf',
  monoBold: 'JetBrainsMono-Bold.ttf',
  arabic: 'NotoSansArabic-Regular.ttf',
} as const;
export type Face = keyof typeof FACES;

const FONT_DIR = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../../../fonts');

/**
 * The part of a fontkit font we use. pdfkit parses a font anew for every document it is registered
 * with, and parsing Inter's layout tables costs more than laying out a whole worksheet; pdfkit also
 * accepts an already parsed fontkit font, so each face is parsed once per process and shared.
 */
export interface ParsedFont {
  characterSet: number[];
  layout: (text: string) => unknown;
}

/** What pdfkit keeps as the current font: its fontkit font. */
interface CurrentFont {
  _font: { font: ParsedFont };
}

let parsed: Map<Face, ParsedFont> | null = null;

/**
 * Each face parsed once per process. pdfkit does not export its fontkit, so a throwaway document
 * opens each file and we keep the fontkit font it made.
 */
function parsedFonts(): Map<Face, ParsedFont> {
  if (!parsed) {
    const scratch = new PDFDocument({ autoFirstPage: false });
    parsed = new Map(
      (Object.keys(FACES) as Face[]).map((face) => {
        scratch.registerFont(face, readFileSync(path.join(FONT_DIR, FACES[face])));
        scratch.font(face);
        return [face, (scratch as unknown as CurrentFont)._font.font];
      }),
    );
  }
  return parsed;
}

export function registerFonts(doc: PDFKit.PDFDocument): void {
  for (const [face, font] of parsedFonts()) {
    doc.registerFont(face, font as unknown as Buffer);
  }
}

/** pdfkit's font in a document: its fontkit font and the word layouts it keeps. */
interface DocumentFont {
  font: ParsedFont;
  layoutCache?: Record<string, unknown>;
}

/** Words laid out per face, kept across documents until there are this many. */
const MAX_SHARED_WORDS = 50_000;
const wordLayouts = new Map<ParsedFont, Record<string, unknown>>();

/**
 * Lets the document's fonts share their word layouts with every other worksheet of this process.
 * pdfkit shapes each word once per document (fontkit's substitution and positioning, most of a
 * worksheet's time) and keeps the result per document; headings, labels, colour codes and
 * numbers repeat from one worksheet to the next. A layout depends only on the word and the parsed
 * font, which all documents share (`registerFonts`), and pdfkit copies a layout before changing
 * it, so one kept layout serves every document.
 */
export function shareWordLayouts(doc: PDFKit.PDFDocument): void {
  for (const [font, words] of wordLayouts) {
    if (Object.keys(words).length > MAX_SHARED_WORDS) wordLayouts.delete(font);
  }
  const select = doc.font.bind(doc) as (...args: unknown[]) => PDFKit.PDFDocument;
  const withShared = (...args: unknown[]) => {
    select(...args);
    const current = (doc as unknown as { _font?: DocumentFont })._font;
    if (current?.layoutCache) {
      let words = wordLayouts.get(current.font);
      if (!words)
        wordLayouts.set(current.font, (words = Object.create(null) as Record<string, unknown>));
      current.layoutCache = words;
    }
    return doc;
  };
  doc.font = withShared as typeof doc.font;
}

const coverage = new Map<Face, Set<number>>();

/** The code points a face has a glyph for. */
export function faceCoverage(face: Face): Set<number> {
  let set = coverage.get(face);
  if (!set) {
    set = new Set(parsedFonts().get(face)!.characterSet);
    coverage.set(face, set);
  }
  return set;
}

let warmed = false;

/**
 * Lays a sample out in every face once per process, pausing between faces: fontkit reads a font's
 * layout tables on first use, which is the longest single stretch of a first worksheet.
 */
export async function warmFonts(): Promise<void> {
  if (warmed) return;
  for (const font of parsedFonts().values()) {
    font.layout('Loomwright bench worksheet 0123456789 mm² → Ω مضخة');
    await new Promise<void>((resolve) => setImmediate(resolve));
  }
  warmed = true;
}
