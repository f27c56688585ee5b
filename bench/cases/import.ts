import Papa from 'papaparse';
import { generatePinoutCsv, IMPORT_ROWS } from '../lib/generate.ts';
import { startServer } from '../lib/process.ts';
import { measure, type BenchRow } from '../lib/report.ts';
import { alternate, num, ratios, spread, times } from '../lib/stats.ts';

interface ProductInfo {
  port: number;
  conversionId: number;
  authorization: string;
}

/**
 * P4: a 5,000-row CSV import through HTTP (the file previewed, then the preview applied by its id
 * in one transaction, as the import wizard does) to Loomwright in its own process, beside papaparse
 * parsing the same text alone here; papaparse is timed in every round and the order alternates.
 * The server's resident size is sampled while it applies.
 */
export async function importCsv(rounds: number): Promise<BenchRow[]> {
  const server = await startServer<ProductInfo>('product', { BENCH_IMPORT_RESET: '1' });
  try {
    const { conversionId, authorization } = server.info;
    const csv = generatePinoutCsv();
    const file = Buffer.from(csv, 'utf8');
    // The upload as a browser sends it, built once: the load generator's own work stays out of
    // the figures.
    const boundary = 'loomwright-bench-boundary';
    const upload = Buffer.concat([
      Buffer.from(
        `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="bench.csv"\r\n` +
          'Content-Type: text/csv\r\n\r\n',
      ),
      file,
      Buffer.from(`\r\n--${boundary}--\r\n`),
    ]);
    const importUrl = `${server.url}/api/conversions/${conversionId}/import`;
    const preview = async () => {
      const res = await fetch(`${importUrl}?dryRun=1`, {
        method: 'POST',
        headers: { authorization, 'content-type': `multipart/form-data; boundary=${boundary}` },
        body: upload,
      });
      return { status: res.status, body: (await res.json()) as Record<string, unknown> };
    };
    /**
     * Applied as the import wizard applies it: by the preview's id, the file not sent again. The
     * generated connectors start with one cavity: applying confirms that they grow.
     */
    const apply = async (previewId: string) => {
      const res = await fetch(`${importUrl}?grow=1&preview=${previewId}`, {
        method: 'POST',
        headers: { authorization },
      });
      return { status: res.status, body: (await res.json()) as Record<string, unknown> };
    };
    const bench = async (path: string, method = 'GET') => {
      const res = await fetch(`${server.url}/bench/${path}`, { method });
      if (res.status !== 200) throw new Error(`bench ${path} answered ${res.status}`);
      return ((await res.json()) as { pins: number }).pins;
    };
    const papa = async () => {
      const m = await measure(() => Papa.parse<string[]>(csv, { header: false }));
      if (m.result.data.length < IMPORT_ROWS) throw new Error('papaparse read too few rows');
      return m.ms;
    };
    /** The preview and the apply a person makes, one after the other, on a freshly reset map. */
    const importOnce = async () => {
      await bench('reset-import', 'POST');
      const previewed = await measure(preview);
      const errors = previewed.result.body.errors as unknown[] | undefined;
      if (previewed.result.status !== 200 || errors?.length) {
        throw new Error(
          `preview failed: ${previewed.result.status} ${JSON.stringify(errors?.slice(0, 3))}`,
        );
      }
      const previewId = previewed.result.body.previewId as string;
      let peakRss = server.rssMb();
      const sampler = setInterval(() => (peakRss = Math.max(peakRss, server.rssMb())), 5);
      const applied = await measure(() => apply(previewId)).finally(() => clearInterval(sampler));
      if (applied.result.status !== 200 || applied.result.body.imported !== IMPORT_ROWS) {
        throw new Error(
          `import failed: ${applied.result.status} ${JSON.stringify(applied.result.body).slice(0, 300)}`,
        );
      }
      const stored = await bench('pin-count');
      if (stored !== IMPORT_ROWS) throw new Error(`expected ${IMPORT_ROWS} pins, found ${stored}`);
      return { preview: previewed.ms, apply: applied.ms, rss: peakRss };
    };
    // Warm-up of both, not counted.
    await papa();
    await importOnce();
    const { product: ours, baseline: parser } = await alternate(rounds, importOnce, papa);
    const applyRatio = ratios(
      ours.map((o) => o.apply),
      parser,
    );
    const previewRatio = ratios(
      ours.map((o) => o.preview),
      parser,
    );
    const kb = (file.length / 1024).toFixed(0);
    return [
      {
        id: 'P4',
        measure: `${IMPORT_ROWS.toLocaleString('en')}-row CSV (${kb} KB) import, applied, ÷ papaparse alone (ms)`,
        figure: `${times(applyRatio)} (${num(spread(ours.map((o) => o.apply)).median)} vs ${num(spread(parser).median)} ms; server RSS peak ${num(Math.max(...ours.map((o) => o.rss)))} MB)`,
        goal: '≤ 3× (≤ 5× to close)',
        met: applyRatio.median <= 5,
      },
      {
        id: 'P4',
        measure: 'the same file, preview (dry run) ÷ papaparse alone',
        figure: `${times(previewRatio)} (${num(spread(ours.map((o) => o.preview)).median)} ms)`,
        goal: '–',
        met: null,
      },
    ];
  } finally {
    await server.stop();
  }
}
