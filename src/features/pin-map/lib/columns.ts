/**
 * The pin grid's columns as data: what each shows as text (to edit, copy and search), which pin
 * fields it owns, and whether it can be typed into. The React rendering lives in components/.
 */
import { DISPOSITIONS } from '#shared/domain/dispositions.ts';
import { SIGNAL_CLASSES } from '#shared/domain/signal-classes.ts';
import {
  fieldColumns,
  type FieldSpec,
  type GridColumnOf,
} from '#shared/domain/fields/field-table.ts';
import { PIN_FIELDS } from '#shared/domain/fields/pin-fields.ts';
import type { PinFields } from '#shared/schemas/pin-map.schema.ts';
import type { SizeUnit } from '#shared/schemas/workshop.schema.ts';
import type { EditableColumnId } from './cell-values.ts';
import type { PinRow } from './rows.ts';

const FIELD_COLUMNS = fieldColumns(PIN_FIELDS) as Array<
  GridColumnOf<PinFields> & { id: EditableColumnId }
>;
const FIELD_COLUMN = new Map(FIELD_COLUMNS.map((c) => [c.id, c]));

/** Which pin a row is; shown in every grid, never typed into. */
const IDENTITY_COLUMNS = ['connector', 'cavity'] as const;

export const PIN_COLUMNS: ReadonlyArray<PinColumnId> = [
  ...IDENTITY_COLUMNS,
  ...FIELD_COLUMNS.map((c) => c.id),
];
export type PinColumnId = (typeof IDENTITY_COLUMNS)[number] | EditableColumnId;

/** The row-selection checkbox column: navigable, never edited, never pasted into. */
export const SELECT_COLUMN = 'select';
export type GridColumnId = PinColumnId | typeof SELECT_COLUMN;

export const isPinColumn = (id: string): id is PinColumnId =>
  (PIN_COLUMNS as readonly string[]).includes(id);

export function columnHeader(id: PinColumnId, unit: SizeUnit): string {
  if (id === 'connector') return 'Connector';
  if (id === 'cavity') return 'Cavity';
  const heading = FIELD_COLUMN.get(id)!.heading;
  return typeof heading === 'string' ? heading : heading(unit);
}

/** The fields a column owns: what fill down copies and undo restores. */
export const COLUMN_FIELDS = Object.fromEntries(
  FIELD_COLUMNS.map((c) => [c.id, c.fields]),
) as Record<EditableColumnId, Array<keyof PinFields>>;

/** Columns that Delete empties; a column whose fields have no empty value (a choice) keeps it. */
export const CLEARABLE_COLUMNS: ReadonlySet<PinColumnId> = new Set(
  FIELD_COLUMNS.filter((c) => c.fields.every((f) => isEmpty(PIN_FIELDS[f].blank))).map((c) => c.id),
);

function isEmpty(value: unknown): boolean {
  return value === null || value === '';
}

/**
 * A cell as text, in the form its parser reads back: what the editor starts from, what copy puts
 * on the clipboard and what the free-text filter searches.
 */
export function cellText(row: PinRow, id: PinColumnId, unit: SizeUnit): string {
  const { pin } = row;
  if (id === 'connector') return row.connectorLabel;
  if (id === 'cavity') return pin.cavity;
  if (id === 'destination') return row.linkedDestination || pin.destination;
  const [key] = COLUMN_FIELDS[id] as [keyof PinFields];
  const spec = PIN_FIELDS[key] as FieldSpec<PinFields[typeof key]>;
  return spec.format(pin[key], unit);
}

const DISPOSITION_ORDER = new Map(DISPOSITIONS.map((d, i) => [d, i]));
const SIGNAL_CLASS_ORDER = new Map(SIGNAL_CLASSES.map((s, i) => [s, i]));

/** The value a column sorts by: numbers for numbers, the choice order for choices. */
export function sortValue(row: PinRow, id: PinColumnId): string | number | undefined {
  const { pin } = row;
  switch (id) {
    case 'signalClass':
      return SIGNAL_CLASS_ORDER.get(pin.signalClass);
    case 'disposition':
      return DISPOSITION_ORDER.get(pin.disposition);
    case 'size':
      return pin.sizeMm2 ?? undefined;
    case 'insulation':
      return pin.insulationRatingC ?? undefined;
    case 'runLength':
      return pin.runLengthM ?? undefined;
    case 'load':
      return pin.loadCurrentA ?? undefined;
    case 'driverRated':
      return pin.driverRatedA ?? undefined;
    case 'pulsesPerRev':
      return pin.pulsesPerRev ?? undefined;
    case 'termination':
      return pin.terminationOhm ?? undefined;
    default:
      return cellText(row, id, 'mm2');
  }
}
