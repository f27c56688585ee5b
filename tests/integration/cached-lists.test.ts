/**
 * The pin, feed and wire lists are served from a cache checked against a change counter that
 * database triggers keep (migrations 0009 and 0015). Every way of writing must change what is served, and what is
 * served must be byte for byte what a fresh read of the database gives.
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '#server/db/index.ts';
import { Feed, FeedLoad, Pin } from '#server/db/models/index.ts';
import { toPinDto } from '#server/modules/pin-map/pin-dto.ts';
import { PIN_ORDER } from '#server/modules/pin-map/pins.service.ts';
import { toFeedDto } from '#server/modules/feeds/feeds.service.ts';
import { wiresOf } from '#server/modules/harness/harness.repository.ts';
import { createOtherWorkshop } from '../factories/workshop.factory.ts';
import { createTestContext, type TestContext } from '../helpers/test-app.ts';

let ctx: TestContext;
let builder: string;

beforeAll(async () => {
  ctx = await createTestContext();
  builder = await ctx.authFor('builder');
});
afterAll(() => ctx.close());

interface PinRow {
  id: number;
  connectorId: number;
  version: number;
  disposition: string;
  destinationFeedId: number | null;
}

/** The bytes the list had before any cache: every pin read afresh, as `res.json` would write them. */
async function freshPinList(conversionId: number): Promise<string> {
  const rows = await Pin.findAll({ where: { conversionId }, order: PIN_ORDER, raw: true });
  return JSON.stringify({ pins: rows.map(toPinDto) });
}

async function freshFeedList(conversionId: number): Promise<string> {
  const feeds = await Feed.findAll({
    where: { conversionId },
    include: [{ model: FeedLoad, as: 'loads' }],
    order: [['id', 'ASC']],
  });
  return JSON.stringify({ feeds: feeds.map(toFeedDto) });
}

async function freshWireList(conversionId: number): Promise<string> {
  return JSON.stringify({ wires: await wiresOf(conversionId) });
}

type List = 'pins' | 'feeds' | 'wires';
const FRESH: Record<List, (conversionId: number) => Promise<string>> = {
  pins: freshPinList,
  feeds: freshFeedList,
  wires: freshWireList,
};

async function served(conversionId: number, list: List, etag?: string) {
  const req = request(ctx.app)
    .get(`/api/conversions/${conversionId}/${list}`)
    .set('Authorization', builder);
  if (etag) req.set('If-None-Match', etag);
  const res = await req;
  return { status: res.status, text: res.text, etag: res.headers.etag as string, res };
}

/**
 * Reads the list (filling the cache), runs `write`, and checks that the list served next is the
 * fresh one, that it differs from before, and that the old ETag no longer gets a 304.
 */
async function expectWriteServed(
  conversionId: number,
  write: () => Promise<unknown>,
  list: List = 'pins',
) {
  const fresh = FRESH[list];
  const before = await served(conversionId, list);
  expect(before.status).toBe(200);
  expect(before.text).toBe(await fresh(conversionId));
  expect((await served(conversionId, list, before.etag)).status).toBe(304);
  await write();
  const after = await served(conversionId, list, before.etag);
  expect(after.status).toBe(200);
  expect(after.text).not.toBe(before.text);
  expect(after.text).toBe(await fresh(conversionId));
  expect(after.etag).not.toBe(before.etag);
}

async function newConversion(name: string) {
  const { body } = await request(ctx.app)
    .post('/api/conversions')
    .set('Authorization', builder)
    .send({ name, donorEngine: 'KT-20', receivingVehicle: 'Corran 100', systemVoltage: 12 })
    .expect(201);
  return body.conversion.id as number;
}

async function newConnector(conversionId: number, label: string, cavityCount = 6) {
  const { body } = await request(ctx.app)
    .post(`/api/conversions/${conversionId}/connectors`)
    .set('Authorization', builder)
    .send({ label, side: 'ecu', cavityCount })
    .expect(201);
  return body.connector.id as number;
}

