/**
 * The pinout library: a built-in SAE J1962 diagnostic connector every workshop sees and nobody can
 * change, workshop templates saved from a connector, and connectors started from a template.
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { PinoutTemplate, PinoutTemplateDetail } from '#shared/schemas/library.schema.ts';
import type { Pin } from '#shared/schemas/pin-map.schema.ts';
import { db } from '#server/db/index.ts';
import { Connector, Pin as PinModel } from '#server/db/models/index.ts';
import { createOtherWorkshop } from '../factories/workshop.factory.ts';
import { createTestContext, type TestContext } from '../helpers/test-app.ts';

let ctx: TestContext;
let builder: string;
let draft: number;

beforeAll(async () => {
  ctx = await createTestContext();
  builder = await ctx.authFor('builder');
  draft = ctx.demo.conversions.draft;
});
afterAll(() => ctx.close());

async function templates(auth = builder): Promise<PinoutTemplate[]> {
  const res = await request(ctx.app).get('/api/library/templates').set('Authorization', auth);
  expect(res.status).toBe(200);
  return res.body.templates;
}

async function connectorOf(conversion: number, label: string) {
  const res = await request(ctx.app)
    .get(`/api/conversions/${conversion}/connectors`)
    .set('Authorization', builder);
  return res.body.connectors.find((c: { label: string }) => c.label === label) as {
    id: number;
    rows: number;
    columns: number;
    side: string;
  };
}

async function pinsOf(conversion: number, connectorId: number): Promise<Pin[]> {
  const res = await request(ctx.app)
    .get(`/api/conversions/${conversion}/pins`)
    .set('Authorization', builder);
  return (res.body.pins as Pin[]).filter((p) => p.connectorId === connectorId);
}

describe('the built-in SAE J1962 template', () => {
  it('is listed for every workshop, read-only, with the standard’s pin assignments', async () => {
    const builtIn = (await templates()).find((t) => t.builtIn)!;
    expect(builtIn).toMatchObject({
      name: '16-pin diagnostic connector (SAE J1962)',
      side: 'vehicle',
      cavityCount: 16,
      rows: 2,
      columns: 8,
      builtIn: true,
    });
    const other = await createOtherWorkshop();
    expect((await templates(other.authFor('technician'))).map((t) => t.id)).toContain(builtIn.id);

    const res = await request(ctx.app)
      .get(`/api/library/templates/${builtIn.id}`)
      .set('Authorization', await ctx.authFor('technician'));
    const detail = res.body.template as PinoutTemplateDetail;
    const fn = (cavity: string) => detail.pins.find((p) => p.cavity === cavity)!;
    expect(detail.pins.map((p) => p.cavity)).toEqual(
      Array.from({ length: 16 }, (_, i) => String(i + 1)),
    );
    expect(fn('4')).toMatchObject({ function: 'Chassis ground', signalClass: 'power_ground' });
    expect(fn('5')).toMatchObject({ function: 'Signal ground', signalClass: 'sensor_ground' });
    expect(fn('6').function).toMatch(/^CAN high/);
    expect(fn('14').function).toMatch(/^CAN low/);
    expect(fn('7').function).toMatch(/^K-line/);
    expect(fn('15').function).toMatch(/^L-line.*optional/);
    expect(fn('2').function).toBe('SAE J1850 bus +');
    expect(fn('10').function).toBe('SAE J1850 bus −');
    expect(fn('16')).toMatchObject({
      function: 'Battery + (unswitched)',
      signalClass: 'power_feed',
    });
    for (const c of ['1', '3', '8', '9', '11', '12', '13']) {
      expect(fn(c).function).toBe("Maker's discretion");
    }
  });

  it('cannot be deleted through the API, nor changed in the database', async () => {
    const builtIn = (await templates()).find((t) => t.builtIn)!;
    const res = await request(ctx.app)
      .delete(`/api/library/templates/${builtIn.id}`)
      .set('Authorization', await ctx.authFor('admin'));
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('read_only');
    // Sequelize reports the trigger's RAISE as a constraint error; SQLite's own message is inside.
    const sqliteMessage = (sql: string) =>
      db()
        .query(sql)
        .then(
          () => 'no error',
          (err: { parent?: { message?: string } }) => err.parent?.message ?? String(err),
        );
    expect(
      await sqliteMessage(`UPDATE pinout_templates SET name = 'x' WHERE id = ${builtIn.id}`),
    ).toMatch(/built-in templates are read-only/);
    expect(
      await sqliteMessage(`DELETE FROM pinout_template_pins WHERE template_id = ${builtIn.id}`),
    ).toMatch(/built-in templates are read-only/);
  });

  it('starts a conversion’s diagnostic connector', async () => {
    const builtIn = (await templates()).find((t) => t.builtIn)!;
    const res = await request(ctx.app)
      .post(`/api/conversions/${draft}/connectors/from-template`)
      .set('Authorization', builder)
      .send({ templateId: builtIn.id, label: 'DLC2' });
    expect(res.status).toBe(201);
    expect(res.body.connector).toMatchObject({
      label: 'DLC2',
      side: 'vehicle',
      cavityCount: 16,
      rows: 2,
      columns: 8,
    });
    const pins = await pinsOf(draft, res.body.connector.id);
    expect(pins).toHaveLength(16);
    expect(pins.find((p) => p.cavity === '16')).toMatchObject({
      function: 'Battery + (unswitched)',
      signalClass: 'power_feed',
      disposition: 'undecided',
    });
  });
});

describe('workshop templates', () => {
  let templateId: number;

  it('saves a connector’s pinout: cavities, layout and each pin’s wire, decision and notes', async () => {
    const e2 = await connectorOf(draft, 'E2');
    const source = await pinsOf(draft, e2.id);
    const res = await request(ctx.app)
      .post('/api/library/templates')
      .set('Authorization', builder)
      .send({ connectorId: e2.id, name: 'KT-20 ECU connector 2', description: 'Vehicle side' });
    expect(res.status).toBe(201);
    const template = res.body.template as PinoutTemplateDetail;
    templateId = template.id;
    expect(template).toMatchObject({
      builtIn: false,
      side: 'ecu',
      cavityCount: 28,
      rows: e2.rows,
      columns: e2.columns,
      createdBy: 'Ivo Brandt',
    });
    expect(template.pins).toEqual(
      source.map((p, position) => ({
        cavity: p.cavity,
        position,
        function: p.function,
        signalClass: p.signalClass,
        colour: p.colour,
        sizeMm2: p.sizeMm2,
        insulationRatingC: p.insulationRatingC,
        disposition: p.disposition,
        driverType: p.driverType,
        driverRatedA: p.driverRatedA,
        pulseSignal: p.pulseSignal,
        pulsesPerRev: p.pulsesPerRev,
        terminationOhm: p.terminationOhm,
        notes: p.notes,
      })),
    );
    const again = await request(ctx.app)
      .post('/api/library/templates')
      .set('Authorization', builder)
      .send({ connectorId: e2.id, name: 'KT-20 ECU connector 2' });
    expect(again.status).toBe(409);
  });

  it('starts a connector of another conversion from it, pins and all, in one transaction', async () => {
    const other = await request(ctx.app).get(`/api/conversions`).set('Authorization', builder);
    const signedOff = ctx.demo.conversions.signedOff;
    expect(other.body.conversions.length).toBeGreaterThan(1);
    const res = await request(ctx.app)
      .post(`/api/conversions/${signedOff}/connectors/from-template`)
      .set('Authorization', builder)
      .send({ templateId, label: 'E2-copy' });
    expect(res.status).toBe(201);
    const copy = await pinsOf(signedOff, res.body.connector.id);
    const original = await pinsOf(draft, (await connectorOf(draft, 'E2')).id);
    const fields = (p: Pin) => [
      p.cavity,
      p.function,
      p.signalClass,
      p.colour,
      p.sizeMm2,
      p.disposition,
      p.notes,
    ];
    expect(copy.map(fields)).toEqual(original.map(fields));
    // Destinations belong to one conversion and are not carried over.
    expect(copy.every((p) => p.destination === '' && p.destinationPinId === null)).toBe(true);

    const pinsBefore = await PinModel.count();
    const connectorsBefore = await Connector.count();
    const clash = await request(ctx.app)
      .post(`/api/conversions/${signedOff}/connectors/from-template`)
      .set('Authorization', builder)
      .send({ templateId, label: 'E2-copy' });
    expect(clash.status).toBe(409);
    expect(await PinModel.count()).toBe(pinsBefore);
    expect(await Connector.count()).toBe(connectorsBefore);
  });

  it('is the workshop’s own: another workshop neither sees nor uses it', async () => {
    const other = await createOtherWorkshop();
    expect((await templates(other.authFor('builder'))).map((t) => t.id)).not.toContain(templateId);
    expect(
      (
        await request(ctx.app)
          .get(`/api/library/templates/${templateId}`)
          .set('Authorization', other.authFor('builder'))
      ).status,
    ).toBe(404);
    const use = await request(ctx.app)
      .post(`/api/conversions/${other.conversion.id}/connectors/from-template`)
      .set('Authorization', other.authFor('builder'))
      .send({ templateId, label: 'Z9' });
    expect(use.status).toBe(404);
    const e2 = await connectorOf(draft, 'E2');
    const steal = await request(ctx.app)
      .post('/api/library/templates')
      .set('Authorization', other.authFor('builder'))
      .send({ connectorId: e2.id, name: 'Stolen' });
    expect(steal.status).toBe(404);
  });

  it('technicians and reviewers read the library but cannot save or delete', async () => {
    const e2 = await connectorOf(draft, 'E2');
    for (const role of ['technician', 'reviewer'] as const) {
      const auth = await ctx.authFor(role);
      expect((await templates(auth)).length).toBeGreaterThan(1);
      expect(
        (
          await request(ctx.app)
            .post('/api/library/templates')
            .set('Authorization', auth)
            .send({ connectorId: e2.id, name: 'Nope' })
        ).status,
      ).toBe(403);
      expect(
        (
          await request(ctx.app)
            .delete(`/api/library/templates/${templateId}`)
            .set('Authorization', auth)
        ).status,
      ).toBe(403);
    }
  });

  it('a builder deletes a workshop template', async () => {
    const res = await request(ctx.app)
      .delete(`/api/library/templates/${templateId}`)
      .set('Authorization', builder);
    expect(res.status).toBe(204);
    expect((await templates()).map((t) => t.id)).not.toContain(templateId);
  });
});
