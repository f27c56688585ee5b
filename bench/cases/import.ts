import Papa from 'papaparse';
import request from 'supertest';
import { Connector, Pin } from '../../server/db/models/index.ts';
import { benchContext } from '../lib/context.ts';
import { measure, type BenchRow } from '../lib/report.ts';
import { alternate, num, ratios, spread, times } from '../lib/stats.ts';

const ROWS = 5000;
const PER_CONNECTOR = 400;
const COLOURS = ['BU/WH', 'RD', 'GN/YE', 'BK', 'VT/WH', 'OG/BK'];
const DISPOSITIONS = ['keep', 'De-pin', 'cut', 'extend', 'join'];

/** A 5,000-row pinout over 13 connectors (a connector holds at most 400 cavities), every column filled. */
export function generatePinoutCsv(rows = ROWS): string {
  let csv =
    '\uFEFFconnector,cavity,function,signal_class,colour,size_mm2,awg,insulation_c,disposition,destination,feed,run_length_m,load_current_a,notes\r\n';
  for (let i = 0; i < rows; i++) {
    const connector = `G${Math.floor(i / PER_CONNECTOR) + 1}`;
    const cavity = (i % PER_CONNECTOR) + 1;
    csv +=
      `${connector},${cavity},"Generated circuit ${i + 1}, bench",sensor_signal,${COLOURS[i % COLOURS.length]},0.5,,105,` +
      `${DISPOSITIONS[i % DISPOSITIONS.length]},Bench point ${i},,1.5,0.1,"Row ${i + 1}; quoted ""notes"""\r\n`;
  }
  return csv;
}

/** Every pin of the conversion gone, one blank pin per connector: the state each round starts from. */
async function resetPins(conversionId: number) {
  await Pin.destroy({ where: { conversionId } });
  await Connector.destroy({ where: { conversionId } });
  for (let c = 0; c * PER_CONNECTOR < ROWS; c++) {
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
}

/**
 * P4: a 5,000-row CSV import through HTTP (preview, then applied in one transaction) beside
 * papaparse parsing the same text alone, papaparse timed in every round, the order alternating.
 */
export async function importCsv(rounds: number): Promise<BenchRow[]> {
  const ctx = await benchContext();
  try {
    const conversionId = ctx.demo.conversions.draft;
    const csv = generatePinoutCsv();
    const file = Buffer.from(csv, 'utf8');
    const post = (dryRun: boolean) =>
      request(ctx.app)
        // The generated connectors start with one cavity: applying confirms that they grow.
        .post(`/api/conversions/${conversionId}/import${dryRun ? '?dryRun=1' : '?grow=1'}`)
        .set(ctx.auth)
        .attach('file', file, { filename: 'bench.csv', contentType: 'text/csv' });
    const papa = async () => {
      const m = await measure(() => Papa.parse<string[]>(csv, { header: false }));
      if (m.result.data.length < ROWS) throw new Error('papaparse read too few rows');
      return m.ms;
    };
    /** The preview and the apply a person makes, one after the other, on a freshly reset map. */
    const importOnce = async () => {
      await resetPins(conversionId);
      const preview = await measure(() => post(true));
      if (preview.result.status !== 200 || preview.result.body.errors.length) {
        throw new Error(
          `preview failed: ${preview.result.status} ${JSON.stringify(preview.result.body.errors?.slice(0, 3))}`,
        );
      }
      const apply = await measure(() => post(false));
      if (apply.result.status !== 200 || apply.result.body.imported !== ROWS) {
        throw new Error(
          `import failed: ${apply.result.status} ${JSON.stringify(apply.result.body).slice(0, 300)}`,
        );
      }
      const stored = await Pin.count({ where: { conversionId } });
      if (stored !== ROWS) throw new Error(`expected ${ROWS} pins, found ${stored}`);
      return { preview: preview.ms, apply: apply.ms, heap: apply.peakHeapMb };
    };
    // Warm-up of both, not counted.
    await papa();
    await importOnce();
    const { product: ours, baseline: parser } = await alternate(rounds, importOnce, papa);
    const apply = ratios(
      ours.map((o) => o.apply),
      parser,
    );
    const preview = ratios(
      ours.map((o) => o.preview),
      parser,
    );
    const kb = (file.length / 1024).toFixed(0);
    return [
      {
        id: 'P4',
        measure: `${ROWS.toLocaleString('en')}-row CSV (${kb} KB) import, applied, ÷ papaparse alone (ms)`,
        figure: `${times(apply)} (${num(spread(ours.map((o) => o.apply)).median)} vs ${num(spread(parser).median)} ms; peak heap ${num(Math.max(...ours.map((o) => o.heap)))} MB)`,
        goal: '≤ 3× (≤ 5× to close)',
        met: apply.median <= 5,
      },
      {
        id: 'P4',
        measure: 'the same file, preview (dry run) ÷ papaparse alone',
        figure: `${times(preview)} (${num(spread(ours.map((o) => o.preview)).median)} ms)`,
        goal: '–',
        met: null,
      },
    ];
  } finally {
    await ctx.close();
  }
}
