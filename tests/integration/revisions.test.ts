import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '#server/db/index.ts';
import { AuditEvent, MailOutbox, Pin, Revision, User } from '#server/db/models/index.ts';
import { startFakeSmtp, type FakeSmtp } from '#server/modules/mail/fake-smtp.ts';
import { configureMail, deliverDueMail } from '#server/modules/mail/outbox.service.ts';
import { createOtherWorkshop } from '../factories/workshop.factory.ts';
import { createTestContext, type TestContext } from '../helpers/test-app.ts';

let ctx: TestContext;
let smtp: FakeSmtp;
let draftId: number;

const mailTo = (fake: FakeSmtp) => ({
  host: fake.host,
  port: fake.port,
  secure: false,
  from: 'Loomwright <loomwright@localhost>',
});

beforeAll(async () => {
  ctx = await createTestContext();
  smtp = await startFakeSmtp();
  configureMail(mailTo(smtp), smtp);
  draftId = ctx.demo.conversions.draft;
});
afterAll(async () => {
  await smtp.close();
  await ctx.close();
});

const as = async (role: 'admin' | 'builder' | 'technician' | 'reviewer') => ctx.authFor(role);

/** Makes the demo draft pass its checks: decide the two pins, fix the fan and pump wires, keep sensor ground on the ECU. */
async function fixDraft() {
  const auth = await as('builder');
  const pins = (
    await request(ctx.app).get(`/api/conversions/${draftId}/pins`).set('Authorization', auth)
  ).body.pins as Array<{
    id: number;
    version: number;
    disposition: string;
    function: string;
  }>;
  for (const pin of pins.filter((p) => p.disposition === 'undecided')) {
    await request(ctx.app)
      .patch(`/api/pins/${pin.id}`)
      .set('Authorization', auth)
      .send({ disposition: 'cut', version: pin.version })
      .expect(200);
  }
  const feeds = (
    await request(ctx.app).get(`/api/conversions/${draftId}/feeds`).set('Authorization', auth)
  ).body.feeds as Array<{
    id: number;
    name: string;
    version: number;
    wire: Record<string, unknown>;
  }>;
  for (const [name, sizeMm2] of [
    ['Cooling fan', 4],
    // 6 mm²: the pump's 3 % is shared with its fuse, relay contacts, terminals and chassis return.
    ['Fuel pump', 6],
  ] as const) {
    const feed = feeds.find((f) => f.name === name)!;
    await request(ctx.app)
      .patch(`/api/conversions/${draftId}/feeds/${feed.id}`)
      .set('Authorization', auth)
      .send({ wire: { ...feed.wire, sizeMm2 }, version: feed.version })
      .expect(200);
  }
}

describe('submitting a revision', () => {
  it('is refused with 422 and the reasons while errors remain, and nothing is frozen', async () => {
    const res = await request(ctx.app)
      .post(`/api/conversions/${draftId}/revisions`)
      .set('Authorization', await as('builder'))
      .send({});
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('checks_failed');
    const rules = res.body.error.details.map((d: { rule: string }) => d.rule);
    expect(rules).toContain('undecided_pins');
    expect(rules).toContain('fuse_protects_wire');
    expect(await Revision.count({ where: { conversionId: draftId } })).toBe(0);
  });

  it('is refused to the technician and the reviewer (403)', async () => {
    for (const role of ['technician', 'reviewer'] as const) {
      expect(
        (
          await request(ctx.app)
            .post(`/api/conversions/${draftId}/revisions`)
            .set('Authorization', await as(role))
            .send({})
        ).status,
      ).toBe(403);
    }
  });
});

