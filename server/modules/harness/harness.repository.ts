/**
 * Reading the harness of a conversion: wires with their two ends, splices, ground points and boxes
 * with their positions, in the shapes of shared/schemas/harness.schema.ts.
 */
import { QueryTypes, type Transaction } from 'sequelize';
import type {
  Box,
  BoxPosition,
  GroundPoint,
  Harness,
  Splice,
  Wire,
  WireEnd,
} from '#shared/schemas/harness.schema.ts';
import type { FuseType } from '#shared/domain/electrical/fuses.ts';
import { db } from '../../db/index.ts';
import { readTogether } from '../../db/portable.ts';

interface WireRow {
  id: number;
  conversion_id: number;
  label: string;
  colour: string;
  size_mm2: number | null;
  insulation_rating_c: number | null;
  length_m: number | null;
  zone: Wire['zone'];
  branch: string;
  notes: string;
  twist_group: string;
  shielded: number | boolean;
  version: number;
}
export interface EndRow {
  wire_id: number;
  end_index: number;
  kind: WireEnd['kind'];
  pin_id: number | null;
  splice_id: number | null;
  ground_point_id: number | null;
  box_position_id: number | null;
  terminal: string | null;
  source: string | null;
  text: string;
}
interface PositionRow {
  id: number;
  box_id: number;
  kind: 'relay' | 'fuse';
  label: string;
  contact_rating_a: number | null;
  coil_resistance_ohm: number | null;
  fuse_type: string | null;
  rating_a: number | null;
  feed_id: number | null;
}

async function select<T extends object>(
  sql: string,
  replacements: Record<string, unknown>,
  transaction?: Transaction,
): Promise<T[]> {
  return db().query<T>(sql, { type: QueryTypes.SELECT, replacements, transaction });
}

/**
 * An end as the API shows it. A reference whose target was deleted (the column set to NULL by the
 * foreign key) reads as unresolved, so the checks and the worksheet say it must be fastened again.
 */
export function toEnd(row: EndRow): WireEnd {
  switch (row.kind) {
    case 'pin':
      if (row.pin_id != null) return { kind: 'pin', refId: row.pin_id };
      break;
    case 'splice':
      if (row.splice_id != null) return { kind: 'splice', refId: row.splice_id };
      break;
    case 'ground':
      if (row.ground_point_id != null) return { kind: 'ground', refId: row.ground_point_id };
      break;
    case 'relay':
      if (row.box_position_id != null)
        return {
          kind: 'relay',
          refId: row.box_position_id,
          terminal: row.terminal as '30' | '87' | '87a' | '85' | '86',
        };
      break;
    case 'fuse':
      if (row.box_position_id != null)
        return { kind: 'fuse', refId: row.box_position_id, terminal: row.terminal as 'in' | 'out' };
      break;
    case 'source':
      return { kind: 'source', source: (row.source ?? 'battery') as 'battery' };
    case 'unresolved':
      return { kind: 'unresolved', text: row.text };
  }
  return { kind: 'unresolved', text: `${row.kind} removed` };
}

export function toWire(row: WireRow, ends: EndRow[]): Wire {
  const byIndex = [0, 1].map(
    (i) => ends.find((e) => e.end_index === i) ?? ({ kind: 'unresolved', text: '' } as EndRow),
  );
  return {
    id: row.id,
    conversionId: row.conversion_id,
    label: row.label,
    colour: row.colour,
    sizeMm2: row.size_mm2,
    insulationRatingC: row.insulation_rating_c,
    lengthM: row.length_m,
    zone: row.zone,
    branch: row.branch,
    notes: row.notes,
    twistGroup: row.twist_group,
    shielded: Boolean(row.shielded),
    ends: [toEnd(byIndex[0]!), toEnd(byIndex[1]!)],
    version: row.version,
  };
}

