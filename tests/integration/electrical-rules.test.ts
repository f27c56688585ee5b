/**
 * The electrical rules of the second round through the API, as a builder uses them: a feed's fuse
 * placement, an ECU output's rating against a relay coil and against a load wired straight to it,
 * colours typed with a stripe or in the common abbreviations, and the workshop's drop budget.
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Finding } from '#shared/schemas/checks.schema.ts';
import { feedBody, HORN_WIRE } from '../factories/feed.factory.ts';
import { createTestContext, type TestContext } from '../helpers/test-app.ts';

let ctx: TestContext;
let builder: string;
let conversionId: number;

beforeAll(async () => {
  ctx = await createTestContext();
  builder = await ctx.authFor('builder');
  conversionId = ctx.demo.conversions.draft;
});
afterAll(() => ctx.close());

/** A work lamp on a 10 A fuse, no relay, 1.5 mm² over 1 m with its own return. */
const lampBody = (over: Record<string, unknown> = {}) =>
  feedBody({
    name: 'Work lamp',
    fuseA: 10,
    relay: null,
    wire: { ...HORN_WIRE, lengthM: 1, returnPath: 'wire', colour: 'RD' },
    loads: [{ pinId: null, name: 'Lamp', currentA: 4, continuous: true }],
    ...over,
  });

async function findings(): Promise<Finding[]> {
  const res = await request(ctx.app)
    .post(`/api/conversions/${conversionId}/checks`)
    .set('Authorization', builder);
  expect(res.status).toBe(200);
  return res.body.findings as Finding[];
}

async function createFeed(over: Record<string, unknown>) {
  const res = await request(ctx.app)
    .post(`/api/conversions/${conversionId}/feeds`)
    .set('Authorization', builder)
    .send(lampBody(over));
  expect(res.status).toBe(201);
  return res.body.feed as { id: number; version: number; unfusedLengthMm: number | null };
}

async function newPin(label: string) {
  const made = await request(ctx.app)
    .post(`/api/conversions/${conversionId}/connectors`)
    .set('Authorization', builder)
    .send({ label, side: 'ecu', cavityCount: 1 });
  expect(made.status).toBe(201);
  const pins = await request(ctx.app)
    .get(`/api/conversions/${conversionId}/pins`)
    .set('Authorization', builder);
  return (pins.body.pins as Array<{ id: number; connectorId: number; version: number }>).find(
    (p) => p.connectorId === made.body.connector.id,
  )!;
}

async function patchPin(pin: { id: number; version: number }, body: Record<string, unknown>) {
  const res = await request(ctx.app)
    .patch(`/api/pins/${pin.id}`)
    .set('Authorization', builder)
    .send({ ...body, version: pin.version });
  expect(res.status).toBe(200);
  return res.body.pin as Record<string, unknown> & { id: number; version: number };
}

describe('fuse placement through the API', () => {
  it('errors on 300 mm of unfused wire citing 33 CFR 183.455(b), and not on 150 mm', async () => {
    const far = await createFeed({ name: 'Lamp far from source', unfusedLengthMm: 300 });
    expect(far.unfusedLengthMm).toBe(300);
    const near = await createFeed({ name: 'Lamp near source', unfusedLengthMm: 150 });
    const placed = (await findings()).filter((f) => f.rule === 'fuse_placement');
    const onFar = placed.find((f) => f.subject.feedId === far.id);
    expect(onFar).toMatchObject({ severity: 'error' });
    expect(onFar!.working.join(' ')).toMatch(/33 CFR 183\.455\(b\)/);
    expect(onFar!.source).toMatch(/183\.455/);
    expect(placed.find((f) => f.subject.feedId === near.id)).toBeUndefined();
  });

  it('keeps the fuse family and the sheath through a round trip', async () => {
    const feed = await createFeed({
      name: 'Winch',
      fuseA: 150,
      fuseType: 'bolt_down',
      unfusedLengthMm: 600,
      fuseSheathed: true,
      wire: { ...lampBody().wire, sizeMm2: 35 },
    });
    const got = await request(ctx.app)
      .get(`/api/conversions/${conversionId}/feeds/${feed.id}`)
      .set('Authorization', builder);
    expect(got.body.feed).toMatchObject({
      fuseType: 'bolt_down',
      unfusedLengthMm: 600,
      fuseSheathed: true,
    });
    // 600 mm is within the 1,016 mm a sheathed run is allowed.
    expect(
      (await findings()).filter((f) => f.rule === 'fuse_placement' && f.subject.feedId === feed.id),
    ).toHaveLength(0);
  });
});

