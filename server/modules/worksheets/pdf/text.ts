/**
 * Text for the worksheet, laid out by us rather than by pdfkit's line wrapper: pdfkit can loop
 * forever when a word is wider than the box or x/width leave the margins (pdfkit #262, #477, #1018),
 * and it has no font fallback. Here every string is cleaned and capped, split into runs by the face
 * that has its glyphs, wrapped at spaces (and inside words too long for the box), put in visual order
 * by the Unicode bidirectional algorithm (bidi-js) where right-to-left text is mixed in, and drawn
 * one line at a time with `lineBreak: false`.
 */
import bidiFactory from 'bidi-js';
import { faceCoverage, type Face } from './fonts.ts';

const bidi = bidiFactory();

export interface TextStyle {
  face: Face;
  size: number;
  color?: string;
}

/** Longest text printed in one table cell; the rest is replaced by a note that it was cut. */
export const MAX_CELL_CHARS = 2000;
export const LINE_HEIGHT = 1.25;
export const INK = '#111111';

const REPLACEMENT = '\uFFFD';
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/g;

/**
 * Characters never printed: controls (C0 but newline, DEL, C1), invisible formatting that would
 * reorder or hide text (bidi embeddings and isolates, zero-width characters, the byte-order mark,
 * the soft hyphen), variation selectors and tags, and noncharacters.
 */
function isStripped(cp: number): boolean {
  return (
    (cp < 0x20 && cp !== 0x0a) ||
    (cp >= 0x7f && cp <= 0x9f) ||
    cp === 0xad ||
    cp === 0x061c ||
    (cp >= 0x200b && cp <= 0x200f) ||
    (cp >= 0x202a && cp <= 0x202e) ||
    (cp >= 0x2060 && cp <= 0x206f) ||
    (cp >= 0xfe00 && cp <= 0xfe0f) ||
    cp === 0xfeff ||
    (cp & 0xfffe) === 0xfffe ||
    (cp >= 0xe0000 && cp <= 0xe01ef)
  );
}

/**
 * Text as the worksheet prints it: well-formed, NFC, control characters stripped, tabs as spaces,
 * at most `maxChars` code points (the cut is said in the text), and one line when `singleLine`.
 */
export function cleanText(
  input: unknown,
  {
    maxChars = MAX_CELL_CHARS,
    singleLine = false,
  }: { maxChars?: number; singleLine?: boolean } = {},
): string {
  let text = input == null ? '' : String(input);
  text = text
    .replace(LONE_SURROGATE, REPLACEMENT)
    .normalize('NFC')
    .replace(/\r\n?|[\u2028\u2029]/g, '\n')
    .replace(/\t/g, ' ');
  text = Array.from(text)
    .filter((ch) => !isStripped(ch.codePointAt(0)!))
    .join('');
  if (singleLine) text = text.replace(/\n+/g, ' ');
  text = text.replace(/[ ]+\n/g, '\n').replace(/\n{3,}/g, '\n\n');
  const points = Array.from(text);
  if (points.length > maxChars) {
    const more = points.length - maxChars;
    text = `${points.slice(0, maxChars).join('')}… [${more} more characters not printed]`;
  }
  return text.trim();
}

type Dir = 'L' | 'R' | 'N';

/** One piece of a line drawn in one call: one face, one direction. */
export interface Piece {
  text: string;
  face: Face;
  dir: Dir;
  width: number;
  space: boolean;
}

export interface Line {
  /** Pieces in visual order, left to right. */
  pieces: Piece[];
  width: number;
  rtl: boolean;
}

interface Cluster {
  text: string;
  face: Face;
  dir: Dir;
}

interface Token {
  space: boolean;
  clusters: Cluster[];
  width: number;
}

/** Hebrew, Arabic, Syriac, Thaana, N'Ko and their presentation forms: right-to-left scripts. */
function isRtl(cp: number): boolean {
  return (
    (cp >= 0x0590 && cp <= 0x08ff) ||
    (cp >= 0xfb1d && cp <= 0xfdff) ||
    (cp >= 0xfe70 && cp <= 0xfefe) ||
    (cp >= 0x10800 && cp <= 0x10fff) ||
    (cp >= 0x1e800 && cp <= 0x1efff)
  );
}

const LETTER = /\p{L}/u;
const MARK = /\p{M}/u;
const SPACE = /[ \u00A0\u1680\u2000-\u200A\u202F\u205F\u3000]/u;

