/**
 * Changing the harness: wires, splices, ground points and boxes. Every write checks the
 * conversion's workshop, that each end names something of the same conversion, the row's version,
 * and writes its audit line in the same transaction.
 */
import { QueryTypes, type Transaction } from 'sequelize';
import { labelKey } from '#shared/domain/labels.ts';
import type {
  Box,
  CreateBoxRequest,
  CreateGroundPointRequest,
  CreateSpliceRequest,
  CreateWireRequest,
  GroundPoint,
  Splice,
  UpdateBoxRequest,
  UpdateGroundPointRequest,
  UpdateSpliceRequest,
  UpdateWireRequest,
  Wire,
  WireEnd,
} from '#shared/schemas/harness.schema.ts';
import { db } from '../../db/index.ts';
import { insertReturningId } from '../../db/portable.ts';
import type { Actor } from '../../lib/actor.ts';
import { ConversionJsonCache, type JsonBody } from '../../lib/cached-json.ts';
import { AppError, conflict, notFound, versionConflict } from '../../lib/errors.ts';
import { inTransaction } from '../../lib/transaction.ts';
import { recordAudit } from '../audit/audit.service.ts';
import {
  conversionChangeCounter,
  findConversionInWorkshop,
} from '../conversions/conversions.service.ts';
import { boxesOf, groundPointsOf, splicesOf, wiresOf } from './harness.repository.ts';

const query = <T extends object>(
  sql: string,
  replacements: Record<string, unknown>,
  transaction: Transaction,
) => db().query<T>(sql, { type: QueryTypes.SELECT, replacements, transaction });

/**
 * Runs a write. An INSERT answers the new row's id, an UPDATE how many rows it changed (the
 * optimistic lock reads it), anything else nothing.
 */
async function run(sql: string, replacements: Record<string, unknown>, transaction: Transaction) {
  const verb = sql.trimStart().slice(0, 6).toUpperCase();
  if (verb === 'INSERT') {
    const id = await insertReturningId(db(), sql, { replacements, transaction });
    return { changes: 1, lastId: id };
  }
  if (verb === 'UPDATE') {
    const [, changes] = await db().query(sql, {
      type: QueryTypes.UPDATE,
      replacements,
      transaction,
    });
    return { changes: Number(changes), lastId: 0 };
  }
  await db().query(sql, { replacements, transaction });
  return { changes: 0, lastId: 0 };
}

const invalidEnd = (index: number, message: string) =>
  new AppError(422, 'invalid_end', `End ${index === 0 ? 'A' : 'B'}: ${message}`, [
    { field: `ends.${index}`, message },
  ]);

/**
 * Each end must name something of this conversion: a pin of one of its connectors, one of its
 * splices or ground points, or a position of one of its boxes of the right kind. Another
 * conversion's or workshop's object is refused as if it did not exist.
 */
async function assertEnds(conversionId: number, ends: readonly WireEnd[], t: Transaction) {
  for (const [i, end] of ends.entries()) {
    if (end.kind === 'source' || end.kind === 'unresolved') continue;
    const table = {
      pin: 'SELECT id FROM pins WHERE id = :id AND conversion_id = :conversionId',
      splice: 'SELECT id FROM splices WHERE id = :id AND conversion_id = :conversionId',
      ground: 'SELECT id FROM ground_points WHERE id = :id AND conversion_id = :conversionId',
      relay: `SELECT p.id, p.kind FROM box_positions p JOIN boxes b ON b.id = p.box_id
               WHERE p.id = :id AND b.conversion_id = :conversionId`,
      fuse: `SELECT p.id, p.kind FROM box_positions p JOIN boxes b ON b.id = p.box_id
              WHERE p.id = :id AND b.conversion_id = :conversionId`,
    }[end.kind];
    const [row] = await query<{ id: number; kind?: string }>(
      table,
      { id: end.refId, conversionId },
      t,
    );
    if (!row) throw invalidEnd(i, `no such ${end.kind} in this conversion`);
    if ((end.kind === 'relay' || end.kind === 'fuse') && row.kind !== end.kind) {
      throw invalidEnd(i, `that box position is a ${row.kind}, not a ${end.kind}`);
    }
  }
}

