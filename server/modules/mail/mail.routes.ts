import { Router, type Request, type Response } from 'express';
import { MailOutbox } from '../../db/models/index.ts';
import { actorOf } from '../../lib/actor.ts';
import { authorize } from '../../middleware/authorize.ts';
import { fakeInbox } from './outbox.service.ts';

/** An invitation's one-time token would let whoever reads it set that person's password. */
const redactTokens = (text: string) => text.replace(/#token=[A-Za-z0-9_-]+/g, '#token=[hidden]');

async function outbox(req: Request, res: Response) {
  const actor = actorOf(req);
  const rows = await MailOutbox.findAll({
    where: { workshopId: actor.workshopId },
    order: [['id', 'DESC']],
    limit: 200,
  });
  const fake = fakeInbox();
  res.json({
    outbox: rows.map((r) => ({
      id: r.id,
      kind: r.kind,
      to: r.toAddress,
      subject: r.subject,
      status: r.status,
      attempts: r.attempts,
      lastError: r.lastError,
      createdAt: r.createdAt.toISOString(),
      sentAt: r.sentAt ? new Date(r.sentAt).toISOString() : null,
    })),
    // In demo mode, what the local fake SMTP server received (this workshop's recipients only).
    received: fake
      ? fake
          .received()
          .filter((m) => rows.some((r) => m.to.includes(r.toAddress)))
          .map((m) => ({ ...m, text: redactTokens(m.text) }))
          .reverse()
      : null,
  });
}

/** Mounted at /api/admin. */
export const mailRoutes = Router();
mailRoutes.get('/outbox', authorize('outbox:read'), outbox);