async function pinsOf(conversionId: number): Promise<PinRow[]> {
  return JSON.parse((await served(conversionId, 'pins')).text).pins as PinRow[];
}

describe('the pin list', () => {
  let conversionId: number;
  beforeAll(async () => {
    conversionId = await newConversion('Cached list');
    await newConnector(conversionId, 'C1');
  });

  it('answers with the same bytes, type and ETag as a plain res.json would', async () => {
    const first = await served(conversionId, 'pins');
    expect(first.text).toBe(await freshPinList(conversionId));
    expect(first.res.headers['content-type']).toBe('application/json; charset=utf-8');
    expect(first.etag).toMatch(/^W\/"[0-9a-f]+-[A-Za-z0-9+/]{27}"$/);
    const again = await served(conversionId, 'pins');
    expect(again.text).toBe(first.text);
    expect(again.etag).toBe(first.etag);
  });

  it('changes after a pin edit', async () => {
    const [pin] = await pinsOf(conversionId);
    await expectWriteServed(conversionId, () =>
      request(ctx.app)
        .patch(`/api/pins/${pin!.id}`)
        .set('Authorization', builder)
        .send({ disposition: 'keep', version: pin!.version })
        .expect(200),
    );
  });

  it('changes after a bulk edit', async () => {
    const pins = await pinsOf(conversionId);
    await expectWriteServed(conversionId, () =>
      request(ctx.app)
        .post(`/api/conversions/${conversionId}/pins/bulk`)
        .set('Authorization', builder)
        .send({ pinIds: pins.slice(1, 4).map((p) => p.id), set: { disposition: 'cut' } })
        .expect(200),
    );
  });

  it('changes after a batch edit', async () => {
    const pins = await pinsOf(conversionId);
    await expectWriteServed(conversionId, () =>
      request(ctx.app)
        .post(`/api/conversions/${conversionId}/pins/batch`)
        .set('Authorization', builder)
        .send({
          changes: pins
            .slice(4, 6)
            .map((p, i) => ({ id: p.id, version: p.version, set: { function: `Batch ${i}` } })),
        })
        .expect(200),
    );
  });

  it('changes after an import', async () => {
    await newConnector(conversionId, 'I1', 2);
    await expectWriteServed(conversionId, () =>
      request(ctx.app)
        .post(`/api/conversions/${conversionId}/import`)
        .set('Authorization', builder)
        .attach(
          'file',
          Buffer.from(
            'connector,cavity,function,colour,disposition\nI1,1,Imported,RD,keep\nI1,2,,,empty\n',
          ),
          { filename: 'pinout.csv', contentType: 'text/csv' },
        )
        .then((res) => expect(res.status, JSON.stringify(res.body)).toBe(200)),
    );
  });

  it('changes after a connector is added and after one is deleted', async () => {
    let added = 0;
    await expectWriteServed(conversionId, async () => {
      added = await newConnector(conversionId, 'C2', 3);
    });
    await expectWriteServed(conversionId, () =>
      request(ctx.app).delete(`/api/connectors/${added}`).set('Authorization', builder).expect(204),
    );
  });

  it('changes after a feed a pin is joined to is deleted', async () => {
    const feed = await request(ctx.app)
      .post(`/api/conversions/${conversionId}/feeds`)
      .set('Authorization', builder)
      .send({
        name: 'Horn',
        source: 'battery',
        sourceFeedId: null,
        fuseA: 15,
        relay: null,
        wire: {
          sizeMm2: 1.5,
          insulationRatingC: 105,
          lengthM: 2,
          zone: 'cabin',
          bundled: 1,
          returnPath: 'chassis',
          colour: 'RD',
        },
        loads: [{ pinId: null, name: 'Horn', currentA: 8, continuous: false }],
        dropClass: 'general',
        dropLimitPct: null,
        notes: '',
      })
      .expect(201);
    const [pin] = await pinsOf(conversionId);
    await request(ctx.app)
      .patch(`/api/pins/${pin!.id}`)
      .set('Authorization', builder)
      .send({ destinationFeedId: feed.body.feed.id, version: pin!.version })
      .expect(200);
    await expectWriteServed(conversionId, () =>
      request(ctx.app)
        .delete(`/api/conversions/${conversionId}/feeds/${feed.body.feed.id}`)
        .set('Authorization', builder)
        .expect(204),
    );
    expect((await pinsOf(conversionId))[0]!.destinationFeedId).toBeNull();
  });

  it('changes after a write no service made (plain SQL)', async () => {
    await expectWriteServed(conversionId, () =>
      db().query(`UPDATE pins SET notes = 'by hand' WHERE conversion_id = ?`, {
        replacements: [conversionId],
      }),
    );
  });

  it('after submitting a revision still serves what the database holds', async () => {
    const pins = await pinsOf(conversionId);
    await request(ctx.app)
      .post(`/api/conversions/${conversionId}/pins/bulk`)
      .set('Authorization', builder)
      .send({
        pinIds: pins.filter((p) => p.disposition === 'undecided').map((p) => p.id),
        set: { disposition: 'empty' },
      })
      .expect(200);
    const before = await served(conversionId, 'pins');
    const submitted = await request(ctx.app)
      .post(`/api/conversions/${conversionId}/revisions`)
      .set('Authorization', builder)
      .send({});
    expect(submitted.status).toBe(201);
    const after = await served(conversionId, 'pins');
    // A submission freezes a copy and writes no pin: the list and its ETag stay, and are current.
    expect(after.text).toBe(await freshPinList(conversionId));
    expect(after.etag).toBe(before.etag);
  });

  it('keeps another workshop out (404) even when the list is cached', async () => {
    await served(conversionId, 'pins');
    const other = await createOtherWorkshop();
    const res = await request(ctx.app)
      .get(`/api/conversions/${conversionId}/pins`)
      .set('Authorization', other.authFor('builder'));
    expect(res.status).toBe(404);
  });
});

