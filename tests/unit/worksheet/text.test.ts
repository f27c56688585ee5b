import PDFDocument from 'pdfkit';
import { describe, expect, it } from 'vitest';
import { registerFonts } from '#server/modules/worksheets/pdf/fonts.ts';
import {
  cleanText,
  TextKit,
  visualOrder,
  type Piece,
} from '#server/modules/worksheets/pdf/text.ts';

function kit() {
  const doc = new PDFDocument({ autoFirstPage: false });
  registerFonts(doc);
  return new TextKit(doc);
}

const piece = (text: string, dir: Piece['dir']): Piece => ({
  text,
  face: dir === 'R' ? 'arabic' : 'regular',
  dir,
  width: 10,
  space: text.trim() === '',
});

describe('cleanText', () => {
  it('strips control and invisible reordering characters but keeps line breaks', () => {
    expect(cleanText('A\u0000B\u0007C\u202E D\u200B\nE\r\nF\tG')).toBe('ABC D\nE\nF G');
  });

  it('caps the length and says how much was left out', () => {
    const text = cleanText('x'.repeat(2500));
    expect(text.startsWith('x'.repeat(2000) + '…')).toBe(true);
    expect(text).toContain('[500 more characters not printed]');
  });

  it('replaces a lone surrogate and makes single-line text', () => {
    expect(cleanText('a\uD800b\n\nc', { singleLine: true })).toBe('a\uFFFDb c');
  });
});

describe('TextKit', () => {
  it('breaks a word wider than the box into lines that fit', () => {
    const t = kit();
    const style = { face: 'regular' as const, size: 8.5 };
    const lines = t.wrap('W'.repeat(5000), style, 90);
    expect(lines.length).toBeGreaterThan(50);
    for (const line of lines) expect(line.width).toBeLessThanOrEqual(90);
    expect(lines.map((l) => l.pieces.map((p) => p.text).join('')).join('')).toBe('W'.repeat(5000));
  });

  it('prints Arabic in the Arabic face and a character no font has as U+FFFD', () => {
    const t = kit();
    const [line] = t.wrap('Pump 😀 مضخة', { face: 'regular', size: 9 }, 500);
    const faces = line!.pieces.map((p) => [p.text.trim(), p.face]);
    expect(faces).toContainEqual(['مضخة', 'arabic']);
    expect(line!.pieces.map((p) => p.text).join('')).toContain('\uFFFD');
    expect(line!.pieces.map((p) => p.text).join('')).not.toContain('😀');
  });

  it('fits one line with an ellipsis', () => {
    const t = kit();
    const style = { face: 'regular' as const, size: 10 };
    const line = t.fit('A long conversion name that will not fit in the header', style, 80);
    expect(line.width).toBeLessThanOrEqual(80);
    expect(line.pieces.map((p) => p.text).join('')).toMatch(/…$/);
  });
});

describe('visualOrder', () => {
  // Arabic words from the worksheet tests: pump, fuel.
  const pump = 'مضخة';
  const fuel = 'الوقود';

  it('reverses a run of right-to-left words inside left-to-right text', () => {
    const order = visualOrder(
      [piece('See ', 'L'), piece(pump, 'R'), piece(' ', 'N'), piece(fuel, 'R'), piece(' now', 'L')],
      false,
    );
    expect(order.map((p) => p.text)).toEqual(['See ', fuel, ' ', pump, ' now']);
  });

  it('lays a right-to-left paragraph out from the right, keeping numbers in their place', () => {
    // The spaces take the paragraph's direction and the number its own, so the piece is cut.
    const order = visualOrder([piece(pump, 'R'), piece(' 12 ', 'N'), piece(fuel, 'R')], true);
    expect(order.map((p) => p.text)).toEqual([fuel, ' ', '12', ' ', pump]);
  });

  it('keeps a number that follows a right-to-left word with it, cutting the piece it sits in', () => {
    // UAX #9 W2 and N1: "12" after an Arabic word is read as part of the right-to-left run, so it
    // is printed to the left of the word; the space before "now" stays with the left-to-right text.
    const order = visualOrder([piece('See ', 'L'), piece(pump, 'R'), piece(' 12 now', 'L')], false);
    expect(order.map((p) => p.text)).toEqual(['See ', '12', ' ', pump, ' now']);
  });

  it('mirrors brackets that fall inside a right-to-left run', () => {
    // "pump (fuel)" read from the right: the closing bracket is printed leftmost, as "(".
    const order = visualOrder(
      [piece(pump, 'R'), piece(' (', 'N'), piece(fuel, 'R'), piece(')', 'N')],
      true,
    );
    expect(order.map((p) => p.text)).toEqual(['(', fuel, ') ', pump]);
  });
});
