import { z } from 'zod';
import type { BenchNotice } from './bench.schema.ts';
import { noteText, requiredText } from './common.schema.ts';
import type { RevisionStatus } from './revisions.schema.ts';

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

/** Where a conversion stands: its latest revision's status, or a draft before any submission. */
export const CONVERSION_STATES = ['draft', 'in_review', 'changes_requested', 'signed_off'] as const;
export type ConversionState = (typeof CONVERSION_STATES)[number];
export const CONVERSION_STATE_LABELS: Record<ConversionState, string> = {
  draft: 'Draft',
  in_review: 'In review',
  changes_requested: 'Changes asked',
  signed_off: 'Signed off',
};

/** A row of the conversions list: the conversion, where it stands and what its bench has to know. */
export type ConversionListItem = Conversion & {
  state: ConversionState;
  latestRevision: { number: number; status: RevisionStatus; submittedBy: string } | null;
  /** The latest change to the conversion, its connectors, pins, feeds, revisions or bench. */
  lastChangeAt: string;
  /** In review, submitted by someone else, and the reader may sign it off. */
  waitingForYou: boolean;
  bench: BenchNotice | null;
};