export async function nextLabel(
  table: 'wires' | 'splices' | 'ground_points',
  conversionId: number,
  prefix: string,
  digits: number,
  t: Transaction,
): Promise<string> {
  const rows = await query<{ label: string }>(
    `SELECT label FROM ${table} WHERE conversion_id = :conversionId`,
    { conversionId },
    t,
  );
  let max = 0;
  for (const { label } of rows) {
    const m = new RegExp(`^${prefix}(\\d+)$`).exec(label);
    if (m) max = Math.max(max, Number(m[1]));
  }
  return `${prefix}${String(max + 1).padStart(digits, '0')}`;
}

async function assertLabelFree(
  table: 'wires' | 'splices' | 'ground_points' | 'boxes',
  conversionId: number,
  label: string,
  exceptId: number | null,
  t: Transaction,
) {
  const rows = await query<{ id: number; label: string }>(
    `SELECT id, label FROM ${table} WHERE conversion_id = :conversionId`,
    { conversionId },
    t,
  );
  const key = labelKey(label);
  if (rows.some((r) => r.id !== exceptId && labelKey(r.label) === key)) {
    throw new AppError(409, 'duplicate', `This conversion already has "${label}".`, [
      { field: 'label', message: 'is already used in this conversion' },
    ]);
  }
}

/** Replaces a wire's two ends (the wire's own row is the caller's). */
export async function writeEnds(wireId: number, ends: readonly WireEnd[], t: Transaction) {
  await run('DELETE FROM wire_ends WHERE wire_id = :wireId', { wireId }, t);
  for (const [index, end] of ends.entries()) {
    await run(
      `INSERT INTO wire_ends (wire_id, end_index, kind, pin_id, splice_id, ground_point_id,
         box_position_id, terminal, source, text)
       VALUES (:wireId, :index, :kind, :pinId, :spliceId, :groundId, :positionId, :terminal,
         :source, :text)`,
      {
        wireId,
        index,
        kind: end.kind,
        pinId: end.kind === 'pin' ? end.refId : null,
        spliceId: end.kind === 'splice' ? end.refId : null,
        groundId: end.kind === 'ground' ? end.refId : null,
        positionId: end.kind === 'relay' || end.kind === 'fuse' ? end.refId : null,
        terminal: end.kind === 'relay' || end.kind === 'fuse' ? end.terminal : null,
        source: end.kind === 'source' ? end.source : null,
        text: end.kind === 'unresolved' ? end.text : '',
      },
      t,
    );
  }
}

async function wireIn(conversionId: number, wireId: number, t: Transaction): Promise<Wire> {
  const [wire] = await wiresOf(conversionId, t, wireId);
  if (!wire) throw notFound('That wire');
  return wire;
}

/** The wire and its conversion, checked against the actor's workshop (another's is a 404). */
async function findWire(actor: Actor, wireId: number, t: Transaction): Promise<Wire> {
  const [row] = await query<{ conversion_id: number }>(
    `SELECT w.conversion_id FROM wires w JOIN conversions c ON c.id = w.conversion_id
      WHERE w.id = :wireId AND c.workshop_id = :workshopId`,
    { wireId, workshopId: actor.workshopId },
    t,
  );
  if (!row) throw notFound('That wire');
  return wireIn(row.conversion_id, wireId, t);
}

const wireListCache = new ConversionJsonCache();

/**
 * The answer of GET …/wires (`{ wires }`) serialised, with its ETag, made again only when the
 * conversion's change counter has moved since (migration 0015: the harness tables move it too).
 */
export async function wireListBody(actor: Actor, conversionId: number): Promise<JsonBody> {
  const counter = await conversionChangeCounter(actor, conversionId);
  return wireListCache.get(conversionId, counter, async () => ({
    wires: await wiresOf(conversionId),
  }));
}

