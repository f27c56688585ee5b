import { z } from 'zod';
import type { BenchNotice } from './bench.schema.ts';
import { noteText, requiredText } from './common.schema.ts';

export const SYSTEM_VOLTAGES = [12, 24] as const;
export const SystemVoltage = z.union([z.literal(12), z.literal(24)], {
  error: 'must be 12 or 24',
});

export const CreateConversionRequest = z.strictObject({
  name: requiredText(120),
  donorEngine: requiredText(120),
  receivingVehicle: requiredText(120),
  systemVoltage: SystemVoltage,
  notes: noteText(4000).optional(),
});
export type CreateConversionRequest = z.infer<typeof CreateConversionRequest>;

export const UpdateConversionRequest = z.strictObject({
  name: requiredText(120).optional(),
  donorEngine: requiredText(120).optional(),
  receivingVehicle: requiredText(120).optional(),
  systemVoltage: SystemVoltage.optional(),
  notes: noteText(4000).optional(),
  version: z.number().int().min(0),
});
export type UpdateConversionRequest = z.infer<typeof UpdateConversionRequest>;

export const Conversion = z.object({
  id: z.number(),
  name: z.string(),
  donorEngine: z.string(),
  receivingVehicle: z.string(),
  systemVoltage: z.number(),
  notes: z.string(),
  createdBy: z.object({ id: z.number(), name: z.string() }).nullable(),
  version: z.number(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Conversion = z.infer<typeof Conversion>;

/** A row of the conversions list: the conversion and what its bench has to know. */
export type ConversionListItem = Conversion & { bench: BenchNotice | null };
