/**
 * Each record of a pinout file checked cell by cell into pin values. Every problem is reported
 * with its line and column; nothing is guessed silently.
 */
import { unescapeFormula } from '#shared/domain/csv.ts';
import { DISPOSITION_INFO, DISPOSITIONS, type Disposition } from '#shared/domain/dispositions.ts';
import {
  SIGNAL_CLASS_LABELS,
  SIGNAL_CLASSES,
  type SignalClass,
} from '#shared/domain/signal-classes.ts';
import { parseWireColour } from '#shared/domain/wire-colours.ts';
import {
  exactAwg,
  exactIsoSize,
  formatAwgGauge,
  ISO_6722_SIZES_MM2,
  parseAwgGauge,
  sameSize,
  storedAwgAreaMm2,
} from '#shared/domain/wire-sizes.ts';
import type { ImportField, ImportIssue } from '#shared/schemas/imports.schema.ts';
import { PinFields } from '#shared/schemas/pin-map.schema.ts';
import { INSULATION_RATINGS_C } from '#shared/schemas/workshop.schema.ts';
import type { CsvRecord } from './csv-text.ts';

/** The pin values a file row sets; a field is present only when its column is imported. */
export interface ImportedValues {
  function?: string;
  signalClass?: SignalClass;
  colour?: string;
  sizeMm2?: number | null;
  insulationRatingC?: number | null;
  disposition?: Disposition;
  /** As written: a vehicle-side cavity's name becomes a link when the plan resolves it. */
  destination?: string;
  /** A feed's name, resolved by the plan. */
  feed?: string;
  runLengthM?: number | null;
  loadCurrentA?: number | null;
  notes?: string;
}

export interface PinRow {
  row: number;
  /** The connector cell, when the file has that column. */
  connector: string | null;
  cavity: string;
  values: ImportedValues;
}

const MAX_CAVITY = 8;
const MAX_TEXT: Partial<Record<ImportField, number>> = {
  connector: 40,
  function: 200,
  destination: 200,
  feed: 120,
  notes: 2000,
};
// Tab and line breaks are fine inside a quoted cell; other control characters are not text.
// eslint-disable-next-line no-control-regex -- finding control characters is the point
const CONTROL = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F]/;

/**
 * The pin API's own strict schema over what a row sets: the cell checks above give the messages a
 * person can act on; this makes sure nothing reaches the database the pin editor would refuse.
 */
const RowFields = PinFields.pick({
  function: true,
  signalClass: true,
  colour: true,
  sizeMm2: true,
  insulationRatingC: true,
  disposition: true,
  destination: true,
  runLengthM: true,
  loadCurrentA: true,
  notes: true,
}).partial();

const squash = (s: string) => s.toLowerCase().replace(/[^a-z0-9]/g, '');

const DISPOSITION_WORDS = new Map<string, Disposition>();
for (const d of DISPOSITIONS) {
  DISPOSITION_WORDS.set(squash(d), d);
  DISPOSITION_WORDS.set(squash(DISPOSITION_INFO[d].label), d);
  DISPOSITION_WORDS.set(squash(DISPOSITION_INFO[d].short), d);
}
const DISPOSITION_ALLOWED = DISPOSITIONS.map((d) => `${d} (${DISPOSITION_INFO[d].label})`).join(
  ', ',
);

const SIGNAL_CLASS_WORDS = new Map<string, SignalClass>();
for (const c of SIGNAL_CLASSES) {
  SIGNAL_CLASS_WORDS.set(squash(c), c);
  SIGNAL_CLASS_WORDS.set(squash(SIGNAL_CLASS_LABELS[c]), c);
}
const SIGNAL_CLASS_ALLOWED = SIGNAL_CLASSES.map((c) => `${c} (${SIGNAL_CLASS_LABELS[c]})`).join(
  ', ',
);

type Cell<T> = { ok: true; value: T } | { ok: false; message: string };
const ok = <T>(value: T): Cell<T> => ({ ok: true, value });
const fail = (message: string): Cell<never> => ({ ok: false, message });

/** "0,75" and "0.75 mm²" alike; null for anything that is not a plain non-negative number. */
function decimal(text: string, unit: RegExp): number | null {
  const bare = text.replace(unit, '').trim();
  if (!/^\d*(?:[.,]\d+)?$/.test(bare) || bare === '' || bare === '.' || bare === ',') return null;
  return Number(bare.replace(',', '.'));
}

function parseSizeMm2(text: string): Cell<number | null> {
  if (text === '') return ok(null);
  const area = decimal(text, /\s*mm(²|2|\^2)?$/i);
  if (area === null || area <= 0 || area > 120) {
    return fail(`"${text}" is not a wire size in mm²`);
  }
  // As the pin editor accepts it: an ISO 6722 size, or the area of an AWG size (within 1 %).
  if (exactIsoSize(area) === null && exactAwg(area) === null) {
    return fail(
      `${area} mm² is neither an ISO 6722 size (${ISO_6722_SIZES_MM2.join(', ')}) nor the area of an AWG size`,
    );
  }
  return ok(area);
}

function parseAwg(text: string): Cell<number | null> {
  if (text === '') return ok(null);
  const gauge = parseAwgGauge(text);
  if (gauge === null) return fail(`"${text}" is not an AWG size between 4/0 and 30`);
  return ok(gauge);
}

function parseBounded(text: string, unit: RegExp, max: number, what: string): Cell<number | null> {
  if (text === '') return ok(null);
  const value = decimal(text, unit);
  if (value === null || value > max) return fail(`"${text}" is not a ${what} between 0 and ${max}`);
  return ok(value);
}