export async function createWire(
  actor: Actor,
  conversionId: number,
  input: CreateWireRequest,
): Promise<Wire> {
  return inTransaction(db(), async (t) => {
    await findConversionInWorkshop(actor, conversionId, t);
    await assertEnds(conversionId, input.ends, t);
    const label = input.label ?? (await nextLabel('wires', conversionId, 'W-', 3, t));
    await assertLabelFree('wires', conversionId, label, null, t);
    const now = new Date().toISOString();
    const { lastId } = await run(
      `INSERT INTO wires (conversion_id, label, colour, size_mm2, insulation_rating_c, length_m,
         zone, branch, notes, twist_group, shielded, version, created_at, updated_at)
       VALUES (:conversionId, :label, :colour, :size, :insulation, :length, :zone, :branch, :notes,
         :twistGroup, :shielded, 0, :now, :now)`,
      {
        conversionId,
        label,
        colour: input.colour ?? '',
        size: input.sizeMm2 ?? null,
        insulation: input.insulationRatingC ?? null,
        length: input.lengthM ?? null,
        zone: input.zone ?? 'cabin',
        branch: input.branch ?? '',
        notes: input.notes ?? '',
        twistGroup: input.twistGroup ?? '',
        shielded: input.shielded ?? false,
        now,
      },
      t,
    );
    await writeEnds(lastId, input.ends, t);
    const wire = await wireIn(conversionId, lastId, t);
    await recordAudit(t, actor, {
      conversionId,
      action: 'create',
      entityType: 'wire',
      entityId: wire.id,
      summary: `Added wire ${wire.label}`,
      after: wire,
    });
    return wire;
  });
}

export async function updateWire(
  actor: Actor,
  wireId: number,
  input: UpdateWireRequest,
): Promise<Wire> {
  return inTransaction(db(), async (t) => {
    const before = await findWire(actor, wireId, t);
    if (before.version !== input.version) throw versionConflict(before);
    const conversionId = before.conversionId;
    if (input.ends) await assertEnds(conversionId, input.ends, t);
    if (input.label !== undefined)
      await assertLabelFree('wires', conversionId, input.label, wireId, t);
    const merged = {
      ...before,
      ...Object.fromEntries(Object.entries(input).filter(([, v]) => v !== undefined)),
    };
    // The version in the WHERE makes a concurrent writer's change a conflict, not a lost update.
    const { changes } = await run(
      `UPDATE wires SET label = :label, colour = :colour, size_mm2 = :size,
         insulation_rating_c = :insulation, length_m = :length, zone = :zone, branch = :branch,
         notes = :notes, twist_group = :twistGroup, shielded = :shielded,
         version = version + 1, updated_at = :now
       WHERE id = :wireId AND version = :version`,
      {
        wireId,
        version: input.version,
        label: merged.label,
        colour: merged.colour,
        size: merged.sizeMm2,
        insulation: merged.insulationRatingC,
        length: merged.lengthM,
        zone: merged.zone,
        branch: merged.branch,
        notes: merged.notes,
        twistGroup: merged.twistGroup ?? '',
        shielded: merged.shielded ?? false,
        now: new Date().toISOString(),
      },
      t,
    );
    if (changes !== 1) throw versionConflict(await wireIn(conversionId, wireId, t));
    if (input.ends) await writeEnds(wireId, input.ends, t);
    const after = await wireIn(conversionId, wireId, t);
    await recordAudit(t, actor, {
      conversionId,
      action: 'update',
      entityType: 'wire',
      entityId: wireId,
      summary: `Changed wire ${after.label}`,
      before,
      after,
    });
    return after;
  });
}

export async function deleteWire(actor: Actor, wireId: number): Promise<void> {
  await inTransaction(db(), async (t) => {
    const before = await findWire(actor, wireId, t);
    await run('DELETE FROM wires WHERE id = :wireId', { wireId }, t);
    await recordAudit(t, actor, {
      conversionId: before.conversionId,
      action: 'delete',
      entityType: 'wire',
      entityId: wireId,
      summary: `Removed wire ${before.label}`,
      before,
    });
  });
}

/**
 * Removes a splice or a ground point that no wire is fastened to; one that still joins wires is
 * refused (409) with how many, so no wire end is left pointing at nothing.
 */
