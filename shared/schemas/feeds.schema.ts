import { z } from 'zod';
import { IdParam, noteText, optionalText, requiredText } from './common.schema.ts';
import { FUSE_TYPES, type FuseType } from '../domain/electrical/fuses.ts';
import { LOAD_KINDS, type LoadKind } from '../domain/electrical/relays.ts';
import { InsulationRatingSchema, WireColourSchema, WireSizeMm2Schema } from './pin-map.schema.ts';

export { FUSE_TYPES, LOAD_KINDS, type FuseType, type LoadKind };

/** Where a new feed takes its power from. */
export const FEED_SOURCES = ['battery', 'ignition', 'relay_output'] as const;
export type FeedSource = (typeof FEED_SOURCES)[number];
export const FEED_SOURCE_LABELS: Record<FeedSource, string> = {
  battery: 'Battery, constant',
  ignition: 'Ignition switched',
  relay_output: 'Relay output of another feed',
};

export const WIRE_ZONES = ['cabin', 'engine_bay'] as const;
export type WireZone = (typeof WIRE_ZONES)[number];
export const WIRE_ZONE_LABELS: Record<WireZone, string> = {
  cabin: 'Outside the engine bay',
  engine_bay: 'Engine bay',
};

export const RETURN_PATHS = ['wire', 'chassis'] as const;
export type ReturnPath = (typeof RETURN_PATHS)[number];
export const RETURN_PATH_LABELS: Record<ReturnPath, string> = {
  wire: 'Own return wire (two-wire)',
  chassis: 'Chassis return',
};

/** ABYC E-11: 3 % where drop must be kept to a minimum, 10 % for non-critical circuits. */
export const DROP_CLASSES = ['critical', 'general'] as const;
export type DropClass = (typeof DROP_CLASSES)[number];
export const DROP_CLASS_LABELS: Record<DropClass, string> = {
  critical: 'Critical (3 %): ECU feeds, sensor references, fuel pump',
  general: 'General (10 %)',
};

export const FeedWire = z.strictObject({
  sizeMm2: WireSizeMm2Schema.unwrap(),
  insulationRatingC: InsulationRatingSchema.unwrap(),
  /** One-way run from the fuse to the load, metres. */
  lengthM: z.number().positive().max(50),
  zone: z.enum(WIRE_ZONES),
  /** Current-carrying conductors in the same bundle, this one included. */
  bundled: z.number().int().min(1).max(100),
  returnPath: z.enum(RETURN_PATHS),
  colour: WireColourSchema,
  /** Crimped terminals and splices along the run, for the drop budget (4 when not given). */
  connections: z.number().int().min(0).max(50).optional(),
});
export type FeedWire = z.infer<typeof FeedWire>;

export const FeedRelay = z.strictObject({
  contactRatingA: z.number().positive().max(200),
  coilCurrentA: z.number().min(0).max(5),
  /** Coil resistance, Ω: when given, the coil current is worked from it (I = V / R). */
  coilResistanceOhm: z.number().positive().max(100_000).nullable().optional(),
  /** The pin of the map that drives the relay's coil (usually switching its ground side). */
  coilPinId: z.number().int().positive().nullable(),
});
export type FeedRelay = z.infer<typeof FeedRelay>;

export const FeedLoad = z.strictObject({
  /** A pin of the map this load is, or null for a named device. */
  pinId: z.number().int().positive().nullable(),
  name: optionalText(80),
  currentA: z.number().min(0).max(200),
  continuous: z.boolean(),
  /** What the load is, for its relay's inrush allowance (resistive when not given). */
  kind: z.enum(LOAD_KINDS).optional(),
});
export type FeedLoad = z.infer<typeof FeedLoad>;

const feedShape = {
  name: requiredText(80),
  source: z.enum(FEED_SOURCES),
  sourceFeedId: z.number().int().positive().nullable(),
  /** Null means no fuse: refused for battery and ignition feeds by the checks. */
  fuseA: z.number().positive().max(500).nullable(),
  /** The fuse's family (a standard blade when not given). */
  fuseType: z.enum(FUSE_TYPES).optional(),
  /** Wire between the source and the fuse, mm: 33 CFR 183.455(b) limits it. Null: not recorded. */
  unfusedLengthMm: z.number().min(0).max(10_000).nullable().optional(),
  /** The unfused length runs in a sheath or enclosure (the longer limit applies). */
  fuseSheathed: z.boolean().optional(),
  relay: FeedRelay.nullable(),
  wire: FeedWire,
  loads: z.array(FeedLoad).max(50),
  dropClass: z.enum(DROP_CLASSES),
  /** Overrides the class's limit, percent of system voltage. */
  dropLimitPct: z.number().positive().max(50).nullable(),
  notes: noteText(2000),
};

const sourceNeedsFeed = (v: { source?: FeedSource; sourceFeedId?: number | null }) =>
  v.source === undefined || (v.source === 'relay_output') === (v.sourceFeedId != null);
const SOURCE_MESSAGE = {
  message:
    'give the feed whose relay output this is when, and only when, the source is a relay output',
  path: ['sourceFeedId'],
};

export const CreateFeedRequest = z.strictObject(feedShape).refine(sourceNeedsFeed, SOURCE_MESSAGE);
export type CreateFeedRequest = z.infer<typeof CreateFeedRequest>;

export const UpdateFeedRequest = z
  .strictObject({ ...feedShape, version: z.number().int().min(0) })
  .partial({
    name: true,
    source: true,
    sourceFeedId: true,
    fuseA: true,
    fuseType: true,
    unfusedLengthMm: true,
    fuseSheathed: true,
    relay: true,
    wire: true,
    loads: true,
    dropClass: true,
    dropLimitPct: true,
    notes: true,
  })
  .refine(sourceNeedsFeed, SOURCE_MESSAGE);
export type UpdateFeedRequest = z.infer<typeof UpdateFeedRequest>;

export const FeedParams = z.strictObject({ id: IdParam, feedId: IdParam });
export type FeedParams = z.output<typeof FeedParams>;

export interface Feed {
  id: number;
  conversionId: number;
  name: string;
  source: FeedSource;
  sourceFeedId: number | null;
  fuseA: number | null;
  fuseType?: FuseType;
  unfusedLengthMm?: number | null;
  fuseSheathed?: boolean;
  relay: FeedRelay | null;
  wire: FeedWire;
  loads: Array<FeedLoad & { id: number }>;
  dropClass: DropClass;
  dropLimitPct: number | null;
  notes: string;
  version: number;
}
