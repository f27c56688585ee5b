/**
 * Reference scans (reliability rows 15–17): stored through the S3 SDK in a local S3 fake that this
 * file starts on a free port, typed by their first bytes, downloaded only through an authorised
 * route, and never from another workshop.
 */
import { randomBytes } from 'node:crypto';
import { existsSync, mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import {
  GetObjectCommand,
  ListObjectsV2Command,
  PutObjectCommand,
  S3Client,
} from '@aws-sdk/client-s3';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Attachment } from '#server/db/models/index.ts';
import { FolderFileStore } from '#server/lib/file-store.ts';
import { startS3Fake, type S3Fake } from '#server/lib/s3-fake.ts';
import { createOtherWorkshop } from '../factories/workshop.factory.ts';
import { createTestContext, type TestContext } from '../helpers/test-app.ts';

const BUCKET = 'loomwright-test';
let s3dir: string;
let fake: S3Fake;
let s3: S3Client;
let ctx: TestContext;
let builder: string;
let connectorId: number;

const PDF = Buffer.concat([
  Buffer.from('%PDF-1.4\n1 0 obj << /Type /Catalog >> endobj\n', 'latin1'),
  randomBytes(2048),
  Buffer.from('\n%%EOF\n', 'latin1'),
]);
const PNG = Buffer.concat([
  Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
  randomBytes(512),
]);
const JPEG = Buffer.concat([Buffer.from([0xff, 0xd8, 0xff, 0xe0]), randomBytes(512)]);
const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/;
/** Names multer's disk storage would give temporary files in the system temp folder. */
const multerTempFiles = () => readdirSync(tmpdir()).filter((f) => /^[0-9a-f]{32}$/.test(f));

function attach(
  connector: number,
  body: Buffer,
  filename: string,
  contentType: string,
  auth = builder,
) {
  return request(ctx.app)
    .post(`/api/connectors/${connector}/attachments`)
    .set('Authorization', auth)
    .attach('file', body, { filename, contentType });
}

async function download(id: number, auth = builder) {
  return request(ctx.app)
    .get(`/api/attachments/${id}`)
    .set('Authorization', auth)
    .buffer(true)
    .parse((res, done) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => done(null, Buffer.concat(chunks)));
    });
}

async function bucketKeys(): Promise<string[]> {
  const list = await s3.send(new ListObjectsV2Command({ Bucket: BUCKET }));
  return (list.Contents ?? []).map((o) => o.Key!);
}

let tempBefore: string[];

