import { randomBytes } from 'node:crypto';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { defineConfig } from '@playwright/test';
import base from './playwright.config.ts';

/**
 * One browser test against two app processes on one PostgreSQL database, as behind a reverse
 * proxy (docs/decisions/0015-postgresql.md): `npm run test:e2e:two-processes`, with
 * TEST_DATABASE_URL naming a PostgreSQL server as for `npm run test:pg`. The first process creates
 * a fresh database there and seeds the demo workshop; the second starts once the first answers.
 * Chromium and its settings are the ones in playwright.config.ts.
 */
const portA = Number(process.env.E2E_PORT_A ?? 3410);
const portB = Number(process.env.E2E_PORT_B ?? 3411);
// Named once here (this file is read again in each worker, which inherits the environment).
process.env.E2E_TWO_DATABASE ??= `lw_e2e_two_${process.pid}_${randomBytes(4).toString('hex')}`;
process.env.E2E_TWO_DIR ??= path.join(tmpdir(), process.env.E2E_TWO_DATABASE);
process.env.E2E_TWO_JWT_SECRET ??= randomBytes(32).toString('base64url');

const server = (which: 'first' | 'second', port: number) => ({
  command: `tsx tests/e2e-two-processes/support/server.ts ${which}`,
  url: `http://localhost:${port}/api/health`,
  reuseExistingServer: false,
  timeout: 120_000,
  env: { E2E_PORT_A: String(portA), E2E_PORT_B: String(portB) },
  // A signal first, so the first process drops its database before it exits.
  gracefulShutdown: { signal: 'SIGTERM' as const, timeout: 15_000 },
  stdout: 'ignore' as const,
  stderr: 'pipe' as const,
});

export default defineConfig({
  ...base,
  testDir: 'tests/e2e-two-processes',
  use: {
    ...base.use,
    // Each spec opens its contexts on one process or the other by full address.
    baseURL: `http://localhost:${portA}`,
  },
  // In order: the second waits for the first, which seeds.
  webServer: [server('first', portA), server('second', portB)],
});
