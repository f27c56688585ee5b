/**
 * Each record of a pinout file checked cell by cell into pin values. Every problem is reported
 * with its line and column; nothing is guessed silently.
 */
import { looseLabelKey } from '#shared/domain/labels.ts';
import { normalizeText, textProblem } from '#shared/schemas/common.schema.ts';
import { unescapeFormula } from '#shared/domain/csv.ts';
import { csvColumns, type FieldParse, type FieldSpec } from '#shared/domain/fields/field-table.ts';
import { PIN_FIELDS, type PinValues } from '#shared/domain/fields/pin-fields.ts';
import type { ImportField, ImportIssue } from '#shared/schemas/imports.schema.ts';
import type { z } from 'zod';
import { PinFields } from '#shared/schemas/pin-map.schema.ts';
import type { CsvRecord } from './csv-text.ts';

/** The pin values a file row sets; a field is present only when its column is imported. */
export type ImportedValues = Partial<PinValues> & {
  /** A feed's name, resolved by the plan. */
  feed?: string;
};

export interface PinRow {
  row: number;
  /** The connector cell, when the file has that column. */
  connector: string | null;
  cavity: string;
  values: ImportedValues;
}

const MAX_CAVITY = 8;
/** Cells that hold names rather than values: checked for length here, resolved by the plan. */
const MAX_NAME: Partial<Record<ImportField, number>> = { connector: 40, feed: 120 };

/**
 * The pin API's own schema for each field a row sets: the cell parsers give the messages a person
 * can act on; this makes sure nothing reaches the database the pin editor would refuse. The pin
 * schema is a strict object of independent fields (no rule spans two), so checking field by field
 * is the same check, and a value met before in the file (a colour, a size, a disposition) is
 * checked once per file rather than once per row.
 */
const FIELD_SCHEMAS: Record<string, z.ZodType | undefined> = PinFields.shape;

function fieldChecker() {
  const seen = new Map<string, Map<unknown, string[]>>();
  return (key: string, value: unknown): string[] => {
    let byValue = seen.get(key);
    if (!byValue) seen.set(key, (byValue = new Map()));
    let problems = byValue.get(value);
    if (!problems) {
      const schema = FIELD_SCHEMAS[key];
      const parsed = schema?.safeParse(value);
      problems = !schema
        ? ['is not a pin field']
        : parsed!.success
          ? []
          : parsed!.error.issues.map((i) => i.message);
      byValue.set(value, problems);
    }
    return problems;
  };
}

const PIN_CSV_COLUMNS = csvColumns(PIN_FIELDS);

/** How a column's cells are read: its own reader, else the field's parser (sizes in mm²). */
function readerOf(key: keyof PinValues, read?: (text: string) => FieldParse<unknown>) {
  const spec = PIN_FIELDS[key] as FieldSpec<unknown>;
  return read ?? ((text: string) => spec.parse(text, 'mm2'));
}

export interface ParsedRows {
  /** Rows without a problem. */
  rows: PinRow[];
  errors: ImportIssue[];
  /** Every cavity the file names, rows with problems included: none of them is "missing". */
  mentioned: Array<{ connector: string | null; cavity: string }>;
}

/**
 * Checks every cell of every record. `columnOf` says which column holds which field; `headers`
 * name the columns in the errors.
 */
