/**
 * From uploaded bytes to CSV records: strict UTF-8 (a bad byte is named by its offset, never
 * replaced with U+FFFD), the byte-order mark dropped, the delimiter found from the header line,
 * then papaparse, whose every error fails the file.
 */
import Papa from 'papaparse';
import type { ImportIssue } from '#shared/schemas/imports.schema.ts';

export type DecodeResult =
  | { ok: true; text: string; hadBom: boolean }
  | { ok: false; message: string; byteOffset: number | null };

/**
 * Offset of the first byte that does not start or continue a well-formed UTF-8 sequence (Unicode
 * Table 3-7: no overlong forms, no surrogates, nothing above U+10FFFF), or -1 when all is well.
 */
export function firstInvalidUtf8(bytes: Uint8Array): number {
  let i = 0;
  const n = bytes.length;
  const cont = (at: number, lo = 0x80, hi = 0xbf) => at < n && bytes[at]! >= lo && bytes[at]! <= hi;
  while (i < n) {
    const b = bytes[i]!;
    if (b <= 0x7f) {
      i += 1;
    } else if (b >= 0xc2 && b <= 0xdf) {
      if (!cont(i + 1)) return i;
      i += 2;
    } else if (b >= 0xe0 && b <= 0xef) {
      const lo = b === 0xe0 ? 0xa0 : 0x80;
      const hi = b === 0xed ? 0x9f : 0xbf;
      if (!cont(i + 1, lo, hi) || !cont(i + 2)) return i;
      i += 3;
    } else if (b >= 0xf0 && b <= 0xf4) {
      const lo = b === 0xf0 ? 0x90 : 0x80;
      const hi = b === 0xf4 ? 0x8f : 0xbf;
      if (!cont(i + 1, lo, hi) || !cont(i + 2) || !cont(i + 3)) return i;
      i += 4;
    } else {
      return i;
    }
  }
  return -1;
}

const hex = (b: number) => `0x${b.toString(16).toUpperCase().padStart(2, '0')}`;

export function decodeUtf8(bytes: Uint8Array): DecodeResult {
  if (
    bytes.length >= 2 &&
    ((bytes[0] === 0xff && bytes[1] === 0xfe) || (bytes[0] === 0xfe && bytes[1] === 0xff))
  ) {
    return {
      ok: false,
      byteOffset: 0,
      message:
        'The file is UTF-16 text. Save it as "CSV UTF-8" (comma or semicolon separated) and upload it again.',
    };
  }
  const bad = firstInvalidUtf8(bytes);
  if (bad >= 0) {
    let line = 1;
    for (let i = 0; i < bad; i++) if (bytes[i] === 0x0a) line++;
    return {
      ok: false,
      byteOffset: bad,
      message:
        `The file is not valid UTF-8: byte ${bad.toLocaleString('en')} (${hex(bytes[bad]!)}, on line ${line}) ` +
        'cannot start or continue a character. Save the file as "CSV UTF-8" and upload it again; ' +
        'nothing was read from it.',
    };
  }
  const hadBom = bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf;
  // fatal: never replace a bad sequence with U+FFFD (the scan above should already have caught it).
  const text = new TextDecoder('utf-8', { fatal: true, ignoreBOM: false }).decode(bytes);
  return { ok: true, text, hadBom };
}

export type Delimiter = ',' | ';' | '\t';
export const DELIMITER_NAMES: Record<Delimiter, string> = {
  ',': 'comma',
  ';': 'semicolon',
  '\t': 'tab',
};

/** The delimiter used most often outside quotes on the first non-blank line; comma when none. */
export function detectDelimiter(text: string): Delimiter {
  const counts: Record<Delimiter, number> = { ',': 0, ';': 0, '\t': 0 };
  let quoted = false;
  let started = false;
  for (let i = 0; i < text.length; i++) {
    const ch = text[i]!;
    if (ch === '"') quoted = !quoted;
    else if (ch === '\n' && !quoted) {
      if (started) break;
    } else if (!quoted && (ch === ',' || ch === ';' || ch === '\t')) {
      counts[ch]++;
      started = true;
    } else if (ch.trim()) started = true;
  }
  const best = (Object.keys(counts) as Delimiter[]).sort((a, b) => counts[b] - counts[a])[0]!;
  return counts[best] > 0 ? best : ',';
}

export interface CsvRecord {
  /** The file's line number where the record starts (1 = the first line). */
  row: number;
  cells: string[];
}

export interface CsvTable {
  headers: string[];
  headerRow: number;
  records: CsvRecord[];
  delimiter: Delimiter;
  blankLines: number;
  errors: ImportIssue[];
  /** Reading stopped after `maxRecords` records: the file has more. */
  overLimit: boolean;
}

/** Line number of each character offset, by binary search over the line starts. */
function lineFinder(text: string): (offset: number) => number {
  const starts = [0];
  for (let i = 0; i < text.length; i++) if (text.charCodeAt(i) === 10) starts.push(i + 1);
  return (offset) => {
    let lo = 0;
    let hi = starts.length - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (starts[mid]! <= offset) lo = mid;
      else hi = mid - 1;
    }
    return lo + 1;
  };
}

const isBlank = (cells: string[]) => cells.every((c) => c.trim() === '');

/**
 * Parses decoded text into a header and records, each with the line it starts on. Line endings
 * (CRLF, LF, CR) are read alike; quoted fields may hold delimiters and line breaks; blank lines are
 * skipped and counted. Any papaparse error is reported and fails the file. Reading stops after
 * `maxRecords` data records (`overLimit`), so an oversized file costs no more than the limit.
 */
export function readCsv(decoded: string, maxRecords = Infinity): CsvTable {
  const text = decoded.replace(/\r\n?/g, '\n');
  const delimiter = detectDelimiter(text);
  const lineOf = lineFinder(text);
  const records: CsvRecord[] = [];
  const errors: ImportIssue[] = [];
  const seen = new Set<string>();
  let start = 0;
  let blankLines = 0;
  let overLimit = false;
  Papa.parse<string[]>(text, {
    delimiter,
    newline: '\n',
    quoteChar: '"',
    escapeChar: '"',
    header: false,
    dynamicTyping: false,
    skipEmptyLines: false,
    step: (result, parser) => {
      const row = lineOf(start);
      for (const e of result.errors) {
        const at = typeof e.index === 'number' ? lineOf(e.index) : row;
        const key = `${e.code}:${at}`;
        if (seen.has(key)) continue;
        seen.add(key);
        errors.push({ row: at, column: null, message: papaMessage(e.code, e.message) });
      }
      const cells = result.data;
      // After a final line break papaparse reports one more, empty record that starts at the end.
      const phantom = start >= text.length;
      start = result.meta.cursor;
      if (isBlank(cells)) {
        if (!phantom) blankLines++;
        return;
      }
      // The header is a record too: one more than `maxRecords` data records means too many.
      if (records.length > maxRecords) {
        overLimit = true;
        parser.abort();
        return;
      }
      records.push({ row, cells });
    },
  });
  const header = records.shift();
  return {
    headers: header?.cells ?? [],
    headerRow: header?.row ?? 1,
    records,
    delimiter,
    blankLines,
    errors,
    overLimit,
  };
}

function papaMessage(code: string, message: string): string {
  switch (code) {
    case 'MissingQuotes':
      return 'A quoted field is never closed: a " opens a field here and no closing " follows. Check the quotes on this line.';
    case 'InvalidQuotes':
      return 'A quoted field has text after its closing quote. Inside quotes, write a quote as "".';
    default:
      return `The file could not be read as CSV here: ${message}.`;
  }
}