describe('the whole workflow', () => {
  let number: number;
  let hash: string;

  it('the builder submits once the checks pass: revision 1, in review, with a hash', async () => {
    await fixDraft();
    const res = await request(ctx.app)
      .post(`/api/conversions/${draftId}/revisions`)
      .set('Authorization', await as('builder'))
      .send({ note: 'Fan and pump wires upsized.' });
    expect(res.status).toBe(201);
    expect(res.body.revision).toMatchObject({ number: 1, status: 'in_review' });
    expect(res.body.revision.hash).toMatch(/^[0-9a-f]{64}$/);
    number = res.body.revision.number;
    hash = res.body.revision.hash;
    const again = await request(ctx.app)
      .post(`/api/conversions/${draftId}/revisions`)
      .set('Authorization', await as('builder'))
      .send({});
    expect(again.status).toBe(409);
  });

  it('notifies the reviewers by e-mail through the outbox', async () => {
    await deliverDueMail();
    const mail = smtp.received().filter((m) => m.to.includes('reviewer@example.com'));
    expect(mail).toHaveLength(1);
    expect(mail[0]!.subject).toBe('Review requested: Ashby yard truck, revision 1');
    expect(mail[0]!.text).toContain(hash);
    expect(await MailOutbox.count({ where: { kind: 'review_requested', status: 'sent' } })).toBe(1);
  });

  it('verifies its hash', async () => {
    const res = await request(ctx.app)
      .get(`/api/conversions/${draftId}/revisions/${number}/verify`)
      .set('Authorization', await as('technician'));
    expect(res.body).toEqual({ ok: true, hash, storedHash: hash, sealed: false, problem: null });
  });

  it('lets the reviewer comment on a pin and read the revision', async () => {
    const detail = await request(ctx.app)
      .get(`/api/conversions/${draftId}/revisions/${number}`)
      .set('Authorization', await as('reviewer'));
    expect(detail.status).toBe(200);
    const pin = detail.body.revision.snapshot.pins[0];
    const res = await request(ctx.app)
      .post(`/api/conversions/${draftId}/revisions/${number}/comments`)
      .set('Authorization', await as('reviewer'))
      .send({ body: 'Check this crimp.', pinId: pin.id });
    expect(res.status).toBe(201);
    expect(res.body.comment.subjectLabel).toBe('E1-1');
    const foreign = await request(ctx.app)
      .post(`/api/conversions/${draftId}/revisions/${number}/comments`)
      .set('Authorization', await as('reviewer'))
      .send({ body: 'x', pinId: 999999 });
    expect(foreign.status).toBe(400);
  });

  it('the reviewer signs it off; it becomes immutable through the API and in the database', async () => {
    const res = await request(ctx.app)
      .post(`/api/conversions/${draftId}/revisions/${number}/sign-off`)
      .set('Authorization', await as('reviewer'))
      .send({});
    expect(res.status).toBe(200);
    expect(res.body.revision).toMatchObject({ status: 'signed_off', reviewedBy: 'Dana Whitlow' });
    expect(res.body.revision.signedAt).toBeTruthy();

    const put = await request(ctx.app)
      .put(`/api/conversions/${draftId}/revisions/${number}`)
      .set('Authorization', await as('admin'))
      .send({});
    expect(put.status).toBe(409);
    const twice = await request(ctx.app)
      .post(`/api/conversions/${draftId}/revisions/${number}/sign-off`)
      .set('Authorization', await as('reviewer'))
      .send({});
    expect(twice.status).toBe(409);

    const row = await Revision.findOne({ where: { conversionId: draftId, number } });
    const refusal = await db()
      .query(`UPDATE revisions SET snapshot_json = 'x' WHERE id = ${row!.id}`)
      .then(
        () => 'accepted',
        (err: { parent?: Error }) => String(err.parent?.message),
      );
    expect(refusal).toMatch(/immutable/);
    const statusChange = await db()
      .query(`UPDATE revisions SET status = 'in_review' WHERE id = ${row!.id}`)
      .then(
        () => 'accepted',
        (err: { parent?: Error }) => String(err.parent?.message),
      );
    expect(statusChange).toMatch(/immutable/);
    const removal = await db()
      .query(`DELETE FROM revisions WHERE id = ${row!.id}`)
      .then(
        () => 'accepted',
        (err: { parent?: Error }) => String(err.parent?.message),
      );
    expect(removal).toMatch(/never deleted/);
  });

  it('tells the submitter it was signed off, and audits submit and sign-off', async () => {
    await deliverDueMail();
    const mail = smtp.received().filter((m) => m.to.includes('builder@example.com'));
    expect(mail.map((m) => m.subject)).toContain('Revision 1 of Ashby yard truck signed off');
    const actions = (
      await AuditEvent.findAll({ where: { conversionId: draftId, entityType: 'revision' } })
    ).map((e) => e.action);
    expect(actions).toEqual(expect.arrayContaining(['submit', 'comment', 'sign_off']));
  });

  it('keeps the signed-off snapshot unchanged while the draft moves on, and diffs the next revision against it', async () => {
    const auth = await as('builder');
    const pin = await Pin.findOne({
      where: { conversionId: draftId, disposition: 'cut' },
      order: [['id', 'ASC']],
    });
    await request(ctx.app)
      .patch(`/api/pins/${pin!.id}`)
      .set('Authorization', auth)
      .send({ notes: 'Heat-shrink the cut end.', version: pin!.version })
      .expect(200);
    const first = await request(ctx.app)
      .get(`/api/conversions/${draftId}/revisions/1/verify`)
      .set('Authorization', auth);
    expect(first.body.ok).toBe(true);
    expect(first.body.hash).toBe(hash);

    const second = await request(ctx.app)
      .post(`/api/conversions/${draftId}/revisions`)
      .set('Authorization', auth)
      .send({});
    expect(second.status).toBe(201);
    expect(second.body.revision.number).toBe(2);
    expect(second.body.revision.hash).not.toBe(hash);
    const detail = await request(ctx.app)
      .get(`/api/conversions/${draftId}/revisions/2`)
      .set('Authorization', await as('reviewer'));
    expect(detail.body.revision.comparedWith).toBe(1);
    expect(detail.body.revision.changes.pins.changed).toEqual([
      expect.objectContaining({
        fields: [{ field: 'notes', before: '', after: 'Heat-shrink the cut end.' }],
      }),
    ]);
  });

  it('the reviewer sends revision 2 back with a comment; the submitter is told', async () => {
    const res = await request(ctx.app)
      .post(`/api/conversions/${draftId}/revisions/2/send-back`)
      .set('Authorization', await as('reviewer'))
      .send({ comment: 'Say which heat-shrink.' });
    expect(res.status).toBe(200);
    expect(res.body.revision).toMatchObject({
      status: 'changes_requested',
      reviewComment: 'Say which heat-shrink.',
    });
    await deliverDueMail();
    expect(
      smtp
        .received()
        .some(
          (m) =>
            m.subject === 'Revision 2 of Ashby yard truck sent back for changes' &&
            m.text.includes('Say which heat-shrink.'),
        ),
    ).toBe(true);
  });

  it('lists the revisions with status, who and when', async () => {
    const res = await request(ctx.app)
      .get(`/api/conversions/${draftId}/revisions`)
      .set('Authorization', await as('technician'));
    expect(
      res.body.revisions.map((r: { number: number; status: string }) => [r.number, r.status]),
    ).toEqual([
      [2, 'changes_requested'],
      [1, 'signed_off'],
    ]);
    expect(res.body.revisions[1]).toMatchObject({
      submittedBy: 'Ivo Brandt',
      reviewedBy: 'Dana Whitlow',
    });
  });
  it('shows revision 1’s pin comment on revision 2, and the builder marks it answered', async () => {
    const detail = await request(ctx.app)
      .get(`/api/conversions/${draftId}/revisions/2`)
      .set('Authorization', await as('builder'))
      .expect(200);
    const earlier = detail.body.revision.earlierComments as Array<{
      id: number;
      revisionNumber: number;
      subjectLabel: string;
      body: string;
      answered: unknown;
    }>;
    expect(earlier).toEqual([
      expect.objectContaining({
        revisionNumber: 1,
        subjectLabel: 'E1-1',
        body: 'Check this crimp.',
        answered: null,
      }),
    ]);
    const url = `/api/conversions/${draftId}/revisions/2/comments/${earlier[0]!.id}/answered`;
    expect(
      (
        await request(ctx.app)
          .post(url)
          .set('Authorization', await as('technician'))
      ).status,
    ).toBe(403);
    const marked = await request(ctx.app)
      .post(url)
      .set('Authorization', await as('builder'))
      .expect(200);
    expect(marked.body.comment.answered).toMatchObject({ by: 'Ivo Brandt' });
    // Once is enough: marking again keeps the first answer.
    const again = await request(ctx.app)
      .post(url)
      .set('Authorization', await as('admin'))
      .expect(200);
    expect(again.body.comment.answered.by).toBe('Ivo Brandt');
    const reread = await request(ctx.app)
      .get(`/api/conversions/${draftId}/revisions/2`)
      .set('Authorization', await as('reviewer'));
    expect(reread.body.revision.earlierComments[0].answered.by).toBe('Ivo Brandt');
    // A comment of another conversion is not found through this one.
    expect(
      (
        await request(ctx.app)
          .post(
            `/api/conversions/${ctx.demo.conversions.signedOff}/revisions/1/comments/${earlier[0]!.id}/answered`,
          )
          .set('Authorization', await as('builder'))
      ).status,
    ).toBe(404);
  });
});

