/**
 * The baseline for the HTTP benches, in a process of its own like the product: a bare Express
 * route answering the bytes in BENCH_BODY_FILE with the same content type, nothing else.
 */
import { readFileSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import express from 'express';

const json = readFileSync(process.env.BENCH_BODY_FILE!, 'utf8');
const app = express();
app.get('/bare', (_req, res) => {
  res.type('application/json').send(json);
});
const server = app.listen(0, '127.0.0.1', () => {
  const { port } = server.address() as AddressInfo;
  process.stdout.write(JSON.stringify({ port }) + '\n');
});
process.on('SIGTERM', () => {
  server.close();
  process.exit(0);
});
