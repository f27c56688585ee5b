/**
 * Loomwright in a process of its own for the HTTP benches: a fresh demo database, the draft
 * conversion's pin map replaced by BENCH_PINS generated pins (when set; BENCH_OTHER_PINS for the
 * signed-off one), the built client served
 * when BENCH_CLIENT_DIR is set. With BENCH_IMPORT_RESET set it also answers POST /bench/reset-import
 * (the import bench's starting state, set between rounds and never timed) and
 * GET /bench/pin-count. Prints one JSON line when listening; stops on SIGTERM.
 */
import type { AddressInfo } from 'node:net';
import express from 'express';
import { Pin } from '../../server/db/models/index.ts';
import { benchContext } from '../lib/context.ts';
import { replacePinMap, resetImportPins } from '../lib/generate.ts';

const pins = Number(process.env.BENCH_PINS ?? 0);
/** Pins for the demo's second conversion (the signed-off one), for a second size in one server. */
const otherPins = Number(process.env.BENCH_OTHER_PINS ?? 0);
const ctx = await benchContext({ clientDir: process.env.BENCH_CLIENT_DIR || undefined });
const conversionId = ctx.demo.conversions.draft;
const otherConversionId = ctx.demo.conversions.signedOff;
if (pins > 0) await replacePinMap(conversionId, pins);
if (otherPins > 0) await replacePinMap(otherConversionId, otherPins);
/** The product's app, behind the bench's own routes when the import bench asks for them. */
let outer: express.Express = ctx.app;
if (process.env.BENCH_IMPORT_RESET) {
  outer = express().disable('x-powered-by');
  outer.post('/bench/reset-import', (_req, res, next) => {
    resetImportPins(conversionId).then((pins) => res.json({ pins }), next);
  });
  outer.get('/bench/pin-count', (_req, res, next) => {
    Pin.count({ where: { conversionId } }).then((pins) => res.json({ pins }), next);
  });
  outer.use(ctx.app);
}
global.gc?.();
const server = outer.listen(0, '127.0.0.1', () => {
  const { port } = server.address() as AddressInfo;
  process.stdout.write(
    JSON.stringify({
      port,
      conversionId,
      otherConversionId,
      authorization: ctx.auth.Authorization,
    }) + '\n',
  );
});
process.on('SIGTERM', () => {
  server.close();
  void ctx.close().finally(() => process.exit(0));
});