describe('ECU outputs through the API', () => {
  it('passes a 60 Ω coil at 12 V on a 0.5 A low-side output and errors on an 8 A fan wired to it', async () => {
    const output = await patchPin(await newPin('Q1'), {
      function: 'Fan relay drive',
      signalClass: 'actuator_output',
      disposition: 'extend',
      driverType: 'low_side',
      driverRatedA: 0.5,
    });
    expect(output).toMatchObject({ driverType: 'low_side', driverRatedA: 0.5 });
    // [C] 12 V / 60 Ω = 0.2 A ≤ 0.5 A.
    const feed = await createFeed({
      name: 'Fan by relay',
      fuseA: 30,
      relay: { contactRatingA: 40, coilCurrentA: 0, coilPinId: output.id, coilResistanceOhm: 60 },
      wire: { ...lampBody().wire, sizeMm2: 6 },
      loads: [{ pinId: null, name: 'Fan', currentA: 8, continuous: true, kind: 'motor' }],
    });
    const coil = (await findings()).filter(
      (f) => f.rule === 'relay_coil_driver' && f.subject.feedId === feed.id,
    );
    expect(coil).toHaveLength(0);

    // The same output wired straight to the 8 A fan.
    await patchPin(output, { loadCurrentA: 8 });
    const direct = (await findings()).find(
      (f) => f.rule === 'ecu_output_overload' && f.subject.pinIds?.includes(output.id),
    );
    expect(direct).toMatchObject({ severity: 'error' });
    expect(direct!.message).toMatch(/drive a relay coil instead/);
  });
});

describe('colours through the API', () => {
  it('keeps "GN/YE" as green with a yellow stripe and stores "BLU/WHT" as BU/WH', async () => {
    const pin = await newPin('C1');
    const striped = await patchPin(pin, { colour: 'GN/YE' });
    expect(striped.colour).toBe('GN/YE');
    const abbreviated = await patchPin(striped, { colour: 'BLU/WHT' });
    expect(abbreviated.colour).toBe('BU/WH');
    const earth = await patchPin(abbreviated, { colour: 'GNYE' });
    expect(earth.colour).toBe('GNYE');
  });
});

describe('the workshop drop budget', () => {
  it('is shown with its defaults and can be changed by an admin', async () => {
    const admin = await ctx.authFor('admin');
    const got = await request(ctx.app).get('/api/workshop').set('Authorization', admin);
    expect(got.body.workshop.dropAllowances).toEqual({
      fuseV: 0.1,
      relayContactsV: 0.1,
      perConnectionV: 0.005,
      chassisReturnV: 0.05,
    });
    const changed = await request(ctx.app)
      .patch('/api/workshop')
      .set('Authorization', admin)
      .send({
        dropAllowances: {
          fuseV: 0.08,
          relayContactsV: 0.05,
          perConnectionV: 0.004,
          chassisReturnV: 0.1,
        },
        version: got.body.workshop.version,
      });
    expect(changed.status).toBe(200);
    expect(changed.body.workshop.dropAllowances.chassisReturnV).toBe(0.1);
    // A figure beyond 2 V is a typo, refused with the field named.
    const typo = await request(ctx.app)
      .patch('/api/workshop')
      .set('Authorization', admin)
      .send({
        dropAllowances: {
          fuseV: 10,
          relayContactsV: 0.05,
          perConnectionV: 0.004,
          chassisReturnV: 0.1,
        },
        version: changed.body.workshop.version,
      });
    expect(typo.status).toBe(400);
    expect(JSON.stringify(typo.body)).toMatch(/dropAllowances\.fuseV/);
  });
});
