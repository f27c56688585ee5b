import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MailOutbox, User } from '#server/db/models/index.ts';
import { createOtherWorkshop } from '../factories/workshop.factory.ts';
import { createTestContext, login, type TestContext } from '../helpers/test-app.ts';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(() => ctx.close());

describe('users (admin)', () => {
  it('lists the people of the workshop without password hashes', async () => {
    const res = await request(ctx.app)
      .get('/api/users')
      .set('Authorization', await ctx.authFor('admin'));
    expect(res.status).toBe(200);
    expect(res.body.users).toHaveLength(4);
    expect(JSON.stringify(res.body)).not.toMatch(/passwordHash|\$2[aby]\$/);
  });

  it.each(['builder', 'technician', 'reviewer'] as const)(
    'refuses the %s with 403',
    async (role) => {
      const res = await request(ctx.app)
        .get('/api/users')
        .set('Authorization', await ctx.authFor(role));
      expect(res.status).toBe(403);
    },
  );

  it('adds a person who can then sign in', async () => {
    const res = await request(ctx.app)
      .post('/api/users')
      .set('Authorization', await ctx.authFor('admin'))
      .send({
        email: 'New.Hand@Example.com',
        name: 'Rhea Castell',
        role: 'technician',
        password: 'torque wrench at dawn',
      });
    expect(res.status).toBe(201);
    expect(res.body.user).toMatchObject({
      email: 'new.hand@example.com',
      role: 'technician',
      active: true,
    });
    expect((await login(ctx.app, 'new.hand@example.com', 'torque wrench at dawn')).status).toBe(
      200,
    );
  });

  it('refuses a duplicate e-mail (409), a weak password (422) and a bad role (400)', async () => {
    const admin = await ctx.authFor('admin');
    const dup = await request(ctx.app).post('/api/users').set('Authorization', admin).send({
      email: 'builder@example.com',
      name: 'X',
      role: 'builder',
      password: 'another fine phrase',
    });
    expect(dup.status).toBe(409);
    const weak = await request(ctx.app)
      .post('/api/users')
      .set('Authorization', admin)
      .send({ email: 'weak@example.com', name: 'X', role: 'builder', password: 'password123' });
    expect(weak.status).toBe(422);
    const role = await request(ctx.app)
      .post('/api/users')
      .set('Authorization', admin)
      .send({ email: 'r@example.com', name: 'X', role: 'owner', password: 'another fine phrase' });
    expect(role.status).toBe(400);
    expect(role.body.error.details[0].field).toBe('role');
  });

  it('deactivates a person: their session ends and they cannot sign in', async () => {
    const admin = await ctx.authFor('admin');
    const { body } = await request(ctx.app).post('/api/users').set('Authorization', admin).send({
      email: 'leaver@example.com',
      name: 'Leaver',
      role: 'builder',
      password: 'cable ties and coffee',
    });
    const session = await login(ctx.app, 'leaver@example.com', 'cable ties and coffee');
    await request(ctx.app)
      .patch(`/api/users/${body.user.id}`)
      .set('Authorization', admin)
      .send({ active: false })
      .expect(200);
    expect(
      (
        await request(ctx.app)
          .get('/api/auth/me')
          .set('Authorization', `Bearer ${session.body.token}`)
      ).status,
    ).toBe(401);
    expect((await login(ctx.app, 'leaver@example.com', 'cable ties and coffee')).status).toBe(401);
  });

  it('keeps at least one active admin', async () => {
    const res = await request(ctx.app)
      .patch(`/api/users/${ctx.demo.users.admin}`)
      .set('Authorization', await ctx.authFor('admin'))
      .send({ role: 'builder' });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('last_admin');
    expect((await User.findByPk(ctx.demo.users.admin!))!.role).toBe('admin');
  });

  it('answers 404 for a person of another workshop', async () => {
    const other = await createOtherWorkshop();
    const res = await request(ctx.app)
      .patch(`/api/users/${other.users.builder.id}`)
      .set('Authorization', await ctx.authFor('admin'))
      .send({ role: 'technician' });
    expect(res.status).toBe(404);
    expect((await User.findByPk(other.users.builder.id))!.role).toBe('builder');
  });
});

