/**
 * The harness as it is built: wires with both ends, splices, ground points and the relay and fuse
 * box. The contract between the client, the server and the checks.
 */
import { z } from 'zod';
import { FUSE_TYPES, type FuseType } from '../domain/electrical/fuses.ts';
import { IdParam, noteText, optionalText, requiredText } from './common.schema.ts';
import { WIRE_ZONES, type WireZone } from './feeds.schema.ts';
import {
  InsulationRatingSchema,
  WireColourSchema,
  WireSizeMm2Schema,
} from './wire-fields.schema.ts';

/** What a wire end is fastened to. */
export const END_KINDS = [
  'pin',
  'splice',
  'ground',
  'relay',
  'fuse',
  'source',
  'unresolved',
] as const;
export type EndKind = (typeof END_KINDS)[number];

/** Relay terminals by DIN 72552: 30 supply, 87 output, 87a normally closed, 85/86 the coil. */
export const RELAY_TERMINALS = ['30', '87', '87a', '85', '86'] as const;
export type RelayTerminal = (typeof RELAY_TERMINALS)[number];
/** A fuse position's two sides. */
export const FUSE_TERMINALS = ['in', 'out'] as const;
export type FuseTerminal = (typeof FUSE_TERMINALS)[number];

/** Named sources a wire can start from. */
export const SOURCES = ['battery', 'ignition', 'starter'] as const;
export type SourceName = (typeof SOURCES)[number];
export const SOURCE_LABELS: Record<SourceName, string> = {
  battery: 'Battery +',
  ignition: 'Ignition switched',
  starter: 'Starter signal',
};

/** A record id in a request body. */
const RefId = z.number().int().positive();

export const WireEnd = z.discriminatedUnion('kind', [
  z.strictObject({ kind: z.literal('pin'), refId: RefId }),
  z.strictObject({ kind: z.literal('splice'), refId: RefId }),
  z.strictObject({ kind: z.literal('ground'), refId: RefId }),
  z.strictObject({ kind: z.literal('relay'), refId: RefId, terminal: z.enum(RELAY_TERMINALS) }),
  z.strictObject({ kind: z.literal('fuse'), refId: RefId, terminal: z.enum(FUSE_TERMINALS) }),
  z.strictObject({ kind: z.literal('source'), source: z.enum(SOURCES) }),
  z.strictObject({ kind: z.literal('unresolved'), text: optionalText(200) }),
]);
export type WireEnd = z.infer<typeof WireEnd>;

const wireShape = {
  label: requiredText(20).optional(),
  colour: WireColourSchema.optional(),
  sizeMm2: WireSizeMm2Schema.optional(),
  insulationRatingC: InsulationRatingSchema.optional(),
  lengthM: z.number().min(0).max(100).nullable().optional(),
  zone: z.enum(WIRE_ZONES).optional(),
  branch: optionalText(80).optional(),
  notes: noteText(2000).optional(),
  /** Wires sharing a twist group are twisted together ("T1"); empty when run loose. */
  twistGroup: optionalText(12).optional(),
  /** Runs inside a shielded cable. */
  shielded: z.boolean().optional(),
};

export const CreateWireRequest = z.strictObject({
  ...wireShape,
  ends: z.tuple([WireEnd, WireEnd]),
});
export type CreateWireRequest = z.infer<typeof CreateWireRequest>;

export const UpdateWireRequest = z.strictObject({
  ...wireShape,
  ends: z.tuple([WireEnd, WireEnd]).optional(),
  version: z.number().int().min(0),
});
export type UpdateWireRequest = z.infer<typeof UpdateWireRequest>;

export interface Wire {
  id: number;
  conversionId: number;
  label: string;
  colour: string;
  sizeMm2: number | null;
  insulationRatingC: number | null;
  lengthM: number | null;
  zone: WireZone;
  branch: string;
  notes: string;
  /** Absent in revisions frozen before wires recorded it (read as ''). */
  twistGroup?: string;
  /** Absent in revisions frozen before wires recorded it (read as false). */
  shielded?: boolean;
  ends: [WireEnd, WireEnd];
  version: number;
}

export const GROUND_LOCATIONS = ['engine_block', 'chassis', 'body', 'ecu_local'] as const;
export type GroundLocation = (typeof GROUND_LOCATIONS)[number];
export const GROUND_LOCATION_LABELS: Record<GroundLocation, string> = {
  engine_block: 'Engine block',
  chassis: 'Chassis',
  body: 'Body',
  ecu_local: 'At the ECU',
};

