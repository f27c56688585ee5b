import { describe, expect, it } from 'vitest';
import { csvField, csvRecord, escapeFormula, unescapeFormula } from '#shared/domain/csv.ts';

describe('CSV fields (RFC 4180) and the formula guard (OWASP CSV injection)', () => {
  it('quotes a field with a comma, a quote or a line break and doubles its quotes', () => {
    expect(csvField('plain')).toBe('plain');
    expect(csvField('a,b')).toBe('"a,b"');
    expect(csvField('say "hi"')).toBe('"say ""hi"""');
    expect(csvField('two\nlines')).toBe('"two\nlines"');
    expect(csvRecord(['a', 1.5, null, ''])).toBe('a,1.5,,\r\n');
  });

  it('prefixes cells a spreadsheet would run, as reliability row 19 asks', () => {
    expect(csvField('=HYPERLINK("x")')).toBe(`"'=HYPERLINK(""x"")"`);
    expect(csvField('@SUM(A1)')).toBe(`'@SUM(A1)`);
    for (const start of ['=', '+', '-', '@', '\t', '\r', '\0']) {
      expect(escapeFormula(`${start}x`)).toBe(`'${start}x`);
    }
    expect(escapeFormula('Sensor ground')).toBe('Sensor ground');
    // Numbers are never prefixed.
    expect(csvField(0.75)).toBe('0.75');
  });

  it('removes exactly the prefix it added, so any text round-trips', () => {
    for (const text of [
      '=HYPERLINK("http://example.com","x")',
      '-12 V reference',
      "'=already quoted",
      "''=twice",
      "it's fine",
      "'plain apostrophe",
      '+',
      '',
    ]) {
      expect(unescapeFormula(escapeFormula(text))).toBe(text);
    }
  });
});
