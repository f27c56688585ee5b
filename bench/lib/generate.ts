import { Connector, Feed, FeedLoad, Pin } from '../../server/db/models/index.ts';

/** Replaces the conversion's connectors and pins with `pinCount` generated pins. */
export async function replacePinMap(conversionId: number, pinCount: number) {
  await Pin.destroy({ where: { conversionId } });
  await Connector.destroy({ where: { conversionId } });
  await generatePinMap(conversionId, pinCount);
}

/** A conversion of `pinCount` pins on 100-cavity connectors, every pin filled in. */
export async function generatePinMap(conversionId: number, pinCount: number) {
  const perConnector = 100;
  for (let c = 0; c * perConnector < pinCount; c++) {
    const count = Math.min(perConnector, pinCount - c * perConnector);
    const connector = await Connector.create({
      conversionId,
      label: `G${c + 1}`,
      side: c === 0 ? 'vehicle' : 'ecu',
      cavityCount: count,
      rows: 4,
      columns: Math.ceil(count / 4),
    });
    await Pin.bulkCreate(
      Array.from({ length: count }, (_, i) => ({
        conversionId,
        connectorId: connector.id,
        cavity: String(i + 1),
        position: i,
        function: `Generated circuit ${c + 1}.${i + 1}`,
        signalClass: 'sensor_signal' as const,
        colour: 'BU/WH',
        sizeMm2: 0.5,
        insulationRatingC: 105,
        disposition: 'keep' as const,
        destination: `Bench test point ${i}`,
        runLengthM: 1.5,
        loadCurrentA: 0.1,
      })),
    );
  }
}

/** 300 feeds, each with two loads, a relay on every third; every fifth pin joined to a feed. */
export async function generateFeeds(conversionId: number, count: number) {
  const pins = await Pin.findAll({
    where: { conversionId },
    attributes: ['id'],
    order: [['id', 'ASC']],
  });
  for (let i = 0; i < count; i++) {
    const feed = await Feed.create({
      conversionId,
      name: `Generated feed ${i + 1}`,
      source: i % 2 ? 'battery' : 'ignition',
      sourceFeedId: null,
      fuseA: [5, 10, 15, 20][i % 4]!,
      hasRelay: i % 3 === 0,
      relayContactRatingA: i % 3 === 0 ? 30 : null,
      relayCoilCurrentA: i % 3 === 0 ? 0.15 : null,
      relayCoilPinId: null,
      wireSizeMm2: [0.75, 1, 1.5, 2.5][i % 4]!,
      wireInsulationRatingC: 105,
      wireLengthM: 1 + (i % 5),
      wireZone: i % 2 ? 'cabin' : 'engine_bay',
      wireBundled: 1 + (i % 4),
      wireReturnPath: i % 2 ? 'chassis' : 'wire',
      wireColour: 'RD',
      dropClass: i % 4 === 0 ? 'critical' : 'general',
      dropLimitPct: null,
    });
    await FeedLoad.bulkCreate([
      {
        feedId: feed.id,
        pinId: null,
        name: 'Load A',
        currentA: 2 + (i % 6),
        continuous: true,
        position: 0,
      },
      { feedId: feed.id, pinId: null, name: 'Load B', currentA: 1, continuous: false, position: 1 },
    ]);
    const joined = pins
      .filter((_, j) => j % 5 === 0 && Math.floor(j / 5) % count === i)
      .map((p) => p.id);
    if (joined.length)
      await Pin.update(
        { disposition: 'join', destinationFeedId: feed.id, signalClass: 'power_feed' },
        { where: { id: joined } },
      );
  }
}