function parseInsulation(text: string): Cell<number | null> {
  if (text === '') return ok(null);
  const value = decimal(text, /\s*°?\s*c$/i);
  if (value === null || !(INSULATION_RATINGS_C as readonly number[]).includes(value)) {
    return fail(`"${text}" is not an insulation rating: use ${INSULATION_RATINGS_C.join(', ')} °C`);
  }
  return ok(value);
}

function parseDisposition(text: string): Cell<Disposition> {
  if (text === '') return ok('undecided');
  const found = DISPOSITION_WORDS.get(squash(text));
  return found
    ? ok(found)
    : fail(`"${text}" is not a disposition: use one of ${DISPOSITION_ALLOWED}`);
}

function parseSignalClass(text: string): Cell<SignalClass> {
  if (text === '') return ok('none');
  const found = SIGNAL_CLASS_WORDS.get(squash(text));
  return found
    ? ok(found)
    : fail(`"${text}" is not a signal class: use one of ${SIGNAL_CLASS_ALLOWED}`);
}

function parseColour(text: string): Cell<string> {
  if (text === '') return ok('');
  if (text.length > 20) return fail(`"${text.slice(0, 20)}…" is not a wire colour`);
  const parsed = parseWireColour(text);
  return parsed.ok ? ok(parsed.value) : fail(parsed.error);
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
export function parseRows(
  records: readonly CsvRecord[],
  headers: readonly string[],
  columnOf: ReadonlyMap<ImportField, number>,
): ParsedRows {
  const rows: PinRow[] = [];
  const errors: ImportIssue[] = [];
  const mentioned: ParsedRows['mentioned'] = [];
  const firstRowOf = new Map<string, number>();

  for (const record of records) {
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
      const value = unescapeFormula(record.cells[index]!.trim());
      if (CONTROL.test(value)) {
        issue(field, 'holds a control character; remove it');
        return '';
      }
      if (value.includes('\uFFFD')) {
        issue(
          field,
          'holds the replacement character �, a sign the text was damaged by an earlier conversion; retype it',
        );
        return '';
      }
      const max = MAX_TEXT[field];
      if (max !== undefined && value.length > max) {
        issue(field, `is ${value.length} characters long; at most ${max} fit`);
        return '';
      }
      return value;
    };
    const take = <T>(field: ImportField, parse: (t: string) => Cell<T>): T | undefined => {
      const t = text(field);
      if (t === undefined) return undefined;
      const parsed = parse(t);
      if (!parsed.ok) {
        issue(field, parsed.message);
        return undefined;
      }
      return parsed.value;
    };

    const cavity = text('cavity') ?? '';
    if (cavity === '') issue('cavity', 'is empty: every row needs its cavity');
    else if (cavity.length > MAX_CAVITY)
      issue('cavity', `"${cavity}" is longer than ${MAX_CAVITY} characters`);
    const connectorText = text('connector');
    const connector = connectorText === undefined ? null : connectorText;

    const values: ImportedValues = {};
    const fn = text('function');
    if (fn !== undefined) values.function = fn;
    const signalClass = take('signal_class', parseSignalClass);
    if (signalClass !== undefined) values.signalClass = signalClass;
    const colour = take('colour', parseColour);
    if (colour !== undefined) values.colour = colour;

    const sizeMm2 = take('size_mm2', parseSizeMm2);
    const gauge = take('awg', parseAwg);
    if (columnOf.has('size_mm2') && sizeMm2 !== undefined) values.sizeMm2 = sizeMm2;
    if (gauge != null) {
      const awgArea = storedAwgAreaMm2(gauge);
      if (sizeMm2 != null && !sameSize(sizeMm2, awgArea)) {
        issue(
          'awg',
          `${formatAwgGauge(gauge)} AWG is ${awgArea.toFixed(2)} mm², but the mm² column says ${sizeMm2} mm²; give one size or make them agree`,
        );
      } else if (sizeMm2 == null) {
        values.sizeMm2 = awgArea;
      }
    } else if (gauge === null && !columnOf.has('size_mm2')) {
      values.sizeMm2 = null;
    }

    const insulation = take('insulation_c', parseInsulation);
    if (insulation !== undefined) values.insulationRatingC = insulation;
    const disposition = take('disposition', parseDisposition);
    if (disposition !== undefined) values.disposition = disposition;
    const destination = text('destination');
    if (destination !== undefined) values.destination = destination;
    const feed = text('feed');
    if (feed !== undefined) values.feed = feed;
    const run = take('run_length_m', (t) => parseBounded(t, /\s*m$/i, 100, 'run length in metres'));
    if (run !== undefined) values.runLengthM = run;
    const load = take('load_current_a', (t) =>
      parseBounded(t, /\s*a$/i, 200, 'load current in amperes'),
    );
    if (load !== undefined) values.loadCurrentA = load;
    const notes = text('notes');
    if (notes !== undefined) values.notes = notes;

    if (cavity !== '') {
      mentioned.push({ connector, cavity });
      const key = `${connector ?? ''}\u0000${cavity.toUpperCase()}`;
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
      const { feed: _feed, ...fields } = values;
      const strict = RowFields.safeParse(fields);
      if (!strict.success) {
        for (const i of strict.error.issues) issue(null, `${String(i.path[0])}: ${i.message}`);
        continue;
      }
      rows.push({ row: record.row, connector, cavity, values });
    }
  }
  return { rows, errors, mentioned };
}
