/**
 * A field table: every field a person sets on a record (a pin, later a wire), written once with its
 * label, CSV columns, schema and text form. Grids, CSV import and export, import plans, revision
 * differences and blank records are derived from it instead of listing the fields again.
 *
 * The rule each field keeps: `parse(format(v, unit), unit)` gives `v` back for every value its
 * schema accepts, in either size unit, so text shown in an editor and committed unchanged never
 * changes saved data.
 */
import { z } from 'zod';
import type { SizeUnit } from '../../schemas/workshop.schema.ts';

export type FieldParse<T> = { ok: true; value: T } | { ok: false; error: string };

export const parsed = <T>(value: T): FieldParse<T> => ({ ok: true, value });
export const refused = <T = never>(error: string): FieldParse<T> => ({ ok: false, error });

/** A column of a CSV file that carries a field. */
export interface CsvColumn<T> {
  /** The header Loomwright writes and recognises. */
  header: string;
  /** What the column is for, in the column choices and in errors. */
  label: string;
  /** Other headers that name it ("color"). */
  aliases?: readonly string[];
  /** The cell as written out; the field's `format` in mm² when omitted. */
  write?: (value: T) => string | number | null;
  /** A cell as read in; the field's `parse` in mm² when omitted. */
  read?: (text: string) => FieldParse<T>;
  /** The cell names a linked record rather than holding the value: resolved by the import plan. */
  names?: 'pin' | 'feed';
}

/** The grid column a field shows in. */
export interface FieldColumn {
  id: string;
  heading: string | ((unit: SizeUnit) => string);
}

export interface FieldSpec<T> {
  /** What a person calls it: in import plans and revision differences. */
  label: string;
  /** The contract: what the API accepts for this field. */
  schema: z.ZodType<T, unknown>;
  /** The value of a record nobody has filled in. */
  blank: T;
  /** Text as typed (in the workshop's size unit) into the value, or why not. */
  parse: (text: string, unit: SizeUnit) => FieldParse<T>;
  /** The value as editable text that `parse` reads back to the same value. */
  format: (value: T, unit: SizeUnit) => string;
  /** The value as shown beside other values, with its unit ("105 °C"); `format` when omitted. */
  show?: (value: T, unit: SizeUnit) => string;
  /** The columns of a CSV file that carry it; none when it travels inside another's column. */
  csv: readonly CsvColumn<T>[];
  /** The grid column that shows and edits it; several fields may share one (a destination). */
  column: FieldColumn | null;
  /**
   * Kept when a record is saved as a reusable template (a connector's pinout in the library): a
   * property of the part itself, not of one conversion's wiring.
   */
  inTemplate?: boolean;
}

/** A record's fields in order, one spec per key. */
export type FieldTable<R> = { readonly [K in keyof R]: FieldSpec<R[K]> };

/** One field of a table; keeps its column id as a literal type, so grids can name columns safely. */
export const field = <T, const C extends FieldColumn | null, const L extends boolean = false>(
  spec: FieldSpec<T> & { column: C; inTemplate?: L },
): FieldSpec<T> & { column: C; inTemplate?: L } => spec;

/** The keys of the fields a template keeps. */
export type TemplateKeyOf<Table> = {
  [K in keyof Table]: Table[K] extends { inTemplate?: true } ? K : never;
}[keyof Table];

/** The keys of the fields a template keeps, in table order. */
export function templateKeys<R>(table: FieldTable<R>): Array<keyof R & string> {
  return fieldKeys(table).filter((k) => table[k].inTemplate === true);
}

/** The ids of the grid columns a table's fields show in. */
export type ColumnIdOf<Table> = {
  [K in keyof Table]: Table[K] extends { column: infer C }
    ? C extends { id: infer I }
      ? I
      : never
    : never;
}[keyof Table];

export function fieldKeys<R>(table: FieldTable<R>): Array<keyof R & string> {
  return Object.keys(table) as Array<keyof R & string>;
}

export function fieldSpecs<R>(table: FieldTable<R>): Array<FieldSpec<R[keyof R]>> {
  return fieldKeys(table).map((k) => table[k] as FieldSpec<R[keyof R]>);
}

/** The record's zod shape: the strict object the API validates is built from it. */
export function fieldShape<R>(table: FieldTable<R>): { [K in keyof R]: z.ZodType<R[K], unknown> } {
  return Object.fromEntries(fieldKeys(table).map((k) => [k, table[k].schema])) as {
    [K in keyof R]: z.ZodType<R[K], unknown>;
  };
}

/** A record nobody has filled in. */
export function blankRecord<R>(table: FieldTable<R>): R {
  return Object.fromEntries(fieldKeys(table).map((k) => [k, table[k].blank])) as R;
}

/** Labels by key, for lists of changes. */
export function fieldLabels<R>(table: FieldTable<R>): Record<keyof R & string, string> {
  return Object.fromEntries(fieldKeys(table).map((k) => [k, table[k].label])) as Record<
    keyof R & string,
    string
  >;
}

/** A value as shown beside others (with its unit); '' for an empty one. */
export function showField<R, K extends keyof R>(
  table: FieldTable<R>,
  key: K,
  value: R[K],
  unit: SizeUnit,
): string {
  const spec = table[key];
  return (spec.show ?? spec.format)(value, unit);
}

export interface GridColumnOf<R> {
  id: string;
  heading: FieldColumn['heading'];
  /** The fields the column shows and edits: what fill down copies and undo restores. */
  fields: Array<keyof R & string>;
}

/** The grid columns of a table in field order, each with the fields it owns. */
export function fieldColumns<R>(table: FieldTable<R>): Array<GridColumnOf<R>> {
  const columns: Array<GridColumnOf<R>> = [];
  for (const key of fieldKeys(table)) {
    const column = table[key].column;
    if (column === null) continue;
    const existing = columns.find((c) => c.id === column.id);
    if (existing) existing.fields.push(key);
    else columns.push({ id: column.id, heading: column.heading, fields: [key] });
  }
  return columns;
}

/** The CSV columns of a table in field order, each with the field it carries. */
export function csvColumns<R>(
  table: FieldTable<R>,
): Array<{ key: keyof R & string; column: CsvColumn<R[keyof R]> }> {
  return fieldKeys(table).flatMap((key) =>
    (table[key].csv as readonly CsvColumn<R[keyof R]>[]).map((column) => ({ key, column })),
  );
}