async function deleteJoint(
  actor: Actor,
  conversionId: number,
  kind: 'splice' | 'ground',
  id: number,
): Promise<void> {
  const table = kind === 'splice' ? 'splices' : 'ground_points';
  const column = kind === 'splice' ? 'splice_id' : 'ground_point_id';
  const what = kind === 'splice' ? 'splice' : 'ground point';
  await inTransaction(db(), async (t) => {
    await findConversionInWorkshop(actor, conversionId, t);
    const [row] = await query<{ label: string }>(
      `SELECT label FROM ${table} WHERE id = :id AND conversion_id = :conversionId`,
      { id, conversionId },
      t,
    );
    if (!row) throw notFound(`That ${what}`);
    const [{ n }] = (await query<{ n: number }>(
      `SELECT COUNT(*) AS n FROM wire_ends WHERE ${column} = :id`,
      { id },
      t,
    )) as [{ n: number }];
    if (Number(n) > 0) {
      throw conflict(
        `${row.label} still joins ${Number(n) === 1 ? '1 wire' : `${Number(n)} wires`}: fasten ${Number(n) === 1 ? 'it' : 'them'} elsewhere or remove ${Number(n) === 1 ? 'it' : 'them'} first.`,
        { wires: Number(n) },
      );
    }
    await run(`DELETE FROM ${table} WHERE id = :id`, { id }, t);
    await recordAudit(t, actor, {
      conversionId,
      action: 'delete',
      entityType: kind === 'splice' ? 'splice' : 'ground_point',
      entityId: id,
      summary: `Removed ${what} ${row.label}`,
    });
  });
}

export const deleteSplice = (actor: Actor, conversionId: number, spliceId: number) =>
  deleteJoint(actor, conversionId, 'splice', spliceId);
export const deleteGroundPoint = (actor: Actor, conversionId: number, groundPointId: number) =>
  deleteJoint(actor, conversionId, 'ground', groundPointId);

export async function listSplices(actor: Actor, conversionId: number): Promise<Splice[]> {
  await findConversionInWorkshop(actor, conversionId);
  return splicesOf(conversionId);
}

export async function createSplice(
  actor: Actor,
  conversionId: number,
  input: CreateSpliceRequest,
): Promise<Splice> {
  return inTransaction(db(), async (t) => {
    await findConversionInWorkshop(actor, conversionId, t);
    const label = input.label ?? (await nextLabel('splices', conversionId, 'S-', 2, t));
    await assertLabelFree('splices', conversionId, label, null, t);
    const now = new Date().toISOString();
    const { lastId } = await run(
      `INSERT INTO splices (conversion_id, label, sealed, branch, distance_mm, notes, version,
         created_at, updated_at)
       VALUES (:conversionId, :label, :sealed, :branch, :distance, :notes, 0, :now, :now)`,
      {
        conversionId,
        label,
        sealed: input.sealed ?? true,
        branch: input.branch ?? '',
        distance: input.distanceMm ?? null,
        notes: input.notes ?? '',
        now,
      },
      t,
    );
    const splice = (await splicesOf(conversionId, t)).find((s) => s.id === lastId)!;
    await recordAudit(t, actor, {
      conversionId,
      action: 'create',
      entityType: 'splice',
      entityId: lastId,
      summary: `Added splice ${label}`,
      after: splice,
    });
    return splice;
  });
}

export async function updateSplice(
  actor: Actor,
  conversionId: number,
  spliceId: number,
  input: UpdateSpliceRequest,
): Promise<Splice> {
  return inTransaction(db(), async (t) => {
    await findConversionInWorkshop(actor, conversionId, t);
    const before = (await splicesOf(conversionId, t)).find((s) => s.id === spliceId);
    if (!before) throw notFound('That splice');
    if (input.label !== undefined)
      await assertLabelFree('splices', conversionId, input.label, spliceId, t);
    const m = {
      ...before,
      ...Object.fromEntries(Object.entries(input).filter(([, v]) => v !== undefined)),
    };
    const { changes } = await run(
      `UPDATE splices SET label = :label, sealed = :sealed, branch = :branch,
         distance_mm = :distance, notes = :notes, version = version + 1, updated_at = :now
       WHERE id = :spliceId AND version = :version`,
      {
        spliceId,
        version: input.version,
        label: m.label,
        sealed: m.sealed,
        branch: m.branch,
        distance: m.distanceMm,
        notes: m.notes,
        now: new Date().toISOString(),
      },
      t,
    );
    if (changes !== 1) throw versionConflict(before);
    const after = (await splicesOf(conversionId, t)).find((s) => s.id === spliceId)!;
    await recordAudit(t, actor, {
      conversionId,
      action: 'update',
      entityType: 'splice',
      entityId: spliceId,
      summary: `Changed splice ${after.label}`,
      before,
      after,
    });
    return after;
  });
}

