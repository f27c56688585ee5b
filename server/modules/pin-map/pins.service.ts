import type { Transaction } from 'sequelize';
import { cavityName } from '#shared/domain/pin-names.ts';
import type {
  BatchPinRequest,
  BulkPinRequest,
  Pin as PinDto,
  PinChanges,
  UpdatePinRequest,
} from '#shared/schemas/pin-map.schema.ts';
import { db } from '../../db/index.ts';
import { Connector, Feed, Pin } from '../../db/models/index.ts';
import type { Actor } from '../../lib/actor.ts';
import { AppError, notFound, versionConflict } from '../../lib/errors.ts';
import { ConversionJsonCache, type JsonBody } from '../../lib/cached-json.ts';
import { inTransaction } from '../../lib/transaction.ts';
import { beforeAndAfter, changedFields, recordAudit } from '../audit/audit.service.ts';
import {
  conversionChangeCounter,
  findConversionInWorkshop,
  ofConversionInWorkshop,
} from '../conversions/conversions.service.ts';
import { toPinDto } from './pin-dto.ts';
import { wiresFollowPins } from '../harness/wire-links.service.ts';
import { loadsFollowPins } from '../feeds/feed-links.service.ts';

/** Connector by connector in the order they were added, each in face order. */
export const PIN_ORDER: Array<[string, string]> = [
  ['connectorId', 'ASC'],
  ['position', 'ASC'],
];

/** Every pin of a conversion, in connector and face order. Plain rows: this is the grid's big read. */
async function pinsOfConversionInOrder(conversionId: number): Promise<PinDto[]> {
  const rows = await Pin.findAll({ where: { conversionId }, order: PIN_ORDER, raw: true });
  return rows.map(toPinDto);
}

const pinListCache = new ConversionJsonCache();

/**
 * The answer of GET …/pins (`{ pins }`) serialised, with its ETag, made again only when the
 * conversion's change counter has moved since.
 */
export async function pinListBody(actor: Actor, conversionId: number): Promise<JsonBody> {
  const counter = await conversionChangeCounter(actor, conversionId);
  return pinListCache.get(conversionId, counter, async () => ({
    pins: await pinsOfConversionInOrder(conversionId),
  }));
}

async function findPinInWorkshop(
  actor: Actor,
  id: number,
  transaction?: Transaction,
): Promise<Pin> {
  const pin = await Pin.findOne({
    where: { id },
    include: [ofConversionInWorkshop(actor)],
    transaction,
  });
  if (!pin) throw notFound('That pin');
  return pin;
}

/**
 * A linked destination must be a cavity of a vehicle-side connector of the same conversion, and
 * not the pin itself.
 */
async function assertDestinationPins(
  conversionId: number,
  links: Array<{ pinId: number; destinationPinId: number | null | undefined }>,
  transaction: Transaction,
): Promise<void> {
  const wanted = [
    ...new Set(links.map((l) => l.destinationPinId).filter((v): v is number => v != null)),
  ];
  if (wanted.length === 0) return;
  const targets = await Pin.findAll({
    where: { id: wanted, conversionId },
    include: [{ model: Connector, attributes: ['side'], required: true }],
    transaction,
  });
  const vehicleSide = new Set(
    targets
      .filter((t) => (t as Pin & { Connector: Connector }).Connector.side === 'vehicle')
      .map((t) => t.id),
  );
  for (const link of links) {
    if (link.destinationPinId == null) continue;
    if (link.destinationPinId === link.pinId) {
      throw new AppError(
        400,
        'validation_failed',
        'destinationPinId: a pin cannot be its own destination',
        [{ field: 'destinationPinId', message: 'cannot be the pin itself' }],
      );
    }
    if (!vehicleSide.has(link.destinationPinId)) {
      throw new AppError(
        400,
        'validation_failed',
        'destinationPinId: must be a cavity of a vehicle-side connector of this conversion',
        [
          {
            field: 'destinationPinId',
            message: 'must be a cavity of a vehicle-side connector of this conversion',
          },
        ],
      );
    }
  }
}