function toPosition(row: PositionRow): BoxPosition {
  return row.kind === 'relay'
    ? {
        id: row.id,
        kind: 'relay',
        label: row.label,
        contactRatingA: row.contact_rating_a ?? 0,
        coilResistanceOhm: row.coil_resistance_ohm,
        feedId: row.feed_id,
      }
    : {
        id: row.id,
        kind: 'fuse',
        label: row.label,
        fuseType: (row.fuse_type ?? 'standard_blade') as FuseType,
        ratingA: row.rating_a ?? 0,
        feedId: row.feed_id,
      };
}

export async function wiresOf(
  conversionId: number,
  transaction?: Transaction,
  onlyId?: number,
): Promise<Wire[]> {
  const where = onlyId == null ? '' : ' AND w.id = :onlyId';
  const rows = await select<WireRow>(
    `SELECT w.* FROM wires w WHERE w.conversion_id = :conversionId${where} ORDER BY w.label, w.id`,
    { conversionId, onlyId },
    transaction,
  );
  const ends = await select<EndRow>(
    `SELECT e.* FROM wire_ends e JOIN wires w ON w.id = e.wire_id
      WHERE w.conversion_id = :conversionId${where}`,
    { conversionId, onlyId },
    transaction,
  );
  const byWire = new Map<number, EndRow[]>();
  for (const e of ends) byWire.set(e.wire_id, [...(byWire.get(e.wire_id) ?? []), e]);
  return rows.map((r) => toWire(r, byWire.get(r.id) ?? []));
}

export async function splicesOf(
  conversionId: number,
  transaction?: Transaction,
): Promise<Splice[]> {
  const rows = await select<{
    id: number;
    conversion_id: number;
    label: string;
    sealed: number;
    branch: string;
    distance_mm: number | null;
    notes: string;
    version: number;
  }>(
    'SELECT * FROM splices WHERE conversion_id = :conversionId ORDER BY label, id',
    { conversionId },
    transaction,
  );
  return rows.map((r) => ({
    id: r.id,
    conversionId: r.conversion_id,
    label: r.label,
    sealed: Boolean(r.sealed),
    branch: r.branch,
    distanceMm: r.distance_mm,
    notes: r.notes,
    version: r.version,
  }));
}

export async function groundPointsOf(
  conversionId: number,
  transaction?: Transaction,
): Promise<GroundPoint[]> {
  const rows = await select<{
    id: number;
    conversion_id: number;
    label: string;
    location: GroundPoint['location'];
    strap_size_mm2: number | null;
    notes: string;
    version: number;
  }>(
    'SELECT * FROM ground_points WHERE conversion_id = :conversionId ORDER BY label, id',
    { conversionId },
    transaction,
  );
  return rows.map((r) => ({
    id: r.id,
    conversionId: r.conversion_id,
    label: r.label,
    location: r.location,
    strapSizeMm2: r.strap_size_mm2,
    notes: r.notes,
    version: r.version,
  }));
}

export async function boxesOf(conversionId: number, transaction?: Transaction): Promise<Box[]> {
  const boxes = await select<{
    id: number;
    conversion_id: number;
    label: string;
    notes: string;
    version: number;
  }>(
    'SELECT * FROM boxes WHERE conversion_id = :conversionId ORDER BY id',
    { conversionId },
    transaction,
  );
  const positions = await select<PositionRow>(
    `SELECT p.* FROM box_positions p JOIN boxes b ON b.id = p.box_id
      WHERE b.conversion_id = :conversionId ORDER BY p.box_id, p.position, p.id`,
    { conversionId },
    transaction,
  );
  return boxes.map((b) => ({
    id: b.id,
    conversionId: b.conversion_id,
    label: b.label,
    notes: b.notes,
    positions: positions.filter((p) => p.box_id === b.id).map(toPosition),
    version: b.version,
  }));
}

/** The whole harness of a conversion. */
export async function harnessOf(conversionId: number, transaction?: Transaction): Promise<Harness> {
  const [wires, splices, groundPoints, boxes] = await readTogether(
    transaction,
    () => wiresOf(conversionId, transaction),
    () => splicesOf(conversionId, transaction),
    () => groundPointsOf(conversionId, transaction),
    () => boxesOf(conversionId, transaction),
  );
  return { wires, splices, groundPoints, boxes };
}
