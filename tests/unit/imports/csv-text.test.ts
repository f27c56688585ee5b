import { describe, expect, it } from 'vitest';
import {
  decodeUtf8,
  detectDelimiter,
  firstInvalidUtf8,
  readCsv,
} from '#server/modules/imports/csv-text.ts';

const bytes = (...parts: Array<string | number[]>) =>
  Buffer.concat(
    parts.map((p) => (typeof p === 'string' ? Buffer.from(p, 'utf8') : Buffer.from(p))),
  );

describe('strict UTF-8', () => {
  it('accepts UTF-8 with and without a byte-order mark, and drops the mark', () => {
    const withBom = decodeUtf8(bytes([0xef, 0xbb, 0xbf], 'cavity\n1 – Ω\n'));
    expect(withBom).toEqual({ ok: true, text: 'cavity\n1 – Ω\n', hadBom: true });
    expect(decodeUtf8(bytes('cavity\n'))).toEqual({ ok: true, text: 'cavity\n', hadBom: false });
  });

  it('names the offset of the first bad byte: 0xFF, a cut-off sequence, cp1252 é, overlong, surrogate', () => {
    expect(firstInvalidUtf8(bytes('ab', [0xff], 'c'))).toBe(2);
    expect(firstInvalidUtf8(bytes('abc', [0xe2, 0x82]))).toBe(3);
    expect(firstInvalidUtf8(bytes('caf', [0xe9], ' au lait'))).toBe(3);
    expect(firstInvalidUtf8(bytes([0xc0, 0xaf]))).toBe(0);
    expect(firstInvalidUtf8(bytes('x', [0xed, 0xa0, 0x80]))).toBe(1);
    expect(firstInvalidUtf8(bytes([0xf4, 0x90, 0x80, 0x80]))).toBe(0);
    expect(firstInvalidUtf8(bytes('ok ✓ 𝄞'))).toBe(-1);
    const result = decodeUtf8(bytes('cavity\n1\n2', [0xff]));
    expect(result.ok).toBe(false);
    if (!result.ok) {
      expect(result.byteOffset).toBe(10);
      expect(result.message).toContain('byte 10 (0xFF, on line 3)');
    }
  });

  it('refuses UTF-16 by its byte-order mark', () => {
    const result = decodeUtf8(bytes([0xff, 0xfe], [0x63, 0]));
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.message).toContain('UTF-16');
  });
});

describe('reading CSV records', () => {
  it('finds the delimiter on the header line, ignoring quoted ones', () => {
    expect(detectDelimiter('cavity;function;colour\n1;a,b,c;BU')).toBe(';');
    expect(detectDelimiter('cavity\tfunction\n')).toBe('\t');
    expect(detectDelimiter('"a;b;c",d\n')).toBe(',');
    expect(detectDelimiter('\n\ncavity\n1\n')).toBe(',');
  });

  it('keeps the file’s line numbers across quoted line breaks, CRLF and blank lines', () => {
    const text =
      'cavity;function;notes\r\n1;"Main; relay";"two\r\nlines"\r\n\r\n2;Feed;\r\n   \r\n3;x;y\r\n';
    const csv = readCsv(text);
    expect(csv.errors).toEqual([]);
    expect(csv.delimiter).toBe(';');
    expect(csv.headers).toEqual(['cavity', 'function', 'notes']);
    expect(csv.records).toEqual([
      { row: 2, cells: ['1', 'Main; relay', 'two\nlines'] },
      { row: 5, cells: ['2', 'Feed', ''] },
      { row: 7, cells: ['3', 'x', 'y'] },
    ]);
    expect(csv.blankLines).toBe(2);
  });

  it('reports papaparse errors with their line', () => {
    const csv = readCsv('cavity,function\n1,ok\n2,"bad"x\n3,fine\n');
    expect(csv.errors.length).toBeGreaterThan(0);
    expect(csv.errors[0]!.row).toBe(3);
    const open = readCsv('cavity,function\n1,"never closed\n2,x\n');
    expect(open.errors.some((e) => e.message.includes('never closed'))).toBe(true);
  });
});