/** A feed destination must be a feed of the same conversion. */
async function assertDestinationFeeds(
  conversionId: number,
  feedIds: Array<number | null | undefined>,
  transaction: Transaction,
): Promise<void> {
  const wanted = [...new Set(feedIds.filter((v): v is number => v != null))];
  if (wanted.length === 0) return;
  const found = await Feed.count({ where: { id: wanted, conversionId }, transaction });
  if (found !== wanted.length) {
    throw new AppError(
      400,
      'validation_failed',
      'destinationFeedId: must be a feed of this conversion',
      [{ field: 'destinationFeedId', message: 'must be a feed of this conversion' }],
    );
  }
}

/** The pin's current values of the fields `set` names. */
function beforeOf(pin: Pin, set: PinChanges): Record<string, unknown> {
  return Object.fromEntries(Object.keys(set).map((k) => [k, pin.get(k as keyof PinChanges)]));
}

const pinName = (pin: Pin, connector?: Connector | null) =>
  cavityName(connector?.label ?? 'connector', pin.cavity);

/** One pin, against the version the client read: a stale version is a 409 with the current row. */
export async function updatePin(
  actor: Actor,
  pinId: number,
  input: UpdatePinRequest,
): Promise<PinDto> {
  // A copy already stale is refused before queueing for a write turn (versions only grow); the
  // check inside the transaction is the one that counts.
  const seen = await findPinInWorkshop(actor, pinId);
  if (seen.version !== input.version) throw versionConflict(toPinDto(seen));
  return inTransaction(db(), async (t) => {
    const pin = await findPinInWorkshop(actor, pinId, t);
    if (pin.version !== input.version) throw versionConflict(toPinDto(pin));
    const { version: _version, ...set } = input;
    await assertDestinationPins(
      pin.conversionId,
      [{ pinId, destinationPinId: set.destinationPinId }],
      t,
    );
    await assertDestinationFeeds(pin.conversionId, [set.destinationFeedId], t);
    const changes = changedFields<PinChanges>(pin, set);
    // Saving the same values again is not a change: no new version, nothing in the audit trail.
    if (Object.keys(changes).length === 0) return toPinDto(pin);
    const feedBefore = new Map([[pin.id, pin.destinationFeedId ?? null]]);
    const pinBefore = new Map([[pin.id, pin.destinationPinId ?? null]]);
    pin.set(set);
    await pin.save({ transaction: t });
    await loadsFollowPins([pin], feedBefore, t);
    await wiresFollowPins(actor, [pin], pinBefore, t);
    const connector = await Connector.findByPk(pin.connectorId, { transaction: t });
    await recordAudit(t, actor, {
      conversionId: pin.conversionId,
      action: 'update',
      entityType: 'pin',
      entityId: pin.id,
      summary: `Changed pin ${pinName(pin, connector)}: ${Object.keys(changes).join(', ')}`,
      ...beforeAndAfter(changes),
    });
    return toPinDto(pin);
  });
}

async function pinsOfConversion(
  conversionId: number,
  ids: number[],
  t: Transaction,
): Promise<Map<number, Pin>> {
  const unique = [...new Set(ids)];
  const pins = await Pin.findAll({ where: { id: unique, conversionId }, transaction: t });
  if (pins.length !== unique.length) {
    const found = new Set(pins.map((p) => p.id));
    const missing = unique.filter((id) => !found.has(id));
    throw new AppError(
      404,
      'not_found',
      `Pins ${missing.slice(0, 10).join(', ')} are not in this conversion.`,
      {
        missing,
      },
    );
  }
  return new Map(pins.map((p) => [p.id, p]));
}

