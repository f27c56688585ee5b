import { checkReport } from '#shared/domain/checks/run-checks.ts';
import { loadConversionSnapshot } from '../../server/modules/checks/snapshot.service.ts';
import { benchContext } from '../lib/context.ts';
import { generateFeeds, replacePinMap } from '../lib/generate.ts';
import { measure, type BenchRow } from '../lib/report.ts';
import { alternate, num, ratios, spread, times } from '../lib/stats.ts';

/**
 * P2: the check service on 2,000 pins and 300 feeds (load + every check) beside loading the same
 * data without checking, alternating round by round after a warm-up.
 */
export async function checksBench(rounds: number): Promise<BenchRow[]> {
  const ctx = await benchContext();
  try {
    const conversionId = ctx.demo.conversions.draft;
    await replacePinMap(conversionId, 2000);
    await generateFeeds(conversionId, 300);
    const actor = { workshopId: ctx.demo.workshopId };
    let findings = 0;
    const loadOnly = () => measure(() => loadConversionSnapshot(actor, conversionId));
    const checked = () =>
      measure(async () => {
        const snapshot = await loadConversionSnapshot(actor, conversionId);
        findings = checkReport(snapshot, { sizeUnit: 'mm2' }).findings.length;
      });
    await checked();
    await loadOnly();
    const { product: ours, baseline: base } = await alternate(
      Math.max(rounds, 5),
      async () => (await checked()).ms,
      async () => (await loadOnly()).ms,
    );
    const ratio = ratios(ours, base);
    return [
      {
        id: 'P2',
        measure: `checks on 2,000 pins / 300 feeds (${findings} findings) ÷ loading the same data (ms)`,
        figure: `${times(ratio)} (${num(spread(ours).median)} vs ${num(spread(base).median)} ms)`,
        goal: '≤ 2×',
        met: ratio.median <= 2,
      },
    ];
  } finally {
    await ctx.close();
  }
}
