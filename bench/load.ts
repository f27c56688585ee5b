/**
 * `npm run load`: concurrent writers and simultaneous sign-offs against a real server process on a
 * fresh demo database, on 127.0.0.1 only. Prints the figures and exits non-zero when a target is
 * missed (docs/decisions/0010-write-queue-and-seal.md):
 * - LOAD_WRITERS (20) clients PATCH pins with the version they read, for LOAD_SECONDS (60):
 *   no 5xx, no client time-out (LOAD_CLIENT_TIMEOUT_MS, 10 s), p99 under 1 s, and every pin's final
 *   version equals its start version plus its 2xx writes;
 * - LOAD_SIGNOFFS (20) sign-offs of one revision at once: exactly one 200, the rest 409, all answered
 *   within 5 s;
 * - open handles on the database files before, after and once idle.
 */
import { spawn } from 'node:child_process';
import { mkdtempSync, readdirSync, readlinkSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { cpus, loadavg, tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const WRITERS = Number(process.env.LOAD_WRITERS ?? 20);
const SECONDS = Number(process.env.LOAD_SECONDS ?? 60);
const SIGNOFFS = Number(process.env.LOAD_SIGNOFFS ?? 20);
const CLIENT_TIMEOUT_MS = Number(process.env.LOAD_CLIENT_TIMEOUT_MS ?? 10_000);
/** Pins the writers share, so that they collide and some writes are refused as stale. */
const SHARED_PINS = Number(process.env.LOAD_PINS ?? 10);
const PASSWORD = 'loomwright-load-run';

const TARGET_P99_MS = 1000;
const TARGET_SIGNOFF_MS = 5000;

interface Answer {
  status: number; // 0: the client gave up (time-out) or the connection failed
  ms: number;
  body: unknown;
}

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const probe = createServer();
    probe.once('error', reject);
    probe.listen(0, '127.0.0.1', () => {
      const { port } = probe.address() as { port: number };
      probe.close(() => resolve(port));
    });
  });
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** Open descriptors of `pid` that point at the database file or its -wal/-shm companions. */
function databaseHandles(pid: number, databasePath: string): number {
  let count = 0;
  for (const fd of readdirSync(`/proc/${pid}/fd`)) {
    try {
      if (readlinkSync(`/proc/${pid}/fd/${fd}`).startsWith(databasePath)) count++;
    } catch {
      // closed while we looked
    }
  }
  return count;
}

function percentile(sorted: number[], p: number): number {
  if (sorted.length === 0) return 0;
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)]!;
}