describe('an address already used in another workshop', () => {
  it('gets the same answer as a new address; nobody is created and the address is told', async () => {
    const other = await createOtherWorkshop();
    const admin = await ctx.authFor('admin');
    const add = (email: string, name: string) =>
      request(ctx.app)
        .post('/api/users')
        .set('Authorization', admin)
        .send({ email, name, role: 'builder' });
    const fresh = await add('brand.new@example.com', 'Brand New');
    const taken = await add(other.users.builder.email.toUpperCase(), 'Someone Else');
    const shape = (res: request.Response) => ({
      status: res.status,
      keys: Object.keys(res.body.user).sort(),
      user: {
        ...res.body.user,
        id: typeof res.body.user.id,
        createdAt: 'time',
        email: 'e',
        name: 'n',
      },
    });
    expect(shape(taken)).toEqual(shape(fresh));
    // The id looks like the next one, and the person added after it gets the one after.
    expect(taken.body.user.id).toBe(fresh.body.user.id + 1);
    const next = await add('after.that@example.com', 'After That');
    expect(next.body.user.id).toBe(taken.body.user.id + 1);

    // The other workshop's account is untouched and nobody new holds the address.
    const holders = await User.findAll({ where: { email: other.users.builder.email } });
    expect(holders.map((u) => u.workshopId)).toEqual([other.workshop.id]);
    expect(await User.findByPk(taken.body.user.id)).toBeNull();
    const outbox = await MailOutbox.findOne({
      where: { toAddress: other.users.builder.email.toLowerCase() },
    });
    expect(outbox).toMatchObject({ kind: 'invitation', workshopId: ctx.demo.workshopId });
    expect(outbox!.textBody).toMatch(/already belongs to a Loomwright account in another workshop/);
    expect(outbox!.textBody).not.toContain(other.workshop.name);
  });

  it('an address already used in this workshop is still a 409', async () => {
    const res = await request(ctx.app)
      .post('/api/users')
      .set('Authorization', await ctx.authFor('admin'))
      .send({ email: ctx.emailFor('reviewer'), name: 'Again', role: 'builder' });
    expect(res.status).toBe(409);
  });
});

describe('workshop settings', () => {
  it('are read by every role and changed only by the admin, with version checks', async () => {
    const tech = await request(ctx.app)
      .get('/api/workshop')
      .set('Authorization', await ctx.authFor('technician'));
    expect(tech.status).toBe(200);
    expect(tech.body.workshop).toMatchObject({
      name: 'Harrow Lane Engine Works',
      paperSize: 'A4',
      sizeUnit: 'mm2',
    });
    const refused = await request(ctx.app)
      .patch('/api/workshop')
      .set('Authorization', await ctx.authFor('builder'))
      .send({ paperSize: 'Letter', version: 0 });
    expect(refused.status).toBe(403);
    const admin = await ctx.authFor('admin');
    const ok = await request(ctx.app)
      .patch('/api/workshop')
      .set('Authorization', admin)
      .send({ paperSize: 'Letter', version: 0 });
    expect(ok.status).toBe(200);
    expect(ok.body.workshop.paperSize).toBe('Letter');
    const stale = await request(ctx.app)
      .patch('/api/workshop')
      .set('Authorization', admin)
      .send({ paperSize: 'A4', version: 0 });
    expect(stale.status).toBe(409);
    const bad = await request(ctx.app)
      .patch('/api/workshop')
      .set('Authorization', admin)
      .send({ defaultInsulationC: 99, version: 1 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.details[0].field).toBe('defaultInsulationC');
  });
});