/** The same values on many pins (a selection), all or nothing. */
export async function bulkUpdatePins(
  actor: Actor,
  conversionId: number,
  input: BulkPinRequest,
): Promise<PinDto[]> {
  return inTransaction(db(), async (t) => {
    await findConversionInWorkshop(actor, conversionId, t);
    const pins = await pinsOfConversion(conversionId, input.pinIds, t);
    await assertDestinationPins(
      conversionId,
      [...pins.keys()].map((pinId) => ({ pinId, destinationPinId: input.set.destinationPinId })),
      t,
    );
    await assertDestinationFeeds(conversionId, [input.set.destinationFeedId], t);
    const before: Record<number, Record<string, unknown>> = {};
    const feedBefore = new Map([...pins.values()].map((p) => [p.id, p.destinationFeedId ?? null]));
    const pinBefore = new Map([...pins.values()].map((p) => [p.id, p.destinationPinId ?? null]));
    for (const pin of pins.values()) {
      if (Object.keys(changedFields<PinChanges>(pin, input.set)).length === 0) continue;
      before[pin.id] = beforeOf(pin, input.set);
      pin.set(input.set);
      await pin.save({ transaction: t });
    }
    await loadsFollowPins(pins.values(), feedBefore, t);
    await wiresFollowPins(actor, pins.values(), pinBefore, t);
    await recordAudit(t, actor, {
      conversionId,
      action: 'bulk_update',
      entityType: 'pin',
      summary: `Set ${Object.keys(input.set).join(', ')} on ${pins.size} pins`,
      before,
      after: { pinIds: [...pins.keys()], set: input.set },
    });
    return [...pins.values()].map(toPinDto);
  });
}

/**
 * Different values on several pins, each checked against the version the client read (paste,
 * fill down, undo). Any stale row refuses the whole batch with 409 and the current rows.
 */
export async function batchUpdatePins(
  actor: Actor,
  conversionId: number,
  input: BatchPinRequest,
): Promise<PinDto[]> {
  return inTransaction(db(), async (t) => {
    await findConversionInWorkshop(actor, conversionId, t);
    const pins = await pinsOfConversion(
      conversionId,
      input.changes.map((c) => c.id),
      t,
    );
    const stale = input.changes.filter((c) => pins.get(c.id)!.version !== c.version);
    if (stale.length) {
      throw new AppError(
        409,
        'version_conflict',
        `${stale.length} of these pins changed since you loaded them. Nothing was saved; the current rows are attached.`,
        { current: stale.map((c) => toPinDto(pins.get(c.id)!)) },
      );
    }
    await assertDestinationPins(
      conversionId,
      input.changes.map((c) => ({ pinId: c.id, destinationPinId: c.set.destinationPinId })),
      t,
    );
    await assertDestinationFeeds(
      conversionId,
      input.changes.map((c) => c.set.destinationFeedId),
      t,
    );
    const before: Record<number, Record<string, unknown>> = {};
    const after: Record<number, Record<string, unknown>> = {};
    const saved = new Map<number, Pin>();
    const feedBefore = new Map([...pins.values()].map((p) => [p.id, p.destinationFeedId ?? null]));
    const pinBefore = new Map([...pins.values()].map((p) => [p.id, p.destinationPinId ?? null]));
    for (const change of input.changes) {
      const pin = pins.get(change.id)!;
      const changes = beforeAndAfter(changedFields<PinChanges>(pin, change.set));
      saved.set(pin.id, pin);
      if (Object.keys(changes.after).length === 0) continue;
      before[pin.id] = { ...before[pin.id], ...changes.before };
      after[pin.id] = { ...after[pin.id], ...changes.after };
      pin.set(change.set);
      await pin.save({ transaction: t });
    }
    await loadsFollowPins(saved.values(), feedBefore, t);
    await wiresFollowPins(actor, saved.values(), pinBefore, t);
    await recordAudit(t, actor, {
      conversionId,
      action: 'batch_update',
      entityType: 'pin',
      summary: `Changed ${saved.size} pins at once`,
      before,
      after,
    });
    return [...saved.values()].map(toPinDto);
  });
}
