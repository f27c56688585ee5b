import { z } from 'zod';
import { DISPOSITIONS } from '../domain/dispositions.ts';
import { SIGNAL_CLASSES } from '../domain/signal-classes.ts';
import { parseWireColour } from '../domain/wire-colours.ts';
import { exactAwg, exactIsoSize } from '../domain/wire-sizes.ts';
import { optionalText, requiredText } from './common.schema.ts';
import { INSULATION_RATINGS_C } from './workshop.schema.ts';

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

// ---------- field schemas, shared by single, bulk and batch edits ----------

export const DispositionSchema = z.enum(DISPOSITIONS);
export const SignalClassSchema = z.enum(SIGNAL_CLASSES);

/** '' (not recorded) or an IEC 60757 colour, normalised to "BU/WH". */
export const WireColourSchema = z
  .string()
  .max(20)
  .transform((value, ctx) => {
    if (value.trim() === '') return '';
    const parsed = parseWireColour(value);
    if (!parsed.ok) {
      ctx.addIssue({ code: 'custom', message: parsed.error });
      return z.NEVER;
    }
    return parsed.value;
  });

/** A conductor area in mm² that is an ISO 6722 size or an AWG size; null when not recorded. */
export const WireSizeMm2Schema = z
  .number()
  .positive()
  .max(120)
  .refine((v) => exactIsoSize(v) !== null || exactAwg(v) !== null, {
    message: 'must be an ISO 6722 size in mm² or the area of an AWG size',
  })
  .nullable();

export const InsulationRatingSchema = z
  .number()
  .refine((v) => (INSULATION_RATINGS_C as readonly number[]).includes(v), {
    message: `must be one of ${INSULATION_RATINGS_C.join(', ')} °C`,
  })
  .nullable();

export const PinFields = z.strictObject({
  function: optionalText(200),
  signalClass: SignalClassSchema,
  colour: WireColourSchema,
  sizeMm2: WireSizeMm2Schema,
  insulationRatingC: InsulationRatingSchema,
  disposition: DispositionSchema,
  destination: optionalText(200),
  /** A cavity of a vehicle-side connector of the same conversion. */
  destinationPinId: z.number().int().positive().nullable(),
  /** A new fused feed of the same conversion this pin is joined to. */
  destinationFeedId: z.number().int().positive().nullable(),
  runLengthM: z.number().min(0).max(100).nullable(),
  loadCurrentA: z.number().min(0).max(200).nullable(),
  notes: optionalText(2000),
});
export type PinFields = z.infer<typeof PinFields>;
export const PIN_FIELD_NAMES = Object.keys(PinFields.shape) as Array<keyof PinFields>;

/** What a new cavity holds: nothing anyone entered. */
export const BLANK_PIN_VALUES: PinFields = {
  function: '',
  signalClass: 'none',
  colour: '',
  sizeMm2: null,
  insulationRatingC: null,
  disposition: 'undecided',
  destination: '',
  destinationPinId: null,
  destinationFeedId: null,
  runLengthM: null,
  loadCurrentA: null,
  notes: '',
};

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
    notes: optionalText(2000).optional(),
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
  .refine((v) => !v.cavityLabels || new Set(v.cavityLabels).size === v.cavityLabels.length, {
    message: 'cavity labels must be unique',
    path: ['cavityLabels'],
  });
export type CreateConnectorRequest = z.infer<typeof CreateConnectorRequest>;

export const UpdateConnectorRequest = z.strictObject({
  label: requiredText(40).optional(),
  side: z.enum(CONNECTOR_SIDES).optional(),
  cavityCount: z.number().int().min(1).max(MAX_CAVITIES).optional(),
  rows: layoutCount.optional(),
  columns: layoutCount.optional(),
  notes: optionalText(2000).optional(),
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
