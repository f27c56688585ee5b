import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditEvent, Feed, Pin } from '#server/db/models/index.ts';
import { feedBody } from '../factories/feed.factory.ts';
import { createOtherWorkshop } from '../factories/workshop.factory.ts';
import { createTestContext, type TestContext } from '../helpers/test-app.ts';

let ctx: TestContext;
let builder: string;
let draftId: number;

beforeAll(async () => {
  ctx = await createTestContext();
  builder = await ctx.authFor('builder');
  draftId = ctx.demo.conversions.draft;
});
afterAll(() => ctx.close());

describe('feeds', () => {
  it('lists the demo feeds with their loads to every role', async () => {
    const res = await request(ctx.app)
      .get(`/api/conversions/${draftId}/feeds`)
      .set('Authorization', await ctx.authFor('technician'));
    expect(res.status).toBe(200);
    expect(res.body.feeds.map((f: { name: string }) => f.name)).toEqual([
      'ECU main',
      'Ignition coils',
      'Fuel pump',
      'Cooling fan',
      'Diagnostic and memory',
    ]);
    const fan = res.body.feeds.find((f: { name: string }) => f.name === 'Cooling fan');
    expect(fan).toMatchObject({
      fuseA: 30,
      wire: { sizeMm2: 1, zone: 'engine_bay' },
      relay: { contactRatingA: 40 },
    });
    expect(fan.loads[0]).toMatchObject({ currentA: 22, continuous: true });
  });

  it('creates, reads, updates with a version check and deletes a feed, auditing each', async () => {
    const created = await request(ctx.app)
      .post(`/api/conversions/${draftId}/feeds`)
      .set('Authorization', builder)
      .send(feedBody());
    expect(created.status).toBe(201);
    const feed = created.body.feed;
    expect(feed.wire.colour).toBe('BU/WH');
    const got = await request(ctx.app)
      .get(`/api/conversions/${draftId}/feeds/${feed.id}`)
      .set('Authorization', builder);
    expect(got.body.feed.loads).toHaveLength(1);
    const updated = await request(ctx.app)
      .patch(`/api/conversions/${draftId}/feeds/${feed.id}`)
      .set('Authorization', builder)
      .send({
        loads: [{ pinId: null, name: 'Single horn', currentA: 4, continuous: false }],
        version: feed.version,
      });
    expect(updated.status).toBe(200);
    expect(updated.body.feed.loads).toEqual([
      expect.objectContaining({ name: 'Single horn', currentA: 4 }),
    ]);
    expect(updated.body.feed.version).toBe(feed.version + 1);
    const stale = await request(ctx.app)
      .patch(`/api/conversions/${draftId}/feeds/${feed.id}`)
      .set('Authorization', builder)
      .send({ fuseA: 40, version: feed.version });
    expect(stale.status).toBe(409);
    expect((await Feed.findByPk(feed.id))!.fuseA).toBe(15);
    const removed = await request(ctx.app)
      .delete(`/api/conversions/${draftId}/feeds/${feed.id}`)
      .set('Authorization', builder);
    expect(removed.status).toBe(204);
    const audit = await AuditEvent.findAll({ where: { entityType: 'feed', entityId: feed.id } });
    expect(audit.map((a) => a.action)).toEqual(['create', 'update', 'delete']);
  });

  it('unlinks pins joined to a deleted feed', async () => {
    const created = await request(ctx.app)
      .post(`/api/conversions/${draftId}/feeds`)
      .set('Authorization', builder)
      .send(feedBody({ name: 'Spare' }));
    const pin = await Pin.findOne({ where: { conversionId: draftId, disposition: 'undecided' } });
    await request(ctx.app)
      .patch(`/api/pins/${pin!.id}`)
      .set('Authorization', builder)
      .send({ destinationFeedId: created.body.feed.id, version: pin!.version })
      .expect(200);
    await request(ctx.app)
      .delete(`/api/conversions/${draftId}/feeds/${created.body.feed.id}`)
      .set('Authorization', builder)
      .expect(204);
    expect((await Pin.findByPk(pin!.id))!.destinationFeedId).toBeNull();
  });

  it.each([
    [
      {
        wire: {
          sizeMm2: 0.8,
          insulationRatingC: 105,
          lengthM: 2,
          zone: 'cabin',
          bundled: 1,
          returnPath: 'wire',
          colour: '',
        },
      },
      'wire.sizeMm2',
    ],
    [{ source: 'relay_output', sourceFeedId: null }, 'sourceFeedId'],
    [{ fuseA: -5 }, 'fuseA'],
    [{ dropClass: 'tight' }, 'dropClass'],
    [{ loads: [{ pinId: null, name: 'x', currentA: -1, continuous: true }] }, 'loads.0.currentA'],
    [{ colour: 'RD' }, '(body)'],
  ])('answers 400 naming the field for %j', async (over, field) => {
    const res = await request(ctx.app)
      .post(`/api/conversions/${draftId}/feeds`)
      .set('Authorization', builder)
      .send(feedBody(over));
    expect(res.status).toBe(400);
    expect(res.body.error.details.map((d: { field: string }) => d.field)).toContain(field);
  });

  it('refuses references outside the conversion and loops of relay outputs', async () => {
    const foreignPin = await Pin.findOne({
      where: { conversionId: ctx.demo.conversions.signedOff },
    });
    const foreign = await request(ctx.app)
      .post(`/api/conversions/${draftId}/feeds`)
      .set('Authorization', builder)
      .send(
        feedBody({
          name: 'Foreign',
          loads: [{ pinId: foreignPin!.id, name: '', currentA: 1, continuous: true }],
        }),
      );
    expect(foreign.status).toBe(400);
    const a = (
      await request(ctx.app)
        .post(`/api/conversions/${draftId}/feeds`)
        .set('Authorization', builder)
        .send(feedBody({ name: 'Loop A' }))
    ).body.feed;
    const b = (
      await request(ctx.app)
        .post(`/api/conversions/${draftId}/feeds`)
        .set('Authorization', builder)
        .send(feedBody({ name: 'Loop B', source: 'relay_output', sourceFeedId: a.id }))
    ).body.feed;
    const loop = await request(ctx.app)
      .patch(`/api/conversions/${draftId}/feeds/${a.id}`)
      .set('Authorization', builder)
      .send({ source: 'relay_output', sourceFeedId: b.id, version: a.version });
    expect(loop.status).toBe(400);
    expect(loop.body.error.message).toMatch(/loop/);
    const inUse = await request(ctx.app)
      .delete(`/api/conversions/${draftId}/feeds/${a.id}`)
      .set('Authorization', builder);
    expect(inUse.status).toBe(409);
    const duplicate = await request(ctx.app)
      .post(`/api/conversions/${draftId}/feeds`)
      .set('Authorization', builder)
      .send(feedBody({ name: 'Loop A' }));
    expect(duplicate.status).toBe(409);
  });

  it('refuses the technician and reviewer (403) and other workshops (404)', async () => {
    for (const role of ['technician', 'reviewer'] as const) {
      const res = await request(ctx.app)
        .post(`/api/conversions/${draftId}/feeds`)
        .set('Authorization', await ctx.authFor(role))
        .send(feedBody({ name: 'No' }));
      expect(res.status).toBe(403);
    }
    const other = await createOtherWorkshop();
    const res = await request(ctx.app)
      .get(`/api/conversions/${draftId}/feeds`)
      .set('Authorization', other.authFor('builder'));
    expect(res.status).toBe(404);
  });
});

