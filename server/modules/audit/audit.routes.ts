import { Router, type Request, type Response } from 'express';
import { Op, type WhereOptions } from 'sequelize';
import { z } from 'zod';
import { IdParams } from '#shared/schemas/common.schema.ts';
import { AuditEvent } from '../../db/models/index.ts';
import { actorOf } from '../../lib/actor.ts';
import { parsedParams, parsedQuery } from '../../lib/request.ts';
import { authorize } from '../../middleware/authorize.ts';
import { validate } from '../../middleware/validate.ts';
import { findConversionInWorkshop } from '../conversions/conversions.service.ts';

export const AuditQuery = z.strictObject({
  action: z.string().max(40).optional(),
  entityType: z.string().max(40).optional(),
  actor: z.string().max(120).optional(),
  /** Page backwards: events with an id below this. */
  before: z.coerce.number().int().positive().optional(),
  limit: z.coerce.number().int().min(1).max(500).default(100),
});
type AuditQuery = z.output<typeof AuditQuery>;

function parseJson(text: string | null): unknown {
  if (text === null) return null;
  try {
    return JSON.parse(text);
  } catch {
    return text;
  }
}

async function list(req: Request, res: Response) {
  const { id } = parsedParams<IdParams>(req);
  const q = parsedQuery<AuditQuery>(req);
  const actor = actorOf(req);
  await findConversionInWorkshop(actor, id);
  const where: WhereOptions<AuditEvent> = { workshopId: actor.workshopId, conversionId: id };
  if (q.action) Object.assign(where, { action: q.action });
  if (q.entityType) Object.assign(where, { entityType: q.entityType });
  if (q.actor) Object.assign(where, { actorName: q.actor });
  if (q.before) Object.assign(where, { id: { [Op.lt]: q.before } });
  const events = await AuditEvent.findAll({ where, order: [['id', 'DESC']], limit: q.limit });
  res.json({
    events: events.map((e) => ({
      id: e.id,
      at: e.createdAt.toISOString(),
      actorName: e.actorName,
      action: e.action,
      entityType: e.entityType,
      entityId: e.entityId,
      summary: e.summary,
      before: parseJson(e.beforeJson),
      after: parseJson(e.afterJson),
    })),
  });
}

/** Mounted at /api/conversions: the conversion's append-only audit trail, newest first. */
export const auditRoutes = Router();
auditRoutes.get(
  '/:id/audit',
  authorize('audit:read'),
  validate({ params: IdParams, query: AuditQuery }),
  list,
);
