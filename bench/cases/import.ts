import Papa from 'papaparse';
import request from 'supertest';
import { Connector, Pin } from '../../server/db/models/index.ts';
import { benchContext } from '../lib/context.ts';
import { measure, type BenchRow } from '../lib/report.ts';

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

/**
 * Import of a 5,000-row CSV (apply, one transaction) and its preview, each through HTTP with the
 * JSON answer, beside papaparse parsing the same text alone. Peak heap is the growth over the run.
 */
export async function importCsv(): Promise<BenchRow[]> {
  const ctx = await benchContext();
  try {
    const conversionId = ctx.demo.conversions.draft;
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
    const csv = generatePinoutCsv();
    const file = Buffer.from(csv, 'utf8');
    const post = (dryRun: boolean) =>
      request(ctx.app)
        .post(`/api/conversions/${conversionId}/import${dryRun ? '?dryRun=1' : ''}`)
        .set(ctx.auth)
        .attach('file', file, { filename: 'bench.csv', contentType: 'text/csv' });

    // One unmeasured run of each first, so neither figure carries the JIT's warm-up.
    Papa.parse<string[]>(csv, { header: false });
    await post(true);
    const papa = await measure(() => Papa.parse<string[]>(csv, { header: false }));
    if (papa.result.data.length < ROWS) throw new Error('papaparse read too few rows');
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

    const name = `import ${ROWS.toLocaleString('en')}-row CSV (${(file.length / 1024).toFixed(0)} KB)`;
    return [
      {
        case: name,
        subject: 'Loomwright import, applied (HTTP, one transaction)',
        figures: { ms: apply.ms, 'peak heap MB': apply.peakHeapMb },
      },
      {
        case: name,
        subject: 'Loomwright preview (dryRun)',
        figures: { ms: preview.ms, 'peak heap MB': preview.peakHeapMb },
      },
      {
        case: name,
        subject: 'papaparse alone, same text',
        figures: { ms: papa.ms, 'peak heap MB': papa.peakHeapMb },
      },
      {
        case: name,
        subject: 'ratio import/papaparse',
        figures: { ms: apply.ms / papa.ms },
      },
    ];
  } finally {
    await ctx.close();
  }
}
