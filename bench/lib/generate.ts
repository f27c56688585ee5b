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

/** Rows of the import bench's pinout and cavities per generated connector. */
export const IMPORT_ROWS = 5000;
const IMPORT_PER_CONNECTOR = 400;
const IMPORT_COLOURS = ['BU/WH', 'RD', 'GN/YE', 'BK', 'VT/WH', 'OG/BK'];
const IMPORT_DISPOSITIONS = ['keep', 'De-pin', 'cut', 'extend', 'join'];

/** A 5,000-row pinout over 13 connectors (a connector holds at most 400 cavities), every column filled. */
export function generatePinoutCsv(rows = IMPORT_ROWS): string {
  let csv =
    '\uFEFFconnector,cavity,function,signal_class,colour,size_mm2,awg,insulation_c,disposition,destination,feed,run_length_m,load_current_a,notes\r\n';
  for (let i = 0; i < rows; i++) {
    const connector = `G${Math.floor(i / IMPORT_PER_CONNECTOR) + 1}`;
    const cavity = (i % IMPORT_PER_CONNECTOR) + 1;
    csv +=
      `${connector},${cavity},"Generated circuit ${i + 1}, bench",sensor_signal,${IMPORT_COLOURS[i % IMPORT_COLOURS.length]},0.5,,105,` +
      `${IMPORT_DISPOSITIONS[i % IMPORT_DISPOSITIONS.length]},Bench point ${i},,1.5,0.1,"Row ${i + 1}; quoted ""notes"""\r\n`;
  }
  return csv;
}

/**
 * The state each import round starts from: every pin of the conversion gone, one blank pin per
 * generated connector (each connector starts with one cavity, so applying confirms that it grows).
 */
export async function resetImportPins(conversionId: number, rows = IMPORT_ROWS) {
  await Pin.destroy({ where: { conversionId } });
  await Connector.destroy({ where: { conversionId } });
  for (let c = 0; c * IMPORT_PER_CONNECTOR < rows; c++) {
    const connector = await Connector.create({
      conversionId,
      label: `G${c + 1}`,
      side: 'ecu',
      cavityCount: 1,
      rows: 1,
      columns: 1,
    });
    await Pin.create({ conversionId, connectorId: connector.id, cavity: '1', position: 0 });
  }
  return Pin.count({ where: { conversionId } });
}
