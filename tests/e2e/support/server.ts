/** Starts Loomwright on a fresh demo database in a temporary folder, for the browser tests. */
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';

const dir = mkdtempSync(path.join(tmpdir(), 'loomwright-e2e-'));
process.env.DATABASE_PATH = path.join(dir, 'e2e.sqlite');
process.env.PORT = process.env.E2E_PORT ?? '3100';
process.env.DEMO = 'true';
process.env.NODE_ENV = 'production';
process.env.LOG_LEVEL = 'warn';
process.env.FAKE_SMTP_PORT ??= '0';
process.env.OUTBOX_INTERVAL_MS ??= '500';
process.env.S3_FAKE_PORT ??= '0';
// Sign-ins in the suite come from one address; the limit itself is covered by the API tests.
process.env.LOGIN_LIMIT_PER_MINUTE = '200';
await import('../../../server/index.ts');
