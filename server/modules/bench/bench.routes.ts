import { Router, type Request, type Response } from 'express';
import { BenchPinParams, BenchRecordRequest } from '#shared/schemas/bench.schema.ts';
import { IdParams } from '#shared/schemas/common.schema.ts';
import { actorOf } from '../../lib/actor.ts';
import { parsedParams } from '../../lib/request.ts';
import { authorize } from '../../middleware/authorize.ts';
import { validate } from '../../middleware/validate.ts';
import * as bench from './bench.service.ts';

async function sheet(req: Request, res: Response) {
  const { id } = parsedParams<IdParams>(req);
  res.json(await bench.getBenchSheet(actorOf(req), id));
}

async function record(req: Request, res: Response) {
  const { id, number, pinId } = parsedParams<BenchPinParams>(req);
  res.json({
    record: await bench.recordBenchWork(
      actorOf(req),
      id,
      number,
      pinId,
      req.body as BenchRecordRequest,
    ),
  });
}

/** Mounted at /api/conversions: the bench checklist of the signed-off revision. */
export const benchRoutes = Router();
benchRoutes.get('/:id/bench', authorize('conversion:read'), validate({ params: IdParams }), sheet);
benchRoutes.put(
  '/:id/revisions/:number/bench/:pinId',
  authorize('bench:record'),
  validate({ params: BenchPinParams, body: BenchRecordRequest }),
  record,
);
