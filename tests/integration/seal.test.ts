/**
 * The seal on reviewers' decisions (docs/decisions/0010-write-queue-and-seal.md): a revision
 * rewritten in the database file, triggers dropped and hash recomputed, is refused by the revision
 * page, the worksheet PDF and the bench instead of being served.
 */
import { statSync } from 'node:fs';
import path from 'node:path';
import { QueryTypes } from 'sequelize';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { revisionHash } from '#shared/domain/revisions/content-hash.ts';
import type { Finding } from '#shared/schemas/checks.schema.ts';
import type { ConversionSnapshot } from '#shared/schemas/snapshot.schema.ts';
import { db } from '#server/db/index.ts';
import { Revision } from '#server/db/models/index.ts';
import { createTestContext, onPostgres, type TestContext } from '../helpers/test-app.ts';

let ctx: TestContext;
let conversionId: number;
let reviewer: string;
beforeAll(async () => {
  ctx = await createTestContext();
  reviewer = await ctx.authFor('reviewer');
  const signed = await Revision.findOne({ where: { status: 'signed_off' } });
  conversionId = signed!.conversionId;
});
afterAll(() => ctx.close());

const raw = (sql: string, replacements?: unknown[]) =>
  db().query(sql, { replacements, type: QueryTypes.RAW });
const refusal = (sql: string) =>
  raw(sql).then(
    () => 'accepted',
    (err: { parent?: Error }) => String(err.parent?.message),
  );
const page = (number: number) =>
  request(ctx.app)
    .get(`/api/conversions/${conversionId}/revisions/${number}`)
    .set('Authorization', reviewer);
const pdf = (number: number) =>
  request(ctx.app)
    .get(`/api/conversions/${conversionId}/revisions/${number}/worksheet.pdf`)
    .set('Authorization', reviewer);

describe('the seal key', () => {
  it('is generated beside the JWT secret, outside the database, readable by the owner only', () => {
    const file = path.join(ctx.env.DATA_DIR, 'seal-key.pem');
    expect(statSync(file).mode & 0o777).toBe(0o600);
    expect(ctx.env.SEAL_PRIVATE_KEY).toContain('BEGIN PRIVATE KEY');
  });
});

describe('a sealed revision', () => {
  it('shows its seal and public key on the revision page and verifies', async () => {
    const res = await page(1);
    expect(res.status).toBe(200);
    expect(res.body.revision.seal).toMatchObject({ algorithm: 'Ed25519' });
    expect(Buffer.from(res.body.revision.seal.publicKey, 'base64')).toHaveLength(32);
    expect(res.body.revision.seal.fingerprint).toMatch(/^([0-9a-f]{4} ){7}[0-9a-f]{4}$/);
    const verify = await request(ctx.app)
      .get(`/api/conversions/${conversionId}/revisions/1/verify`)
      .set('Authorization', reviewer);
    expect(verify.body).toMatchObject({ ok: true, sealed: true, problem: null });
    // Printing a sealed revision is covered in worksheet.test.ts (the demo's revision is sealed).
  });

  it('is sealed when signed off through the API, with the reviewer and time it stores', async () => {
    const builder = await ctx.authFor('builder');
    const submitted = await request(ctx.app)
      .post(`/api/conversions/${conversionId}/revisions`)
      .set('Authorization', builder)
      .send({ note: 'Second look' });
    expect(submitted.status).toBe(201);
    const number = submitted.body.revision.number as number;
    expect((await page(number)).body.revision.seal).toBeNull();
    const signed = await request(ctx.app)
      .post(`/api/conversions/${conversionId}/revisions/${number}/sign-off`)
      .set('Authorization', reviewer)
      .send({});
    expect(signed.status).toBe(200);
    const shown = await page(number);
    expect(shown.status).toBe(200);
    expect(shown.body.revision.seal.signature).toMatch(/^[A-Za-z0-9+/]{86}==$/);
  });

  it('keeps the review comments of a decided revision', async () => {
    const revision = await Revision.findOne({ where: { conversionId, number: 1 } });
    await request(ctx.app)
      .post(`/api/conversions/${conversionId}/revisions/1/comments`)
      .set('Authorization', reviewer)
      .send({ body: 'A late remark' })
      .expect(201);
    expect(
      await refusal(`DELETE FROM review_comments WHERE revision_id = ${revision!.id}`),
    ).toMatch(/kept/);
    expect(await refusal(`UPDATE review_comments SET body = 'x'`)).toMatch(/append-only/);
    expect(
      await refusal(`UPDATE revisions SET review_comment = 'x' WHERE id = ${revision!.id}`),
    ).toMatch(/immutable/);
  });
});