describe('separation of duties and races', () => {
  it('a reviewer cannot sign off a revision they submitted (403), and a technician cannot sign off at all', async () => {
    // An admin made reviewer for the day submits; being the submitter, they may not sign it off.
    const admin = await User.findByPk(ctx.demo.users.admin!);
    const id = ctx.demo.conversions.signedOff;
    const submitted = await request(ctx.app)
      .post(`/api/conversions/${id}/revisions`)
      .set('Authorization', await as('admin'))
      .send({});
    expect(submitted.status).toBe(201);
    const n = submitted.body.revision.number;
    expect(
      (
        await request(ctx.app)
          .post(`/api/conversions/${id}/revisions/${n}/sign-off`)
          .set('Authorization', await as('technician'))
          .send({})
      ).status,
    ).toBe(403);
    await admin!.update({ role: 'reviewer' });
    try {
      const self = await request(ctx.app)
        .post(`/api/conversions/${id}/revisions/${n}/sign-off`)
        .set('Authorization', await as('admin'))
        .send({});
      expect(self.status).toBe(403);
    } finally {
      await admin!.update({ role: 'admin' });
    }
  });

  it('two sign-offs at once: exactly one succeeds', async () => {
    const id = ctx.demo.conversions.signedOff;
    const revision = await Revision.findOne({ where: { conversionId: id, status: 'in_review' } });
    const second = await User.create({
      workshopId: ctx.demo.workshopId,
      email: 'second.reviewer@example.com',
      name: 'Second Reviewer',
      role: 'reviewer',
      passwordHash: null,
    });
    const { signSessionToken } = await import('#server/modules/auth/tokens.ts');
    const other = `Bearer ${signSessionToken(second.id, second.tokenVersion)}`;
    const url = `/api/conversions/${id}/revisions/${revision!.number}/sign-off`;
    const results = await Promise.all([
      request(ctx.app)
        .post(url)
        .set('Authorization', await as('reviewer'))
        .send({}),
      request(ctx.app).post(url).set('Authorization', other).send({}),
    ]);
    expect(results.map((r) => r.status).sort()).toEqual([200, 409]);
    expect(
      await AuditEvent.count({
        where: { conversionId: id, action: 'sign_off', entityId: revision!.id },
      }),
    ).toBe(1);
  });

  it('answers 404 for another workshop’s revisions', async () => {
    const other = await createOtherWorkshop();
    const res = await request(ctx.app)
      .get(`/api/conversions/${draftId}/revisions/1`)
      .set('Authorization', other.authFor('reviewer'));
    expect(res.status).toBe(404);
  });
});