const MONO_OF: Record<Face, Face> = {
  regular: 'mono',
  medium: 'mono',
  semibold: 'monoBold',
  bold: 'monoBold',
  mono: 'mono',
  monoBold: 'monoBold',
  arabic: 'mono',
};
const TEXT_OF: Record<Face, Face> = {
  regular: 'regular',
  medium: 'medium',
  semibold: 'semibold',
  bold: 'bold',
  mono: 'regular',
  monoBold: 'bold',
  arabic: 'regular',
};

/**
 * Widths by face, size and string. The fonts are the same in every document, so the cache is shared
 * by all of them; it is emptied when it grows large.
 */
const widths = new Map<string, number>();
const MAX_CACHED_WIDTHS = 50_000;
/** Wrapped lines by style, width and text: pin tables repeat the same words on every row. */
const wrapped = new Map<string, Line[]>();
const MAX_CACHED_WRAPS = 5_000;

/** Measures and draws text on one document. */
export class TextKit {
  constructor(readonly doc: PDFKit.PDFDocument) {}

  private covers(face: Face, cp: number): boolean {
    return faceCoverage(face).has(cp);
  }

  /** The face that prints this character: the preferred one, else a fallback that has it. */
  private faceFor(cp: number, preferred: Face): Face | null {
    if (isRtl(cp) && this.covers('arabic', cp)) return 'arabic';
    for (const face of [preferred, MONO_OF[preferred], TEXT_OF[preferred], 'arabic'] as Face[]) {
      if (this.covers(face, cp)) return face;
    }
    return null;
  }

  width(face: Face, size: number, text: string): number {
    const key = `${face}|${size}|${text}`;
    let w = widths.get(key);
    if (w === undefined) {
      w = this.doc.font(face).fontSize(size).widthOfString(text);
      if (widths.size >= MAX_CACHED_WIDTHS) widths.clear();
      widths.set(key, w);
    }
    return w;
  }

  /** Splits one hard line into words and spaces, each character in a face that has it. */
  private tokenize(text: string, preferred: Face, size: number): Token[] {
    const tokens: Token[] = [];
    let current: Token | null = null;
    let last: Cluster | null = null;
    for (const ch of text) {
      const cp = ch.codePointAt(0)!;
      const space = SPACE.test(ch);
      if (MARK.test(ch) && last && this.covers(last.face, cp)) {
        last.text += ch;
        continue;
      }
      let face = this.faceFor(cp, preferred);
      let out = space ? ' ' : ch;
      if (face === null) {
        face = MONO_OF[preferred];
        out = REPLACEMENT;
      }
      const dir: Dir = out === REPLACEMENT ? 'N' : isRtl(cp) ? 'R' : LETTER.test(ch) ? 'L' : 'N';
      if (!current || current.space !== space) {
        current = { space, clusters: [], width: 0 };
        tokens.push(current);
      }
      last = { text: out, face, dir };
      current.clusters.push(last);
    }
    for (const t of tokens)
      t.width = this.piecesOf(t.clusters, size).reduce((s, p) => s + p.width, 0);
    return tokens;
  }

  /**
   * Joins clusters into pieces drawn in one call. A right-to-left piece holds one word and nothing
   * else (pdfkit lays words out one by one, so a phrase would come out in the wrong word order);
   * spaces and neutrals join the left-to-right text beside them.
   */
  private piecesOf(clusters: Cluster[], size: number): Piece[] {
    const pieces: Piece[] = [];
    for (const c of clusters) {
      const prev = pieces[pieces.length - 1];
      const space = c.text === ' ';
      const joins =
        prev !== undefined &&
        prev.face === c.face &&
        (c.dir === 'R' ? prev.dir === 'R' : prev.dir !== 'R');
      if (joins) {
        prev.text += c.text;
        prev.space = prev.space && space;
        if (prev.dir === 'N' && c.dir === 'L') prev.dir = 'L';
      } else {
        pieces.push({ text: c.text, face: c.face, dir: c.dir, width: 0, space });
      }
    }
    for (const p of pieces) p.width = this.width(p.face, size, p.text);
    return pieces;
  }

  /** Breaks a word wider than the box into chunks that fit, at least one character each. */
  private splitWord(token: Token, size: number, maxWidth: number): Token[] {
    const chunks: Token[] = [];
    let chunk: Token = { space: false, clusters: [], width: 0 };
    for (const c of token.clusters) {
      const w = this.width(c.face, size, c.text);
      if (chunk.clusters.length > 0 && chunk.width + w > maxWidth) {
        chunks.push(chunk);
        chunk = { space: false, clusters: [], width: 0 };
      }
      chunk.clusters.push(c);
      chunk.width += w;
    }
    if (chunk.clusters.length) chunks.push(chunk);
    return chunks;
  }

