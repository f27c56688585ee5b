/**
 * Schemas of the values a wire carries, shared by pins, feeds and the field tables built on them.
 */
import { z } from 'zod';
import { DISPOSITIONS } from '../domain/dispositions.ts';
import { SIGNAL_CLASSES } from '../domain/signal-classes.ts';
import { parseWireColour } from '../domain/wire-colours.ts';
import { acceptedWireSize } from '../domain/wire-sizes.ts';
import { INSULATION_RATINGS_C } from './workshop.schema.ts';

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

/**
 * A conductor area in mm², one of the accepted sizes (an ISO 6722 size or the stored area of an AWG
 * size); an area within 1 % of one is read as that size. Null when not recorded.
 */
export const WireSizeMm2Schema = z
  .number()
  .positive()
  .max(120)
  .refine((v) => acceptedWireSize(v) !== null, {
    message: 'must be an ISO 6722 size in mm² or the area of an AWG size',
  })
  .transform((v) => acceptedWireSize(v)!)
  .nullable();

export const InsulationRatingSchema = z
  .number()
  .refine((v) => (INSULATION_RATINGS_C as readonly number[]).includes(v), {
    message: `must be one of ${INSULATION_RATINGS_C.join(', ')} °C`,
  })
  .nullable();
