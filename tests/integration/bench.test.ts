import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BenchRecord } from '#server/db/models/index.ts';
import type { BenchSheet } from '#shared/schemas/bench.schema.ts';
import { createTestContext, type TestContext } from '../helpers/test-app.ts';

let ctx: TestContext;
let id: number;
beforeAll(async () => {
  ctx = await createTestContext();
  id = ctx.demo.conversions.signedOff;
});
afterAll(() => ctx.close());

const sheetFor = async (role: 'technician' | 'builder' = 'technician') =>
  (
    await request(ctx.app)
      .get(`/api/conversions/${id}/bench`)
      .set('Authorization', await ctx.authFor(role))
  ).body as BenchSheet;

describe('bench checklist', () => {
  it('lists the signed-off revision’s pins in bench order with the demo’s work already done', async () => {
    const sheet = await sheetFor();
    expect(sheet.revision).toMatchObject({ number: 1, reviewedBy: 'Dana Whitlow' });
    expect(sheet.items.every((i) => i.pin.disposition !== 'empty')).toBe(true);
    expect(sheet.items[0]!.pin.disposition).toBe('depin');
    expect(sheet.progress).toEqual({ total: sheet.items.length, done: 14, tested: 6 });
    const linked = sheet.items.find((i) => i.name === 'E2-15');
    expect(linked?.destinationLabel).toBe('DLC-6');
    const fed = sheet.items.find((i) => i.name === 'E2-2');
    expect(fed?.destinationLabel).toBe('Feed: ECU main');
  });

  it('is empty for a conversion with nothing signed off', async () => {
    const res = await request(ctx.app)
      .get(`/api/conversions/${ctx.demo.conversions.draft}/bench`)
      .set('Authorization', await ctx.authFor('technician'));
    expect(res.body).toEqual({
      revision: null,
      items: [],
      progress: { total: 0, done: 0, tested: 0 },
    });
  });

  it('records a pin done and tested with a reading, checking the version', async () => {
    const sheet = await sheetFor();
    const open = sheet.items.find((i) => !i.record)!;
    const url = `/api/conversions/${id}/revisions/1/bench/${open.pin.id}`;
    const auth = await ctx.authFor('technician');
    const first = await request(ctx.app)
      .put(url)
      .set('Authorization', auth)
      .send({ done: true, tested: true, resistanceOhm: 0.08, note: '', version: null });
    expect(first.status).toBe(200);
    expect(first.body.record).toMatchObject({
      done: true,
      tested: true,
      resistanceOhm: 0.08,
      recordedBy: 'Sal Okafor',
      version: 0,
    });
    const stale = await request(ctx.app)
      .put(url)
      .set('Authorization', auth)
      .send({ done: false, tested: false, resistanceOhm: null, note: '', version: null });
    expect(stale.status).toBe(409);
    const second = await request(ctx.app)
      .put(url)
      .set('Authorization', auth)
      .send({ done: true, tested: true, resistanceOhm: 0.09, note: 'Re-measured', version: 0 });
    expect(second.status).toBe(200);
    expect(await BenchRecord.count({ where: { pinId: open.pin.id } })).toBe(1);
    expect((await sheetFor()).progress.done).toBe(15);
  });

  it('refuses the builder (403), a pin not in the revision (404), a negative reading (400) and a revision not signed off (409)', async () => {
    const sheet = await sheetFor();
    const pin = sheet.items[0]!.pin;
    const body = { done: true, tested: false, resistanceOhm: null, note: '', version: null };
    const builder = await request(ctx.app)
      .put(`/api/conversions/${id}/revisions/1/bench/${pin.id}`)
      .set('Authorization', await ctx.authFor('builder'))
      .send(body);
    expect(builder.status).toBe(403);
    const tech = await ctx.authFor('technician');
    expect(
      (
        await request(ctx.app)
          .put(`/api/conversions/${id}/revisions/1/bench/999999`)
          .set('Authorization', tech)
          .send(body)
      ).status,
    ).toBe(404);
    const negative = await request(ctx.app)
      .put(`/api/conversions/${id}/revisions/1/bench/${pin.id}`)
      .set('Authorization', tech)
      .send({ ...body, resistanceOhm: -1 });
    expect(negative.status).toBe(400);
    const submitted = await request(ctx.app)
      .post(`/api/conversions/${id}/revisions`)
      .set('Authorization', await ctx.authFor('builder'))
      .send({});
    expect(submitted.status).toBe(201);
    const notSigned = await request(ctx.app)
      .put(`/api/conversions/${id}/revisions/2/bench/${pin.id}`)
      .set('Authorization', tech)
      .send(body);
    expect(notSigned.status).toBe(409);
  });
});