function* parseRowsInSteps(
  records: readonly CsvRecord[],
  headers: readonly string[],
  columnOf: ReadonlyMap<ImportField, number>,
): Generator<void, ParsedRows> {
  const rows: PinRow[] = [];
  const errors: ImportIssue[] = [];
  const mentioned: ParsedRows['mentioned'] = [];
  const firstRowOf = new Map<string, number>();
  const fieldProblems = fieldChecker();
  /** Per column, each cell text read without a problem and the value it gave. */
  const readCells = new Map<ImportField, Map<string, unknown>>();

  for (const [at, record] of records.entries()) {
    if (at > 0 && at % STEP_ROWS === 0) yield;
    const issue = (field: ImportField | null, message: string) =>
      errors.push({
        row: record.row,
        column: field === null ? null : headers[columnOf.get(field)!]!,
        message,
      });
    if (record.cells.length !== headers.length) {
      issue(
        null,
        `This line has ${record.cells.length} cell${record.cells.length === 1 ? '' : 's'} but the header has ${headers.length}. ` +
          'Check for a missing or extra delimiter, or a quote that is not closed.',
      );
      continue;
    }
    const errorsBefore = errors.length;
    /** The trimmed text of a field's cell, with our formula guard removed; undefined when not imported. */
    const text = (field: ImportField): string | undefined => {
      const index = columnOf.get(field);
      if (index === undefined) return undefined;
      const multiline = field === 'notes' || field === 'function';
      const value = normalizeText(unescapeFormula(record.cells[index]!.trim()), multiline).trim();
      const problem = textProblem(value, multiline);
      if (problem) {
        issue(field, `${problem}; remove it`);
        return '';
      }
      if (value.includes('\uFFFD')) {
        issue(
          field,
          'holds the replacement character �, a sign the text was damaged by an earlier conversion; retype it',
        );
        return '';
      }
      const max = MAX_NAME[field];
      if (max !== undefined && value.length > max) {
        issue(field, `is ${value.length} characters long; at most ${max} fit`);
        return '';
      }
      return value;
    };
    const take = (field: ImportField, parse: (t: string) => FieldParse<unknown>) => {
      const index = columnOf.get(field);
      if (index === undefined) return undefined;
      // A cell read cleanly before in this column (a colour, a size, a disposition) reads the same.
      const cell = record.cells[index]!;
      let clean = readCells.get(field);
      if (!clean) readCells.set(field, (clean = new Map()));
      if (clean.has(cell)) return clean.get(cell);
      const before = errors.length;
      const t = text(field)!;
      const parsed = parse(t);
      if (!parsed.ok) {
        issue(field, parsed.error);
        return undefined;
      }
      if (errors.length === before) clean.set(cell, parsed.value);
      return parsed.value;
    };

    const cavity = text('cavity') ?? '';
    if (cavity === '') issue('cavity', 'is empty: every row needs its cavity');
    else if (cavity.length > MAX_CAVITY)
      issue('cavity', `"${cavity}" is longer than ${MAX_CAVITY} characters`);
    const connectorText = text('connector');
    const connector = connectorText === undefined ? null : connectorText;

    const values: ImportedValues = {};
    const fields = values as Record<string, unknown>;
    /** Which column gave a field its value, when a field has more than one (size in mm² and AWG). */
    const givenBy = new Map<string, string>();
    for (const { key, column } of PIN_CSV_COLUMNS) {
      if (!columnOf.has(column.header)) continue;
      if (column.names === 'feed') {
        values.feed = text(column.header);
        continue;
      }
      const value = take(column.header, readerOf(key, column.read));
      if (value === undefined) continue;
      const earlier = givenBy.get(key);
      if (earlier === undefined || fields[key] == null) {
        fields[key] = value;
        givenBy.set(key, column.header);
      } else if (value !== null && value !== fields[key]) {
        const spec = PIN_FIELDS[key] as FieldSpec<unknown>;
        const show = (v: unknown) => (spec.show ?? spec.format)(v, 'mm2');
        issue(
          column.header,
          `says ${show(value)}, but the ${headers[columnOf.get(earlier)!]} column says ${show(fields[key])}; give one value or make them agree`,
        );
      }
    }

    if (cavity !== '') {
      mentioned.push({ connector, cavity });
      const key = `${connector ?? ''}\u0000${looseLabelKey(cavity)}`;
      const first = firstRowOf.get(key);
      if (first !== undefined) {
        issue(
          'cavity',
          `cavity "${cavity}"${connector ? ` of ${connector}` : ''} is already on line ${first}; each cavity may appear once`,
        );
      } else {
        firstRowOf.set(key, record.row);
      }
    }
    if (errors.length === errorsBefore) {
      for (const [key, value] of Object.entries(values)) {
        if (key === 'feed') continue;
        for (const message of fieldProblems(key, value)) issue(null, `${key}: ${message}`);
      }
      if (errors.length === errorsBefore) rows.push({ row: record.row, connector, cavity, values });
    }
  }
  return { rows, errors, mentioned };
}

/** Records checked between two turns of the event loop: a few tens of milliseconds of work. */
const STEP_ROWS = 1000;

export function parseRows(
  records: readonly CsvRecord[],
  headers: readonly string[],
  columnOf: ReadonlyMap<ImportField, number>,
): ParsedRows {
  const steps = parseRowsInSteps(records, headers, columnOf);
  for (;;) {
    const step = steps.next();
    if (step.done) return step.value;
  }
}

/**
 * `parseRows`, letting other requests run every thousand records: checking 20,000 rows takes
 * half a second or more, and the health check and everyone else's edits must not wait for it.
 */
export async function parseRowsYielding(
  records: readonly CsvRecord[],
  headers: readonly string[],
  columnOf: ReadonlyMap<ImportField, number>,
): Promise<ParsedRows> {
  const steps = parseRowsInSteps(records, headers, columnOf);
  for (;;) {
    const step = steps.next();
    if (step.done) return step.value;
    await new Promise<void>((resolve) => setImmediate(resolve));
  }
}