  /** Wraps text into lines no wider than maxWidth (a lone character wider than the box excepted). */
  wrap(text: string, style: TextStyle, maxWidth: number): Line[] {
    const key = `${style.face}|${style.size}|${maxWidth}|${text}`;
    const cached = wrapped.get(key);
    if (cached) return cached;
    const lines = this.wrapUncached(text, style, maxWidth);
    if (text.length <= 500) {
      if (wrapped.size >= MAX_CACHED_WRAPS) wrapped.clear();
      wrapped.set(key, lines);
    }
    return lines;
  }

  private wrapUncached(text: string, style: TextStyle, maxWidth: number): Line[] {
    const width = Math.max(1, maxWidth);
    const lines: Line[] = [];
    const spaceWidth = this.width(style.face, style.size, ' ');
    for (const hard of text.split('\n')) {
      const rtl = paragraphIsRtl(hard);
      let words: Token[] = [];
      let lineWidth = 0;
      const flush = () => {
        lines.push(this.toLine(words, style.size, rtl));
        words = [];
        lineWidth = 0;
      };
      const tokens = this.tokenize(hard, style.face, style.size);
      for (const token of tokens) {
        if (token.space) continue;
        const gap = words.length ? spaceWidth : 0;
        if (lineWidth + gap + token.width <= width) {
          words.push(token);
          lineWidth += gap + token.width;
          continue;
        }
        if (token.width <= width) {
          if (words.length) flush();
          words.push(token);
          lineWidth = token.width;
          continue;
        }
        if (words.length) flush();
        const chunks = this.splitWord(token, style.size, width);
        for (const chunk of chunks.slice(0, -1)) {
          words.push(chunk);
          flush();
        }
        const tail = chunks[chunks.length - 1]!;
        words.push(tail);
        lineWidth = tail.width;
      }
      flush();
    }
    while (lines.length > 1 && lines[lines.length - 1]!.pieces.length === 0) lines.pop();
    return lines;
  }

  /** One line holding as much of the text as fits, ending in "…" when cut. */
  fit(text: string, style: TextStyle, maxWidth: number): Line {
    const key = `fit|${style.face}|${style.size}|${maxWidth}|${text}`;
    const cached = wrapped.get(key);
    if (cached) return cached[0]!;
    const line = this.fitUncached(text, style, maxWidth);
    if (wrapped.size >= MAX_CACHED_WRAPS) wrapped.clear();
    wrapped.set(key, [line]);
    return line;
  }

  private fitUncached(text: string, style: TextStyle, maxWidth: number): Line {
    const single = text.replace(/\n/g, ' ');
    const whole = this.wrap(single, style, Number.MAX_SAFE_INTEGER)[0]!;
    if (whole.width <= maxWidth) return whole;
    // Character widths summed (kerning aside) find the cut; the line is then measured for real.
    const clusters = this.tokenize(single, style.face, style.size).flatMap((t) => t.clusters);
    const room = maxWidth - this.width(style.face, style.size, '…');
    let used = 0;
    let count = 0;
    while (count < clusters.length) {
      const c = clusters[count]!;
      const w = this.width(c.face, style.size, c.text);
      if (used + w > room) break;
      used += w;
      count += 1;
    }
    for (; count >= 0; count--) {
      const candidate = `${clusters
        .slice(0, count)
        .map((c) => c.text)
        .join('')
        .trimEnd()}…`;
      const line = this.wrap(candidate, style, Number.MAX_SAFE_INTEGER)[0]!;
      if (line.width <= maxWidth || count === 0) return line;
    }
    return this.wrap('…', style, Number.MAX_SAFE_INTEGER)[0]!;
  }

  /** Words of one line, spaces put back, in visual order. */
  private toLine(words: Token[], size: number, rtl: boolean): Line {
    const clusters: Cluster[] = [];
    for (const [i, w] of words.entries()) {
      if (i > 0) {
        const prevFace = words[i - 1]!.clusters.at(-1)!.face;
        clusters.push({ text: ' ', face: prevFace, dir: 'N' });
      }
      clusters.push(...w.clusters);
    }
    const logical = this.piecesOf(clusters, size);
    const pieces = visualOrder(logical, rtl, (p) => this.width(p.face, size, p.text));
    return { pieces, width: pieces.reduce((s, p) => s + p.width, 0), rtl };
  }

