import type { Request, Response } from 'express';
import type { IdParams } from '#shared/schemas/common.schema.ts';
import type {
  ConnectorFromTemplateRequest,
  SaveTemplateRequest,
} from '#shared/schemas/library.schema.ts';
import { actorOf } from '../../lib/actor.ts';
import { parsedParams } from '../../lib/request.ts';
import * as service from './library.service.ts';

export async function listTemplates(req: Request, res: Response) {
  res.json({ templates: await service.listTemplates(actorOf(req)) });
}

export async function getTemplate(req: Request, res: Response) {
  const { id } = parsedParams<IdParams>(req);
  res.json({ template: await service.getTemplate(actorOf(req), id) });
}

export async function saveTemplate(req: Request, res: Response) {
  const template = await service.saveTemplate(actorOf(req), req.body as SaveTemplateRequest);
  res.status(201).json({ template });
}

export async function deleteTemplate(req: Request, res: Response) {
  const { id } = parsedParams<IdParams>(req);
  await service.deleteTemplate(actorOf(req), id);
  res.status(204).end();
}

export async function connectorFromTemplate(req: Request, res: Response) {
  const { id } = parsedParams<IdParams>(req);
  const connector = await service.connectorFromTemplate(
    actorOf(req),
    id,
    req.body as ConnectorFromTemplateRequest,
  );
  res.status(201).json({ connector });
}
