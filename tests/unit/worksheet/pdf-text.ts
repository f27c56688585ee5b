/** Reads a PDF back with pdfjs-dist: each page's size and text, for the worksheet tests. */
import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';

export interface PdfPage {
  width: number;
  height: number;
  /** Text items in drawing order. */
  items: string[];
  /** Items joined with spaces. */
  text: string;
}

export async function readPdf(data: Buffer | Uint8Array): Promise<PdfPage[]> {
  const pdf = await getDocument({
    data: new Uint8Array(data),
    disableFontFace: true,
    useSystemFonts: false,
    isEvalSupported: false,
    verbosity: 0,
  }).promise;
  const pages: PdfPage[] = [];
  for (let n = 1; n <= pdf.numPages; n++) {
    const page = await pdf.getPage(n);
    const content = await page.getTextContent();
    const items = content.items
      .map((item) => ('str' in item ? item.str : ''))
      .filter((s) => s.trim() !== '');
    const [x0, y0, x1, y1] = page.view as [number, number, number, number];
    pages.push({ width: x1 - x0, height: y1 - y0, items, text: items.join(' ') });
  }
  await pdf.destroy();
  return pages;
}

/** All text with every kind of white space removed: finds words broken across lines. */
export function squeeze(text: string): string {
  return text.replace(/\s+/g, '');
}
