import { z } from 'zod';
import { requiredText } from './common.schema.ts';
import { SystemVoltage } from './conversions.schema.ts';

export const PAPER_SIZES = ['A4', 'Letter'] as const;
export const SIZE_UNITS = ['mm2', 'awg'] as const;
export type PaperSize = (typeof PAPER_SIZES)[number];
export type SizeUnit = (typeof SIZE_UNITS)[number];
export const SIZE_UNIT_LABELS: Record<SizeUnit, string> = { mm2: 'mm²', awg: 'AWG' };

/** SAE J1128 insulation temperature ratings, °C: GPT 85, TWP 105, TXL/GXL/SXL 125. */
export const INSULATION_RATINGS_C = [60, 75, 80, 85, 90, 105, 125, 200] as const;

/** What each part of a feed may drop, volts (drop-budget.ts); each at most 2 V, a typo guard. */
export const DropAllowancesSchema = z.strictObject({
  fuseV: z.number().min(0).max(2),
  relayContactsV: z.number().min(0).max(2),
  perConnectionV: z.number().min(0).max(2),
  chassisReturnV: z.number().min(0).max(2),
});

export const WorkshopSettings = z.object({
  id: z.number(),
  name: z.string(),
  paperSize: z.enum(PAPER_SIZES),
  sizeUnit: z.enum(SIZE_UNITS),
  systemVoltage: z.number(),
  defaultInsulationC: z.number(),
  serviceAllowancePct: z.number(),
  dropAllowances: DropAllowancesSchema,
  version: z.number(),
});
export type WorkshopSettings = z.infer<typeof WorkshopSettings>;

export const UpdateWorkshopRequest = z.strictObject({
  name: requiredText(120).optional(),
  paperSize: z.enum(PAPER_SIZES).optional(),
  sizeUnit: z.enum(SIZE_UNITS).optional(),
  systemVoltage: SystemVoltage.optional(),
  defaultInsulationC: z
    .number()
    .refine((v) => (INSULATION_RATINGS_C as readonly number[]).includes(v), {
      message: `must be one of ${INSULATION_RATINGS_C.join(', ')}`,
    })
    .optional(),
  serviceAllowancePct: z.number().min(0).max(100).optional(),
  dropAllowances: DropAllowancesSchema.optional(),
  version: z.number().int().min(0),
});
export type UpdateWorkshopRequest = z.infer<typeof UpdateWorkshopRequest>;