describe('the feed list', () => {
  const draft = () => ctx.demo.conversions.draft;
  const feedsOf = async () =>
    JSON.parse((await served(draft(), 'feeds')).text).feeds as Array<{
      id: number;
      version: number;
      fuseA: number;
    }>;

  it('changes after a feed edit', async () => {
    const [feed] = await feedsOf();
    await expectWriteServed(
      draft(),
      () =>
        request(ctx.app)
          .patch(`/api/conversions/${draft()}/feeds/${feed!.id}`)
          .set('Authorization', builder)
          .send({ fuseA: feed!.fuseA + 5, version: feed!.version })
          .expect(200),
      'feeds',
    );
  });

  it('changes after a load is changed by hand and after a feed is deleted', async () => {
    const [feed] = await feedsOf();
    await expectWriteServed(
      draft(),
      () =>
        db().query(`UPDATE feed_loads SET name = 'by hand' WHERE feed_id = ?`, {
          replacements: [feed!.id],
        }),
      'feeds',
    );
    const last = (await feedsOf()).at(-1)!;
    await expectWriteServed(
      draft(),
      async () => {
        await db().query(`UPDATE feeds SET source_feed_id = NULL WHERE source_feed_id = ?`, {
          replacements: [last.id],
        });
        await request(ctx.app)
          .delete(`/api/conversions/${draft()}/feeds/${last.id}`)
          .set('Authorization', builder)
          .expect(204);
      },
      'feeds',
    );
  });
});

