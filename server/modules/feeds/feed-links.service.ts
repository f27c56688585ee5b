import { literal, Op, type Transaction } from 'sequelize';
import { Feed, FeedLoad, Pin } from '../../db/models/index.ts';

/**
 * A pin joined to a new feed is one fact with two faces: the pin's destination and the feed's list
 * of loads. Whichever side a person edits, the other follows in the same transaction, so the two
 * never disagree (which left a power pin "joined without a fuse upstream" while the feed listed it).
 */

/** Moves a feed's version on, so a form holding its old loads gets a 409 instead of undoing this. */
async function touchFeeds(feedIds: Iterable<number>, t: Transaction) {
  const ids = [...new Set(feedIds)];
  if (!ids.length) return;
  const feeds = await Feed.findAll({ where: { id: ids }, transaction: t });
  for (const feed of feeds) {
    feed.changed('updatedAt', true);
    await feed.save({ transaction: t });
  }
}

/** A load row for a pin that was just joined to a feed from the pin map. */
async function addLoadFor(
  pin: Pick<Pin, 'id' | 'function' | 'loadCurrentA'>,
  feedId: number,
  t: Transaction,
) {
  const existing = await FeedLoad.findOne({ where: { feedId, pinId: pin.id }, transaction: t });
  if (existing) return;
  const position = await FeedLoad.count({ where: { feedId }, transaction: t });
  await FeedLoad.create(
    {
      feedId,
      pinId: pin.id,
      name: pin.function.replace(/\s+/g, ' ').trim().slice(0, 80),
      currentA: pin.loadCurrentA ?? 0,
      continuous: true,
      position,
    },
    { transaction: t },
  );
}

/**
 * After pins were saved: a pin whose destination became a feed is one of that feed's loads, and a
 * pin that left a feed is no longer one of its loads. `before` holds each pin's feed before the save.
 */
export async function loadsFollowPins(
  pins: Iterable<Pin>,
  before: Map<number, number | null>,
  t: Transaction,
): Promise<void> {
  const touched: number[] = [];
  for (const pin of pins) {
    const from = before.get(pin.id) ?? null;
    const to = pin.destinationFeedId ?? null;
    if (from === to) continue;
    // A pin has one destination: it leaves every other feed's loads.
    const left = await FeedLoad.findAll({
      where: { pinId: pin.id, ...(to != null ? { feedId: { [Op.ne]: to } } : {}) },
      transaction: t,
    });
    for (const load of left) {
      touched.push(load.feedId);
      await load.destroy({ transaction: t });
    }
    if (to != null) {
      await addLoadFor(pin, to, t);
      touched.push(to);
    }
  }
  await touchFeeds(touched, t);
}

/**
 * After a feed's loads were replaced: each pin listed now has the feed as its destination (and
 * leaves any other feed's loads); a pin taken off the list that pointed at the feed points nowhere.
 */
export async function pinsFollowLoads(
  conversionId: number,
  feedId: number,
  loadPinIds: Array<number | null>,
  t: Transaction,
): Promise<void> {
  const listed = new Set(loadPinIds.filter((id): id is number => id != null));
  const pins = await Pin.findAll({
    where: {
      conversionId,
      [Op.or]: [{ id: [...listed] }, { destinationFeedId: feedId }],
    },
    transaction: t,
  });
  const touched: number[] = [];
  for (const pin of pins) {
    if (listed.has(pin.id)) {
      if (pin.destinationFeedId === feedId) continue;
      if (pin.destinationFeedId != null) {
        await FeedLoad.destroy({
          where: { feedId: pin.destinationFeedId, pinId: pin.id },
          transaction: t,
        });
        touched.push(pin.destinationFeedId);
      }
      pin.set({ destinationFeedId: feedId, destinationPinId: null, destination: '' });
      await pin.save({ transaction: t });
    } else if (pin.destinationFeedId === feedId) {
      pin.set({ destinationFeedId: null });
      await pin.save({ transaction: t });
    }
  }
  await touchFeeds(
    touched.filter((id) => id !== feedId),
    t,
  );
}

/**
 * After pins were written in bulk (a pinout import): the feed loads of these connectors' pins are
 * made to agree with the pins' destinations. Pins are the side the import edited.
 */
export async function loadsFollowConnectorPins(
  connectorIds: number[],
  t: Transaction,
): Promise<void> {
  if (!connectorIds.length) return;
  // Only the pins joined to a feed, and the loads of any pin of these connectors: an import of
  // 20,000 pins passes through here, most of them joined to nothing.
  const pins = await Pin.findAll({
    where: { connectorId: connectorIds, destinationFeedId: { [Op.ne]: null } },
    attributes: ['id', 'function', 'loadCurrentA', 'destinationFeedId'],
    raw: true,
    transaction: t,
  });
  const ids = connectorIds.map((id) => Number(id)).filter(Number.isSafeInteger);
  const loads = await FeedLoad.findAll({
    where: {
      pinId: {
        [Op.in]: literal(`(SELECT id FROM pins WHERE connector_id IN (${ids.join(', ')}))`),
      },
    },
    transaction: t,
  });
  // A load's pin that is not among those joined to a feed is joined to none.
  const pinById = new Map(pins.map((p) => [p.id, p]));
  const loadKeys = new Set(loads.map((l) => `${l.pinId}:${l.feedId}`));
  const touched: number[] = [];
  for (const load of loads) {
    if (pinById.get(load.pinId!)?.destinationFeedId === load.feedId) continue;
    touched.push(load.feedId);
    await load.destroy({ transaction: t });
  }
  for (const pin of pins) {
    if (pin.destinationFeedId == null) continue;
    if (loadKeys.has(`${pin.id}:${pin.destinationFeedId}`)) continue;
    await addLoadFor(pin, pin.destinationFeedId, t);
    touched.push(pin.destinationFeedId);
  }
  await touchFeeds(touched, t);
}
