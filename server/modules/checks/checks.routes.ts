import { Router, type Request, type Response } from 'express';
import { IdParams } from '#shared/schemas/common.schema.ts';
import { actorOf } from '../../lib/actor.ts';
import { parsedParams } from '../../lib/request.ts';
import { authorize } from '../../middleware/authorize.ts';
import { validate } from '../../middleware/validate.ts';
import { runConversionChecks } from './checks.service.ts';

async function run(req: Request, res: Response) {
  const { id } = parsedParams<IdParams>(req);
  res.json(await runConversionChecks(actorOf(req), id));
}

/** Mounted at /api/conversions. Any signed-in role may run the checks: they change nothing. */
export const checksRoutes = Router();
checksRoutes.post('/:id/checks', authorize('checks:run'), validate({ params: IdParams }), run);
