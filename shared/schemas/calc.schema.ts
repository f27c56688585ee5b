import { z } from 'zod';
import {
  exactIsoSize,
  ISO_6722_SIZES_MM2,
  isAwgGauge,
  parseAwgGauge,
} from '../domain/wire-sizes.ts';
import { FUSE_TYPES, RETURN_PATHS, WIRE_ZONES } from './feeds.schema.ts';
import { InsulationRatingSchema } from './pin-map.schema.ts';

/**
 * Low-voltage DC only: 60 V is the usual upper limit of voltage class A for road vehicles
 * (ISO 6469-3, from memory). 12 and 24 V are the common cases, but 48 V systems and a 14.4 V
 * charging voltage are fair inputs for a drop calculation, so any positive voltage up to 60 is
 * accepted.
 */
export const MAX_CALC_SYSTEM_V = 60;
/**
 * Blade fuses stop at 40 A, but breakers and bolt-down fuses come in other ratings, so any positive
 * rating is checked against the wire; the cap only refuses typos.
 */
export const MAX_CALC_FUSE_A = 500;
export const MAX_DROP_LIMIT_PCT = 50;

const positive = (max: number) =>
  z.number().positive('must be greater than 0').max(max, `must be at most ${max}`);

/** A metric size in the ISO 6722 series, normalised to the series value. */
export const CalcSizeMm2Schema = z
  .number()
  .positive('must be greater than 0')
  .transform((value, ctx) => {
    const size = exactIsoSize(value);
    if (size === null) {
      ctx.addIssue({
        code: 'custom',
        message: `must be an ISO 6722 size (${ISO_6722_SIZES_MM2.join(', ')} mm²)`,
      });
      return z.NEVER;
    }
    return size;
  });

/** An AWG gauge 4/0…30 as a number (0, −1, −2, −3 for 1/0…4/0) or as written ("18", "4/0"). */
export const CalcAwgSchema = z.union([z.number(), z.string().max(12)]).transform((value, ctx) => {
  const gauge =
    typeof value === 'number' ? (isAwgGauge(value) ? value : null) : parseAwgGauge(value);
  if (gauge === null) {
    ctx.addIssue({ code: 'custom', message: 'must be an AWG size from 4/0 to 30' });
    return z.NEVER;
  }
  return gauge;
});

/** One circuit for the stateless calculator: load, run and wire, with optional fuse and limit. */
export const CalcRequest = z
  .strictObject({
    currentA: positive(1000),
    /** One-way run length, m. */
    lengthM: positive(1000),
    systemV: positive(MAX_CALC_SYSTEM_V),
    sizeMm2: CalcSizeMm2Schema.optional(),
    awg: CalcAwgSchema.optional(),
    returnPath: z.enum(RETURN_PATHS),
    /**
     * Air around the wire, °C. Not given: the ambient Table 5 assumes for the zone (30 °C outside
     * the engine bay, 50 °C in it), as the checks take it.
     */
    ambientC: z.number().min(-40).max(150).optional(),
    /** Conductor temperature, °C, when measured; not given, it is estimated from the load. */
    conductorTempC: z.number().min(-40).max(250).optional(),
    /** For an AWG size: work resistance from the SAE J1128 minimum area (default) or the nominal. */
    awgAreaBasis: z.enum(['sae-j1128-min', 'astm-b258-nominal']).default('sae-j1128-min'),
    /** The fuse's family, for the ratings a recommendation picks from. */
    fuseType: z.enum(FUSE_TYPES).default('standard_blade'),
    insulationRatingC: InsulationRatingSchema.unwrap().default(105),
    zone: z.enum(WIRE_ZONES).default('cabin'),
    /**
     * Conductors in the bundle, this one included. Three or more applies the bundle factors of
     * 33 CFR 183.435 (a conservative choice below 50 V); 1 leaves them off.
     */
    bundled: z.number().int('must be a whole number').min(1).max(500).default(1),
    fuseA: positive(MAX_CALC_FUSE_A).optional(),
    dropLimitPct: positive(MAX_DROP_LIMIT_PCT).optional(),
  })
  .superRefine((v, ctx) => {
    const hasSize = v.sizeMm2 !== undefined;
    const hasAwg = v.awg !== undefined;
    if (hasSize && hasAwg) {
      ctx.addIssue({ code: 'custom', path: ['awg'], message: 'give sizeMm2 or awg, not both' });
    }
    if (!hasSize && !hasAwg) {
      ctx.addIssue({ code: 'custom', path: ['sizeMm2'], message: 'give sizeMm2 or awg' });
    }
  });
export type CalcRequest = z.output<typeof CalcRequest>;
export type CalcRequestInput = z.input<typeof CalcRequest>;
