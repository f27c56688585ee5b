import type { Transaction } from 'sequelize';
import type {
  CreateFeedRequest,
  Feed as FeedDto,
  UpdateFeedRequest,
} from '#shared/schemas/feeds.schema.ts';
import { labelKey } from '#shared/domain/labels.ts';
import { db } from '../../db/index.ts';
import { Feed, FeedLoad, Pin } from '../../db/models/index.ts';
import type { Actor } from '../../lib/actor.ts';
import { AppError, notFound, versionConflict } from '../../lib/errors.ts';
import { inTransaction, inTransactionOf } from '../../lib/transaction.ts';
import { recordAudit } from '../audit/audit.service.ts';
import { pinsFollowLoads } from './feed-links.service.ts';
import { ConversionJsonCache, type JsonBody } from '../../lib/cached-json.ts';
import {
  conversionChangeCounter,
  findConversionInWorkshop,
} from '../conversions/conversions.service.ts';

type FeedWithLoads = Feed & { loads?: FeedLoad[] };

export function toFeedDto(feed: FeedWithLoads): FeedDto {
  return {
    id: feed.id,
    conversionId: feed.conversionId,
    name: feed.name,
    source: feed.source,
    sourceFeedId: feed.sourceFeedId,
    fuseA: feed.fuseA,
    fuseType: feed.fuseType,
    unfusedLengthMm: feed.unfusedLengthMm,
    fuseSheathed: Boolean(feed.fuseSheathed),
    relay: feed.hasRelay
      ? {
          contactRatingA: feed.relayContactRatingA ?? 0,
          coilCurrentA: feed.relayCoilCurrentA ?? 0,
          coilPinId: feed.relayCoilPinId,
          coilResistanceOhm: feed.relayCoilResistanceOhm,
        }
      : null,
    wire: {
      sizeMm2: feed.wireSizeMm2,
      insulationRatingC: feed.wireInsulationRatingC,
      lengthM: feed.wireLengthM,
      zone: feed.wireZone,
      bundled: feed.wireBundled,
      returnPath: feed.wireReturnPath,
      colour: feed.wireColour,
      connections: feed.wireConnections,
    },
    loads: [...(feed.loads ?? [])]
      .sort((a, b) => a.position - b.position)
      .map((l) => ({
        id: l.id,
        pinId: l.pinId,
        name: l.name,
        currentA: l.currentA,
        continuous: l.continuous,
        kind: l.kind,
      })),
    dropClass: feed.dropClass,
    dropLimitPct: feed.dropLimitPct,
    notes: feed.notes,
    version: feed.version,
  };
}

/** The columns of a feed row from the API's nested shape. */
function columnsOf(input: Partial<CreateFeedRequest>) {
  const columns: Partial<Feed['_creationAttributes']> = {};
  if (input.name !== undefined) columns.name = input.name;
  if (input.source !== undefined) columns.source = input.source;
  if (input.sourceFeedId !== undefined) columns.sourceFeedId = input.sourceFeedId;
  if (input.fuseA !== undefined) columns.fuseA = input.fuseA;
  if (input.fuseType !== undefined) columns.fuseType = input.fuseType;
  if (input.unfusedLengthMm !== undefined) columns.unfusedLengthMm = input.unfusedLengthMm;
  if (input.fuseSheathed !== undefined) columns.fuseSheathed = input.fuseSheathed;
  if (input.relay !== undefined) {
    columns.hasRelay = input.relay !== null;
    columns.relayContactRatingA = input.relay?.contactRatingA ?? null;
    columns.relayCoilCurrentA = input.relay?.coilCurrentA ?? null;
    columns.relayCoilPinId = input.relay?.coilPinId ?? null;
    columns.relayCoilResistanceOhm = input.relay?.coilResistanceOhm ?? null;
  }
  if (input.wire !== undefined) {
    columns.wireSizeMm2 = input.wire.sizeMm2;
    columns.wireInsulationRatingC = input.wire.insulationRatingC;
    columns.wireLengthM = input.wire.lengthM;
    columns.wireZone = input.wire.zone;
    columns.wireBundled = input.wire.bundled;
    columns.wireReturnPath = input.wire.returnPath;
    columns.wireColour = input.wire.colour;
    if (input.wire.connections !== undefined) columns.wireConnections = input.wire.connections;
  }
  if (input.dropClass !== undefined) columns.dropClass = input.dropClass;
  if (input.dropLimitPct !== undefined) columns.dropLimitPct = input.dropLimitPct;
  if (input.notes !== undefined) columns.notes = input.notes;
  return columns;
}

