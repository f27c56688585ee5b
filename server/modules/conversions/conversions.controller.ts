import type { Request, Response } from 'express';
import type { IdParams } from '#shared/schemas/common.schema.ts';
import type {
  ConversionListItem,
  CreateConversionRequest,
  UpdateConversionRequest,
} from '#shared/schemas/conversions.schema.ts';
import { actorOf } from '../../lib/actor.ts';
import { parsedParams } from '../../lib/request.ts';
import { benchNotices } from '../bench/bench.service.ts';
import * as conversionsService from './conversions.service.ts';
import { conversionStandings } from './standing.service.ts';

/**
 * The list carries, for each conversion, where it stands (state, latest revision, last change),
 * the revision its bench works from, its progress there and the rework owed.
 */
export async function list(req: Request, res: Response) {
  const actor = actorOf(req);
  const [conversions, bench] = await Promise.all([
    conversionsService.listConversions(actor),
    benchNotices(actor),
  ]);
  const standings = await conversionStandings(actor, conversions);
  const items: ConversionListItem[] = conversions.map((c) => ({
    ...c,
    ...standings.get(c.id)!,
    bench: bench.get(c.id) ?? null,
  }));
  res.json({ conversions: items });
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