async function main() {
  const dir = mkdtempSync(path.join(tmpdir(), 'loomwright-load-'));
  const databasePath = path.join(dir, 'load.sqlite');
  const port = await freePort();
  const base = `http://127.0.0.1:${port}/api`;
  // LOAD_NODE_FLAGS passes flags to the server's node, e.g. "--cpu-prof --cpu-prof-dir=/tmp/prof".
  const flags = (process.env.LOAD_NODE_FLAGS ?? '').split(' ').filter(Boolean);
  const entry = path.join(root, 'server/index.ts');
  const server = spawn(process.execPath, [...flags, '--import', 'tsx', entry], {
    cwd: root,
    env: {
      ...process.env,
      NODE_ENV: 'production',
      HOST: '127.0.0.1',
      PORT: String(port),
      DATABASE_PATH: databasePath,
      DEMO: 'true',
      DEMO_PASSWORD: PASSWORD,
      LOG_LEVEL: 'warn',
      FAKE_SMTP_PORT: '0',
      S3_FAKE_PORT: '0',
      OUTBOX_INTERVAL_MS: '1000',
    },
    stdio: ['ignore', 'ignore', 'inherit'],
  });
  let serverExited = false;
  server.on('exit', () => (serverExited = true));
  const stop = async () => {
    if (!serverExited) {
      server.kill('SIGTERM');
      for (let i = 0; i < 50 && !serverExited; i++) await sleep(100);
    }
    rmSync(dir, { recursive: true, force: true });
  };

  try {
    async function call(
      method: string,
      url: string,
      token: string | null,
      body?: unknown,
    ): Promise<Answer> {
      const started = performance.now();
      try {
        const res = await fetch(base + url, {
          method,
          headers: {
            ...(token ? { Authorization: `Bearer ${token}` } : {}),
            ...(body !== undefined ? { 'Content-Type': 'application/json' } : {}),
          },
          body: body !== undefined ? JSON.stringify(body) : undefined,
          signal: AbortSignal.timeout(CLIENT_TIMEOUT_MS),
        });
        const text = await res.text();
        return {
          status: res.status,
          ms: performance.now() - started,
          body: text ? (JSON.parse(text) as unknown) : null,
        };
      } catch {
        return { status: 0, ms: performance.now() - started, body: null };
      }
    }

    for (let i = 0; ; i++) {
      if (serverExited) throw new Error('the server exited while starting');
      if ((await call('GET', '/health', null)).status === 200) break;
      if (i > 600) throw new Error('the server did not answer /health within 60 s');
      await sleep(100);
    }
    const signIn = async (email: string) => {
      const res = await call('POST', '/auth/login', null, { email, password: PASSWORD });
      if (res.status !== 200) throw new Error(`sign-in of ${email} failed: ${res.status}`);
      return (res.body as { token: string }).token;
    };
    const builder = await signIn('builder@example.com');
    const reviewer = await signIn('reviewer@example.com');

    const { conversions } = (await call('GET', '/conversions', builder)).body as {
      conversions: Array<{ id: number; name: string }>;
    };
    // The conversion with a signed-off revision takes the sign-offs; another one takes the writers.
    let signConversion: number | undefined;
    for (const c of conversions) {
      const { revisions } = (await call('GET', `/conversions/${c.id}/revisions`, builder)).body as {
        revisions: Array<{ status: string }>;
      };
      if (revisions.some((r) => r.status === 'signed_off')) signConversion = c.id;
    }
    const writeConversion = conversions.find((c) => c.id !== signConversion)?.id;
    if (!signConversion || !writeConversion) throw new Error('the demo data lacks a conversion');
    const pinsOf = async () => {
      // Patient: after an overload the server may still be working off its backlog.
      for (let tries = 0; ; tries++) {
        const res = await call('GET', `/conversions/${writeConversion}/pins`, builder);
        if (res.status === 200) {
          return (res.body as { pins: Array<{ id: number; version: number }> }).pins;
        }
        if (tries >= 30) throw new Error(`listing pins failed: ${res.status}`);
        await sleep(1000);
      }
    };
    const shared = (await pinsOf()).slice(0, SHARED_PINS);
    const startVersion = new Map(shared.map((p) => [p.id, p.version]));
    const handlesBefore = databaseHandles(server.pid!, databasePath);

    // ---- writers ----
    process.stderr.write(`load: ${WRITERS} writers for ${SECONDS} s on ${shared.length} pins…\n`);
    const writes: Answer[] = [];
    const okWrites = new Map<number, number>(shared.map((p) => [p.id, 0]));
    const health: number[] = [];
    const until = Date.now() + SECONDS * 1000;
    const writer = async (w: number) => {
      const known = new Map(startVersion);
      for (let n = 0; Date.now() < until; n++) {
        const pin = shared[Math.floor(Math.random() * shared.length)]!;
        const res = await call('PATCH', `/pins/${pin.id}`, builder, {
          version: known.get(pin.id),
          notes: `load writer ${w}, write ${n}`,
        });
        writes.push(res);
        if (res.status === 200) {
          known.set(pin.id, (res.body as { pin: { version: number } }).pin.version);
          okWrites.set(pin.id, okWrites.get(pin.id)! + 1);
        } else if (res.status === 409) {
          const current = (res.body as { error: { details: { current: { version: number } } } })
            .error.details.current;
          known.set(pin.id, current.version);
        }
      }
    };
    const watchHealth = async () => {
      while (Date.now() < until) {
        health.push((await call('GET', '/health', null)).ms);
        await sleep(250);
      }
    };
    await Promise.all([...Array.from({ length: WRITERS }, (_, w) => writer(w)), watchHealth()]);
    const handlesAfterWriters = databaseHandles(server.pid!, databasePath);

    const latencies = writes.map((w) => w.ms).sort((a, b) => a - b);
    const healthSorted = [...health].sort((a, b) => a - b);
    const count = (pred: (a: Answer) => boolean) => writes.filter(pred).length;
    const final = await pinsOf();
    const lost = shared.filter((p) => {
      const now = final.find((f) => f.id === p.id)!;
      return now.version !== startVersion.get(p.id)! + okWrites.get(p.id)!;
    });

    // ---- simultaneous sign-offs ----
    const submitted = await call('POST', `/conversions/${signConversion}/revisions`, builder, {
      note: 'Load run: sign-off race',
    });
    if (submitted.status !== 201) {
      throw new Error(
        `submitting a revision failed: ${submitted.status} ${JSON.stringify(submitted.body)}`,
      );
    }
    const revision = (submitted.body as { revision: { number: number; version: number } }).revision;
    process.stderr.write(`load: ${SIGNOFFS} sign-offs of revision ${revision.number} at once…\n`);
    const signOffs = await Promise.all(
      Array.from({ length: SIGNOFFS }, () =>
        call(
          'POST',
          `/conversions/${signConversion}/revisions/${revision.number}/sign-off`,
          reviewer,
          { version: revision.version },
        ),
      ),
    );
    const handlesAfterSignOffs = databaseHandles(server.pid!, databasePath);
    await sleep(2000);
    const handlesIdle = databaseHandles(server.pid!, databasePath);

    // ---- report ----
    const fiveXx = count((a) => a.status >= 500);
    const timeOuts = count((a) => a.status === 0);
    const p99 = percentile(latencies, 99);
    const signOffOk = signOffs.filter((a) => a.status === 200).length;
    const signOff409 = signOffs.filter((a) => a.status === 409).length;
    const signOffSlowest = Math.max(...signOffs.map((a) => a.ms));
    const checks: Array<[string, boolean]> = [
      ['writers: no 5xx', fiveXx === 0],
      ['writers: no client time-outs', timeOuts === 0],
      [`writers: p99 < ${TARGET_P99_MS} ms`, p99 < TARGET_P99_MS],
      ['writers: every pin version = start + its 2xx writes', lost.length === 0],
      ['sign-offs: exactly one 200', signOffOk === 1],
      ['sign-offs: the rest 409', signOff409 === SIGNOFFS - 1],
      [
        `sign-offs: all answered within ${TARGET_SIGNOFF_MS} ms`,
        signOffSlowest < TARGET_SIGNOFF_MS,
      ],
      ['database handles back to the start count when idle', handlesIdle <= handlesBefore],
    ];
    const fmt = (ms: number) => `${ms.toFixed(0)} ms`;
    const lines = [
      `Machine: ${cpus().length} cores, load average ${loadavg()
        .map((l) => l.toFixed(1))
        .join(' / ')} (1/5/15 min) at the end of the run`,
      `Writers: ${WRITERS} × ${SECONDS} s on ${shared.length} shared pins`,
      `  requests          ${writes.length} (${(writes.length / SECONDS).toFixed(1)}/s)`,
      `  2xx               ${count((a) => a.status >= 200 && a.status < 300)}`,
      `  409 (stale copy)  ${count((a) => a.status === 409)}`,
      `  other 4xx         ${count((a) => a.status >= 400 && a.status < 500 && a.status !== 409)}`,
      `  5xx               ${fiveXx}`,
      `  client time-outs  ${timeOuts} (after ${CLIENT_TIMEOUT_MS} ms)`,
      `  p50 / p95 / p99   ${fmt(percentile(latencies, 50))} / ${fmt(percentile(latencies, 95))} / ${fmt(p99)}`,
      `  slowest           ${fmt(latencies.at(-1) ?? 0)}`,
      `  pins whose final version ≠ start + 2xx writes: ${lost.length}`,
      `  /health during the run: p99 ${fmt(percentile(healthSorted, 99))} over ${health.length} probes`,
      `Sign-offs: ${SIGNOFFS} at once on revision ${revision.number}`,
      `  200: ${signOffOk}, 409: ${signOff409}, other: ${SIGNOFFS - signOffOk - signOff409}`,
      `  fastest / slowest answer: ${fmt(Math.min(...signOffs.map((a) => a.ms)))} / ${fmt(signOffSlowest)}`,
      `Open handles on the database files: before ${handlesBefore}, after writers ${handlesAfterWriters}, after sign-offs ${handlesAfterSignOffs}, idle ${handlesIdle}`,
      '',
      ...checks.map(([name, ok]) => `${ok ? 'PASS' : 'FAIL'}  ${name}`),
    ];
    process.stdout.write(lines.join('\n') + '\n');
    await stop();
    process.exit(checks.every(([, ok]) => ok) ? 0 : 1);
  } catch (err) {
    await stop();
    throw err;
  }
}

await main();