describe('a revision rewritten in the database file', () => {
  beforeAll(async () => {
    // What someone who can write the file can do: drop the triggers that guard revisions.
    for (const trigger of [
      'revisions_frozen_content',
      'revisions_signed_immutable',
      'revisions_decided_immutable',
    ]) {
      await raw(onPostgres ? `DROP TRIGGER ${trigger} ON revisions` : `DROP TRIGGER ${trigger}`);
    }
  });

  it('is refused for a forged reviewer name, and served again once it is put back', async () => {
    const revision = await Revision.findOne({ where: { conversionId, number: 1 } });
    const real = revision!.reviewedByName;
    await raw('UPDATE revisions SET reviewed_by_name = ? WHERE id = ?', [
      'Someone Else',
      revision!.id,
    ]);
    const res = await page(1);
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('seal_mismatch');
    expect(res.body.error.message).toMatch(/does not match its seal/);
    await raw('UPDATE revisions SET reviewed_by_name = ? WHERE id = ?', [real, revision!.id]);
    expect((await page(1)).status).toBe(200);
  });

  it('is refused by the revision page, the worksheet PDF and the bench when a fuse is changed and the hash recomputed', async () => {
    const revision = await Revision.findOne({ where: { conversionId, number: 1 } });
    const snapshot = JSON.parse(revision!.snapshotJson) as ConversionSnapshot;
    const findings = JSON.parse(revision!.findingsJson) as Finding[];
    const feed = snapshot.feeds.find((f) => f.fuseA === 15) ?? snapshot.feeds[0]!;
    feed.fuseA = 40;
    const forgedHash = await revisionHash(snapshot, findings);
    await raw('UPDATE revisions SET snapshot_json = ?, hash = ? WHERE id = ?', [
      JSON.stringify(snapshot),
      forgedHash,
      revision!.id,
    ]);
    // The latest signed-off revision the bench works from is revision 2: forge that one as well.
    const latest = await Revision.findOne({ where: { conversionId }, order: [['number', 'DESC']] });
    await raw('UPDATE revisions SET reviewed_at = ? WHERE id = ?', [
      '2020-01-01 00:00:00.000 +00:00',
      latest!.id,
    ]);

    const shown = await page(1);
    expect(shown.status).toBe(409);
    expect(shown.body.error.code).toBe('seal_mismatch');
    expect(JSON.stringify(shown.body)).not.toMatch(/"fuseA"/);

    const printed = await pdf(1);
    expect(printed.status).toBe(409);
    expect(printed.headers['content-type']).toMatch(/json/);
    expect(printed.body.error.code).toBe('seal_mismatch');

    const bench = await request(ctx.app)
      .get(`/api/conversions/${conversionId}/bench`)
      .set('Authorization', await ctx.authFor('technician'));
    expect(bench.status).toBe(409);

    const verify = await request(ctx.app)
      .get(`/api/conversions/${conversionId}/revisions/1/verify`)
      .set('Authorization', reviewer);
    // The recomputed hash matches the stored one, yet the seal does not.
    expect(verify.body).toMatchObject({ ok: false, hash: forgedHash, storedHash: forgedHash });
  });
});
