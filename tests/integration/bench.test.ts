import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BenchRecord, MailOutbox, Pin } from '#server/db/models/index.ts';
import type { BenchSheet } from '#shared/schemas/bench.schema.ts';
import type { TestPlanResponse } from '#shared/schemas/test-plan.schema.ts';
import { createTestContext, type TestContext } from '../helpers/test-app.ts';

let ctx: TestContext;
let id: number;
beforeAll(async () => {
  ctx = await createTestContext();
  id = ctx.demo.conversions.signedOff;
});
afterAll(() => ctx.close());

const sheetFor = async (role: 'technician' | 'builder' = 'technician', path = 'bench') =>
  (
    await request(ctx.app)
      .get(`/api/conversions/${id}/${path}`)
      .set('Authorization', await ctx.authFor(role))
  ).body as BenchSheet;

const put = async (number: number, key: string, body: object) =>
  request(ctx.app)
    .put(`/api/conversions/${id}/revisions/${number}/bench/${encodeURIComponent(key)}`)
    .set('Authorization', await ctx.authFor('technician'))
    .send({ ticks: {}, reading: null, note: '', version: null, ...body });

describe('bench checklist', () => {
  it('lists the signed-off revision’s pins in bench order, then the feeds, with the demo’s work done', async () => {
    const sheet = await sheetFor();
    expect(sheet.revision).toMatchObject({ number: 1, reviewedBy: 'Dana Whitlow', current: true });
    expect(sheet.items.every((i) => i.pin?.disposition !== 'empty')).toBe(true);
    expect(sheet.items[0]!.pin!.disposition).toBe('depin');
    // Then the harness: wires, splices, ground points and box positions, each with its own ticks.
    const kinds = sheet.items.map((i) => i.kind);
    expect(kinds.lastIndexOf('feed')).toBeLessThan(kinds.indexOf('wire'));
    expect(kinds).toEqual(expect.arrayContaining(['wire', 'splice', 'ground', 'box']));
    const wire = sheet.items.find((i) => i.kind === 'wire')!;
    expect(wire.ticks.map((t) => t.key)).toEqual(['done', 'labelled', 'tested']);
    expect(sheet.items.find((i) => i.kind === 'ground')!.ticks.map((t) => t.key)).toEqual([
      'done',
      'torqued',
    ]);
    expect(sheet.items.find((i) => i.kind === 'box')!.ticks).toHaveLength(1);
    expect(sheet.progress).toEqual({ total: sheet.items.length, done: 20, tested: 6, rework: 0 });
    expect(sheet.items.find((i) => i.name === 'E2-15')?.destinationLabel).toBe('DLC-6');
    expect(sheet.items.find((i) => i.name === 'E2-2')?.destinationLabel).toBe('Feed: ECU main');
    const depin = sheet.items[0]!;
    expect(depin.ticks.map((t) => t.key)).toEqual(['done', 'sealed']);
    expect(depin.reading).toBeNull();
  });

  it('is empty for a conversion with nothing signed off', async () => {
    const res = await request(ctx.app)
      .get(`/api/conversions/${ctx.demo.conversions.draft}/bench`)
      .set('Authorization', await ctx.authFor('technician'));
    expect(res.body).toMatchObject({ revision: null, items: [], rework: [], removed: [] });
  });

  it('records an item’s ticks and reading, checking the version', async () => {
    const open = (await sheetFor()).items.find((i) => !i.record && i.reading)!;
    const first = await put(1, open.key, { ticks: { done: true, tested: true }, reading: 0.08 });
    expect(first.status).toBe(200);
    expect(first.body.record).toMatchObject({
      key: open.key,
      ticks: { done: true, tested: true },
      reading: 0.08,
      recordedBy: 'Sal Okafor',
      version: 0,
    });
    expect((await put(1, open.key, { ticks: { done: false } })).status).toBe(409);
    const second = await put(1, open.key, {
      ticks: { done: true, tested: true },
      reading: 0.09,
      note: 'Re-measured',
      version: 0,
    });
    expect(second.status).toBe(200);
    expect(await BenchRecord.count({ where: { itemKey: open.key } })).toBe(1);
    expect((await sheetFor()).progress).toMatchObject({ done: 21, tested: 7 });
  });

  it('refuses ticks and readings that make no sense for the item (422, naming the field)', async () => {
    const depin = (await sheetFor()).items.find((i) => i.pin?.disposition === 'depin')!;
    const tested = await put(1, depin.key, { ticks: { done: true, tested: true } });
    expect(tested.status).toBe(422);
    expect(tested.body.error.details).toEqual([
      { field: 'ticks.tested', message: `is not offered for ${depin.name}` },
    ]);
    const reading = await put(1, depin.key, { ticks: { done: true }, reading: 0.1 });
    expect(reading.status).toBe(422);
    expect(reading.body.error.details[0].field).toBe('reading');
  });

  it('refuses the builder (403), an unknown item (404), an unknown tick (400)', async () => {
    const key = (await sheetFor()).items[0]!.key;
    const builder = await request(ctx.app)
      .put(`/api/conversions/${id}/revisions/1/bench/${encodeURIComponent(key)}`)
      .set('Authorization', await ctx.authFor('builder'))
      .send({ ticks: {}, reading: null, note: '', version: null });
    expect(builder.status).toBe(403);
    expect((await put(1, 'pin:Z9-99', {})).status).toBe(404);
    expect((await put(1, key, { ticks: { polished: true } })).status).toBe(400);
  });

  it('lists an expected resistance and a limit for every wire in the test plan, and judges readings', async () => {
    const res = await request(ctx.app)
      .get(`/api/conversions/${id}/revisions/1/test-plan`)
      .set('Authorization', await ctx.authFor('reviewer'));
    expect(res.status).toBe(200);
    const body = res.body as TestPlanResponse;
    const sheet = await sheetFor();
    const wires = sheet.items.filter(
      (i) =>
        i.feed ||
        i.kind === 'wire' ||
        i.pin?.disposition === 'extend' ||
        i.pin?.disposition === 'join',
    );
    const continuity = body.plan.steps.filter((s) => s.phase === 'unplugged' && s.unit === 'Ω');
    expect(continuity.map((s) => s.key).sort()).toEqual(wires.map((w) => w.key).sort());
    // Every wire of the harness is tested end to end, with its expected resistance and limit.
    expect(continuity.filter((s) => s.key.startsWith('wire:W-')).length).toBe(
      sheet.items.filter((i) => i.kind === 'wire').length,
    );
    for (const s of continuity) expect(s.limit?.max).toBeGreaterThan(0);
    expect(continuity.filter((s) => s.expected != null).length).toBeGreaterThan(0);
    const battery = await put(1, 'test:battery', { reading: 12.6 });
    expect(battery.status).toBe(200);
    const power = body.plan.steps.find((s) => s.key.startsWith('test:volts:'))!;
    expect(
      (await put(1, power.key, { reading: 11.9, note: 'Low: check the main relay' })).status,
    ).toBe(200);
    const after = (
      await request(ctx.app)
        .get(`/api/conversions/${id}/revisions/1/test-plan`)
        .set('Authorization', await ctx.authFor('technician'))
    ).body as TestPlanResponse;
    // 11.9 V against a 12.6 V battery: more than 0.5 V below (common practice, no source).
    expect(after.results[power.key]).toMatchObject({ verdict: 'fail', reading: 11.9 });
    expect(after.results['test:battery']).toMatchObject({ verdict: 'pass' });
  });
});

