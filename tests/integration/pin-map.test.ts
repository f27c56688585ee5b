import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditEvent, Pin } from '#server/db/models/index.ts';
import { createOtherWorkshop } from '../factories/workshop.factory.ts';
import { createTestContext, type TestContext } from '../helpers/test-app.ts';

let ctx: TestContext;
let builder: string;
let conversionId: number;

beforeAll(async () => {
  ctx = await createTestContext();
  builder = await ctx.authFor('builder');
  const { body } = await request(ctx.app)
    .post('/api/conversions')
    .set('Authorization', builder)
    .send({
      name: 'Pin map test',
      donorEngine: 'KT-20',
      receivingVehicle: 'Corran 100',
      systemVoltage: 12,
    });
  conversionId = body.conversion.id;
});
afterAll(() => ctx.close());

async function createConnector(body: Record<string, unknown>) {
  return request(ctx.app)
    .post(`/api/conversions/${conversionId}/connectors`)
    .set('Authorization', builder)
    .send(body);
}

async function pinsOf(connectorId: number) {
  const res = await request(ctx.app)
    .get(`/api/conversions/${conversionId}/pins`)
    .set('Authorization', builder);
  return (
    res.body.pins as Array<{
      id: number;
      connectorId: number;
      cavity: string;
      version: number;
      disposition: string;
    }>
  ).filter((p) => p.connectorId === connectorId);
}

describe('connectors', () => {
  it('creating a connector with N cavities makes N undecided pins', async () => {
    const res = await createConnector({ label: 'X1', side: 'ecu', cavityCount: 24 });
    expect(res.status).toBe(201);
    expect(res.body.connector).toMatchObject({
      label: 'X1',
      side: 'ecu',
      cavityCount: 24,
      rows: 2,
      columns: 12,
    });
    const pins = await pinsOf(res.body.connector.id);
    expect(pins).toHaveLength(24);
    expect(pins.map((p) => p.cavity)).toEqual(Array.from({ length: 24 }, (_, i) => String(i + 1)));
    expect(new Set(pins.map((p) => p.disposition))).toEqual(new Set(['undecided']));
  });

  it('takes cavity labels and a face layout', async () => {
    const labels = ['A1', 'A2', 'A3', 'B1', 'B2', 'B3'];
    const res = await createConnector({
      label: 'X2',
      side: 'vehicle',
      cavityCount: 6,
      rows: 2,
      columns: 3,
      cavityLabels: labels,
    });
    expect(res.status).toBe(201);
    expect((await pinsOf(res.body.connector.id)).map((p) => p.cavity)).toEqual(labels);
  });

  it('refuses a layout too small, a duplicate label and a label count mismatch', async () => {
    expect(
      (await createConnector({ label: 'X3', side: 'ecu', cavityCount: 10, rows: 2, columns: 4 }))
        .status,
    ).toBe(400);
    expect((await createConnector({ label: 'X1', side: 'ecu', cavityCount: 4 })).status).toBe(409);
    expect(
      (
        await createConnector({
          label: 'X4',
          side: 'ecu',
          cavityCount: 3,
          cavityLabels: ['1', '2'],
        })
      ).status,
    ).toBe(400);
    expect((await createConnector({ label: 'X5', side: 'ecu', cavityCount: 401 })).status).toBe(
      400,
    );
  });

  it('lists connectors with counts by disposition', async () => {
    const res = await request(ctx.app)
      .get(`/api/conversions/${ctx.demo.conversions.draft}/connectors`)
      .set('Authorization', await ctx.authFor('technician'));
    expect(res.status).toBe(200);
    const e3 = res.body.connectors.find((c: { label: string }) => c.label === 'E3');
    expect(e3.counts.undecided).toBe(2);
  });

  it('grows and shrinks a connector, refusing to drop cavities that hold work', async () => {
    const { body } = await createConnector({ label: 'X6', side: 'other', cavityCount: 4 });
    const id = body.connector.id;
    const grown = await request(ctx.app)
      .patch(`/api/connectors/${id}`)
      .set('Authorization', builder)
      .send({ cavityCount: 6, version: 0 });
    expect(grown.status).toBe(200);
    expect(await pinsOf(id)).toHaveLength(6);
    const pins = await pinsOf(id);
    await request(ctx.app)
      .patch(`/api/pins/${pins[5]!.id}`)
      .set('Authorization', builder)
      .send({ function: 'Spare', version: 0 })
      .expect(200);
    const refused = await request(ctx.app)
      .patch(`/api/connectors/${id}`)
      .set('Authorization', builder)
      .send({ cavityCount: 4, version: 1 });
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe('cavities_in_use');
    expect(await pinsOf(id)).toHaveLength(6);
    const shrunk = await request(ctx.app)
      .patch(`/api/connectors/${id}`)
      .set('Authorization', builder)
      .send({ cavityCount: 5, version: 1 });
    expect(shrunk.status).toBe(409);
  });

  it('deletes a connector with its pins', async () => {
    const { body } = await createConnector({ label: 'X7', side: 'other', cavityCount: 3 });
    const res = await request(ctx.app)
      .delete(`/api/connectors/${body.connector.id}`)
      .set('Authorization', builder);
    expect(res.status).toBe(204);
    expect(await Pin.count({ where: { connectorId: body.connector.id } })).toBe(0);
  });
});

