import { z } from 'zod';
import { blankRecord, fieldKeys, fieldShape } from '../domain/fields/field-table.ts';
import { PIN_FIELDS, type PinValues } from '../domain/fields/pin-fields.ts';
import { labelKey } from '../domain/labels.ts';
import { noteText, requiredText } from './common.schema.ts';

export const CONNECTOR_SIDES = ['ecu', 'engine', 'vehicle', 'other'] as const;
export type ConnectorSide = (typeof CONNECTOR_SIDES)[number];
export const CONNECTOR_SIDE_LABELS: Record<ConnectorSide, string> = {
  ecu: 'ECU side',
  engine: 'Engine side',
  vehicle: 'Vehicle side',
  other: 'Other',
};

export const MAX_CAVITIES = 400;
export const MAX_BULK_PINS = 5000;

// ---------- pin fields: built from the pin field table (shared/domain/fields/pin-fields.ts) ----------

export {
  DispositionSchema,
  InsulationRatingSchema,
  SignalClassSchema,
  WireColourSchema,
  WireSizeMm2Schema,
} from './wire-fields.schema.ts';

export const PinFields = z.strictObject(fieldShape(PIN_FIELDS));
export type PinFields = PinValues;
export const PIN_FIELD_NAMES = fieldKeys(PIN_FIELDS);

/** What a new cavity holds: nothing anyone entered. */
export const BLANK_PIN_VALUES: PinFields = blankRecord(PIN_FIELDS);

/** Whether a pin holds anything a person entered (so removing its cavity would lose work). */
export function pinHoldsData(pin: PinFields): boolean {
  return PIN_FIELD_NAMES.some((key) => pin[key] !== BLANK_PIN_VALUES[key]);
}

const atLeastOne = (v: object) => Object.keys(v).length > 0;

export const PinChanges = PinFields.partial().refine(
  atLeastOne,
  'give at least one field to change',
);
export type PinChanges = z.infer<typeof PinChanges>;

export const UpdatePinRequest = PinFields.partial()
  .extend({ version: z.number().int().min(0) })
  .refine((v) => Object.keys(v).length > 1, 'give at least one field to change');
export type UpdatePinRequest = z.infer<typeof UpdatePinRequest>;

export const BulkPinRequest = z.strictObject({
  pinIds: z.array(z.number().int().positive()).min(1).max(MAX_BULK_PINS),
  set: PinChanges,
});
export type BulkPinRequest = z.infer<typeof BulkPinRequest>;

/** Several pins changed at once, each against the version the client read (paste, fill down, undo). */
export const BatchPinRequest = z.strictObject({
  changes: z
    .array(
      z.strictObject({
        id: z.number().int().positive(),
        version: z.number().int().min(0),
        set: PinChanges,
      }),
    )
    .min(1)
    .max(MAX_BULK_PINS),
});
export type BatchPinRequest = z.infer<typeof BatchPinRequest>;

// ---------- connectors ----------

const layoutCount = z.number().int().min(1).max(MAX_CAVITIES);

export const CreateConnectorRequest = z
  .strictObject({
    label: requiredText(40),
    side: z.enum(CONNECTOR_SIDES),
    cavityCount: z.number().int().min(1).max(MAX_CAVITIES),
    rows: layoutCount.optional(),
    columns: layoutCount.optional(),
    notes: noteText(2000).optional(),
    /** Cavity labels in face order ("A1", "B12"…); "1" to N when omitted. */
    cavityLabels: z.array(requiredText(8)).optional(),
  })
  .refine((v) => !v.rows || !v.columns || v.rows * v.columns >= v.cavityCount, {
    message: 'rows × columns must hold every cavity',
    path: ['rows'],
  })
  .refine((v) => !v.cavityLabels || v.cavityLabels.length === v.cavityCount, {
    message: 'give one label per cavity',
    path: ['cavityLabels'],
  })
  .refine(
    (v) => !v.cavityLabels || new Set(v.cavityLabels.map(labelKey)).size === v.cavityLabels.length,
    {
      message: 'cavity labels must be unique and read differently',
      path: ['cavityLabels'],
    },
  );
export type CreateConnectorRequest = z.infer<typeof CreateConnectorRequest>;

export const UpdateConnectorRequest = z.strictObject({
  label: requiredText(40).optional(),
  side: z.enum(CONNECTOR_SIDES).optional(),
  cavityCount: z.number().int().min(1).max(MAX_CAVITIES).optional(),
  rows: layoutCount.optional(),
  columns: layoutCount.optional(),
  notes: noteText(2000).optional(),
  version: z.number().int().min(0),
});
export type UpdateConnectorRequest = z.infer<typeof UpdateConnectorRequest>;

// ---------- responses ----------

export interface Pin extends PinFields {
  id: number;
  connectorId: number;
  conversionId: number;
  cavity: string;
  /** Order on the connector face, 0-based, row by row. */
  position: number;
  version: number;
  updatedAt: string;
}

export interface Connector {
  id: number;
  conversionId: number;
  label: string;
  side: ConnectorSide;
  cavityCount: number;
  rows: number;
  columns: number;
  notes: string;
  version: number;
}

/** The face layout to use when none is given: one row up to 12 cavities, two up to 48. */
export function defaultFaceLayout(cavityCount: number): { rows: number; columns: number } {
  const rows = cavityCount <= 12 ? 1 : cavityCount <= 48 ? 2 : Math.ceil(cavityCount / 24);
  return { rows, columns: Math.ceil(cavityCount / rows) };
}
