/**
 * Which column of a pinout file feeds which pin field. Headers are only ever looked up in an
 * allowlist (a Map), never used as object keys, and a header such as `__proto__` is refused.
 */
import { createHash } from 'node:crypto';
import {
  COLUMN_TARGETS,
  HEADER_ALIASES,
  IGNORE,
  IMPORT_FIELD_LABELS,
  type ColumnMapping,
  type ColumnTarget,
  type ImportField,
  type ImportIssue,
  type ImportResult,
} from '#shared/schemas/imports.schema.ts';
import { badRequest } from '../../lib/errors.ts';

const ALIASES = new Map<string, ImportField>(Object.entries(HEADER_ALIASES));
const TARGETS = new Set<string>(COLUMN_TARGETS);
/** Names that mean something to JavaScript objects; no pinout has a column called that. */
const FORBIDDEN = new Set(['__proto__', 'constructor', 'prototype']);
const MAX_HEADER_LENGTH = 100;
// Control characters other than tab; line breaks inside a quoted header are refused too.
// eslint-disable-next-line no-control-regex -- finding control characters is the point
const CONTROL = /[\u0000-\u0008\u000A-\u001F\u007F]/;

/** "Size mm²" → "size_mm2", " Signal-Class " → "signal_class". */
export function normaliseHeader(header: string): string {
  return header
    .trim()
    .toLowerCase()
    .replace(/²/g, '2')
    .replace(/[\s-]+/g, '_');
}

/** The field a header names without a mapping, or `ignore`. */
export function detectTarget(header: string): ColumnTarget {
  return ALIASES.get(normaliseHeader(header)) ?? IGNORE;
}

/** Identifies "a file with exactly these columns", for remembering the workshop's mapping. */
export function headerSignature(headers: readonly string[]): string {
  return createHash('sha256')
    .update(JSON.stringify(headers.map(normaliseHeader)))
    .digest('hex');
}

/**
 * Reads the optional `mapping` form field: a JSON object from column header to a field name or
 * "ignore". Its shape is checked here (a 400); headers it names that the file lacks are reported
 * with the file's other problems.
 */
export function parseMappingField(raw: unknown): Map<string, ColumnTarget> | null {
  if (raw === undefined || raw === null || raw === '') return null;
  if (typeof raw !== 'string') throw badRequest('mapping: send it once, as a JSON object');
  let parsed: unknown;
  try {
    parsed = JSON.parse(raw);
  } catch {
    throw badRequest('mapping: is not valid JSON');
  }
  if (typeof parsed !== 'object' || parsed === null || Array.isArray(parsed)) {
    throw badRequest('mapping: must be a JSON object from column header to field');
  }
  const mapping = new Map<string, ColumnTarget>();
  for (const [header, target] of Object.entries(parsed)) {
    if (typeof target !== 'string' || !TARGETS.has(target)) {
      throw badRequest(
        `mapping: "${String(header).slice(0, 60)}" must map to one of ${COLUMN_TARGETS.join(', ')}`,
      );
    }
    mapping.set(header, target as ColumnTarget);
  }
  if (mapping.size > 200) throw badRequest('mapping: too many columns');
  return mapping;
}

export interface ResolvedMapping {
  mapping: ColumnMapping[];
  source: ImportResult['mappingSource'];
  /** Column index of each field in use. */
  columnOf: Map<ImportField, number>;
  errors: ImportIssue[];
  notes: string[];
}

/**
 * The column → field choice for this file: what the client sent, else the workshop's saved choice
 * for these exact headers, else detection by header name. Checks the headers and the result.
 */
export function resolveMapping(
  headers: readonly string[],
  headerRow: number,
  given: Map<string, ColumnTarget> | null,
  saved: ColumnTarget[] | null,
): ResolvedMapping {
  const errors: ImportIssue[] = [];
  const notes: string[] = [];
  for (const header of headers) {
    if (FORBIDDEN.has(normaliseHeader(header))) {
      errors.push({
        row: headerRow,
        column: header,
        message: `"${header}" is not allowed as a column header. Rename or remove the column.`,
      });
    } else if (header.length > MAX_HEADER_LENGTH) {
      errors.push({
        row: headerRow,
        column: header,
        message: `A column header is longer than ${MAX_HEADER_LENGTH} characters.`,
      });
    } else if (CONTROL.test(header) || header.includes('\uFFFD')) {
      errors.push({
        row: headerRow,
        column: header,
        message: 'A column header holds a control character or a damaged character (�).',
      });
    }
  }
  if (given) {
    for (const header of given.keys()) {
      if (!headers.includes(header)) {
        errors.push({
          row: null,
          column: header,
          message: `The column choices name a column "${header}" that this file does not have.`,
        });
      }
    }
  }

  const usable = !given && saved && saved.length === headers.length ? saved : null;
  const source: ResolvedMapping['source'] = given ? 'given' : usable ? 'saved' : 'detected';
  const mapping: ColumnMapping[] = headers.map((header, i) => {
    const refused = errors.some((e) => e.row === headerRow && e.column === header);
    const target: ColumnTarget = refused
      ? IGNORE
      : (given?.get(header) ?? (usable ? usable[i]! : detectTarget(header)));
    return { header, target };
  });

  const columnOf = new Map<ImportField, number>();
  mapping.forEach(({ header, target }, i) => {
    if (target === IGNORE) return;
    if (headers.indexOf(header) !== i) {
      errors.push({
        row: headerRow,
        column: header,
        message: `Two columns are headed "${header}"; rename one so each column can be told apart.`,
      });
      return;
    }
    const first = columnOf.get(target);
    if (first !== undefined) {
      errors.push({
        row: headerRow,
        column: header,
        message: `Both "${headers[first]}" and "${header}" are set to ${IMPORT_FIELD_LABELS[target]}; choose one of them.`,
      });
      return;
    }
    columnOf.set(target, i);
  });

  if (!columnOf.has('cavity')) {
    errors.push({
      row: headerRow,
      column: null,
      message:
        'No column is set to Cavity. Head one column "cavity", or choose it in the column choices.',
    });
  }
  const unnamed = mapping.filter((m, i) => m.target === IGNORE && headers[i]!.trim() === '').length;
  const ignored = mapping
    .filter((m) => m.target === IGNORE && m.header.trim() !== '')
    .map((m) => `"${m.header}"`);
  if (ignored.length) {
    notes.push(
      `${ignored.length === 1 ? 'Column' : 'Columns'} ${ignored.join(', ')} ${ignored.length === 1 ? 'is' : 'are'} not imported.`,
    );
  }
  if (unnamed) {
    notes.push(
      `${unnamed} column${unnamed === 1 ? '' : 's'} without a header ${unnamed === 1 ? 'is' : 'are'} not imported.`,
    );
  }
  return { mapping, source, columnOf, errors, notes };
}
