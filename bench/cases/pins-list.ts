import { writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { load } from '../lib/http.ts';
import { startServer } from '../lib/process.ts';
import type { BenchRow } from '../lib/report.ts';
import { alternate, num, ratios, spread, times, withUnit } from '../lib/stats.ts';

interface ProductInfo {
  port: number;
  conversionId: number;
  authorization: string;
}

const CLIENTS = 20;

/**
 * P1: GET …/pins of a conversion of `pins` pins under 20 clients, Loomwright and a bare Express
 * route serving the same bytes, each in its own process, alternating round by round after a
 * warm-up; the load generator runs here. On the largest size also the server's RSS under load.
 */
async function oneSize(pins: number, seconds: number, rounds: number, withRss: boolean) {
  const product = await startServer<ProductInfo>('product', { BENCH_PINS: String(pins) });
  let bare: Awaited<ReturnType<typeof startServer>> | null = null;
  try {
    const pinsUrl = `${product.url}/api/conversions/${product.info.conversionId}/pins`;
    const headers = { authorization: product.info.authorization };
    const res = await fetch(pinsUrl, { headers });
    const text = await res.text();
    if (res.status !== 200 || (JSON.parse(text) as { pins: unknown[] }).pins.length !== pins) {
      throw new Error(`pins list answered ${res.status} without ${pins} pins`);
    }
    const bodyFile = path.join(tmpdir(), `loomwright-bench-pins-${process.pid}-${pins}.json`);
    writeFileSync(bodyFile, text);
    bare = await startServer('bare', { BENCH_BODY_FILE: bodyFile });
    const bareUrl = `${bare.url}/bare`;

    let peakRss = 0;
    let bareRss = 0;
    const runProduct = () =>
      load(pinsUrl, headers, {
        seconds,
        connections: CLIENTS,
        during: withRss ? () => (peakRss = Math.max(peakRss, product.rssMb())) : undefined,
      });
    const runBare = () =>
      load(
        bareUrl,
        {},
        {
          seconds,
          connections: CLIENTS,
          during: withRss ? () => (bareRss = Math.max(bareRss, bare!.rssMb())) : undefined,
        },
      );
    // Warm-up: JIT, caches, sockets; not counted.
    await runProduct();
    await runBare();
    peakRss = 0;
    bareRss = 0;
    const rss: number[] = [];
    const { product: ours, baseline: theirs } = await alternate(rounds, runProduct, runBare, () => {
      rss.push(peakRss);
      peakRss = 0;
    });
    const errors = [...ours, ...theirs].reduce((n, r) => n + r.errors, 0);
    if (errors) throw new Error(`${errors} failed requests in the pins bench`);
    return {
      ratio: ratios(
        ours.map((r) => r.requestsPerSec),
        theirs.map((r) => r.requestsPerSec),
      ),
      ours: spread(ours.map((r) => r.requestsPerSec)),
      theirs: spread(theirs.map((r) => r.requestsPerSec)),
      p99: spread(ours.map((r) => r.p99Ms)),
      kb: Buffer.byteLength(text) / 1024,
      rss: rss.length && withRss ? spread(rss) : null,
      bareRss,
    };
  } finally {
    await bare?.stop();
    await product.stop();
  }
}

export async function pinsList(seconds: number, rounds: number): Promise<BenchRow[]> {
  const rows: BenchRow[] = [];
  for (const pins of [250, 1000, 4000]) {
    const r = await oneSize(pins, seconds, rounds, pins === 4000);
    rows.push({
      id: 'P1',
      measure: `GET pins, ${pins.toLocaleString('en')} pins (${num(r.kb)} KB), ${CLIENTS} clients, ÷ bare Express same bytes (req/s)`,
      figure: `${times(r.ratio)} (${num(r.ours.median)} vs ${num(r.theirs.median)} req/s; p99 ${num(r.p99.median)} ms)`,
      goal: '≥ 0.5×',
      met: r.ratio.median >= 0.5,
    });
    if (r.rss) {
      rows.push({
        id: 'RSS',
        measure: `server RSS, peak under ${CLIENTS} clients on ${pins.toLocaleString('en')} pins`,
        figure: `${withUnit(r.rss, 'MB')} (bare Express: ${num(r.bareRss)} MB)`,
        goal: '< 300 MB',
        met: r.rss.max < 300,
      });
    }
  }
  return rows;
}
