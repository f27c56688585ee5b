/**
 * One of the two app processes of the two-process browser test, both on one fresh PostgreSQL
 * database with the demo workshop (docs/decisions/0015-postgresql.md).
 *
 * `first` creates the database on the server at TEST_DATABASE_URL, runs the app as a child process
 * (which migrates and seeds it), and on SIGTERM waits for the app to stop and drops the database.
 * `second` waits until the first answers, so the database is migrated and seeded and the shared
 * seal key exists, then runs the app in this process: it finds the workshop there and seeds
 * nothing (seeding is not safe for two processes at once; migrations are).
 *
 * Both send mail to the first's demo mail server, so the first's Admin → Mail page shows every
 * notice that left either process.
 */
import { spawn } from 'node:child_process';
import { mkdirSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import pg from 'pg';

const role = process.argv[2];
const serverUrl = process.env.TEST_DATABASE_URL;
const database = process.env.E2E_TWO_DATABASE;
const shared = process.env.E2E_TWO_DIR;
const firstPort = Number(process.env.E2E_PORT_A ?? 3410);
const smtpPort = Number(process.env.E2E_TWO_SMTP_PORT ?? 3412);
if (!serverUrl?.startsWith('postgres')) {
  throw new Error('TEST_DATABASE_URL must name a PostgreSQL server, as for npm run test:pg');
}
if (!database || !/^[a-z0-9_]+$/.test(database) || !shared) {
  throw new Error('start through playwright.two-processes.config.ts (it names the database)');
}

const url = new URL(serverUrl);
url.pathname = `/${database}`;
const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../..');

/** What both processes share, as behind a reverse proxy: one database, one key, one secret. */
const appEnv = (port: number, name: string) => ({
  DATABASE_URL: url.toString(),
  // Each process its own folder (its S3 fake keeps files there); the seal key is shared.
  DATABASE_PATH: path.join(shared, name, 'unused.sqlite'),
  SEAL_KEY_FILE: path.join(shared, 'seal-key.pem'),
  PORT: String(port),
  DEMO: 'true',
  NODE_ENV: 'production',
  LOG_LEVEL: 'warn',
  OUTBOX_INTERVAL_MS: '500',
  S3_FAKE_PORT: '0',
  // Sign-ins in the suite come from one address; the limit itself is covered by the API tests.
  LOGIN_LIMIT_PER_MINUTE: '200',
});

async function onServer(sql: string) {
  const client = new pg.Client({ connectionString: serverUrl });
  await client.connect();
  try {
    await client.query(sql);
  } finally {
    await client.end();
  }
}

/** Fails at once if the mail port is taken: the app would quietly pick another one. */
function checkFree(port: number): Promise<void> {
  return new Promise((resolve, reject) => {
    const probe = createServer();
    probe.once('error', () =>
      reject(new Error(`port ${port} is taken; set E2E_TWO_SMTP_PORT to a free one`)),
    );
    probe.listen(port, '127.0.0.1', () => probe.close(() => resolve()));
  });
}

if (role === 'first') {
  await checkFree(smtpPort);
  mkdirSync(shared, { recursive: true });
  // Byte order for text, as SQLite's default collation sorts it (as tests/helpers/test-app.ts).
  await onServer(`CREATE DATABASE ${database} TEMPLATE template0 ENCODING 'UTF8' LOCALE 'C'`);
  const app = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    cwd: root,
    env: {
      ...process.env,
      ...appEnv(firstPort, 'first'),
      JWT_SECRET: process.env.E2E_TWO_JWT_SECRET,
      FAKE_SMTP_PORT: String(smtpPort),
    },
    stdio: ['ignore', 'inherit', 'inherit'],
  });
  let stopping = false;
  const cleanUp = async () => {
    await onServer(`DROP DATABASE IF EXISTS ${database} WITH (FORCE)`).catch(() => {});
    rmSync(shared, { recursive: true, force: true });
  };
  app.once('exit', (code) => {
    void cleanUp().finally(() => process.exit(stopping ? 0 : (code ?? 1)));
  });
  const stop = () => {
    stopping = true;
    // Playwright signals the whole process group; this covers a signal to this process alone.
    if (app.exitCode === null) app.kill('SIGTERM');
  };
  process.on('SIGTERM', stop);
  process.on('SIGINT', stop);
} else if (role === 'second') {
  const first = `http://127.0.0.1:${firstPort}/api/health`;
  // Generous: starting through tsx is slow on a busy machine; the limit only stops a hang.
  const until = Date.now() + 120_000;
  while (
    !(await fetch(first)
      .then((r) => r.ok)
      .catch(() => false))
  ) {
    if (Date.now() > until) throw new Error(`the first process never answered at ${first}`);
    await new Promise((r) => setTimeout(r, 250));
  }
  Object.assign(process.env, appEnv(Number(process.env.E2E_PORT_B ?? 3411), 'second'), {
    JWT_SECRET: process.env.E2E_TWO_JWT_SECRET,
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: String(smtpPort),
    SMTP_SECURE: '0',
  });
  await import('../../../server/index.ts');
} else {
  throw new Error('usage: tsx tests/e2e-two-processes/support/server.ts first|second');
}
