import { z } from 'zod';

/**
 * The columns a pinout CSV can carry, in the order Loomwright writes them. The first nine after
 * `connector` are the canonical pinout headers; `insulation_c`, `feed`, `run_length_m` and
 * `load_current_a` carry the rest of a pin so that export → import loses nothing.
 */
export const IMPORT_FIELDS = [
  'connector',
  'cavity',
  'function',
  'signal_class',
  'colour',
  'size_mm2',
  'awg',
  'insulation_c',
  'disposition',
  'destination',
  'feed',
  'run_length_m',
  'load_current_a',
  'notes',
] as const;
export type ImportField = (typeof IMPORT_FIELDS)[number];

export const IMPORT_FIELD_LABELS: Record<ImportField, string> = {
  connector: 'Connector',
  cavity: 'Cavity',
  function: 'Function',
  signal_class: 'Signal class',
  colour: 'Wire colour (IEC 60757)',
  size_mm2: 'Wire size, mm²',
  awg: 'Wire size, AWG',
  insulation_c: 'Insulation rating, °C',
  disposition: 'Disposition',
  destination: 'Destination',
  feed: 'Joined to feed',
  run_length_m: 'Run length, m',
  load_current_a: 'Load current, A',
  notes: 'Notes',
};

/** What a column of the file is used for: one field, or nothing. */
export const IGNORE = 'ignore' as const;
export type ColumnTarget = ImportField | typeof IGNORE;
export const COLUMN_TARGETS = [...IMPORT_FIELDS, IGNORE] as const;

/** Headers recognised without a mapping (after lower-casing; spaces and hyphens read as `_`). */
export const HEADER_ALIASES: Readonly<Record<string, ImportField>> = Object.freeze({
  ...Object.fromEntries(IMPORT_FIELDS.map((f) => [f, f])),
  color: 'colour',
});

/** `?dryRun=1` previews; anything else applies. */
export const ImportQuery = z.strictObject({
  dryRun: z
    .enum(['0', '1', 'true', 'false'])
    .optional()
    .transform((v) => v === '1' || v === 'true'),
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
  changes: ImportChange[];
  summary: ImportSummary;
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
  /** Preview only: the file's rows as read, for showing errors in their cells. */
  table?: Array<{ row: number; cells: string[] }>;
  tableTruncated?: boolean;
}

export const MAX_IMPORT_ERRORS_LISTED = 500;
