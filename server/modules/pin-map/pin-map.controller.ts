import type { Request, Response } from 'express';
import type { IdParams } from '#shared/schemas/common.schema.ts';
import type {
  BatchPinRequest,
  BulkPinRequest,
  CreateConnectorRequest,
  UpdateConnectorRequest,
  UpdatePinRequest,
} from '#shared/schemas/pin-map.schema.ts';
import { actorOf } from '../../lib/actor.ts';
import { sendJsonBody } from '../../lib/cached-json.ts';
import { parsedParams } from '../../lib/request.ts';
import * as connectorsService from './connectors.service.ts';
import * as pinsService from './pins.service.ts';

export async function listConnectors(req: Request, res: Response) {
  const { id } = parsedParams<IdParams>(req);
  res.json({ connectors: await connectorsService.listConnectors(actorOf(req), id) });
}

export async function createConnector(req: Request, res: Response) {
  const { id } = parsedParams<IdParams>(req);
  const connector = await connectorsService.createConnector(
    actorOf(req),
    id,
    req.body as CreateConnectorRequest,
  );
  res.status(201).json({ connector });
}

export async function updateConnector(req: Request, res: Response) {
  const { id } = parsedParams<IdParams>(req);
  const connector = await connectorsService.updateConnector(
    actorOf(req),
    id,
    req.body as UpdateConnectorRequest,
  );
  res.json({ connector });
}

export async function deleteConnector(req: Request, res: Response) {
  const { id } = parsedParams<IdParams>(req);
  await connectorsService.deleteConnector(actorOf(req), id);
  res.status(204).end();
}

export async function listPins(req: Request, res: Response) {
  const { id } = parsedParams<IdParams>(req);
  await sendJsonBody(req, res, await pinsService.pinListBody(actorOf(req), id));
}

export async function updatePin(req: Request, res: Response) {
  const { id } = parsedParams<IdParams>(req);
  res.json({ pin: await pinsService.updatePin(actorOf(req), id, req.body as UpdatePinRequest) });
}

export async function bulkUpdatePins(req: Request, res: Response) {
  const { id } = parsedParams<IdParams>(req);
  res.json({
    pins: await pinsService.bulkUpdatePins(actorOf(req), id, req.body as BulkPinRequest),
  });
}

export async function batchUpdatePins(req: Request, res: Response) {
  const { id } = parsedParams<IdParams>(req);
  res.json({
    pins: await pinsService.batchUpdatePins(actorOf(req), id, req.body as BatchPinRequest),
  });
}