beforeAll(async () => {
  tempBefore = multerTempFiles();
  s3dir = mkdtempSync(path.join(tmpdir(), 'loomwright-s3-'));
  fake = await startS3Fake({ directory: s3dir, bucket: BUCKET, port: 0 });
  s3 = new S3Client({
    endpoint: fake.endpoint,
    region: 'us-east-1',
    forcePathStyle: true,
    credentials: fake.credentials,
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
  await ctx.close();
  s3.destroy();
  await fake.close();
  rmSync(s3dir, { recursive: true, force: true });
  // Uploads are read into memory: no temporary file is ever left behind.
  expect(multerTempFiles()).toEqual(tempBefore);
});

describe('reference scans in the S3 fake', () => {
  it('stores a PDF under a UUID and reads it back byte for byte, through the API and from S3', async () => {
    const res = await attach(connectorId, PDF, 'E2 pinout sheet.pdf', 'application/pdf');
    expect(res.status).toBe(201);
    expect(res.body.attachment).toMatchObject({
      connectorId,
      fileName: 'E2 pinout sheet.pdf',
      contentType: 'application/pdf',
      sizeBytes: PDF.length,
      uploadedBy: 'Ivo Brandt',
    });
    const row = await Attachment.findByPk(res.body.attachment.id);
    expect(row!.storageKey).toMatch(UUID);
    expect(await bucketKeys()).toContain(row!.storageKey);
    const direct = await s3.send(new GetObjectCommand({ Bucket: BUCKET, Key: row!.storageKey }));
    expect(Buffer.from(await direct.Body!.transformToByteArray()).equals(PDF)).toBe(true);

    const got = await download(res.body.attachment.id);
    expect(got.status).toBe(200);
    expect(Buffer.compare(got.body as Buffer, PDF)).toBe(0);
    expect(got.headers['content-type']).toBe('application/pdf');
    expect(got.headers['content-disposition']).toBe(
      `attachment; filename="E2_pinout_sheet.pdf"; filename*=UTF-8''E2%20pinout%20sheet.pdf`,
    );
    expect(got.headers['x-content-type-options']).toBe('nosniff');
    expect(got.headers['cache-control']).toBe('private, no-store');
  });

  it('reads a UTF-8 file name as UTF-8, and drops direction and zero-width characters from it', async () => {
    const res = await attach(
      connectorId,
      PDF,
      'Motorsteuerger\u00e4t \u201eE2\u201c.pdf',
      'application/pdf',
    );
    expect(res.status).toBe(201);
    expect(res.body.attachment.fileName).toBe('Motorsteuerger\u00e4t \u201eE2\u201c.pdf');
    const tricky = await attach(connectorId, PDF, 'scan\u202egpj.pdf\u200b', 'application/pdf');
    expect(tricky.body.attachment.fileName).toBe('scangpj.pdf');
  });

  it('types PNG and JPEG by their bytes, whatever name and type the browser sent', async () => {
    const png = await attach(connectorId, PNG, 'photo.pdf', 'application/pdf');
    expect(png.status).toBe(201);
    expect(png.body.attachment.contentType).toBe('image/png');
    const jpeg = await attach(connectorId, JPEG, 'scan', 'application/octet-stream');
    expect(jpeg.body.attachment.contentType).toBe('image/jpeg');
    const got = await download(jpeg.body.attachment.id);
    expect(got.headers['content-type']).toBe('image/jpeg');
    expect(got.headers['content-disposition']).toMatch(/filename="scan\.jpg"/);
    expect(Buffer.compare(got.body as Buffer, JPEG)).toBe(0);
  });

  it('refuses HTML named .pdf and SVG with 415, storing nothing', async () => {
    const keys = await bucketKeys();
    const rows = await Attachment.count();
    const html = await attach(
      connectorId,
      Buffer.from('<!doctype html><script>alert(1)</script>'),
      'pinout.pdf',
      'application/pdf',
    );
    expect(html.status).toBe(415);
    expect(html.body.error.message).toContain('HTML');
    const svg = await attach(
      connectorId,
      Buffer.from('<?xml version="1.0"?><svg xmlns="http://www.w3.org/2000/svg"></svg>'),
      'face.png',
      'image/png',
    );
    expect(svg.status).toBe(415);
    expect(svg.body.error.message).toContain('SVG');
    expect(await bucketKeys()).toEqual(keys);
    expect(await Attachment.count()).toBe(rows);
  });

  it('never stores under the uploaded name and serves nothing from a static path', async () => {
    const res = await attach(connectorId, PDF, '../../app.db', 'application/pdf');
    expect(res.status).toBe(201);
    expect(res.body.attachment.fileName).toBe('app.db');
    const row = await Attachment.findByPk(res.body.attachment.id);
    expect(row!.storageKey).toMatch(UUID);
    const statics = await request(ctx.app)
      .get(`/uploads/${row!.storageKey}`)
      .set('Authorization', builder);
    expect(statics.status).toBe(404);
    const got = await download(res.body.attachment.id);
    expect(got.headers['content-disposition']).toMatch(/^attachment; filename="app\.pdf"/);
  });

  it('answers 413 for a file over 10 MB', async () => {
    const big = Buffer.concat([Buffer.from('%PDF-1.7\n'), Buffer.alloc(10 * 1024 * 1024 + 1)]);
    const res = await attach(connectorId, big, 'huge.pdf', 'application/pdf');
    expect(res.status).toBe(413);
    expect(res.body.error.message).toContain('10 MB');
  });

  it('answers 400 to a cut-off upload and keeps serving', async () => {
    const boundary = 'cutoff';
    const res = await request(ctx.app)
      .post(`/api/connectors/${connectorId}/attachments`)
      .set('Authorization', builder)
      .set('Content-Type', `multipart/form-data; boundary=${boundary}`)
      .send(
        `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="a.pdf"\r\n` +
          'Content-Type: application/pdf\r\n\r\n%PDF-1.4 and then nothing',
      );
    expect(res.status).toBe(400);
    expect((await request(ctx.app).get('/api/health')).status).toBe(200);
  });
});

describe('who may see and change reference scans', () => {
  it('technicians and reviewers list and download but cannot upload or delete', async () => {
    const { body } = await attach(connectorId, PNG, 'face.png', 'image/png');
    const id = body.attachment.id as number;
    for (const role of ['technician', 'reviewer'] as const) {
      const auth = await ctx.authFor(role);
      const list = await request(ctx.app)
        .get(`/api/connectors/${connectorId}/attachments`)
        .set('Authorization', auth);
      expect(list.status).toBe(200);
      expect(list.body.attachments.map((a: { id: number }) => a.id)).toContain(id);
      const got = await download(id, auth);
      expect(got.status).toBe(200);
      expect(Buffer.compare(got.body as Buffer, PNG)).toBe(0);
      expect((await attach(connectorId, PNG, 'x.png', 'image/png', auth)).status).toBe(403);
      expect(
        (await request(ctx.app).delete(`/api/attachments/${id}`).set('Authorization', auth)).status,
      ).toBe(403);
    }
    expect((await request(ctx.app).get(`/api/attachments/${id}`)).status).toBe(401);
  });

  it('another workshop gets 404 for the attachment, its list and its delete', async () => {
    const { body } = await attach(connectorId, PDF, 'ours.pdf', 'application/pdf');
    const other = await createOtherWorkshop();
    const auth = other.authFor('admin');
    expect((await download(body.attachment.id, auth)).status).toBe(404);
    expect(
      (
        await request(ctx.app)
          .get(`/api/connectors/${connectorId}/attachments`)
          .set('Authorization', auth)
      ).status,
    ).toBe(404);
    expect(
      (
        await request(ctx.app)
          .delete(`/api/attachments/${body.attachment.id}`)
          .set('Authorization', auth)
      ).status,
    ).toBe(404);
    expect(
      (await attach(connectorId, PDF, 'theirs.pdf', 'application/pdf', other.authFor('builder')))
        .status,
    ).toBe(404);
    expect((await download(body.attachment.id)).status).toBe(200);
  });

  it('a builder deletes a scan: the row and the stored object go', async () => {
    const { body } = await attach(connectorId, PDF, 'old.pdf', 'application/pdf');
    const key = (await Attachment.findByPk(body.attachment.id))!.storageKey;
    const res = await request(ctx.app)
      .delete(`/api/attachments/${body.attachment.id}`)
      .set('Authorization', builder);
    expect(res.status).toBe(204);
    expect(await bucketKeys()).not.toContain(key);
    expect((await download(body.attachment.id)).status).toBe(404);
  });
});

describe('a stored file changed behind the app', () => {
  it('is refused on download (500 stored_file_altered), not served under the scan’s name', async () => {
    const { body } = await attach(connectorId, PNG, 'loom.png', 'image/png');
    const key = (await Attachment.findByPk(body.attachment.id))!.storageKey;
    // Someone holding the bucket's keys swaps the scan for a page of HTML.
    await s3.send(
      new PutObjectCommand({
        Bucket: BUCKET,
        Key: key,
        Body: '<html><script>alert(1)</script></html>',
        ContentType: 'image/png',
      }),
    );
    const got = await request(ctx.app)
      .get(`/api/attachments/${body.attachment.id}`)
      .set('Authorization', builder);
    expect(got.status).toBe(500);
    expect(got.body.error.code).toBe('stored_file_altered');
    expect(got.body.error.message).toMatch(/no longer matches/);
    expect(got.headers['content-type']).toMatch(/^application\/json/);
    expect(JSON.stringify(got.body)).not.toContain('<script>');
    expect((await request(ctx.app).get('/api/health')).status).toBe(200);
  });
});

describe('the S3 stand-in answers only requests signed with its own key', () => {
  it('refuses an unsigned listing, an unsigned PUT and a request signed with another secret (403)', async () => {
    const { body } = await attach(connectorId, PNG, 'keep.png', 'image/png');
    const key = (await Attachment.findByPk(body.attachment.id))!.storageKey;
    const listing = await fetch(`${fake.endpoint}/${BUCKET}`);
    expect(listing.status).toBe(403);
    expect(await listing.text()).not.toContain(key);
    const overwrite = await fetch(`${fake.endpoint}/${BUCKET}/${key}`, {
      method: 'PUT',
      headers: { 'Content-Type': 'image/png' },
      body: '<html><script>alert(1)</script></html>',
    });
    expect(overwrite.status).toBe(403);
    const unsignedGet = await fetch(`${fake.endpoint}/${BUCKET}/${key}`);
    expect(unsignedGet.status).toBe(403);

    const forger = new S3Client({
      endpoint: fake.endpoint,
      region: 'us-east-1',
      forcePathStyle: true,
      maxAttempts: 1,
      credentials: { accessKeyId: fake.credentials.accessKeyId, secretAccessKey: 'guessed' },
    });
    try {
      await expect(
        forger.send(new GetObjectCommand({ Bucket: BUCKET, Key: key })),
      ).rejects.toMatchObject({ $metadata: { httpStatusCode: 403 } });
    } finally {
      forger.destroy();
    }
    // The stored scan is untouched and still served.
    const got = await download(body.attachment.id);
    expect(got.status).toBe(200);
    expect(Buffer.compare(got.body as Buffer, PNG)).toBe(0);
  });

  it('makes up a different key pair on every start', async () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'loomwright-s3-keys-'));
    const other = await startS3Fake({ directory: dir, bucket: BUCKET, port: 0 });
    try {
      expect(other.credentials.accessKeyId).not.toBe(fake.credentials.accessKeyId);
      expect(other.credentials.secretAccessKey).not.toBe(fake.credentials.secretAccessKey);
      expect(other.credentials.secretAccessKey.length).toBeGreaterThanOrEqual(40);
    } finally {
      await other.close();
      rmSync(dir, { recursive: true, force: true });
    }
  });
});