const invalid = (field: string, message: string) =>
  new AppError(400, 'validation_failed', `${field}: ${message}`, [{ field, message }]);

/**
 * References must stay inside the conversion: the source feed (and no loop of relay outputs), the
 * relay's coil pin and each load's pin. The name must be unique in the conversion.
 */
async function assertReferences(
  conversionId: number,
  feedId: number | null,
  feed: { name: string; sourceFeedId: number | null; relayCoilPinId: number | null },
  loads: Array<{ pinId: number | null }>,
  t: Transaction,
) {
  // Compared by look-alike key, so a name that reads the same as another feed's is refused too.
  const key = labelKey(feed.name);
  const named = await Feed.findAll({
    where: { conversionId },
    attributes: ['id', 'name'],
    transaction: t,
  });
  const clash = named.find((f) => f.id !== feedId && labelKey(f.name) === key);
  if (clash) {
    throw new AppError(
      409,
      'duplicate',
      clash.name === feed.name
        ? `This conversion already has a feed named "${feed.name}".`
        : `"${feed.name}" looks the same as feed "${clash.name}" in this conversion; choose a name that reads differently.`,
      [{ field: 'name', message: 'is already used in this conversion' }],
    );
  }
  if (feed.sourceFeedId != null) {
    const all = await Feed.findAll({
      where: { conversionId },
      attributes: ['id', 'sourceFeedId'],
      transaction: t,
    });
    const byId = new Map(all.map((f) => [f.id, f]));
    if (!byId.has(feed.sourceFeedId))
      throw invalid('sourceFeedId', 'must be a feed of this conversion');
    // Walk up the chain of relay outputs: it must not come back to this feed.
    const seen = new Set<number>();
    for (
      let at: number | null = feed.sourceFeedId;
      at != null;
      at = byId.get(at)?.sourceFeedId ?? null
    ) {
      if (at === feedId || seen.has(at))
        throw invalid('sourceFeedId', 'would make a loop of feeds powering each other');
      seen.add(at);
    }
  }
  const pinIds = [
    ...new Set(
      [feed.relayCoilPinId, ...loads.map((l) => l.pinId)].filter((v): v is number => v != null),
    ),
  ];
  if (pinIds.length) {
    const found = await Pin.count({ where: { id: pinIds, conversionId }, transaction: t });
    if (found !== pinIds.length)
      throw invalid('loads', 'every pin must be a pin of this conversion');
  }
}

/** A feed with its loads; the caller has already checked the conversion's workshop. */
function feedWithLoads(
  conversionId: number,
  feedId: number,
  t?: Transaction,
): Promise<FeedWithLoads | null> {
  return Feed.findOne({
    where: { id: feedId, conversionId },
    include: [{ model: FeedLoad, as: 'loads' }],
    transaction: t,
  });
}

async function findFeed(
  actor: Actor,
  conversionId: number,
  feedId: number,
  t?: Transaction,
): Promise<FeedWithLoads> {
  await findConversionInWorkshop(actor, conversionId, t);
  const feed = await feedWithLoads(conversionId, feedId, t);
  if (!feed) throw notFound('That feed');
  return feed;
}

async function replaceLoads(feedId: number, loads: CreateFeedRequest['loads'], t: Transaction) {
  await FeedLoad.destroy({ where: { feedId }, transaction: t });
  await FeedLoad.bulkCreate(
    loads.map((l, position) => ({ ...l, feedId, position })),
    { transaction: t },
  );
}

const feedListCache = new ConversionJsonCache();

/** The answer of GET …/feeds (`{ feeds }`) serialised, made again only after a change. */
export async function feedListBody(actor: Actor, conversionId: number): Promise<JsonBody> {
  const counter = await conversionChangeCounter(actor, conversionId);
  return feedListCache.get(conversionId, counter, async () => ({
    feeds: await feedsOfConversion(conversionId),
  }));
}

