import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditEvent, Conversion } from '#server/db/models/index.ts';
import { createOtherWorkshop } from '../factories/workshop.factory.ts';
import { createTestContext, type TestContext } from '../helpers/test-app.ts';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(() => ctx.close());

const newConversion = {
  name: 'Greaves dray',
  donorEngine: 'KT-20 2.0 L turbo I4',
  receivingVehicle: 'Corran 100, 1975',
  systemVoltage: 12,
  notes: 'Customer wants the original gauges kept.',
};

describe('GET /api/conversions', () => {
  it.each(['admin', 'builder', 'technician', 'reviewer'] as const)(
    'lists both demo conversions for the %s',
    async (role) => {
      const res = await request(ctx.app)
        .get('/api/conversions')
        .set('Authorization', await ctx.authFor(role));
      expect(res.status).toBe(200);
      const names = res.body.conversions.map((c: { name: string }) => c.name);
      expect(names).toEqual(expect.arrayContaining(['Pellow farm flatbed', 'Ashby yard truck']));
    },
  );

  it('never lists another workshop’s conversions', async () => {
    const other = await createOtherWorkshop();
    const mine = await request(ctx.app)
      .get('/api/conversions')
      .set('Authorization', await ctx.authFor('builder'));
    expect(mine.body.conversions.map((c: { id: number }) => c.id)).not.toContain(
      other.conversion.id,
    );
    const theirs = await request(ctx.app)
      .get('/api/conversions')
      .set('Authorization', other.authFor('builder'));
    expect(theirs.body.conversions).toHaveLength(1);
  });
});

describe('POST /api/conversions', () => {
  it.each(['builder', 'admin'] as const)(
    'creates a conversion for the %s (201) and audits it',
    async (role) => {
      const res = await request(ctx.app)
        .post('/api/conversions')
        .set('Authorization', await ctx.authFor(role))
        .send(newConversion);
      expect(res.status).toBe(201);
      expect(res.body.conversion).toMatchObject({ ...newConversion, version: 0 });
      expect(res.body.conversion.createdBy.id).toBe(ctx.demo.users[role]);
      const audit = await AuditEvent.findAll({ where: { conversionId: res.body.conversion.id } });
      expect(audit).toHaveLength(1);
      expect(audit[0]!.action).toBe('create');
    },
  );

  it.each(['technician', 'reviewer'] as const)('refuses the %s with 403', async (role) => {
    const before = await Conversion.count();
    const res = await request(ctx.app)
      .post('/api/conversions')
      .set('Authorization', await ctx.authFor(role))
      .send(newConversion);
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('forbidden');
    expect(await Conversion.count()).toBe(before);
  });

  it('refuses anonymous callers with 401', async () => {
    expect((await request(ctx.app).post('/api/conversions').send(newConversion)).status).toBe(401);
  });

  it.each([
    [{ ...newConversion, systemVoltage: 13 }, 'systemVoltage'],
    [{ ...newConversion, name: '   ' }, 'name'],
    [{ ...newConversion, donorEngine: undefined }, 'donorEngine'],
    [{ ...newConversion, workshopId: 2 }, '(body)'],
  ])('answers 400 naming the field for %j', async (body, field) => {
    const res = await request(ctx.app)
      .post('/api/conversions')
      .set('Authorization', await ctx.authFor('builder'))
      .send(body);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation_failed');
    expect(res.body.error.details.map((d: { field: string }) => d.field)).toContain(field);
  });
});

describe('GET /api/conversions/:id', () => {
  it('answers the conversion to every role of the workshop', async () => {
    for (const role of ['admin', 'builder', 'technician', 'reviewer'] as const) {
      const res = await request(ctx.app)
        .get(`/api/conversions/${ctx.demo.conversions.draft}`)
        .set('Authorization', await ctx.authFor(role));
      expect(res.status).toBe(200);
      expect(res.body.conversion.name).toBe('Ashby yard truck');
    }
  });

  it('answers 404, not 403, for another workshop’s conversion', async () => {
    const other = await createOtherWorkshop();
    const res = await request(ctx.app)
      .get(`/api/conversions/${other.conversion.id}`)
      .set('Authorization', await ctx.authFor('admin'));
    expect(res.status).toBe(404);
    const missing = await request(ctx.app)
      .get('/api/conversions/999999')
      .set('Authorization', await ctx.authFor('admin'));
    expect(missing.status).toBe(404);
    expect(res.body.error).toEqual(missing.body.error);
  });

  it('answers 400 for an id that is not a number', async () => {
    const res = await request(ctx.app)
      .get('/api/conversions/abc')
      .set('Authorization', await ctx.authFor('admin'));
    expect(res.status).toBe(400);
    expect(res.body.error.details[0].field).toBe('id');
  });
});

describe('PATCH /api/conversions/:id', () => {
  it('saves with the current version and refuses a stale one with 409 and the current copy', async () => {
    const auth = await ctx.authFor('builder');
    const id = ctx.demo.conversions.draft;
    const auditBefore = await AuditEvent.count({ where: { conversionId: id } });
    const first = await request(ctx.app)
      .patch(`/api/conversions/${id}`)
      .set('Authorization', auth)
      .send({ notes: 'edit one', version: 0 });
    expect(first.status).toBe(200);
    expect(first.body.conversion.version).toBe(1);
    const second = await request(ctx.app)
      .patch(`/api/conversions/${id}`)
      .set('Authorization', auth)
      .send({ notes: 'edit two', version: 0 });
    expect(second.status).toBe(409);
    expect(second.body.error.code).toBe('version_conflict');
    expect(second.body.error.details.current.notes).toBe('edit one');
    const stored = await Conversion.findByPk(id);
    expect(stored!.notes).toBe('edit one');
    expect(await AuditEvent.count({ where: { conversionId: id } })).toBe(auditBefore + 1);
  });

  it('refuses a client-set createdBy or version bump', async () => {
    const res = await request(ctx.app)
      .patch(`/api/conversions/${ctx.demo.conversions.draft}`)
      .set('Authorization', await ctx.authFor('builder'))
      .send({ createdById: 1, version: 1 });
    expect(res.status).toBe(400);
  });
});