describe('PATCH /api/pins/:id', () => {
  it('saves with the current version and bumps it; a stale version is 409 and the row is unchanged', async () => {
    const { body } = await createConnector({ label: 'P1', side: 'ecu', cavityCount: 2 });
    const [pin] = await pinsOf(body.connector.id);
    const auditBefore = await AuditEvent.count({ where: { conversionId, entityType: 'pin' } });
    const first = await request(ctx.app)
      .patch(`/api/pins/${pin!.id}`)
      .set('Authorization', builder)
      .send({
        function: 'Injector 1 drive',
        colour: 'bu/wh',
        sizeMm2: 0.75,
        disposition: 'keep',
        version: 0,
      });
    expect(first.status).toBe(200);
    expect(first.body.pin).toMatchObject({
      function: 'Injector 1 drive',
      colour: 'BU/WH',
      sizeMm2: 0.75,
      disposition: 'keep',
      version: 1,
    });
    const stale = await request(ctx.app)
      .patch(`/api/pins/${pin!.id}`)
      .set('Authorization', builder)
      .send({ function: 'Overwritten', version: 0 });
    expect(stale.status).toBe(409);
    expect(stale.body.error.details.current.function).toBe('Injector 1 drive');
    const stored = await Pin.findByPk(pin!.id);
    expect(stored!.function).toBe('Injector 1 drive');
    expect(stored!.version).toBe(1);
    expect(await AuditEvent.count({ where: { conversionId, entityType: 'pin' } })).toBe(
      auditBefore + 1,
    );
  });

  it('two edits with the same version: exactly one wins', async () => {
    const { body } = await createConnector({ label: 'P2', side: 'ecu', cavityCount: 1 });
    const [pin] = await pinsOf(body.connector.id);
    const send = (fn: string) =>
      request(ctx.app)
        .patch(`/api/pins/${pin!.id}`)
        .set('Authorization', builder)
        .send({ function: fn, version: 0 });
    const results = await Promise.all([send('first'), send('second')]);
    expect(results.map((r) => r.status).sort()).toEqual([200, 409]);
  });

  it.each([
    [{ colour: 'LB' }, 'colour'],
    [{ sizeMm2: 0.8 }, 'sizeMm2'],
    [{ disposition: 'remove' }, 'disposition'],
    [{ signalClass: 'power' }, 'signalClass'],
    [{ insulationRatingC: 99 }, 'insulationRatingC'],
    [{ loadCurrentA: -1 }, 'loadCurrentA'],
    [{ cavity: '9' }, '(body)'],
  ])('answers 400 naming the field for %j', async (change, field) => {
    const pin = await Pin.findOne({ where: { conversionId } });
    const res = await request(ctx.app)
      .patch(`/api/pins/${pin!.id}`)
      .set('Authorization', builder)
      .send({ ...change, version: pin!.version });
    expect(res.status).toBe(400);
    expect(res.body.error.details.map((d: { field: string }) => d.field)).toContain(field);
  });

  it('links a destination only to a vehicle-side cavity of the same conversion', async () => {
    const ecu = (await createConnector({ label: 'L1', side: 'ecu', cavityCount: 2 })).body
      .connector;
    const vehicle = (await createConnector({ label: 'L2', side: 'vehicle', cavityCount: 2 })).body
      .connector;
    const [a, b] = await pinsOf(ecu.id);
    const [v] = await pinsOf(vehicle.id);
    const ok = await request(ctx.app)
      .patch(`/api/pins/${a!.id}`)
      .set('Authorization', builder)
      .send({ disposition: 'join', destinationPinId: v!.id, version: a!.version });
    expect(ok.status).toBe(200);
    expect(ok.body.pin.destinationPinId).toBe(v!.id);
    const toEcu = await request(ctx.app)
      .patch(`/api/pins/${b!.id}`)
      .set('Authorization', builder)
      .send({ destinationPinId: a!.id, version: b!.version });
    expect(toEcu.status).toBe(400);
    const otherConversionPin = await Pin.findOne({
      where: { conversionId: ctx.demo.conversions.draft },
    });
    const across = await request(ctx.app)
      .patch(`/api/pins/${b!.id}`)
      .set('Authorization', builder)
      .send({ destinationPinId: otherConversionPin!.id, version: b!.version });
    expect(across.status).toBe(400);
  });

  it('refuses the technician and the reviewer with 403', async () => {
    const pin = await Pin.findOne({ where: { conversionId } });
    for (const role of ['technician', 'reviewer'] as const) {
      const res = await request(ctx.app)
        .patch(`/api/pins/${pin!.id}`)
        .set('Authorization', await ctx.authFor(role))
        .send({ function: 'x', version: pin!.version });
      expect(res.status).toBe(403);
    }
    expect((await Pin.findByPk(pin!.id))!.function).toBe(pin!.function);
  });

  it('answers 404 for another workshop’s pin', async () => {
    const other = await createOtherWorkshop();
    const pin = await Pin.findOne({ where: { conversionId } });
    const res = await request(ctx.app)
      .patch(`/api/pins/${pin!.id}`)
      .set('Authorization', other.authFor('builder'))
      .send({ function: 'x', version: pin!.version });
    expect(res.status).toBe(404);
    const list = await request(ctx.app)
      .get(`/api/conversions/${conversionId}/pins`)
      .set('Authorization', other.authFor('builder'));
    expect(list.status).toBe(404);
  });
});