export async function listGroundPoints(actor: Actor, conversionId: number): Promise<GroundPoint[]> {
  await findConversionInWorkshop(actor, conversionId);
  return groundPointsOf(conversionId);
}

export async function createGroundPoint(
  actor: Actor,
  conversionId: number,
  input: CreateGroundPointRequest,
): Promise<GroundPoint> {
  return inTransaction(db(), async (t) => {
    await findConversionInWorkshop(actor, conversionId, t);
    const label = input.label ?? (await nextLabel('ground_points', conversionId, 'G-', 1, t));
    await assertLabelFree('ground_points', conversionId, label, null, t);
    const now = new Date().toISOString();
    const { lastId } = await run(
      `INSERT INTO ground_points (conversion_id, label, location, strap_size_mm2, notes, version,
         created_at, updated_at)
       VALUES (:conversionId, :label, :location, :strap, :notes, 0, :now, :now)`,
      {
        conversionId,
        label,
        location: input.location,
        strap: input.strapSizeMm2 ?? null,
        notes: input.notes ?? '',
        now,
      },
      t,
    );
    const point = (await groundPointsOf(conversionId, t)).find((g) => g.id === lastId)!;
    await recordAudit(t, actor, {
      conversionId,
      action: 'create',
      entityType: 'ground_point',
      entityId: lastId,
      summary: `Added ground point ${label}`,
      after: point,
    });
    return point;
  });
}

export async function updateGroundPoint(
  actor: Actor,
  conversionId: number,
  pointId: number,
  input: UpdateGroundPointRequest,
): Promise<GroundPoint> {
  return inTransaction(db(), async (t) => {
    await findConversionInWorkshop(actor, conversionId, t);
    const before = (await groundPointsOf(conversionId, t)).find((g) => g.id === pointId);
    if (!before) throw notFound('That ground point');
    if (input.label !== undefined)
      await assertLabelFree('ground_points', conversionId, input.label, pointId, t);
    const m = {
      ...before,
      ...Object.fromEntries(Object.entries(input).filter(([, v]) => v !== undefined)),
    };
    const { changes } = await run(
      `UPDATE ground_points SET label = :label, location = :location, strap_size_mm2 = :strap,
         notes = :notes, version = version + 1, updated_at = :now
       WHERE id = :pointId AND version = :version`,
      {
        pointId,
        version: input.version,
        label: m.label,
        location: m.location,
        strap: m.strapSizeMm2,
        notes: m.notes,
        now: new Date().toISOString(),
      },
      t,
    );
    if (changes !== 1) throw versionConflict(before);
    const after = (await groundPointsOf(conversionId, t)).find((g) => g.id === pointId)!;
    await recordAudit(t, actor, {
      conversionId,
      action: 'update',
      entityType: 'ground_point',
      entityId: pointId,
      summary: `Changed ground point ${after.label}`,
      before,
      after,
    });
    return after;
  });
}

export async function listBoxes(actor: Actor, conversionId: number): Promise<Box[]> {
  await findConversionInWorkshop(actor, conversionId);
  return boxesOf(conversionId);
}

async function assertFeeds(conversionId: number, feedIds: Array<number | null>, t: Transaction) {
  for (const feedId of feedIds) {
    if (feedId == null) continue;
    const [row] = await query<{ id: number }>(
      'SELECT id FROM feeds WHERE id = :feedId AND conversion_id = :conversionId',
      { feedId, conversionId },
      t,
    );
    if (!row) {
      throw new AppError(
        422,
        'invalid_position',
        'A position names a feed of another conversion.',
        [{ field: 'positions', message: 'every feed must be a feed of this conversion' }],
      );
    }
  }
}