  /** Draws one line with its baseline at y, aligned in the box [x, x + boxWidth]. */
  drawLine(
    line: Line,
    x: number,
    baselineY: number,
    style: TextStyle,
    boxWidth: number,
    align: 'left' | 'right' | 'center' = 'left',
  ): void {
    const effective = line.rtl && align === 'left' ? 'right' : align;
    let cx =
      effective === 'right'
        ? x + boxWidth - line.width
        : effective === 'center'
          ? x + (boxWidth - line.width) / 2
          : x;
    cx = Math.max(x, cx);
    this.doc.fillColor(style.color ?? INK);
    for (const p of line.pieces) {
      if (!p.space) {
        this.doc
          .font(p.face)
          .fontSize(style.size)
          .text(p.text, cx, baselineY, { lineBreak: false, baseline: 'alphabetic' });
      }
      cx += p.width;
    }
  }

  /** Wraps and draws a paragraph from the top y; returns the height used. */
  paragraph(
    text: string,
    x: number,
    topY: number,
    style: TextStyle,
    width: number,
    align: 'left' | 'right' | 'center' = 'left',
  ): number {
    const lines = this.wrap(text, style, width);
    const lh = style.size * LINE_HEIGHT;
    lines.forEach((line, i) =>
      this.drawLine(line, x, baselineOf(topY + i * lh, style), style, width, align),
    );
    return lines.length * lh;
  }
}

/** Baseline of a line whose box starts at top, for the style's size and line height. */
export function baselineOf(top: number, style: TextStyle): number {
  return top + style.size * (LINE_HEIGHT - 0.25) + style.size * 0.02;
}

/** The paragraph's direction, by the bidi algorithm's rules P2 and P3 (its first strong character). */
function paragraphIsRtl(text: string): boolean {
  if (!hasRtl(text)) return false;
  return bidi.getEmbeddingLevels(text, 'auto').paragraphs[0]?.level === 1;
}

/** Most lines hold no right-to-left character; they skip the bidi algorithm, which changes nothing. */
function hasRtl(text: string): boolean {
  for (const ch of text) if (isRtl(ch.codePointAt(0)!)) return true;
  return false;
}

/**
 * The pieces of one line in visual order, left to right, by the Unicode bidirectional algorithm
 * (UAX #9, bidi-js): embedding levels for the line's text, then the runs reversed (rule L2). A piece
 * whose characters resolve to different levels (a number after a right-to-left word, say) is first
 * cut where the level changes, each part measured again with `measure`. A right-to-left word keeps
 * its logical order, as fontkit reverses its glyphs when it is drawn; any other part that ends up
 * right-to-left (brackets, spaces, punctuation in a right-to-left run) has its characters reversed
 * and mirrored here (rule L4), since it is drawn left to right.
 */
export function visualOrder(
  pieces: Piece[],
  rtl: boolean,
  measure: (piece: Piece) => number = (piece) => piece.width,
): Piece[] {
  const text = pieces.map((p) => p.text).join('');
  if (text === '' || (!rtl && !hasRtl(text))) return pieces;
  const embedding = bidi.getEmbeddingLevels(text, rtl ? 'rtl' : 'ltr');
  const { levels } = embedding;

  // Visual position of each UTF-16 unit of the line.
  const order = Array.from({ length: text.length }, (_, i) => i);
  for (const segment of bidi.getReorderSegments(text, embedding)) {
    const [start, end] = segment as [number, number];
    order.splice(start, end - start + 1, ...order.slice(start, end + 1).reverse());
  }
  const position = new Array<number>(text.length);
  order.forEach((logical, visual) => (position[logical] = visual));

  const parts: Array<{ piece: Piece; at: number }> = [];
  let offset = 0;
  for (const piece of pieces) {
    let start = 0;
    const units = piece.text.length;
    for (let i = 1; i <= units; i++) {
      if (i < units && levels[offset + i] === levels[offset + start]) continue;
      // A surrogate pair's halves share a level, so a cut never falls inside one.
      const slice = piece.text.slice(start, i);
      const odd = (levels[offset + start]! & 1) === 1;
      let part: Piece =
        start === 0 && i === units ? piece : { ...piece, text: slice, space: slice.trim() === '' };
      if (odd && piece.dir !== 'R') {
        const mirrored = Array.from(slice)
          .reverse()
          .map((ch) => bidi.getMirroredCharacter(ch) ?? ch)
          .join('');
        part = { ...part, text: mirrored };
      }
      if (part !== piece) part.width = measure(part);
      let at = Infinity;
      for (let u = start; u < i; u++) at = Math.min(at, position[offset + u]!);
      parts.push({ piece: part, at });
      start = i;
    }
    offset += units;
  }
  return parts.sort((a, b) => a.at - b.at).map((p) => p.piece);
}
