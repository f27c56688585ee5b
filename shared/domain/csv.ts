/**
 * CSV text for pinout files: RFC 4180 fields and the guard against spreadsheet formulas (OWASP
 * "CSV Injection": a cell that starts with = + - @ tab, CR or NUL is run as a formula by Excel,
 * LibreOffice and Sheets, so it is written with a leading apostrophe).
 */

/** A text that would start a formula, possibly already behind apostrophes we added before. */
const FORMULA_START = /^'*[=+\-@\t\r\0]/;
const ESCAPED_FORMULA = /^'+[=+\-@\t\r\0]/;

/**
 * Prefixes `'` to a text cell a spreadsheet would run as a formula. Texts that already start with
 * apostrophes before such a character get one more, so {@link unescapeFormula} is its exact inverse.
 */
export function escapeFormula(text: string): string {
  return FORMULA_START.test(text) ? `'${text}` : text;
}

/** Removes the one apostrophe {@link escapeFormula} added; any other text comes back unchanged. */
export function unescapeFormula(text: string): string {
  return ESCAPED_FORMULA.test(text) ? text.slice(1) : text;
}

/** One RFC 4180 field: quoted when it holds a comma, a quote or a line break. */
export function csvField(value: string | number | null | undefined): string {
  if (value === null || value === undefined) return '';
  const text = typeof value === 'number' ? String(value) : escapeFormula(value);
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** One record, comma-separated and ended with CRLF as RFC 4180 §2 asks. */
export function csvRecord(values: ReadonlyArray<string | number | null | undefined>): string {
  return values.map(csvField).join(',') + '\r\n';
}

/** Excel reads a CSV as UTF-8 only when it starts with a byte-order mark. */
export const UTF8_BOM = '\uFEFF';
