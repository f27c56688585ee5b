/**
 * Clean text everywhere (issue #16): NFC, no control, zero-width or direction characters, no lone
 * surrogates (400 naming the field); labels that read the same cannot stand side by side (409);
 * and whatever text the API accepts comes back unchanged through a CSV export and import.
 */
import fc from 'fast-check';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Pin } from '#shared/schemas/pin-map.schema.ts';
import { Pin as PinModel } from '#server/db/models/index.ts';
import { createTestContext, type TestContext } from '../helpers/test-app.ts';

let ctx: TestContext;
let builder: string;
const draft = () => ctx.demo.conversions.draft;

beforeAll(async () => {
  ctx = await createTestContext();
  builder = await ctx.authFor('builder');
});
afterAll(() => ctx.close());

const addConnector = (label: string, extra: Record<string, unknown> = {}) =>
  request(ctx.app)
    .post(`/api/conversions/${draft()}/connectors`)
    .set('Authorization', builder)
    .send({ label, side: 'engine', cavityCount: 2, ...extra });

const addConversion = (body: Record<string, unknown>) =>
  request(ctx.app)
    .post('/api/conversions')
    .set('Authorization', builder)
    .send({
      name: 'Clean',
      donorEngine: 'KT-20',
      receivingVehicle: 'Corran 100',
      systemVoltage: 12,
      ...body,
    });

describe('text the API refuses (400, naming the field)', () => {
  it('a NUL in a name', async () => {
    const res = await addConversion({ name: 'Bad\u0000name' });
    expect(res.status).toBe(400);
    expect(res.body.error.details).toEqual([
      { field: 'name', message: 'holds a control character (U+0000)' },
    ]);
    expect(res.body.error.message).toMatch(/^name: /);
  });

  it.each([
    ['an escape sequence', '\u001b[31mred', 'holds a control character (U+001B)'],
    ['a bell', 'ding\u0007', 'holds a control character (U+0007)'],
    ['a zero-width space', 'E1\u200b', 'holds an invisible zero-width character (U+200B)'],
    [
      'a right-to-left override',
      'fuse \u202e51 A',
      'holds an invisible text-direction character (U+202E)',
    ],
    ['a line break in a one-line field', 'two\nlines', 'must be one line, without tabs'],
  ])('%s in a connector label', async (_what, label, message) => {
    const res = await addConnector(label);
    expect(res.status).toBe(400);
    expect(res.body.error.details).toContainEqual({ field: 'label', message });
  });

  it('a lone surrogate, sent as raw JSON', async () => {
    const res = await request(ctx.app)
      .post('/api/conversions')
      .set('Authorization', builder)
      .set('Content-Type', 'application/json')
      .send(
        '{"name":"half \\ud800 a pair","donorEngine":"x","receivingVehicle":"y","systemVoltage":12}',
      );
    expect(res.status).toBe(400);
    expect(res.body.error.details[0]).toMatchObject({ field: 'name' });
    expect(res.body.error.details[0].message).toMatch(/lone surrogate/);
  });

  it('a control character in notes, where tab and line breaks are fine', async () => {
    const bad = await addConversion({ notes: 'ok\u0000' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.details[0].field).toBe('notes');
    const good = await addConversion({ notes: 'line one\r\n\tline two' });
    expect(good.status).toBe(201);
    expect(good.body.conversion.notes).toBe('line one\n\tline two');
  });
});

describe('text the API stores in one form', () => {
  it('stores NFC: an accent typed as a combining mark is the same string as the composed letter', async () => {
    const res = await addConversion({ name: 'Re\u0301gie' });
    expect(res.status).toBe(201);
    expect(res.body.conversion.name).toBe('R\u00e9gie');
  });
});

describe('labels that read the same (409)', () => {
  it('a Cyrillic "Е1" beside the demo\'s "E1"', async () => {
    const res = await addConnector('\u04151');
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/looks the same as connector "E1"/);
  });

  it('a fullwidth label, and a rename to a look-alike', async () => {
    expect((await addConnector('\uff25\uff12')).status).toBe(409);
    const created = await addConnector('K9');
    expect(created.status).toBe(201);
    const rename = await request(ctx.app)
      .patch(`/api/connectors/${created.body.connector.id}`)
      .set('Authorization', builder)
      .send({ label: '\u04153', version: created.body.connector.version });
    expect(rename.status).toBe(409);
  });

  it('cavity labels of one connector that read the same', async () => {
    const res = await addConnector('K10', { cavityLabels: ['A1', '\u04101'] });
    expect(res.status).toBe(400);
    expect(res.body.error.details[0].field).toBe('cavityLabels');
  });

  it('a feed named like another with a look-alike letter', async () => {
    const feed = (name: string) =>
      request(ctx.app)
        .post(`/api/conversions/${draft()}/feeds`)
        .set('Authorization', builder)
        .send({
          name,
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
            colour: 'bu/wh',
          },
          loads: [{ pinId: null, name: 'Twin horns', currentA: 8, continuous: false }],
          dropClass: 'general',
          dropLimitPct: null,
          notes: '',
        });
    expect((await feed('Horn')).status).toBe(201);
    const res = await feed('H\u043ern');
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/looks the same as feed "Horn"/);
  });
});

