import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import autocannon from 'autocannon';
import express, { type Express } from 'express';
import type { BenchRow } from './report.ts';

export interface LoadResult {
  requestsPerSec: number;
  p99Ms: number;
  errors: number;
}

async function listen(app: Express): Promise<{ server: Server; url: string }> {
  return new Promise((resolve) => {
    const server = app.listen(0, '127.0.0.1', () => {
      resolve({ server, url: `http://127.0.0.1:${(server.address() as AddressInfo).port}` });
    });
  });
}

/** Drives `path` on `app` with `connections` concurrent clients for `seconds`. */
export async function load(
  app: Express,
  path: string,
  headers: Record<string, string>,
  { connections = 20, seconds = 5 } = {},
): Promise<LoadResult> {
  const { server, url } = await listen(app);
  try {
    const result = await autocannon({ url: url + path, connections, duration: seconds, headers });
    return {
      requestsPerSec: result.requests.average,
      p99Ms: result.latency.p99,
      errors: result.errors + result.non2xx,
    };
  } finally {
    server.close();
  }
}

/** The baseline: a bare Express route answering the same JSON from memory. */
export function bareJsonApp(body: unknown): Express {
  const app = express();
  const json = JSON.stringify(body);
  app.get('/bare', (_req, res) => {
    res.type('application/json').send(json);
  });
  return app;
}

/** Loads `path` on the app and the same JSON from a bare route, and reports both and their ratio. */
export async function compareWithBareRoute(
  name: string,
  app: Express,
  path: string,
  headers: Record<string, string>,
  body: unknown,
  seconds: number,
): Promise<BenchRow[]> {
  const ours = await load(app, path, headers, { seconds });
  const bare = await load(bareJsonApp(body), '/bare', {}, { seconds });
  return [
    {
      case: name,
      subject: 'Loomwright',
      figures: { 'req/s': ours.requestsPerSec, 'p99 ms': ours.p99Ms, errors: ours.errors },
    },
    {
      case: name,
      subject: 'bare Express, same JSON',
      figures: { 'req/s': bare.requestsPerSec, 'p99 ms': bare.p99Ms, errors: bare.errors },
    },
    {
      case: name,
      subject: 'ratio bare/Loomwright',
      figures: { 'req/s': bare.requestsPerSec / ours.requestsPerSec },
    },
  ];
}
