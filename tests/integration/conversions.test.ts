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

describe('where each conversion stands, on the list', () => {
  type Item = {
    id: number;
    name: string;
    state: string;
    latestRevision: { number: number; status: string } | null;
    lastChangeAt: string;
    waitingForYou: boolean;
    bench: { progress: { total: number; done: number; tested: number } } | null;
  };
  const list = async (role: 'builder' | 'reviewer') =>
    (
      await request(ctx.app)
        .get('/api/conversions')
        .set('Authorization', await ctx.authFor(role))
        .expect(200)
    ).body.conversions as Item[];
  const byName = (items: Item[], name: string) => items.find((c) => c.name === name)!;

  it('gives the state, the latest revision and the bench progress', async () => {
    const items = await list('builder');
    const signed = byName(items, 'Pellow farm flatbed');
    expect(signed.state).toBe('signed_off');
    expect(signed.latestRevision).toMatchObject({ number: 1, status: 'signed_off' });
    expect(signed.bench!.progress.total).toBeGreaterThan(0);
    expect(signed.bench!.progress.done).toBeLessThanOrEqual(signed.bench!.progress.total);
    const draft = byName(items, 'Ashby yard truck');
    expect(draft.state).toBe('draft');
    expect(draft.latestRevision).toBeNull();
    expect(draft.bench).toBeNull();
  });

  it('moves the last change when a pin changes, and counts a submission as waiting for the reviewer', async () => {
    const auth = await ctx.authFor('builder');
    const before = byName(await list('builder'), 'Pellow farm flatbed');
    const pins = (
      await request(ctx.app).get(`/api/conversions/${before.id}/pins`).set('Authorization', auth)
    ).body.pins as Array<{ id: number; version: number }>;
    const edited = await request(ctx.app)
      .patch(`/api/pins/${pins[3]!.id}`)
      .set('Authorization', auth)
      .send({ notes: 'Checked against the donor loom', version: pins[3]!.version })
      .expect(200);
    const after = byName(await list('builder'), 'Pellow farm flatbed');
    expect(Date.parse(after.lastChangeAt)).toBeGreaterThan(Date.parse(before.lastChangeAt));
    expect(Date.parse(after.lastChangeAt)).toBeGreaterThanOrEqual(
      Date.parse(edited.body.pin.updatedAt ?? after.lastChangeAt),
    );

    await request(ctx.app)
      .post(`/api/conversions/${before.id}/revisions`)
      .set('Authorization', auth)
      .send({})
      .expect(201);
    const forReviewer = byName(await list('reviewer'), 'Pellow farm flatbed');
    expect(forReviewer).toMatchObject({
      state: 'in_review',
      latestRevision: { number: 2, status: 'in_review' },
      waitingForYou: true,
    });
    expect(byName(await list('builder'), 'Pellow farm flatbed').waitingForYou).toBe(false);
  });
});
