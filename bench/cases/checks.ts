import { checkReport } from '#shared/domain/checks/run-checks.ts';
import { Feed, FeedLoad, Pin } from '../../server/db/models/index.ts';
import { loadConversionSnapshot } from '../../server/modules/checks/snapshot.service.ts';
import { benchContext } from '../lib/context.ts';
import { measure, type BenchRow } from '../lib/report.ts';
import { generatePinMap } from './pins-list.ts';

/** 300 feeds, each with two loads, a relay on every third; every fifth pin joined to a feed. */
async function generateFeeds(conversionId: number, count: number) {
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

/** The check service on 2,000 pins and 300 feeds, beside loading the same data without checking. */
export async function checksBench(): Promise<BenchRow[]> {
  const ctx = await benchContext();
  try {
    const conversionId = ctx.demo.conversions.draft;
    await generatePinMap(conversionId, 2000);
    await generateFeeds(conversionId, 300);
    const actor = { workshopId: ctx.demo.workshopId };
    const runs = 5;
    // Warm up both paths once so neither pays for the first query plans or JIT.
    checkReport(await loadConversionSnapshot(actor, conversionId), { sizeUnit: 'mm2' });
    const loadOnly = await measure(async () => {
      for (let i = 0; i < runs; i++) await loadConversionSnapshot(actor, conversionId);
    });
    let findings = 0;
    const checked = await measure(async () => {
      for (let i = 0; i < runs; i++) {
        const snapshot = await loadConversionSnapshot(actor, conversionId);
        findings = checkReport(snapshot, { sizeUnit: 'mm2' }).findings.length;
      }
    });
    const name = `checks, 2,112 pins + 305 feeds (${findings} findings), mean of ${runs}`;
    return [
      {
        case: name,
        subject: 'load + run every check',
        figures: { ms: checked.ms / runs, 'peak heap MB': checked.peakHeapMb },
      },
      {
        case: name,
        subject: 'load the same data, no checks',
        figures: { ms: loadOnly.ms / runs, 'peak heap MB': loadOnly.peakHeapMb },
      },
      {
        case: name,
        subject: 'checking alone (difference)',
        figures: { ms: (checked.ms - loadOnly.ms) / runs },
      },
    ];
  } finally {
    await ctx.close();
  }
}