describe('a pin joined to a feed is one fact', () => {
  const pinsOf = async () =>
    (
      await request(ctx.app)
        .get(`/api/conversions/${draftId}/pins`)
        .set('Authorization', builder)
        .expect(200)
    ).body.pins as Array<{
      id: number;
      version: number;
      function: string;
      destination: string;
      destinationFeedId: number | null;
    }>;
  const feedOf = async (id: number) =>
    (
      await request(ctx.app)
        .get(`/api/conversions/${draftId}/feeds`)
        .set('Authorization', builder)
        .expect(200)
    ).body.feeds.find((f: { id: number }) => f.id === id) as {
      id: number;
      version: number;
      loads: Array<{ pinId: number | null; name: string }>;
    };

  it('adding a pin as a feed load sets its destination; taking it off clears it', async () => {
    const pin = (await pinsOf()).find((p) => p.destinationFeedId == null)!;
    const created = await request(ctx.app)
      .post(`/api/conversions/${draftId}/feeds`)
      .set('Authorization', builder)
      .send(
        feedBody({
          name: 'Washer pump',
          loads: [{ pinId: pin.id, name: 'Washer', currentA: 3, continuous: false }],
        }),
      )
      .expect(201);
    const feed = created.body.feed;
    let now = (await pinsOf()).find((p) => p.id === pin.id)!;
    expect(now).toMatchObject({ destinationFeedId: feed.id, destination: '' });
    expect(now.version).toBeGreaterThan(pin.version);

    await request(ctx.app)
      .patch(`/api/conversions/${draftId}/feeds/${feed.id}`)
      .set('Authorization', builder)
      .send({ loads: [], version: feed.version })
      .expect(200);
    now = (await pinsOf()).find((p) => p.id === pin.id)!;
    expect(now.destinationFeedId).toBeNull();
  });

  it('setting a pin’s destination to a feed adds it as a load and moves it off the old feed', async () => {
    const feeds = (
      await request(ctx.app).get(`/api/conversions/${draftId}/feeds`).set('Authorization', builder)
    ).body.feeds as Array<{ id: number; name: string }>;
    const horn = (
      await request(ctx.app)
        .post(`/api/conversions/${draftId}/feeds`)
        .set('Authorization', builder)
        .send(feedBody({ name: 'Horn relay', loads: [] }))
        .expect(201)
    ).body.feed;
    const other = feeds.find((f) => f.name === 'Fuel pump')!;
    const pin = (await pinsOf()).find((p) => p.destinationFeedId == null && p.function)!;
    const hornBefore = await feedOf(horn.id);

    const first = await request(ctx.app)
      .patch(`/api/pins/${pin.id}`)
      .set('Authorization', builder)
      .send({ destinationFeedId: horn.id, version: pin.version })
      .expect(200);
    const hornAfter = await feedOf(horn.id);
    expect(hornAfter.loads).toEqual([
      expect.objectContaining({ pinId: pin.id, name: pin.function.slice(0, 80) }),
    ]);
    expect(hornAfter.version).toBeGreaterThan(hornBefore.version);

    // The same pin to another feed: it leaves the horn's loads.
    await request(ctx.app)
      .post(`/api/conversions/${draftId}/pins/batch`)
      .set('Authorization', builder)
      .send({
        changes: [
          { id: pin.id, version: first.body.pin.version, set: { destinationFeedId: other.id } },
        ],
      })
      .expect(200);
    expect((await feedOf(horn.id)).loads).toEqual([]);
    expect((await feedOf(other.id)).loads.map((l) => l.pinId)).toContain(pin.id);
  });
});