describe('the folder store used without an S3 endpoint', () => {
  it('writes through a temporary name, reads back, deletes, and refuses keys that are not UUIDs', async () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'loomwright-folder-'));
    try {
      const store = new FolderFileStore(path.join(dir, 'uploads'));
      const key = '6f1c1a2e-8c1b-4c3a-9d7e-2b1f0a9c8d7e';
      await store.put(key, PDF);
      expect(readdirSync(path.join(dir, 'uploads'))).toEqual([key]);
      expect((await store.get(key))!.equals(PDF)).toBe(true);
      await store.delete(key);
      expect(await store.get(key)).toBeNull();
      await expect(store.put('../../app.db', PDF)).rejects.toThrow(/UUID/);
      expect(existsSync(path.join(dir, 'app.db'))).toBe(false);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});

describe('bench photos through the same S3 path', () => {
  const photoUrl = (key: string) =>
    `/api/conversions/${ctx.demo.conversions.signedOff}/revisions/1/bench/${encodeURIComponent(key)}/photos`;

  it('stores a technician’s photo of a pin under a UUID and lists it on the revision’s sheet', async () => {
    const tech = await ctx.authFor('technician');
    const before = await bucketKeys();
    const res = await request(ctx.app)
      .post(photoUrl('pin:E2-2'))
      .set('Authorization', tech)
      .attach('file', PNG, { filename: 'crimp.png', contentType: 'image/png' });
    expect(res.status).toBe(201);
    const added = (await bucketKeys()).filter((k) => !before.includes(k));
    expect(added).toHaveLength(1);
    expect(added[0]).toMatch(UUID);
    const sheet = await request(ctx.app)
      .get(`/api/conversions/${ctx.demo.conversions.signedOff}/revisions/1/bench`)
      .set('Authorization', await ctx.authFor('reviewer'));
    expect(sheet.body.photos['pin:E2-2']).toEqual([
      expect.objectContaining({ id: res.body.photo.id, takenBy: 'Sal Okafor' }),
    ]);
    const bytes = await request(ctx.app)
      .get(`/api/bench-photos/${res.body.photo.id}`)
      .set('Authorization', await ctx.authFor('reviewer'))
      .buffer(true)
      .parse((r, done) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => done(null, Buffer.concat(chunks)));
      });
    expect(bytes.status).toBe(200);
    expect(bytes.headers['content-type']).toBe('image/png');
    expect(bytes.headers['x-content-type-options']).toBe('nosniff');
    expect(Buffer.compare(bytes.body as Buffer, PNG)).toBe(0);
  });

  it('refuses a PDF or HTML as a photo (415), an unknown item (404) and the builder (403)', async () => {
    const tech = await ctx.authFor('technician');
    const pdf = await request(ctx.app)
      .post(photoUrl('pin:E2-2'))
      .set('Authorization', tech)
      .attach('file', PDF, { filename: 'x.jpg', contentType: 'image/jpeg' });
    expect(pdf.status).toBe(415);
    const unknown = await request(ctx.app)
      .post(photoUrl('pin:Z9-9'))
      .set('Authorization', tech)
      .attach('file', JPEG, { filename: 'x.jpg', contentType: 'image/jpeg' });
    expect(unknown.status).toBe(404);
    const builderPhoto = await request(ctx.app)
      .post(photoUrl('pin:E2-2'))
      .set('Authorization', builder)
      .attach('file', JPEG, { filename: 'x.jpg', contentType: 'image/jpeg' });
    expect(builderPhoto.status).toBe(403);
  });
});