describe('a newer revision signed off', () => {
  it('carries unchanged work, puts the changed pin under rework, keeps revision 1 readable and tells the bench', async () => {
    const before = await sheetFor();
    // A cut pin that was done on revision 1 becomes a de-pin.
    const cut = before.items.find((i) => i.pin?.disposition === 'cut' && i.record)!;
    const pin = await Pin.findByPk(cut.pin!.id);
    const builder = await ctx.authFor('builder');
    const patched = await request(ctx.app)
      .patch(`/api/pins/${pin!.id}`)
      .set('Authorization', builder)
      .send({ disposition: 'depin', version: pin!.version });
    expect(patched.status).toBe(200);
    expect(
      (
        await request(ctx.app)
          .post(`/api/conversions/${id}/revisions`)
          .set('Authorization', builder)
          .send({})
      ).status,
    ).toBe(201);
    // Work sent for revision 1 while revision 2 waits is still accepted; once 2 is signed off it is not.
    const mailBefore = await MailOutbox.count({ where: { kind: 'bench_notice' } });
    const signed = await request(ctx.app)
      .post(`/api/conversions/${id}/revisions/2/sign-off`)
      .set('Authorization', await ctx.authFor('reviewer'))
      .send({});
    expect(signed.status).toBe(200);

    const after = await sheetFor();
    expect(after.revision).toMatchObject({ number: 2, current: true });
    expect(after.rework.map((i) => i.key)).toEqual([cut.key]);
    expect(after.rework[0]!.record!.rework).toMatchObject({
      fromRevision: 1,
      was: expect.stringContaining('Cut and insulate (cut back, end insulated)'),
    });
    expect(after.rework[0]!.asked).toContain('De-pin');
    expect(after.rework[0]!.record!.ticks).toEqual({});
    const doneBefore = before.items.filter((i) => i.key !== cut.key && i.record?.ticks.done);
    for (const item of doneBefore) {
      const now = after.items.find((i) => i.key === item.key)!;
      expect(now.record).toMatchObject({ ticks: item.record!.ticks, carriedFrom: 1 });
    }
    expect(after.progress.rework).toBe(1);

    const old = await sheetFor('technician', 'revisions/1/bench');
    expect(old.revision).toMatchObject({ number: 1, current: false });
    expect(old.items.find((i) => i.key === cut.key)!.record!.ticks).toMatchObject({ done: true });
    const stale = await put(1, cut.key, { ticks: { done: true } });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('superseded');

    expect(await MailOutbox.count({ where: { kind: 'bench_notice' } })).toBe(mailBefore + 1);
    const notice = await MailOutbox.findOne({
      where: { kind: 'bench_notice' },
      order: [['id', 'DESC']],
    });
    expect(notice!.toAddress).toBe('tech@example.com');
    expect(notice!.textBody).toContain('1 item needs rework');

    const list = await request(ctx.app)
      .get('/api/conversions')
      .set('Authorization', await ctx.authFor('technician'));
    const row = list.body.conversions.find((c: { id: number }) => c.id === id);
    expect(row.bench).toMatchObject({ revisionNumber: 2, reworkOpen: 1 });

    const redo = await put(2, cut.key, {
      ticks: { done: true, sealed: true },
      version: after.rework[0]!.record!.version,
    });
    expect(redo.status).toBe(200);
    expect((await sheetFor()).progress.rework).toBe(0);
  });
});