/** Characters most likely to break a CSV round trip or text handling, mixed into ordinary ones. */
const NASTY = [
  '"',
  ',',
  ';',
  '\t',
  '\n',
  '\r',
  '\r\n',
  ' ',
  '=',
  '+',
  '-',
  '@',
  "'",
  '\u0000',
  '\u001b',
  '\u007f',
  '\u0085',
  '\u00a0',
  '\u200b',
  '\u200d',
  '\u202e',
  '\u2066',
  '\ufeff',
  '\ud800',
  '\udc00',
  'e\u0301',
  '\u00e9',
  '\u0415',
  '\u00df',
  '\u{1f600}',
  '\u{1f468}\u200d\u{1f527}',
  '\u05d0',
  '\u0627',
  '\u6f22',
  '\ufffd',
  '\\',
  '°',
  '²',
  'Ω',
];
const textArb = (maxLength: number) =>
  fc.string({
    unit: fc.oneof(
      { weight: 3, arbitrary: fc.constantFrom(...NASTY) },
      { weight: 5, arbitrary: fc.constantFrom(...'abcXYZ 0129.()/') },
      { weight: 1, arbitrary: fc.string({ unit: 'binary', minLength: 1, maxLength: 1 }) },
    ),
    maxLength,
  });

describe('whatever the API accepts comes back unchanged through CSV', () => {
  it('pin text: accepted by PATCH → exported → blanked → imported → the same values', async () => {
    const conversion = (await addConversion({ name: 'Round trip' })).body.conversion.id as number;
    const connector = await request(ctx.app)
      .post(`/api/conversions/${conversion}/connectors`)
      .set('Authorization', builder)
      .send({ label: 'R1', side: 'ecu', cavityCount: 1 });
    expect(connector.status).toBe(201);
    const pinNow = async (): Promise<Pin> =>
      (
        await request(ctx.app)
          .get(`/api/conversions/${conversion}/pins`)
          .set('Authorization', builder)
      ).body.pins[0];
    let accepted = 0;
    await fc.assert(
      fc.asyncProperty(textArb(40), textArb(40), textArb(120), async (fn, destination, notes) => {
        const pin = await pinNow();
        const patch = await request(ctx.app)
          .patch(`/api/pins/${pin.id}`)
          .set('Authorization', builder)
          .send({ version: pin.version, function: fn, destination, notes });
        if (patch.status === 400) return; // refused, and said why: nothing to round-trip
        expect(patch.status).toBe(200);
        accepted += 1;
        const stored = await pinNow();
        const file = (
          await request(ctx.app)
            .get(`/api/conversions/${conversion}/pins.csv`)
            .set('Authorization', builder)
        ).text;
        await PinModel.update(
          { function: '', destination: '', notes: '' },
          { where: { id: pin.id } },
        );
        const imported = await request(ctx.app)
          .post(`/api/conversions/${conversion}/import`)
          .set('Authorization', builder)
          .attach('file', Buffer.from(file, 'utf8'), {
            filename: 'round-trip.csv',
            contentType: 'text/csv',
          });
        expect(imported.body.errors ?? []).toEqual([]);
        expect(imported.status).toBe(200);
        const back = await pinNow();
        expect({ f: back.function, d: back.destination, n: back.notes }).toEqual({
          f: stored.function,
          d: stored.destination,
          n: stored.notes,
        });
      }),
      { numRuns: 60 },
    );
    // The generator is not so hostile that nothing gets through.
    expect(accepted).toBeGreaterThan(5);
  });
});