describe('bulk and batch edits', () => {
  it('sets a disposition on a selection at once', async () => {
    const { body } = await createConnector({ label: 'B1', side: 'ecu', cavityCount: 5 });
    const pins = await pinsOf(body.connector.id);
    const res = await request(ctx.app)
      .post(`/api/conversions/${conversionId}/pins/bulk`)
      .set('Authorization', builder)
      .send({ pinIds: pins.slice(0, 3).map((p) => p.id), set: { disposition: 'depin' } });
    expect(res.status).toBe(200);
    expect(res.body.pins).toHaveLength(3);
    expect((await pinsOf(body.connector.id)).map((p) => p.disposition)).toEqual([
      'depin',
      'depin',
      'depin',
      'undecided',
      'undecided',
    ]);
  });

  it('changes nothing when one value is invalid (400) or one pin is not in the conversion (404)', async () => {
    const { body } = await createConnector({ label: 'B2', side: 'ecu', cavityCount: 3 });
    const pins = await pinsOf(body.connector.id);
    const ids = pins.map((p) => p.id);
    const bad = await request(ctx.app)
      .post(`/api/conversions/${conversionId}/pins/bulk`)
      .set('Authorization', builder)
      .send({ pinIds: ids, set: { disposition: 'cut', colour: 'XX' } });
    expect(bad.status).toBe(400);
    const foreign = await Pin.findOne({ where: { conversionId: ctx.demo.conversions.draft } });
    const across = await request(ctx.app)
      .post(`/api/conversions/${conversionId}/pins/bulk`)
      .set('Authorization', builder)
      .send({ pinIds: [...ids, foreign!.id], set: { disposition: 'cut' } });
    expect(across.status).toBe(404);
    expect(
      (await pinsOf(body.connector.id)).every(
        (p) => p.disposition === 'undecided' && p.version === 0,
      ),
    ).toBe(true);
  });

  it('applies a pasted block against each row’s version, all or nothing', async () => {
    const { body } = await createConnector({ label: 'B3', side: 'ecu', cavityCount: 3 });
    const [p1, p2, p3] = await pinsOf(body.connector.id);
    const ok = await request(ctx.app)
      .post(`/api/conversions/${conversionId}/pins/batch`)
      .set('Authorization', builder)
      .send({
        changes: [
          { id: p1!.id, version: 0, set: { function: 'Coil 1', colour: 'GN/WH' } },
          { id: p2!.id, version: 0, set: { function: 'Coil 2', colour: 'GN/RD' } },
        ],
      });
    expect(ok.status).toBe(200);
    const stale = await request(ctx.app)
      .post(`/api/conversions/${conversionId}/pins/batch`)
      .set('Authorization', builder)
      .send({
        changes: [
          { id: p3!.id, version: 0, set: { function: 'Coil 3' } },
          { id: p1!.id, version: 0, set: { function: 'Overwrite' } },
        ],
      });
    expect(stale.status).toBe(409);
    expect(stale.body.error.details.current[0].function).toBe('Coil 1');
    const after = await pinsOf(body.connector.id);
    expect(after.map((p) => p.version)).toEqual([1, 1, 0]);
  });
});