async function feedsOfConversion(conversionId: number): Promise<FeedDto[]> {
  const feeds = await Feed.findAll({
    where: { conversionId },
    include: [{ model: FeedLoad, as: 'loads' }],
    order: [['id', 'ASC']],
  });
  return feeds.map(toFeedDto);
}

export async function getFeed(
  actor: Actor,
  conversionId: number,
  feedId: number,
): Promise<FeedDto> {
  return toFeedDto(await findFeed(actor, conversionId, feedId));
}

export async function createFeed(
  actor: Actor,
  conversionId: number,
  input: CreateFeedRequest,
  transaction?: Transaction,
): Promise<FeedDto> {
  const work = async (t: Transaction) => {
    await findConversionInWorkshop(actor, conversionId, t);
    await assertReferences(
      conversionId,
      null,
      {
        name: input.name,
        sourceFeedId: input.sourceFeedId,
        relayCoilPinId: input.relay?.coilPinId ?? null,
      },
      input.loads,
      t,
    );
    const feed = await Feed.create(
      { ...(columnsOf(input) as Feed['_creationAttributes']), conversionId },
      { transaction: t },
    );
    await replaceLoads(feed.id, input.loads, t);
    await pinsFollowLoads(
      conversionId,
      feed.id,
      input.loads.map((l) => l.pinId),
      t,
    );
    const created = toFeedDto((await feedWithLoads(conversionId, feed.id, t))!);
    await recordAudit(t, actor, {
      conversionId,
      action: 'create',
      entityType: 'feed',
      entityId: feed.id,
      summary: `Added feed "${feed.name}"`,
      after: created,
    });
    return created;
  };
  return inTransactionOf(db(), transaction, work);
}

export async function updateFeed(
  actor: Actor,
  conversionId: number,
  feedId: number,
  input: UpdateFeedRequest,
): Promise<FeedDto> {
  return inTransaction(db(), async (t) => {
    const feed = await findFeed(actor, conversionId, feedId, t);
    if (feed.version !== input.version) throw versionConflict(toFeedDto(feed));
    const before = toFeedDto(feed);
    const { version: _version, loads, ...fields } = input;
    const merged = { ...before, ...fields };
    if ((merged.source === 'relay_output') !== (merged.sourceFeedId != null)) {
      throw invalid(
        'sourceFeedId',
        'give the source feed when, and only when, the source is a relay output',
      );
    }
    await assertReferences(
      conversionId,
      feedId,
      {
        name: merged.name,
        sourceFeedId: merged.sourceFeedId,
        relayCoilPinId: merged.relay?.coilPinId ?? null,
      },
      loads ?? before.loads,
      t,
    );
    feed.set(columnsOf(fields));
    // Loads live in their own table: the version must move even when only they change.
    feed.changed('updatedAt', true);
    await feed.save({ transaction: t });
    if (loads) {
      await replaceLoads(feedId, loads, t);
      await pinsFollowLoads(
        conversionId,
        feedId,
        loads.map((l) => l.pinId),
        t,
      );
    }
    const after = toFeedDto((await feedWithLoads(conversionId, feedId, t))!);
    await recordAudit(t, actor, {
      conversionId,
      action: 'update',
      entityType: 'feed',
      entityId: feedId,
      summary: `Changed feed "${after.name}"`,
      before,
      after,
    });
    return after;
  });
}

export async function deleteFeed(
  actor: Actor,
  conversionId: number,
  feedId: number,
): Promise<void> {
  await inTransaction(db(), async (t) => {
    const feed = await findFeed(actor, conversionId, feedId, t);
    const downstream = await Feed.findAll({
      where: { conversionId, sourceFeedId: feedId },
      transaction: t,
    });
    if (downstream.length) {
      throw new AppError(
        409,
        'in_use',
        `${downstream.map((f) => `"${f.name}"`).join(', ')} take their power from this feed's relay; change them first.`,
      );
    }
    const before = toFeedDto(feed);
    await feed.destroy({ transaction: t });
    await recordAudit(t, actor, {
      conversionId,
      action: 'delete',
      entityType: 'feed',
      entityId: feedId,
      summary: `Removed feed "${before.name}"`,
      before,
    });
  });
}
