/**
 * Two app processes on one PostgreSQL database, as behind a reverse proxy
 * (docs/decisions/0015-postgresql.md): a sign-off raced through both is won once, and a notice
 * queued by one is sent once although both send from the same outbox. Runs with `npm run test:pg`.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditEvent, MailOutbox, Revision } from '#server/db/models/index.ts';
import { startFakeSmtp, type FakeSmtp } from '#server/modules/mail/fake-smtp.ts';
import { createTestContext, onPostgres, type TestContext } from '../helpers/test-app.ts';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');

interface AppProcess {
  url: string;
  child: ChildProcess;
  output: string[];
}

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address() as { port: number };
      server.close(() => resolve(port));
    });
  });
}

// Generous: starting the server through tsx is slow on a busy machine; the limit only stops a hang.
async function waitFor<T>(what: string, probe: () => Promise<T | undefined>, ms = 90_000) {
  const until = Date.now() + ms;
  for (;;) {
    const value = await probe().catch(() => undefined);
    if (value !== undefined) return value;
    if (Date.now() > until) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

describe.skipIf(!onPostgres)('two app processes on one PostgreSQL database', () => {
  let ctx: TestContext;
  let smtp: FakeSmtp;
  let dir: string;
  const apps: AppProcess[] = [];

  async function startApp(name: string): Promise<AppProcess> {
    const port = await freePort();
    const output: string[] = [];
    const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
      cwd: root,
      env: {
        PATH: process.env.PATH,
        NODE_ENV: 'production',
        HOST: '127.0.0.1',
        PORT: String(port),
        DATABASE_URL: ctx.env.DATABASE_URL,
        // Each process its own folder; what they must share is set explicitly.
        DATABASE_PATH: path.join(dir, name, 'unused.sqlite'),
        UPLOAD_DIR: path.join(dir, 'uploads'),
        JWT_SECRET: ctx.env.JWT_SECRET,
        SEAL_KEY_FILE: path.join(dir, 'seal-key.pem'),
        DEMO: '0',
        SMTP_HOST: smtp.host,
        SMTP_PORT: String(smtp.port),
        SMTP_SECURE: '0',
        OUTBOX_INTERVAL_MS: '200',
        BCRYPT_COST: '10',
        LOG_LEVEL: 'warn',
      },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    child.stdout!.on('data', (b: Buffer) => output.push(b.toString()));
    child.stderr!.on('data', (b: Buffer) => output.push(b.toString()));
    const url = `http://127.0.0.1:${port}`;
    // Known before it listens, so afterAll stops it even if it never comes up.
    apps.push({ url, child, output });
    await waitFor(`${name} to listen`, async () => {
      if (child.exitCode !== null) throw new Error(`${name} exited: ${output.join('')}`);
      const res = await fetch(`${url}/api/health`);
      return res.ok ? true : undefined;
    });
    return { url, child, output };
  }

  const post = async (app: AppProcess, route: string, auth: string, body: object) => {
    const res = await fetch(`${app.url}${route}`, {
      method: 'POST',
      headers: { Authorization: auth, 'Content-Type': 'application/json' },
      body: JSON.stringify(body),
    });
    return { status: res.status, body: (await res.json()) as Record<string, unknown> };
  };

  beforeAll(async () => {
    ctx = await createTestContext();
    smtp = await startFakeSmtp();
    dir = mkdtempSync(path.join(tmpdir(), 'loomwright-two-'));
    writeFileSync(path.join(dir, 'seal-key.pem'), ctx.env.SEAL_PRIVATE_KEY, { mode: 0o600 });
    await Promise.all([startApp('first'), startApp('second')]);
  }, 180_000);

  afterAll(async () => {
    await Promise.all(
      apps.map(
        (app) =>
          new Promise<void>((resolve) => {
            if (app.child.exitCode !== null) return resolve();
            app.child.once('exit', () => resolve());
            app.child.kill('SIGTERM');
          }),
      ),
    );
    await smtp?.close();
    await ctx?.close();
    if (dir) rmSync(dir, { recursive: true, force: true });
  }, 30_000);

  it('20 simultaneous sign-offs through both processes: exactly one 200, the rest 409', async () => {
    const conversionId = ctx.demo.conversions.signedOff;
    const submitted = await post(
      apps[0]!,
      `/api/conversions/${conversionId}/revisions`,
      await ctx.authFor('admin'),
      {},
    );
    expect(submitted.status, JSON.stringify(submitted.body)).toBe(201);
    const { number } = submitted.body.revision as { number: number };
    const revision = (await Revision.findOne({ where: { conversionId, number } }))!;
    const reviewer = await ctx.authFor('reviewer');
    const statuses = await Promise.all(
      Array.from({ length: 20 }, (_, i) =>
        post(
          apps[i % 2]!,
          `/api/conversions/${conversionId}/revisions/${number}/sign-off`,
          reviewer,
          {},
        ).then((r) => r.status),
      ),
    );
    expect(statuses.filter((s) => s === 200)).toHaveLength(1);
    expect(
      statuses.filter((s) => s !== 200).every((s) => s === 409),
      String(statuses),
    ).toBe(true);
    expect(
      await AuditEvent.count({
        where: { conversionId, action: 'sign_off', entityId: revision.id },
      }),
    ).toBe(1);
  }, 60_000);

  it('sends each notice queued by one process exactly once, though both send from the outbox', async () => {
    const admin = await ctx.authFor('admin');
    for (let i = 1; i <= 10; i++) {
      const res = await post(apps[i % 2]!, '/api/users', admin, {
        email: `fitter.${i}@example.com`,
        name: `Fitter ${i}`,
        role: 'technician',
      });
      expect(res.status, JSON.stringify(res.body)).toBe(201);
    }
    const queued = await MailOutbox.count();
    expect(queued).toBeGreaterThanOrEqual(11);
    await waitFor('the outbox to drain', async () =>
      (await MailOutbox.count({ where: { status: 'sent' } })) === queued ? true : undefined,
    );
    // Several more rounds of both senders: nothing goes out twice.
    await new Promise((r) => setTimeout(r, 1500));
    const ids = smtp.received().map((m) => m.messageId);
    expect(ids).toHaveLength(queued);
    expect(new Set(ids).size).toBe(queued);
    const sent = await MailOutbox.findAll({ where: { status: 'sent' } });
    expect(new Set(sent.map((row) => `<${row.messageId!.replace(/^<|>$/g, '')}>`))).toEqual(
      new Set(ids.map((id) => `<${id!.replace(/^<|>$/g, '')}>`)),
    );
  }, 60_000);
});
