/**
 * The pin grid's columns as data: what each shows as text (to edit, copy and search), which pin
 * fields it owns, and whether it can be typed into. The React rendering lives in components/.
 */
import { DISPOSITION_INFO, DISPOSITIONS } from '#shared/domain/dispositions.ts';
import { SIGNAL_CLASS_LABELS, SIGNAL_CLASSES } from '#shared/domain/signal-classes.ts';
import { editableWireSize } from '#shared/domain/wire-sizes.ts';
import type { PinFields } from '#shared/schemas/pin-map.schema.ts';
import type { SizeUnit } from '#shared/schemas/workshop.schema.ts';
import type { EditableColumnId } from './cell-values.ts';
import type { PinRow } from './rows.ts';

export const PIN_COLUMNS = [
  'connector',
  'cavity',
  'function',
  'signalClass',
  'colour',
  'size',
  'insulation',
  'disposition',
  'destination',
  'runLength',
  'load',
  'notes',
] as const;
export type PinColumnId = (typeof PIN_COLUMNS)[number];

/** The row-selection checkbox column: navigable, never edited, never pasted into. */
export const SELECT_COLUMN = 'select';
export type GridColumnId = PinColumnId | typeof SELECT_COLUMN;

export const isPinColumn = (id: string): id is PinColumnId =>
  (PIN_COLUMNS as readonly string[]).includes(id);

export function columnHeader(id: PinColumnId, unit: SizeUnit): string {
  switch (id) {
    case 'connector':
      return 'Connector';
    case 'cavity':
      return 'Cavity';
    case 'function':
      return 'Function';
    case 'signalClass':
      return 'Signal class';
    case 'colour':
      return 'Colour';
    case 'size':
      return unit === 'awg' ? 'Size AWG' : 'Size mm²';
    case 'insulation':
      return 'Insul. °C';
    case 'disposition':
      return 'Disposition';
    case 'destination':
      return 'Destination';
    case 'runLength':
      return 'Run m';
    case 'load':
      return 'Load A';
    case 'notes':
      return 'Notes';
  }
}

/** The fields a column owns: what fill down copies and undo restores. */
export const COLUMN_FIELDS: Record<EditableColumnId, Array<keyof PinFields>> = {
  function: ['function'],
  signalClass: ['signalClass'],
  colour: ['colour'],
  size: ['sizeMm2'],
  insulation: ['insulationRatingC'],
  disposition: ['disposition'],
  destination: ['destination', 'destinationPinId', 'destinationFeedId'],
  runLength: ['runLengthM'],
  load: ['loadCurrentA'],
  notes: ['notes'],
};

/** Columns that Delete empties; disposition and signal class always hold a choice. */
export const CLEARABLE_COLUMNS: ReadonlySet<PinColumnId> = new Set([
  'function',
  'colour',
  'size',
  'insulation',
  'destination',
  'runLength',
  'load',
  'notes',
]);

const numberText = (n: number | null) => (n == null ? '' : String(n));

/**
 * A cell as text, in the form its parser reads back: what the editor starts from, what copy puts
 * on the clipboard and what the free-text filter searches.
 */
export function cellText(row: PinRow, id: PinColumnId, unit: SizeUnit): string {
  const { pin } = row;
  switch (id) {
    case 'connector':
      return row.connectorLabel;
    case 'cavity':
      return pin.cavity;
    case 'function':
      return pin.function;
    case 'signalClass':
      return pin.signalClass === 'none' ? '' : SIGNAL_CLASS_LABELS[pin.signalClass];
    case 'colour':
      return pin.colour;
    case 'size':
      return editableWireSize(pin.sizeMm2, unit);
    case 'insulation':
      return numberText(pin.insulationRatingC);
    case 'disposition':
      return DISPOSITION_INFO[pin.disposition].label;
    case 'destination':
      return row.linkedDestination || pin.destination;
    case 'runLength':
      return numberText(pin.runLengthM);
    case 'load':
      return numberText(pin.loadCurrentA);
    case 'notes':
      return pin.notes;
  }
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
    default:
      return cellText(row, id, 'mm2');
  }
}
