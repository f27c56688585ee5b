/**
 * Storage that fills up or turns read-only (issue #16): the client gets 507 or 503 with a plain
 * message, nothing is half-written, and the server keeps answering. The S3 stand-in's disk is
 * swapped for one that fails on demand; SQLite is filled for real with PRAGMA max_page_count.
 */
import { mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { writeFile } from 'node:fs/promises';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '#server/db/index.ts';
import { Attachment, Conversion } from '#server/db/models/index.ts';
import { setFileStore, type FileStore } from '#server/lib/file-store.ts';
import { startS3Fake, type S3Fake } from '#server/lib/s3-fake.ts';
import { inTransaction } from '#server/lib/transaction.ts';
import { createTestContext, onPostgres, type TestContext } from '../helpers/test-app.ts';

const BUCKET = 'loomwright-storage';
const PNG = Buffer.concat([
  Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
  Buffer.alloc(256, 7),
]);

let s3dir: string;
let fake: S3Fake;
let ctx: TestContext;
let builder: string;
let connectorId: number;
/** The errno the stand-in's disk fails with next, or null for a healthy disk. */
let diskFault: string | null = null;

function errnoError(code: string): NodeJS.ErrnoException {
  return Object.assign(new Error(`${code}: simulated, write '/data/s3/object'`), { code });
}

/** Every file under the stand-in's folder, at any depth. */
function filesUnder(dir: string): string[] {
  return readdirSync(dir, { recursive: true, withFileTypes: true })
    .filter((d) => d.isFile())
    .map((d) => d.name);
}

const attach = () =>
  request(ctx.app)
    .post(`/api/connectors/${connectorId}/attachments`)
    .set('Authorization', builder)
    .attach('file', PNG, { filename: 'scan.png', contentType: 'image/png' });

beforeAll(async () => {
  s3dir = mkdtempSync(path.join(tmpdir(), 'loomwright-s3-full-'));
  fake = await startS3Fake({
    directory: s3dir,
    bucket: BUCKET,
    port: 0,
    disk: {
      writeFile: async (file, data) => {
        if (diskFault) throw errnoError(diskFault);
        await writeFile(file, data, { flag: 'wx' });
      },
    },
  });
  ctx = await createTestContext({
    S3_ENDPOINT: fake.endpoint,
    S3_BUCKET: BUCKET,
    S3_ACCESS_KEY_ID: fake.credentials.accessKeyId,
    S3_SECRET_ACCESS_KEY: fake.credentials.secretAccessKey,
  });
  builder = await ctx.authFor('builder');
  const connectors = await request(ctx.app)
    .get(`/api/conversions/${ctx.demo.conversions.draft}/connectors`)
    .set('Authorization', builder);
  connectorId = connectors.body.connectors.find((c: { label: string }) => c.label === 'E2').id;
});

afterAll(async () => {
  setFileStore(null);
  await ctx.close();
  await fake.close();
  rmSync(s3dir, { recursive: true, force: true });
});

describe('a full or read-only disk under the S3 stand-in', () => {
  it('answers 507 to an upload on a full disk, stores nothing, and keeps serving', async () => {
    const rowsBefore = await Attachment.count();
    const filesBefore = filesUnder(s3dir);
    diskFault = 'ENOSPC';
    const res = await attach();
    diskFault = null;
    expect(res.status).toBe(507);
    expect(res.body.error.code).toBe('storage_full');
    expect(res.body.error.message).toMatch(/out of storage space\. Nothing was saved/);
    expect(JSON.stringify(res.body)).not.toMatch(/ENOSPC|\/data\//);
    expect(await Attachment.count()).toBe(rowsBefore);
    expect(filesUnder(s3dir)).toEqual(filesBefore);

    expect((await request(ctx.app).get('/api/health')).status).toBe(200);
    // The same process stores the next file once there is room again.
    expect((await attach()).status).toBe(201);
  });

  it('answers 507 for a quota (EDQUOT) and 503 with Retry-After for a read-only disk', async () => {
    diskFault = 'EDQUOT';
    const quota = await attach();
    diskFault = 'EROFS';
    const readOnly = await attach();
    diskFault = null;
    expect(quota.status).toBe(507);
    expect(readOnly.status).toBe(503);
    expect(readOnly.body.error.code).toBe('storage_read_only');
    expect(readOnly.headers['retry-after']).toBeDefined();
    expect((await request(ctx.app).get('/api/health')).status).toBe(200);
  });
});

describe('a full disk under the upload folder', () => {
  it('answers 507 and records nothing', async () => {
    const full: FileStore = {
      kind: 'folder',
      put: () => Promise.reject(errnoError('ENOSPC')),
      get: () => Promise.resolve(null),
      delete: () => Promise.resolve(),
    };
    const rowsBefore = await Attachment.count();
    setFileStore(full);
    try {
      const res = await attach();
      expect(res.status).toBe(507);
      expect(res.body.error.code).toBe('storage_full');
    } finally {
      setFileStore(null);
    }
    expect(await Attachment.count()).toBe(rowsBefore);
  });
});

// SQLite's own file (its page limit, a read-only file); PostgreSQL's disk is the server's to watch.
describe.skipIf(onPostgres)('a full database file', () => {
  it('answers 507 to a write SQLite cannot fit, keeps no part of it, and keeps serving', async () => {
    const admin = await ctx.authFor('admin');
    const before = await Conversion.count();
    // SQLite's own cap on the file's size: a write needing one more page fails with SQLITE_FULL,
    // exactly as on a full disk. Set on the handle write transactions use.
    await inTransaction(db(), async (t) => {
      const [[{ page_count: pages }]] = (await db().query('PRAGMA page_count', {
        transaction: t,
      })) as [[{ page_count: number }], unknown];
      await db().query(`PRAGMA max_page_count = ${pages}`, { transaction: t });
    });
    try {
      const res = await request(ctx.app)
        .post('/api/conversions')
        .set('Authorization', admin)
        .send({
          name: 'Overflow',
          donorEngine: 'x',
          receivingVehicle: 'y',
          systemVoltage: 12,
          notes: 'n'.repeat(4000),
        });
      expect(res.status).toBe(507);
      expect(res.body.error.code).toBe('storage_full');
    } finally {
      await inTransaction(db(), (t) =>
        db().query('PRAGMA max_page_count = 1073741823', { transaction: t }),
      );
    }
    expect(await Conversion.count()).toBe(before);
    expect((await request(ctx.app).get('/api/health')).status).toBe(200);
  });

  it('answers 503 with Retry-After when SQLite refuses writes (read-only), and keeps serving', async () => {
    const admin = await ctx.authFor('admin');
    const before = await Conversion.count();
    // query_only makes SQLite refuse every write with SQLITE_READONLY, as a read-only mount does.
    await inTransaction(db(), (t) => db().query('PRAGMA query_only = 1', { transaction: t }));
    try {
      const res = await request(ctx.app)
        .post('/api/conversions')
        .set('Authorization', admin)
        .send({ name: 'Nowhere', donorEngine: 'x', receivingVehicle: 'y', systemVoltage: 12 });
      expect(res.status).toBe(503);
      expect(res.body.error.code).toBe('storage_read_only');
      expect(res.headers['retry-after']).toBeDefined();
      expect(JSON.stringify(res.body)).not.toMatch(/SQLITE/);
    } finally {
      await inTransaction(db(), (t) => db().query('PRAGMA query_only = 0', { transaction: t }));
    }
    expect(await Conversion.count()).toBe(before);
    expect((await request(ctx.app).get('/api/health')).status).toBe(200);
  });
});