async function writePositions(
  boxId: number,
  positions: CreateBoxRequest['positions'],
  t: Transaction,
) {
  const labels = new Set<string>();
  for (const p of positions) {
    const key = labelKey(p.label);
    if (labels.has(key)) {
      throw new AppError(409, 'duplicate', `Two positions of this box are named "${p.label}".`, [
        { field: 'positions', message: 'position labels must differ' },
      ]);
    }
    labels.add(key);
  }
  // Positions keep their ids when their label stays, so the wires fastened to them stay fastened.
  const existing = await query<{ id: number; label: string }>(
    'SELECT id, label FROM box_positions WHERE box_id = :boxId',
    { boxId },
    t,
  );
  const kept = new Set<number>();
  for (const [position, p] of positions.entries()) {
    const same = existing.find((e) => labelKey(e.label) === labelKey(p.label));
    const values = {
      boxId,
      kind: p.kind,
      label: p.label,
      contact: p.kind === 'relay' ? p.contactRatingA : null,
      coil: p.kind === 'relay' ? p.coilResistanceOhm : null,
      fuseType: p.kind === 'fuse' ? p.fuseType : null,
      rating: p.kind === 'fuse' ? p.ratingA : null,
      feedId: p.feedId,
      position,
    };
    if (same) {
      kept.add(same.id);
      await run(
        `UPDATE box_positions SET kind = :kind, label = :label, contact_rating_a = :contact,
           coil_resistance_ohm = :coil, fuse_type = :fuseType, rating_a = :rating,
           feed_id = :feedId, position = :position WHERE id = :id`,
        { ...values, id: same.id },
        t,
      );
    } else {
      await run(
        `INSERT INTO box_positions (box_id, kind, label, contact_rating_a, coil_resistance_ohm,
           fuse_type, rating_a, feed_id, position)
         VALUES (:boxId, :kind, :label, :contact, :coil, :fuseType, :rating, :feedId, :position)`,
        values,
        t,
      );
    }
  }
  for (const e of existing) {
    if (!kept.has(e.id)) await run('DELETE FROM box_positions WHERE id = :id', { id: e.id }, t);
  }
}

export async function createBox(
  actor: Actor,
  conversionId: number,
  input: CreateBoxRequest,
): Promise<Box> {
  return inTransaction(db(), async (t) => {
    await findConversionInWorkshop(actor, conversionId, t);
    await assertLabelFree('boxes', conversionId, input.label, null, t);
    await assertFeeds(
      conversionId,
      input.positions.map((p) => p.feedId),
      t,
    );
    const now = new Date().toISOString();
    const { lastId } = await run(
      `INSERT INTO boxes (conversion_id, label, notes, version, created_at, updated_at)
       VALUES (:conversionId, :label, :notes, 0, :now, :now)`,
      { conversionId, label: input.label, notes: input.notes ?? '', now },
      t,
    );
    await writePositions(lastId, input.positions, t);
    const box = (await boxesOf(conversionId, t)).find((b) => b.id === lastId)!;
    await recordAudit(t, actor, {
      conversionId,
      action: 'create',
      entityType: 'box',
      entityId: lastId,
      summary: `Added box ${box.label}`,
      after: box,
    });
    return box;
  });
}

export async function updateBox(
  actor: Actor,
  conversionId: number,
  boxId: number,
  input: UpdateBoxRequest,
): Promise<Box> {
  return inTransaction(db(), async (t) => {
    await findConversionInWorkshop(actor, conversionId, t);
    const before = (await boxesOf(conversionId, t)).find((b) => b.id === boxId);
    if (!before) throw notFound('That box');
    if (input.label !== undefined)
      await assertLabelFree('boxes', conversionId, input.label, boxId, t);
    if (input.positions)
      await assertFeeds(
        conversionId,
        input.positions.map((p) => p.feedId),
        t,
      );
    const { changes } = await run(
      `UPDATE boxes SET label = :label, notes = :notes, version = version + 1, updated_at = :now
       WHERE id = :boxId AND version = :version`,
      {
        boxId,
        version: input.version,
        label: input.label ?? before.label,
        notes: input.notes ?? before.notes,
        now: new Date().toISOString(),
      },
      t,
    );
    if (changes !== 1) throw versionConflict(before);
    if (input.positions) await writePositions(boxId, input.positions, t);
    const after = (await boxesOf(conversionId, t)).find((b) => b.id === boxId)!;
    await recordAudit(t, actor, {
      conversionId,
      action: 'update',
      entityType: 'box',
      entityId: boxId,
      summary: `Changed box ${after.label}`,
      before,
      after,
    });
    return after;
  });
}