describe('mail outage', () => {
  it('keeps the submission when SMTP is down, and sends the notice exactly once when it is back', async () => {
    const down = await startFakeSmtp();
    const port = down.port;
    await down.close();
    configureMail({
      host: '127.0.0.1',
      port,
      secure: false,
      from: 'Loomwright <loomwright@localhost>',
    });
    try {
      // Revision 2 was sent back, so the draft may be submitted again.
      const res = await request(ctx.app)
        .post(`/api/conversions/${draftId}/revisions`)
        .set('Authorization', await as('builder'))
        .send({});
      expect(res.status).toBe(201);
      expect(await deliverDueMail()).toBe(0);
      const row = await MailOutbox.findOne({
        where: { kind: 'review_requested' },
        order: [['id', 'DESC']],
      });
      expect(row!.status).toBe('pending');
      expect(row!.attempts).toBe(1);

      const back = await startFakeSmtp({ port });
      configureMail(mailTo(back), back);
      await row!.update({ nextAttemptAt: new Date(Date.now() - 1000) });
      expect(await deliverDueMail()).toBe(1);
      expect(await deliverDueMail()).toBe(0);
      const received = back
        .received()
        .filter((m) => m.subject.includes(`revision ${res.body.revision.number}`));
      expect(received).toHaveLength(1);
      expect((await row!.reload()).status).toBe('sent');
      await back.close();
    } finally {
      configureMail(mailTo(smtp), smtp);
    }
  });
});