export const CreateSpliceRequest = z.strictObject({
  label: requiredText(20).optional(),
  sealed: z.boolean().optional(),
  branch: optionalText(80).optional(),
  /** Distance from the branch's datum, mm. */
  distanceMm: z.number().min(0).max(20_000).nullable().optional(),
  notes: noteText(2000).optional(),
});
export type CreateSpliceRequest = z.infer<typeof CreateSpliceRequest>;
export const UpdateSpliceRequest = CreateSpliceRequest.extend({ version: z.number().int().min(0) });
export type UpdateSpliceRequest = z.infer<typeof UpdateSpliceRequest>;

export interface Splice {
  id: number;
  conversionId: number;
  label: string;
  sealed: boolean;
  branch: string;
  distanceMm: number | null;
  notes: string;
  version: number;
}

export const CreateGroundPointRequest = z.strictObject({
  label: requiredText(20).optional(),
  location: z.enum(GROUND_LOCATIONS),
  /** Cross-section of the strap or main ground cable, mm². */
  strapSizeMm2: z.number().positive().max(200).nullable().optional(),
  notes: noteText(2000).optional(),
});
export type CreateGroundPointRequest = z.infer<typeof CreateGroundPointRequest>;
export const UpdateGroundPointRequest = CreateGroundPointRequest.partial().extend({
  version: z.number().int().min(0),
});
export type UpdateGroundPointRequest = z.infer<typeof UpdateGroundPointRequest>;

export interface GroundPoint {
  id: number;
  conversionId: number;
  label: string;
  location: GroundLocation;
  strapSizeMm2: number | null;
  notes: string;
  version: number;
}

export const POSITION_KINDS = ['relay', 'fuse'] as const;
export type PositionKind = (typeof POSITION_KINDS)[number];

export const BoxPositionInput = z.discriminatedUnion('kind', [
  z.strictObject({
    kind: z.literal('relay'),
    label: requiredText(12),
    contactRatingA: z.number().positive().max(200),
    coilResistanceOhm: z.number().positive().max(100_000).nullable(),
    feedId: RefId.nullable(),
  }),
  z.strictObject({
    kind: z.literal('fuse'),
    label: requiredText(12),
    fuseType: z.enum(FUSE_TYPES),
    ratingA: z.number().positive().max(500),
    feedId: RefId.nullable(),
  }),
]);
export type BoxPositionInput = z.infer<typeof BoxPositionInput>;

export const CreateBoxRequest = z.strictObject({
  label: requiredText(40),
  notes: noteText(2000).optional(),
  positions: z.array(BoxPositionInput).max(60),
});
export type CreateBoxRequest = z.infer<typeof CreateBoxRequest>;
export const UpdateBoxRequest = CreateBoxRequest.partial().extend({
  version: z.number().int().min(0),
});
export type UpdateBoxRequest = z.infer<typeof UpdateBoxRequest>;

export type BoxPosition =
  | {
      id: number;
      kind: 'relay';
      label: string;
      contactRatingA: number;
      coilResistanceOhm: number | null;
      feedId: number | null;
    }
  | {
      id: number;
      kind: 'fuse';
      label: string;
      fuseType: FuseType;
      ratingA: number;
      feedId: number | null;
    };

export interface Box {
  id: number;
  conversionId: number;
  label: string;
  notes: string;
  positions: BoxPosition[];
  version: number;
}

/** The harness of a conversion, as the checks, diagrams and worksheet read it. */
export interface Harness {
  wires: Wire[];
  splices: Splice[];
  groundPoints: GroundPoint[];
  boxes: Box[];
}

/** The harness as a snapshot freezes it: row versions left out, as for pins and feeds. */
export interface SnapshotHarness {
  wires: Array<Omit<Wire, 'version'>>;
  splices: Array<Omit<Splice, 'version'>>;
  groundPoints: Array<Omit<GroundPoint, 'version'>>;
  boxes: Array<Omit<Box, 'version'>>;
}

/** A harness without its row versions. */
export function withoutVersions(h: Harness): SnapshotHarness {
  const strip = <T extends { version: number }>({ version: _v, ...rest }: T) => rest;
  return {
    wires: h.wires.map(strip),
    splices: h.splices.map(strip),
    groundPoints: h.groundPoints.map(strip),
    boxes: h.boxes.map(strip),
  };
}

export const HarnessItemParams = z.strictObject({ id: IdParam });
export const CircuitParams = z.strictObject({ id: IdParam, refId: IdParam });
export type CircuitParams = z.output<typeof CircuitParams>;