describe('saving without a change', () => {
  it('keeps the version and writes nothing to the audit trail', async () => {
    const { body } = await createConnector({ label: 'N1', side: 'ecu', cavityCount: 1 });
    const [pin] = await pinsOf(body.connector.id);
    const audit = await AuditEvent.count({ where: { conversionId, entityType: 'pin' } });
    const res = await request(ctx.app)
      .patch(`/api/pins/${pin!.id}`)
      .set('Authorization', builder)
      .send({ disposition: 'undecided', version: 0 });
    expect(res.status).toBe(200);
    expect(res.body.pin.version).toBe(0);
    expect(await AuditEvent.count({ where: { conversionId, entityType: 'pin' } })).toBe(audit);
  });
});

describe('shrinking a connector', () => {
  it('refuses to drop a cavity that holds any value or that another pin links to', async () => {
    const { body } = await createConnector({ label: 'S1', side: 'vehicle', cavityCount: 4 });
    const id = body.connector.id;
    const pins = await pinsOf(id);
    // Only a signal class on cavity 4: still work someone entered.
    await request(ctx.app)
      .patch(`/api/pins/${pins[3]!.id}`)
      .set('Authorization', builder)
      .send({ signalClass: 'power_ground', version: 0 })
      .expect(200);
    const refused = await request(ctx.app)
      .patch(`/api/connectors/${id}`)
      .set('Authorization', builder)
      .send({ cavityCount: 3, version: 0 });
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toMatch(/Cavities 4/);
    // Cavity 3 is blank, but an ECU pin points at it.
    const ecu = (await createConnector({ label: 'S2', side: 'ecu', cavityCount: 1 })).body
      .connector;
    const [source] = await pinsOf(ecu.id);
    await request(ctx.app)
      .patch(`/api/pins/${source!.id}`)
      .set('Authorization', builder)
      .send({ disposition: 'join', destinationPinId: pins[2]!.id, version: 0 })
      .expect(200);
    await request(ctx.app)
      .patch(`/api/pins/${pins[3]!.id}`)
      .set('Authorization', builder)
      .send({ signalClass: 'none', version: 1 })
      .expect(200);
    const linked = await request(ctx.app)
      .patch(`/api/connectors/${id}`)
      .set('Authorization', builder)
      .send({ cavityCount: 2, version: 0 });
    expect(linked.status).toBe(409);
    expect(linked.body.error.message).toMatch(/Cavities 3/);
    expect(await pinsOf(id)).toHaveLength(4);
    const ok = await request(ctx.app)
      .patch(`/api/connectors/${id}`)
      .set('Authorization', builder)
      .send({ cavityCount: 3, version: 0 });
    expect(ok.status).toBe(200);
    expect(await pinsOf(id)).toHaveLength(3);
  });
});
