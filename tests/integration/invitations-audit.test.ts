import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MailOutbox } from '#server/db/models/index.ts';
import { startFakeSmtp, type FakeSmtp } from '#server/modules/mail/fake-smtp.ts';
import {
  configureMail,
  deliverDueMail,
  noticeMessageId,
  recoverOutbox,
} from '#server/modules/mail/outbox.service.ts';
import { createTestContext, login, type TestContext } from '../helpers/test-app.ts';

let ctx: TestContext;
let smtp: FakeSmtp;
beforeAll(async () => {
  ctx = await createTestContext();
  smtp = await startFakeSmtp();
  configureMail(
    { host: smtp.host, port: smtp.port, secure: false, from: 'Loomwright <loomwright@localhost>' },
    smtp,
  );
});
afterAll(async () => {
  await smtp.close();
  await ctx.close();
});

describe('invitations', () => {
  it('an admin adds a person without a password; they get a one-time link and set their own', async () => {
    const res = await request(ctx.app)
      .post('/api/users')
      .set('Authorization', await ctx.authFor('admin'))
      .send({ email: 'apprentice@example.com', name: 'Jo Apprentice', role: 'technician' });
    expect(res.status).toBe(201);
    expect((await login(ctx.app, 'apprentice@example.com', 'anything at all')).status).toBe(401);

    await deliverDueMail();
    const mail = smtp.received().find((m) => m.to.includes('apprentice@example.com'));
    expect(mail?.subject).toBe('You are invited to Loomwright at Harrow Lane Engine Works');
    const token = /#token=([A-Za-z0-9_-]+)/.exec(mail!.text)?.[1];
    expect(token).toBeTruthy();
    // Once the invitation is sent its link is kept nowhere: invitations hold only its SHA-256.
    expect(JSON.stringify(await MailOutbox.findAll({ raw: true }))).not.toContain(token!);

    const weak = await request(ctx.app)
      .post('/api/auth/set-password')
      .send({ token, password: 'password123' });
    expect(weak.status).toBe(422);
    const set = await request(ctx.app)
      .post('/api/auth/set-password')
      .send({ token, password: 'grease under the nails' });
    expect(set.status).toBe(200);
    expect(set.body.user).toMatchObject({ email: 'apprentice@example.com', role: 'technician' });
    expect((await login(ctx.app, 'apprentice@example.com', 'grease under the nails')).status).toBe(
      200,
    );
    const reused = await request(ctx.app)
      .post('/api/auth/set-password')
      .send({ token, password: 'another good phrase' });
    expect(reused.status).toBe(400);
    expect(reused.body.error.code).toBe('invalid_invitation');
  });

  it('the admin sees the outbox and what the fake server received', async () => {
    const res = await request(ctx.app)
      .get('/api/admin/outbox')
      .set('Authorization', await ctx.authFor('admin'));
    expect(res.status).toBe(200);
    expect(res.body.outbox[0]).toMatchObject({
      kind: 'invitation',
      status: 'sent',
      to: 'apprentice@example.com',
    });
    expect(res.body.received.length).toBeGreaterThan(0);
    // The one-time link is there, its token is not: an admin must not take over an invited account.
    const invitation = (res.body.received as Array<{ text: string }>).find((m) =>
      m.text.includes('/set-password#token='),
    );
    expect(invitation!.text).toContain('#token=[hidden]');
    expect(JSON.stringify(res.body)).not.toMatch(/#token=(?!\[hidden\])/);
    expect(res.headers['cache-control']).toBe('no-store');
    expect(
      (
        await request(ctx.app)
          .get('/api/admin/outbox')
          .set('Authorization', await ctx.authFor('builder'))
      ).status,
    ).toBe(403);
  });

  it('sends a notice again after a crash under the same Message-ID', async () => {
    const res = await request(ctx.app)
      .post('/api/users')
      .set('Authorization', await ctx.authFor('admin'))
      .send({ email: 'night.shift@example.com', name: 'Night Shift', role: 'builder' });
    expect(res.status).toBe(201);
    const row = await MailOutbox.findOne({ where: { toAddress: 'night.shift@example.com' } });
    const messageId = noticeMessageId(row!);
    expect(messageId).toBe(
      `<notice.${row!.id}.w${row!.workshopId}.${row!.createdAt.getTime().toString(36)}@localhost>`,
    );
    await deliverDueMail();
    // The process died after the mail server took the notice, before the row was marked sent:
    // the row still says "sending", and the next start puts it back.
    await MailOutbox.update(
      { status: 'sending', textBody: row!.textBody },
      { where: { id: row!.id } },
    );
    await recoverOutbox();
    await deliverDueMail();
    const copies = smtp.received().filter((m) => m.to.includes('night.shift@example.com'));
    expect(copies).toHaveLength(2);
    expect(copies.map((m) => m.messageId)).toEqual([messageId, messageId]);
    expect(copies[1]!.text).toBe(copies[0]!.text);
    expect((await MailOutbox.findByPk(row!.id))!.messageId).toBe(messageId);
  });

  it('refuses a recipient with a line break', async () => {
    const res = await request(ctx.app)
      .post('/api/users')
      .set('Authorization', await ctx.authFor('admin'))
      .send({ email: 'a@example.com\r\nBcc: b@example.com', name: 'X', role: 'builder' });
    expect(res.status).toBe(400);
  });
});

describe('audit trail', () => {
  it('records each change with who, when and before → after, filterable', async () => {
    const auth = await ctx.authFor('builder');
    const id = ctx.demo.conversions.draft;
    const pins = (
      await request(ctx.app).get(`/api/conversions/${id}/pins`).set('Authorization', auth)
    ).body.pins;
    await request(ctx.app)
      .patch(`/api/pins/${pins[0].id}`)
      .set('Authorization', auth)
      .send({ notes: 'Audit me', version: pins[0].version })
      .expect(200);
    const all = await request(ctx.app)
      .get(`/api/conversions/${id}/audit`)
      .set('Authorization', await ctx.authFor('reviewer'));
    expect(all.status).toBe(200);
    const event = all.body.events[0];
    expect(event).toMatchObject({
      actorName: 'Ivo Brandt',
      action: 'update',
      entityType: 'pin',
      before: { notes: '' },
      after: { notes: 'Audit me' },
    });
    expect(event.summary).toMatch(/E1-1/);
    const filtered = await request(ctx.app)
      .get(`/api/conversions/${id}/audit?entityType=feed`)
      .set('Authorization', auth);
    expect(filtered.body.events.every((e: { entityType: string }) => e.entityType === 'feed')).toBe(
      true,
    );
    expect(
      (await request(ctx.app).get(`/api/conversions/${id}/audit?foo=1`).set('Authorization', auth))
        .status,
    ).toBe(400);
    expect(
      (
        await request(ctx.app)
          .get(`/api/conversions/${id}/audit`)
          .set('Authorization', await ctx.authFor('technician'))
      ).status,
    ).toBe(403);
  });
});
