import type { Request, Response } from 'express';
import type { IdParams } from '#shared/schemas/common.schema.ts';
import type {
  CreateConversionRequest,
  UpdateConversionRequest,
} from '#shared/schemas/conversions.schema.ts';
import { actorOf } from '../../lib/actor.ts';
import { parsedParams } from '../../lib/request.ts';
import * as conversionsService from './conversions.service.ts';

export async function list(req: Request, res: Response) {
  res.json({ conversions: await conversionsService.listConversions(actorOf(req)) });
}

export async function get(req: Request, res: Response) {
  const { id } = parsedParams<IdParams>(req);
  res.json({ conversion: await conversionsService.getConversion(actorOf(req), id) });
}

export async function create(req: Request, res: Response) {
  const conversion = await conversionsService.createConversion(
    actorOf(req),
    req.body as CreateConversionRequest,
  );
  res.status(201).json({ conversion });
}

export async function update(req: Request, res: Response) {
  const { id } = parsedParams<IdParams>(req);
  const conversion = await conversionsService.updateConversion(
    actorOf(req),
    id,
    req.body as UpdateConversionRequest,
  );
  res.json({ conversion });
}
