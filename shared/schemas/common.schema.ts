import { z } from 'zod';

/** A database id in a URL: digits only, no leading zero. */
export const IdParam = z
  .string()
  .regex(/^[1-9][0-9]{0,15}$/, 'must be a positive whole number')
  .transform(Number);

export const IdParams = z.strictObject({ id: IdParam });

/** The one error shape every API error takes. */
export interface ApiErrorBody {
  error: {
    code: string;
    message: string;
    details?: unknown;
  };
}

export interface FieldIssue {
  field: string;
  message: string;
}

/** Trimmed text with a length cap; empty strings are refused rather than stored. */
export const requiredText = (max: number) => z.string().trim().min(1, 'is required').max(max);
export const optionalText = (max: number) => z.string().trim().max(max);
export type IdParams = z.output<typeof IdParams>;
