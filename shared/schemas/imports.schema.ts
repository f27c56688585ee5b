import { z } from 'zod';
import { csvColumns } from '../domain/fields/field-table.ts';
import { PIN_FIELDS } from '../domain/fields/pin-fields.ts';

/** The columns that say which pin a row is, before the pin's own fields. */
const IDENTITY_COLUMNS = [
  { header: 'connector', label: 'Connector' },
  { header: 'cavity', label: 'Cavity' },
] as const;

const PIN_CSV_COLUMNS = csvColumns(PIN_FIELDS);

/**
 * The columns a pinout CSV can carry, in the order Loomwright writes them: `connector`, `cavity`,
 * then each pin field's columns from the pin field table, so that export → import loses nothing.
 */
export const IMPORT_FIELDS: readonly string[] = [
  ...IDENTITY_COLUMNS.map((c) => c.header),
  ...PIN_CSV_COLUMNS.map((c) => c.column.header),
];
export type ImportField = string;

export const IMPORT_FIELD_LABELS: Readonly<Record<ImportField, string>> = Object.fromEntries([
  ...IDENTITY_COLUMNS.map((c) => [c.header, c.label]),
  ...PIN_CSV_COLUMNS.map((c) => [c.column.header, c.column.label]),
]);

/** What a column of the file is used for: one field, or nothing. */
export const IGNORE = 'ignore' as const;
export type ColumnTarget = ImportField | typeof IGNORE;
export const COLUMN_TARGETS = [...IMPORT_FIELDS, IGNORE] as const;

/** Headers recognised without a mapping (after lower-casing; spaces and hyphens read as `_`). */
export const HEADER_ALIASES: Readonly<Record<string, ImportField>> = Object.freeze(
  Object.fromEntries([
    ...IMPORT_FIELDS.map((f) => [f, f]),
    ...PIN_CSV_COLUMNS.flatMap((c) => (c.column.aliases ?? []).map((a) => [a, c.column.header])),
  ]),
);

/** Lines of the file in one page of a preview. */
export const PREVIEW_PAGE_ROWS = 200;

/** `?dryRun=1` previews (`page`: which page of the file's lines, from 1); anything else applies. */
export const ImportQuery = z.strictObject({
  dryRun: z
    .enum(['0', '1', 'true', 'false'])
    .optional()
    .transform((v) => v === '1' || v === 'true'),
  page: z
    .string()
    .regex(/^[1-9][0-9]{0,5}$/, 'must be a page number from 1')
    .optional()
    .transform((v) => (v === undefined ? 1 : Number(v))),
  /** The person confirmed the cavities the file adds to connectors that lack them. */
  grow: z
    .enum(['0', '1', 'true', 'false'])
    .optional()
    .transform((v) => v === '1' || v === 'true'),
  /** Applying only: the id of the person's own kept preview, sent instead of the file. */
  preview: z.uuid('must be the id of a preview').optional(),
});
export type ImportQuery = z.output<typeof ImportQuery>;

/** One problem in the file. `row` is the file's line number (1 = the header); null for the file. */
export interface ImportIssue {
  row: number | null;
  /** The header of the column, as written in the file; null for the row or the file as a whole. */
  column: string | null;
  message: string;
}

export interface FieldChange {
  /** Pin field name (`colour`, `sizeMm2`…) and its label. */
  field: string;
  label: string;
  before: string;
  after: string;
}

export type ImportChange =
  | { kind: 'add'; connector: string; cavity: string; row: number; fields: FieldChange[] }
  | {
      kind: 'change';
      connector: string;
      cavity: string;
      row: number;
      pinId: number;
      fields: FieldChange[];
    }
  | { kind: 'remove'; connector: string; cavity: string; pinId: number; blank: boolean };

export interface ImportSummary {
  added: number;
  changed: number;
  unchanged: number;
  removed: number;
}

/** Cavities a file adds to a connector that lacks them: the connector grows. */
export interface ConnectorGrowth {
  connector: string;
  /** Its cavities before the import. */
  cavityCount: number;
  /** The cavities the file adds, as written. */
  cavities: string[];
}

/** "adds cavity 14 to a 12-cavity connector" */
export function describeGrowth(g: ConnectorGrowth): string {
  const list =
    g.cavities.slice(0, 12).join(', ') +
    (g.cavities.length > 12 ? ` and ${g.cavities.length - 12} more` : '');
  return `${g.connector}: adds ${g.cavities.length === 1 ? 'cavity' : 'cavities'} ${list} to a ${g.cavityCount}-cavity connector`;
}

export interface ColumnMapping {
  header: string;
  target: ColumnTarget;
}

export interface ImportResult {
  dryRun: boolean;
  /** Data rows read (blank lines not counted). */
  rows: number;
  /** Rows written: 0 for a preview and for a refused file. */
  imported: number;
  errors: ImportIssue[];
  /** All errors found; `errors` lists at most the first 500. */
  errorCount: number;
  /** Every change, field by field: in a preview and a refusal. An applied import answers with
   * its summary alone (this is empty): the wizard has the preview's list already. */
  changes: ImportChange[];
  summary: ImportSummary;
  /** Connectors the file would give cavities they lack; applying needs `grow=1` then. */
  growth: ConnectorGrowth[];
  /** False when the file could not be read far enough to say what it would change. */
  planned: boolean;
  notes: string[];
  /** The file's columns in order and what each is used for. */
  mapping: ColumnMapping[];
  /** `saved`: the workshop's last choice for these exact columns; `detected`: by header name. */
  mappingSource: 'detected' | 'saved' | 'given';
  sha256: string | null;
  /** An earlier import of the same file (same SHA-256) into the same place. */
  previousImport: { at: string; by: string | null } | null;
  target: { conversionId: number; connectorId: number | null; label: string | null };
  /**
   * Preview only: one page of the file's lines as read, for showing problems in their cells. In a
   * preview, `errors` holds the problems of the file as a whole and of this page's lines, and
   * `changes` the changes of this page's lines and every removal; the counts and `summary` are
   * for the whole file.
   */
  table?: Array<{ row: number; cells: string[] }>;
  page?: PreviewPage;
  /**
   * Preview only: the id by which its maker may apply it (`?preview=`) instead of sending the file
   * again, while it is kept (the pin map unchanged, for 15 minutes).
   */
  previewId?: string;
}

export interface PreviewPage {
  /** From 1. */
  number: number;
  /** Pages of `PREVIEW_PAGE_ROWS` lines; at least 1. */
  count: number;
  size: number;
  /** Pages holding a line with a problem, in order (at most 100 listed). */
  withProblems: number[];
}

export const MAX_IMPORT_ERRORS_LISTED = 500;
/**
 * The most pin rows one file may hold. Twenty thousand is fifty full 400-cavity connectors, far
 * beyond any harness; the cap keeps checking a file to about a second of work
 * (docs/decisions/0005-pinout-import-and-file-storage.md).
 */
export const MAX_IMPORT_ROWS = 20_000;