describe('a pinout import that joins pins to feeds', () => {
  it('adds the pins to the feeds’ loads, and takes them off when the file no longer joins them', async () => {
    const connector = await request(ctx.app)
      .post(`/api/conversions/${draftId}/connectors`)
      .set('Authorization', builder)
      .send({ label: 'X7', side: 'ecu', cavityCount: 2 })
      .expect(201);
    const upload = (csv: string) =>
      request(ctx.app)
        .post(`/api/connectors/${connector.body.connector.id}/import`)
        .set('Authorization', builder)
        .attach('file', Buffer.from(csv, 'utf8'), {
          filename: 'x7.csv',
          contentType: 'text/csv',
        });
    const fuelPump = async () =>
      (
        (
          await request(ctx.app)
            .get(`/api/conversions/${draftId}/feeds`)
            .set('Authorization', builder)
        ).body.feeds as Array<{ name: string; loads: Array<{ pinId: number | null }> }>
      ).find((f) => f.name === 'Fuel pump')!;
    const x71 = async () =>
      (
        (
          await request(ctx.app)
            .get(`/api/conversions/${draftId}/pins`)
            .set('Authorization', builder)
        ).body.pins as Array<{ id: number; connectorId: number; cavity: string }>
      ).find((p) => p.connectorId === connector.body.connector.id && p.cavity === '1')!;

    await upload('cavity,function,feed\n1,Pump relay supply,Fuel pump\n2,,\n').expect(200);
    const pin = await x71();
    expect((await fuelPump()).loads.map((l) => l.pinId)).toContain(pin.id);
    await upload('cavity,function,feed\n1,Pump relay supply,\n2,,\n').expect(200);
    expect((await fuelPump()).loads.map((l) => l.pinId)).not.toContain(pin.id);
  });
});