describe('the wire list', () => {
  const draft = () => ctx.demo.conversions.draft;
  interface WireRow {
    id: number;
    version: number;
    ends: Array<{ kind: string; refId?: number }>;
  }
  const wiresServed = async () =>
    JSON.parse((await served(draft(), 'wires')).text).wires as WireRow[];
  const pinIds = async () =>
    (JSON.parse((await served(draft(), 'pins')).text).pins as PinRow[]).map((p) => p.id);

  it('answers with the same bytes and ETag as a plain res.json would', async () => {
    const first = await served(draft(), 'wires');
    expect(first.status).toBe(200);
    expect(first.text).toBe(await freshWireList(draft()));
    expect(first.res.headers['content-type']).toBe('application/json; charset=utf-8');
    expect((await served(draft(), 'wires', first.etag)).status).toBe(304);
  });

  it('changes after a wire is added, edited and deleted', async () => {
    const [a, b] = await pinIds();
    let id = 0;
    await expectWriteServed(
      draft(),
      async () => {
        const res = await request(ctx.app)
          .post(`/api/conversions/${draft()}/wires`)
          .set('Authorization', builder)
          .send({
            colour: 'GN',
            sizeMm2: 0.5,
            ends: [
              { kind: 'pin', refId: a },
              { kind: 'pin', refId: b },
            ],
          })
          .expect(201);
        id = res.body.wire.id as number;
      },
      'wires',
    );
    await expectWriteServed(
      draft(),
      () =>
        request(ctx.app)
          .patch(`/api/wires/${id}`)
          .set('Authorization', builder)
          .send({ lengthM: 2.5, version: 0 })
          .expect(200),
      'wires',
    );
    await expectWriteServed(
      draft(),
      () => request(ctx.app).delete(`/api/wires/${id}`).set('Authorization', builder).expect(204),
      'wires',
    );
  });

  it('changes after an end is changed by hand (plain SQL on wire_ends)', async () => {
    const [wire] = await wiresServed();
    await expectWriteServed(
      draft(),
      () =>
        db().query(
          `UPDATE wire_ends SET kind = 'unresolved', pin_id = NULL, splice_id = NULL,
             ground_point_id = NULL, box_position_id = NULL, terminal = NULL, source = NULL,
             text = 'by hand' WHERE wire_id = ? AND end_index = 1`,
          { replacements: [wire!.id] },
        ),
      'wires',
    );
  });

  it('changes after the pin an end is fastened to goes with its connector', async () => {
    const fastened = (await wiresServed()).find((w) => w.ends.some((e) => e.kind === 'pin'))!;
    const pinId = fastened.ends.find((e) => e.kind === 'pin')!.refId!;
    const pin = await Pin.findByPk(pinId);
    await expectWriteServed(
      draft(),
      () =>
        request(ctx.app)
          .delete(`/api/connectors/${pin!.connectorId}`)
          .set('Authorization', builder)
          .expect(204),
      'wires',
    );
    const after = (await wiresServed()).find((w) => w.id === fastened.id)!;
    expect(after.ends.some((e) => e.kind === 'pin' && e.refId === pinId)).toBe(false);
  });

  it('changes after a wire list CSV import', async () => {
    const csv = await request(ctx.app)
      .get(`/api/conversions/${draft()}/wires.csv`)
      .set('Authorization', builder)
      .buffer(true)
      .parse((res, done) => {
        let text = '';
        res.on('data', (c: Buffer) => (text += c.toString('utf8')));
        res.on('end', () => done(null, text));
      });
    const body = (csv.body as string).replace(/^\uFEFF/, '');
    const [header, ...lines] = body.split('\r\n');
    // The first wire's notes (a column of its own, whatever columns follow it) take new text.
    const notes = header!.split(',').indexOf('notes');
    const cells = lines[0]!.split(',');
    cells[notes] = 'imported note';
    const edited = [header, cells.join(','), ...lines.slice(1)];
    await expectWriteServed(
      draft(),
      () =>
        request(ctx.app)
          .post(`/api/conversions/${draft()}/wires/import`)
          .set('Authorization', builder)
          .attach('file', Buffer.from(edited.join('\r\n')), 'wires.csv')
          .expect(200),
      'wires',
    );
  });
});
