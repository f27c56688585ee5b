import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import autocannon from 'autocannon';
import express, { type Express } from 'express';

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
